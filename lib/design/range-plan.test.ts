import { describe, expect, it } from "vitest";
import { evaluateCandidate } from "./candidate";
import { solve } from "./solve";
import { SWITCH_DOWN_FRACTION } from "./range-plan";
import { req } from "./test-helpers";

describe("range plans for spans too wide for one range", () => {
  const cases = [
    // docs/model.md §6: the soil-moisture logger, 3 µA asleep to 180 mA transmitting, from 3.0 V.
    [
      "the demo logger, 3 µA .. 180 mA",
      req({ current: { min: "3 uA", max: "180 mA" }, supply: { voltage: "3.0 V" }, drop: { max: "60 mV" } }),
    ],
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
  });

  it("proposes no plan when one range is enough", () => {
    expect(solve(req({ current: { min: "10 mA", max: "180 mA" }, supply: { voltage: "3 V" } })).rangePlan).toBeNull();
  });
});
