import { describe, expect, it } from "vitest";
import { toDisplayDigits } from "./display-digits";

describe("toDisplayDigits", () => {
  it("rounds every number in plain data to five significant digits by default", () => {
    expect(toDisplayDigits(0.6000000000000001)).toBe(0.6);
    expect(toDisplayDigits(1.23456789e-7)).toBe(1.2346e-7);
    expect(toDisplayDigits(-12345.678)).toBe(-12346);
    expect(
      toDisplayDigits({ a: [{ x: 0.123456789, y: 2 / 3 }], label: "0.123456789 V", ok: true, none: null }),
    ).toEqual({
      a: [{ x: 0.12346, y: 0.66667 }],
      label: "0.123456789 V",
      ok: true,
      none: null,
    });
  });

  it("keeps zero, infinities and NaN as they are, and takes another digit count", () => {
    expect(toDisplayDigits([0, -0, Infinity, -Infinity])).toEqual([0, -0, Infinity, -Infinity]);
    expect(toDisplayDigits(NaN)).toBeNaN();
    expect(toDisplayDigits(Math.PI, 3)).toBe(3.14);
  });

  it("stays within half a unit in the fifth digit of each value", () => {
    for (const v of [4.7e-3, 0.0499999, 123.456789, 9.99996e5, 3.3e-12]) {
      const r = toDisplayDigits(v);
      expect(Math.abs(r - v) / Math.abs(v)).toBeLessThanOrEqual(5e-5);
    }
  });
});
