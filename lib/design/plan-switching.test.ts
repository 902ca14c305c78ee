import { describe, expect, it } from "vitest";
import {
  pathOhms,
  planProfileDesign,
  startingRange,
  summarizePlanProfile,
  type PlanProfileDesign,
} from "./plan-switching";

import { parseRequirement } from "./requirement";
import { req, twoRangeDesign } from "./test-helpers";

const design = twoRangeDesign;

// One sample per millisecond: asleep, a burst to 50 mA, a tail at 0.9 mA (inside the hysteresis),
// a drop to 0.5 mA (below the switch-down point), asleep again.
const t = Float64Array.from([0, 1, 2, 3, 4, 5, 6, 7, 8, 9], (ms) => ms * 1e-3);
const i = Float64Array.from([0.1, 0.1, 50, 50, 50, 0.9, 0.9, 0.5, 0.5, 0.1], (mA) => mA * 1e-3);

describe("the switching rule over a recording (counted by hand)", () => {
  it("with a 0.5 ms delay: two switches, 4 ms on range 0 and 5 ms on range 1, one sample read late", () => {
    // Hand count: the burst at 2 ms asks for range 1, which acts at 2.5 ms (range 0 held 0 to 2.5 ms);
    // 0.9 mA stays on range 1 (above the 0.8 mA switch-down point); 0.5 mA at 7 ms asks for range 0,
    // which acts at 7.5 ms (range 1 held 2.5 to 7.5 ms = 5 ms; range 0 again 7.5 to 9 ms: 4 ms in all).
    const { summary, trace } = summarizePlanProfile(t, i, design(0.5e-3));
    expect(summary.rangeSwitches).toBe(2);
    expect(summary.timeInRangeS[0]).toBeCloseTo(4e-3, 12);
    expect(summary.timeInRangeS[1]).toBeCloseTo(5e-3, 12);
    expect(Array.from(trace.rangeOf)).toEqual([0, 0, 0, 1, 1, 1, 1, 1, 0, 0]);
    expect(summary.samplesInRange).toEqual([5, 5]);
    // The 50 mA sample at 2 ms is read on range 0 (top 1 mA) while the switch waits.
    expect(summary.clippedBeforeSwitchSamples).toBe(1);
    expect(summary.clippedBeforeSwitchPercent).toBeCloseTo(10, 12);
    // Below one resolvable step: 0.1 mA on range 0 (step 0.2 mA) three times; 0.9, 0.9 and 0.5 mA
    // on range 1 (step 1 mA) three times.
    expect(summary.belowStepSamples).toBe(6);
    expect(summary.belowResolutionPercent).toBeCloseTo(60, 12);
    expect(summary.switchDelayS).toBe(0.5e-3);
  });

  it("with no delay: the same two switches, acting on the sample that asks, nothing read late", () => {
    const { summary, trace } = summarizePlanProfile(t, i, design(0));
    expect(summary.rangeSwitches).toBe(2);
    expect(Array.from(trace.rangeOf)).toEqual([0, 0, 1, 1, 1, 1, 1, 0, 0, 0]);
    // Range 0: 0 to 2 ms and 7 to 9 ms; range 1: 2 to 7 ms.
    expect(summary.timeInRangeS[0]).toBeCloseTo(4e-3, 12);
    expect(summary.timeInRangeS[1]).toBeCloseTo(5e-3, 12);
    expect(summary.clippedBeforeSwitchSamples).toBe(0);
    // 0.5 mA at 7 ms is now read on range 0, above its 0.2 mA step.
    expect(summary.belowStepSamples).toBe(5);
  });

  it("with a 1.5 ms delay: two burst samples read late on range 0", () => {
    const { summary } = summarizePlanProfile(t, i, design(1.5e-3));
    // Up at 2 + 1.5 = 3.5 ms, down at 7 + 1.5 = 8.5 ms.
    expect(summary.clippedBeforeSwitchSamples).toBe(2);
    expect(summary.timeInRangeS[0]).toBeCloseTo(3.5e-3 + 0.5e-3, 12);
    expect(summary.timeInRangeS[1]).toBeCloseTo(5e-3, 12);
  });

  it("the drop includes the switch, and the protection caps a lower range at the burst", () => {
    const d = design(0.5e-3);
    // Ohm's law on round numbers: 50 mA through 10 Ω + 0.1 Ω would drop 505 mV, past the 60 mV
    // allowed, so the top path (0.2 Ω) closes beside it: 10.1 ∥ 0.2 = 10.1·0.2/10.3 Ω.
    expect(pathOhms(d, 0, 50e-3)).toBeCloseTo((10.1 * 0.2) / 10.3, 12);
    expect(pathOhms(d, 0, 1e-3)).toBeCloseTo(10.1, 12); // 10.1 mV: no protection
    const { summary } = summarizePlanProfile(t, i, d);
    // The worst drop is 50 mA through range 1's 0.1 Ω shunt and 0.1 Ω switch: 10 mV.
    expect(summary.maxBurdenV).toBeCloseTo(0.01, 12);
    expect(summary.minLoadVoltageV).toBeCloseTo(2.99, 12);
    expect(summary.peakCurrentA).toBeCloseTo(0.05, 12);
  });

  it("charge by the trapezoid rule (any numerical-methods text), averaged over the duration", () => {
    const { summary } = summarizePlanProfile(t, i, design(0));
    // Trapezoids of 1 ms on the mA values: (0.1+0.1)/2 + (0.1+50)/2 + (50+50)/2·2 + (50+0.9)/2 +
    // (0.9+0.9)/2 + (0.9+0.5)/2 + (0.5+0.5)/2 + (0.5+0.1)/2 = 153 mA·ms = 153 µC.
    expect(summary.chargeC).toBeCloseTo(153e-6, 12);
    expect(summary.averageCurrentA).toBeCloseTo(153e-6 / 9e-3, 12);
    expect(summary.durationS).toBeCloseTo(9e-3, 12);
  });

  it("hysteresis: a current wavering between 0.85 and 1.05 mA switches once, not on every crossing", () => {
    const n = 20;
    const tt = Float64Array.from({ length: n }, (_, k) => k * 1e-3);
    const ii = Float64Array.from({ length: n }, (_, k) => (k % 2 === 0 ? 0.85e-3 : 1.05e-3));
    const { summary } = summarizePlanProfile(tt, ii, design(0));
    // Starts on range 0 (0.85 mA fits), goes up at 1 ms, and 0.85 mA never falls below 0.8 mA.
    expect(summary.rangeSwitches).toBe(1);
    expect(summary.timeInRangeS[0]).toBeCloseTo(1e-3, 12);
    expect(summary.timeInRangeS[1]).toBeCloseTo(18e-3, 12);
  });

  it("starts in the range that fits the first sample, and jumps straight past a range it does not need", () => {
    const three = [
      { upA: 1e-3, downA: 0.8e-3 },
      { upA: 10e-3, downA: 8e-3 },
    ];
    expect(startingRange(0.5e-3, three)).toBe(0);
    expect(startingRange(5e-3, three)).toBe(1);
    expect(startingRange(50e-3, three)).toBe(2);
    const base = design(0);
    const mid = { ...base.ranges[1]!, maxA: 10e-3 };
    const top = { ...base.ranges[1]!, minA: 8e-3, shuntOhms: 0.01 };
    const d: PlanProfileDesign = { ...base, switchPoints: three, ranges: [base.ranges[0]!, mid, top] };
    const tt = Float64Array.from([0, 1e-3, 2e-3]);
    const ii = Float64Array.from([0.1e-3, 50e-3, 0.1e-3]);
    const { summary, trace } = summarizePlanProfile(tt, ii, d);
    expect(Array.from(trace.rangeOf)).toEqual([0, 2, 0]);
    expect(summary.rangeSwitches).toBe(2);
  });
});

describe("planProfileDesign", () => {
  it("takes each range's step from the readout: full scale / (2^bits · R·G) (DESIGN.md §3, the ADC step)", () => {
    const r = req({ current: { min: "3 uA", max: "180 mA" }, supply: { voltage: "3.0 V" }, drop: { max: "60 mV" } });
    const d = planProfileDesign(r, {
      ranges: [
        { minA: 3e-6, maxA: 4.6e-3, shuntOhms: 1.07, gain: 500 },
        { minA: 3.68e-3, maxA: 0.18, shuntOhms: 0.274, gain: 50 },
      ],
      switchPoints: [{ upA: 4.6e-3, downA: 3.68e-3 }],
    });
    expect(d.ranges[0]!.lsbA).toBeCloseTo(2.5 / 4096 / (1.07 * 500), 15);
    expect(d.ranges[1]!.clipCurrentA).toBeCloseTo(2.5 / (0.274 * 50), 12);
    expect(d.ranges[0]!.resolvableStepA).toBeGreaterThanOrEqual(d.ranges[0]!.lsbA);
    // The default switch delay (DEFAULTS.md, from memory) and on-resistance (a tenth of the drop at 180 mA).
    expect(d.switchDelayS).toBe(100e-6);
    expect(d.ranges[0]!.switchOhms).toBeCloseTo(0.006 / 0.18, 12);
  });
});

describe("rangeSwitch.delay (a requirement field)", () => {
  const base = { current: { min: "3 uA", max: "180 mA" }, supply: { voltage: "3.0 V" } };
  it("reads a time with its prefix, and defaults to 100 µs (DEFAULTS.md, from memory)", () => {
    expect(req({ ...base, rangeSwitch: { delay: "2 ms" } }).rangeSwitch.delay).toBeCloseTo(2e-3, 15);
    expect(req(base).rangeSwitch.delay).toBe(100e-6);
  });
  it("refuses a negative delay or a quantity that is not a time, on the field's path", () => {
    const neg = parseRequirement({ ...base, rangeSwitch: { delay: "-1 ms" } });
    expect(neg.ok).toBe(false);
    if (!neg.ok) expect(neg.fieldErrors["rangeSwitch.delay"]?.[0]).toMatch(/Range switch delay cannot be negative/);
    const volts = parseRequirement({ ...base, rangeSwitch: { delay: "5 V" } });
    expect(volts.ok).toBe(false);
    if (!volts.ok) expect(volts.fieldErrors["rangeSwitch.delay"]?.[0]).toMatch(/not a time/);
  });
});
