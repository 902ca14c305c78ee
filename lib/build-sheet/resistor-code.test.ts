// IEC 60062's letter-and-digit code, against the standard's own style of examples (4K7, R47,
// 1M0; recalled from memory) and the values this product's parts lists use.
import { describe, expect, it } from "vitest";
import { iecResistorCode } from "./resistor-code";

describe("IEC 60062 resistor codes", () => {
  it.each([
    [4700, "4K7"],
    [470, "470R"],
    [4.7, "4R7"],
    [0.47, "R47"],
    [1e6, "1M0"],
    [10_000, "10K"],
    [1020, "1K02"],
    [0.274, "R274"],
    [4.7e-3, "R0047"],
    [0.001, "R001"],
    [49.9, "49R9"],
    [1, "1R0"],
    [2.2e9, "2G2"],
  ])("%s Ω is %s", (ohms, code) => {
    expect(iecResistorCode(ohms)).toBe(code);
  });
  it("refuses what is not a resistance", () => {
    expect(() => iecResistorCode(0)).toThrow();
    expect(() => iecResistorCode(NaN)).toThrow();
  });
});
