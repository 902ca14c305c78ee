// A profile with negative samples (a pack that charges and discharges): net charge and the charge
// in and out, by the trapezoid rule with each segment split where it crosses zero (hand-worked).
import { describe, expect, it } from "vitest";
import { isBelowStep, isClipped, segmentCharge, summarizeProfile } from "./profile";

const design = { shuntOhms: 0.001, gain: 50, supplyV: 48, fullScaleV: 2.5, lsbA: 0.001, zeroLevelV: 1.25 };

describe("profiles with negative samples", () => {
  it("splits a segment at its zero crossing: 2 A to −2 A over 1 s carries 0.5 C each way", () => {
    // The line crosses zero at 0.5 s: ½ × 2 A × 0.5 s = 0.5 C in, the same out.
    const s = segmentCharge(2, -2, 1);
    expect(s.inC).toBeCloseTo(0.5, 15);
    expect(s.outC).toBeCloseTo(0.5, 15);
  });
  it("sums net, in and out over a profile", () => {
    // 0–10 s at 10 A (100 C in), a 1 s ramp to −5 A (10 A × 2/3 s ÷ 2 = 3.333 C in, 5 A × 1/3 s ÷ 2 = 0.8333 C out),
    // then 10 s at −5 A (50 C out). Net 103.333 − 50.833 = 52.5 C.
    const t = Float64Array.from([0, 10, 11, 21]);
    const i = Float64Array.from([10, 10, -5, -5]);
    const s = summarizeProfile(t, i, design);
    expect(s.chargeInC).toBeCloseTo(100 + 10 / 3, 12);
    expect(s.chargeOutC).toBeCloseTo(50 + 5 / 6, 12);
    expect(s.chargeC).toBeCloseTo(s.chargeInC - s.chargeOutC, 12);
    expect(s.chargeC).toBeCloseTo(52.5, 12);
    // The drop is taken at the largest magnitude: 10 A × 1 mΩ.
    expect(s.maxBurdenV).toBeCloseTo(0.01, 15);
  });
  it("clips a negative sample below 0 V about the zero level, and judges steps by magnitude", () => {
    // 1.25 V − 30 A × 1 mΩ × 50 = −0.25 V: off the bottom; −20 A gives 0.25 V: inside.
    expect(isClipped(-30, design)).toBe(true);
    expect(isClipped(-20, design)).toBe(false);
    expect(isBelowStep(-0.0005, design)).toBe(true);
    expect(isBelowStep(-0.002, design)).toBe(false);
  });
});
