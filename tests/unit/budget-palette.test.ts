// Neighbouring error-budget colours must differ in lightness (WCAG 2.x relative luminance and
// contrast ratio, W3C) in both colour schemes, so they stay apart for colour-blind readers too.
import { describe, expect, it } from "vitest";
import { budgetBackground, budgetColours } from "@/components/charts/palette";

const luminance = (hex: string) => {
  const [r, g, b] = [1, 3, 5]
    .map((i) => parseInt(hex.slice(i, i + 2), 16) / 255)
    .map((v) => (v <= 0.03928 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4)) as [number, number, number];
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
};
const contrast = (a: string, b: string) => {
  const [x, y] = [luminance(a), luminance(b)];
  return (Math.max(x, y) + 0.05) / (Math.min(x, y) + 0.05);
};

describe("budget colours", () => {
  it("WCAG luminance of white is 1 and of black 0 (formula check)", () => {
    expect(luminance("#FFFFFF")).toBeCloseTo(1, 6);
    expect(contrast("#000000", "#FFFFFF")).toBeCloseTo(21, 6);
  });
  for (const scheme of ["light", "dark"] as const) {
    it(`neighbours differ in lightness in the ${scheme} scheme, the last next to the first too`, () => {
      const set = budgetColours[scheme];
      set.forEach((c, i) => {
        const next = set[(i + 1) % set.length]!;
        expect(contrast(c, next), `${c} next to ${next}`).toBeGreaterThanOrEqual(1.3);
      });
    });
  }
  it("stripes a colour once the eight are used", () => {
    expect(budgetBackground(0)).toBe("light-dark(#0072B2, #3A9AD9)");
    expect(budgetBackground(8)).toContain("repeating-linear-gradient");
  });
});
