import { describe, expect, it } from "vitest";
import { benchMeterRanges, meterBesidePlan, planCurve, planStretches, rangeInUse } from "./plan-stretches";
import { planChoiceOf } from "./range-candidates";
import { solve } from "./solve";
import { req } from "./test-helpers";

// docs/model.md §6: the demo logger, 3 µA to 180 mA from a 3.0 V cell, 60 mV allowed.
const logger = req({ current: { min: "3 uA", max: "180 mA" }, supply: { voltage: "3.0 V" }, drop: { max: "60 mV" } });
const plan = planChoiceOf(solve(logger, { diagnose: false }).rangePlan!);
const ron = logger.rangeSwitch.onResistance;

describe("the plan as one instrument across the span", () => {
  const curves = planStretches(logger, plan, 25);

  it("draws each range over its own stretch, the stretches meeting in the hysteresis bands", () => {
    expect(curves.ranges).toHaveLength(plan.ranges.length);
    curves.ranges.forEach((r, k) => {
      expect(r.points[0]!.currentA).toBe(plan.ranges[k]!.minA);
      expect(r.points.at(-1)!.currentA).toBe(plan.ranges[k]!.maxA);
    });
    expect(curves.ranges[0]!.points[0]!.currentA).toBe(3e-6);
    expect(curves.ranges.at(-1)!.points.at(-1)!.currentA).toBe(0.18);
    expect(curves.switchPoints).toEqual(plan.switchPoints);
  });

  it("drop and load voltage by Ohm's law on each range's path, shunt and switch in series", () => {
    for (const r of curves.ranges)
      for (const q of r.points) {
        expect(q.burdenV).toBeCloseTo(q.currentA * (r.shuntOhms + ron), 12);
        expect(q.loadVoltageV).toBeCloseTo(3.0 - q.burdenV, 12);
        // Within the allowed drop everywhere on its own stretch.
        expect(q.burdenV).toBeLessThanOrEqual(0.06 * (1 + 1e-9));
      }
    // At the full 180 mA on the top range: 180 mA × (R + Ron), by hand.
    const top = curves.ranges.at(-1)!;
    expect(top.points.at(-1)!.burdenV).toBeCloseTo(0.18 * (top.shuntOhms + ron), 12);
  });

  it("errors bounded below by the readout's half step and the offset, and worst case ≥ RSS", () => {
    for (const r of curves.ranges)
      for (const q of r.points) {
        // A sum of magnitudes is at least their root-sum-square (triangle inequality).
        expect(q.worstPercent).toBeGreaterThanOrEqual(q.rssPercent * (1 - 1e-12));
        // Half an ADC step referred to current, Vfs/(2^bits·R·G)/2 (ideal quantisation), plus the
        // 10 µV offset over R (DEFAULTS.md), are two of the worst-case sum's terms.
        const halfStepA = 2.5 / 2 ** 12 / (r.shuntOhms * r.gain) / 2;
        const offsetA = 10e-6 / r.shuntOhms;
        expect(q.worstPercent).toBeGreaterThanOrEqual((100 * (halfStepA + offsetA)) / q.currentA);
      }
    // At the top of the top range gain-type terms dominate: at least the 0.1 % amplifier gain error plus
    // the 0.5 % shunt tolerance (DEFAULTS.md), within the 2 % target.
    const last = curves.ranges.at(-1)!.points.at(-1)!;
    expect(last.worstPercent).toBeGreaterThanOrEqual(0.6);
    expect(last.worstPercent).toBeLessThanOrEqual(2);
  });
});

describe("a bench meter's ranges beside the plan, same load", () => {
  it("constant-current load: supply less I·R for each meter range, the plan's path at the ranges in use", () => {
    const series = meterBesidePlan(logger, plan, benchMeterRanges, 41);
    const by = Object.fromEntries(series.map((s) => [s.key, s]));
    const at = (key: string, a: number) => by[key]!.points.find((q) => Math.abs(q.currentA - a) <= 1e-12 * a);
    // The typical meter-range resistances of DESIGN.md §1 (common practice, no source); Ohm's law at 180 mA.
    expect(at("milliamps", 0.18)!.loadVoltageV).toBeCloseTo(3.0 - 0.18 * 1.9, 12); // 2.658 V
    expect(at("amps", 0.18)!.loadVoltageV).toBeCloseTo(3.0 - 0.018, 12);
    // 180 mA through 100 Ω would need 18 V: no operating point, left out.
    expect(at("microamps", 0.18)).toBeUndefined();
    expect(at("microamps", 3e-6)!.loadVoltageV).toBeCloseTo(3.0 - 3e-6 * 100, 12);
    const top = plan.ranges.at(-1)!;
    expect(at("plan", 0.18)!.loadVoltageV).toBeCloseTo(3.0 - 0.18 * (top.shuntOhms + ron), 12);
    // The plan leaves the load more than the milliamp range at full current, and more than the microamp
    // range at the bottom; the amps range drops less there (0.1 Ω against the top range's path), but
    // cannot resolve 3 µA. Everywhere the plan stays within its 60 mV.
    expect(at("plan", 0.18)!.loadVoltageV).toBeGreaterThan(at("milliamps", 0.18)!.loadVoltageV);
    expect(at("plan", 3e-6)!.loadVoltageV).toBeGreaterThan(at("microamps", 3e-6)!.loadVoltageV);
    for (const q of by.plan!.points) expect(q.loadVoltageV).toBeGreaterThanOrEqual(3.0 - 0.06 * (1 + 1e-9));
    expect(by.plan!.points).toHaveLength(41);
  });

  it("inside a hysteresis band the plan shows the worse of the two ranges that may be in use", () => {
    const s = plan.switchPoints[0]!;
    const mid = Math.sqrt(s.upA * s.downA);
    const r = req({ current: { min: mid, max: 0.18 }, supply: { voltage: "3.0 V" }, drop: { max: "60 mV" } });
    // Same plan, same switch: ask at exactly `mid` (the span's bottom).
    const series = meterBesidePlan({ ...r, rangeSwitch: logger.rangeSwitch }, plan, [], 2);
    const first = series.find((x) => x.key === "plan")!.points[0]!;
    expect(first.currentA).toBe(mid);
    const low = plan.ranges[0]!.shuntOhms + ron;
    const high = plan.ranges[1]!.shuntOhms + ron;
    expect(low).toBeGreaterThan(high);
    expect(first.loadVoltageV).toBeCloseTo(3.0 - mid * low, 12);
  });

  it("resistive load: the current itself falls, V·RL/(RL + R) at the load (voltage divider)", () => {
    const r = { ...logger, load: { ...logger.load, model: "resistive" as const } };
    const series = meterBesidePlan(r, plan, benchMeterRanges, 41);
    const q = series.find((x) => x.key === "milliamps")!.points.at(-1)!;
    // RL = 3.0 V / 180 mA = 16.667 Ω; 3.0 · 16.667 / (16.667 + 1.9) = 2.6930 V (by hand).
    expect(q.loadVoltageV).toBeCloseTo((3.0 * (3.0 / 0.18)) / (3.0 / 0.18 + 1.9), 9);
    expect(q.loadVoltageV).toBeCloseTo(2.693, 3);
  });
});

describe("the plan along the span, the range in use on a rising current", () => {
  it("uses range k up to its switch-up point, then the next", () => {
    const up = plan.switchPoints[0]?.upA ?? NaN;
    expect(rangeInUse(plan, logger.current.min)).toBe(0);
    expect(rangeInUse(plan, up)).toBe(0);
    expect(rangeInUse(plan, up * 1.01)).toBe(1);
    expect(rangeInUse(plan, logger.current.max)).toBe(plan.ranges.length - 1);
  });

  it("drops I·(R + Ron) on the load (Ohm's law, constant-current load) and stays within the allowed drop", () => {
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

  it("agrees with the stretches where both read the same range at the same current (the span's ends)", () => {
    const curve = planCurve(logger, plan, 40);
    const stretches = planStretches(logger, plan, 25);
    const first = stretches.ranges[0]!.points[0]!;
    const last = stretches.ranges.at(-1)!.points.at(-1)!;
    // The lowest range starts at the span's minimum and the top one ends at its maximum.
    expect(first.currentA).toBe(logger.current.min);
    expect(last.currentA).toBe(logger.current.max);
    expect(curve[0]).toEqual({ ...first, range: 0 });
    expect(curve.at(-1)).toEqual({ ...last, range: plan.ranges.length - 1 });
  });
});
