import { describe, expect, it } from "vitest";
import { planCurve, rangeInUse } from "./plan-curves";
import { solve } from "./solve";
import { req } from "./test-helpers";

// docs/model.md §6: the demo logger, 3 µA–180 mA on a 3.0 V cell, 60 mV allowed.
const logger = req({ current: { min: "3 uA", max: "180 mA" }, supply: { voltage: "3.0 V" }, drop: { max: "60 mV" } });
const plan = solve(logger).rangePlan;

describe("a range plan as one instrument across the span", () => {
  if (!plan) throw new Error("no plan");

  it("uses range k up to its switch-up point, then the next", () => {
    const up = plan.switchPoints[0]?.upA ?? NaN;
    expect(rangeInUse(plan, logger.current.min)).toBe(0);
    expect(rangeInUse(plan, up)).toBe(0);
    expect(rangeInUse(plan, up * 1.01)).toBe(1);
    expect(rangeInUse(plan, logger.current.max)).toBe(plan.ranges.length - 1);
  });

  it("drops I·(R + Ron) on the load (Ohm's law, constant-current load) and stays within the allowed drop", () => {
    const ron = logger.rangeSwitch.onResistance;
    const curve = planCurve(logger, plan, 40);
    expect(curve[0]?.currentA).toBe(3e-6);
    expect(curve.at(-1)?.currentA).toBe(0.18);
    for (const p of curve) {
      const r = plan.ranges[p.range];
      if (!r) throw new Error("no range");
      expect(p.burdenV).toBeCloseTo(p.currentA * (r.shuntOhms + ron), 12);
      expect(p.loadVoltageV).toBeCloseTo(3 - p.burdenV, 12);
      expect(p.burdenV).toBeLessThanOrEqual(0.06 * (1 + 1e-9));
      expect(p.worstPercent).toBeGreaterThan(0);
    }
    // Every range takes part.
    expect(new Set(curve.map((p) => p.range)).size).toBe(plan.ranges.length);
  });
});
