// Battery capacities as people type them, read by the engine's quantity parser (mathjs units).
// 1 mAh = 1e-3 A × 3600 s = 3.6 C (definition of the ampere-hour).
import { describe, expect, it } from "vitest";
import { formatDuration, parseCapacityC } from "./capacity";

describe("parseCapacityC", () => {
  it.each([
    ["220 mAh", 792],
    ["2.4 Ah", 8640],
    ["800 C", 800],
    ["220 µAh", 0.792],
    ["1000", 3600], // a bare number is mAh
  ])("%s is %f C", (text, coulombs) => {
    expect(parseCapacityC(text)).toBeCloseTo(coulombs, 9);
  });
  it.each(["", "abc", "220 mA", "-5 mAh", "0 mAh", "3 V"])("refuses %j", (text) => {
    expect(parseCapacityC(text)).toBeNull();
  });
});

describe("formatDuration", () => {
  it("picks the largest sensible unit", () => {
    expect(formatDuration(90)).toBe("90 s");
    expect(formatDuration(5759.3)).toBe("96 min");
    expect(formatDuration(10 * 3600)).toBe("10 h");
    expect(formatDuration(41 * 86400)).toBe("41 days");
  });
});
