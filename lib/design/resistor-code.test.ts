import { describe, expect, it } from "vitest";
import { resistorCode } from "./resistor-code";

describe("resistorCode (IEC 60062 letter code)", () => {
  // The issue's own examples (R010, 4R7) and the standard's pattern of the letter in place of the
  // decimal point (IEC 60062; examples from memory, as printed on parts: R47, 4K7, 2M2, 1K0).
  it.each([
    [0.01, "R010"],
    [4.7, "4R7"],
    [0.47, "R47"],
    [4700, "4K7"],
    [2.2e6, "2M2"],
    [1000, "1K0"],
    [47, "47R"],
    [0.274, "R274"],
    [41.2, "41R2"],
    [1.07, "1R07"],
    [0.0015, "R0015"],
    [100, "100R"],
    [10_000, "10K"],
    [1, "1R0"],
  ])("%s Ω is %s", (ohms, code) => {
    expect(resistorCode(ohms)).toBe(code);
  });
  it("refuses zero and negative values", () => {
    expect(() => resistorCode(0)).toThrow(RangeError);
    expect(() => resistorCode(-1)).toThrow(RangeError);
  });
});
