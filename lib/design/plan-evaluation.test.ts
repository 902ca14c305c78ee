import { planChoiceOf } from "./range-candidates";
import { describe, expect, it } from "vitest";
import { seriesValues } from "./eseries";
import { buildModel } from "./model";
import { pairMask } from "./pair";
import type { PlanChoice } from "./plan-choice";
import { evaluatePlan } from "./plan-evaluation";
import { subModel } from "./range-plan";
import type { Requirement } from "./requirement";
import { solve } from "./solve";
import { demoLoggerInput, req } from "./test-helpers";

// docs/model.md §6: the demo soil-moisture logger, 3 µA asleep to 180 mA transmitting, on a 3.0 V cell
// (db/seed uses the same span, supply and allowed drop).
const logger = req(demoLoggerInput);
// The hidden-style case of issue 13: 2 µA–120 mA, 3.0 V, 50 mV, 12-bit ADC at 2.048 V, 4 counts at the bottom.
const hidden = req({
  current: { min: "2 uA", max: "120 mA" },
  supply: { voltage: "3.0 V" },
  drop: { max: "50 mV" },
  readout: { kind: "adc", bits: 12, fullScale: "2.048 V" },
  resolution: { countsAtMin: 4 },
});

function proposed(r: Requirement): PlanChoice {
  const plan = solve(r).rangePlan;
  if (!plan) throw new Error("the engine proposed no plan");
  return planChoiceOf(plan);
}

/** A copy of the plan with one change. */
function edited(plan: PlanChoice, change: (p: PlanChoice) => void): PlanChoice {
  const copy: PlanChoice = structuredClone(plan);
  change(copy);
  return copy;
}

describe("evaluatePlan accepts every plan the engine proposes", () => {
  it.each([
    ["the demo logger, 3 µA–180 mA at 3.0 V, 60 mV", logger],
    ["the hidden-style case, 2 µA–120 mA, 50 mV, 12-bit at 2.048 V", hidden],
  ] as const)("%s", (_name, r) => {
    const plan = proposed(r);
    const e = evaluatePlan(r, plan);
    if (!e.ok) throw new Error(`${e.path}: ${e.message}`);
    expect(e.ranges).toHaveLength(plan.ranges.length);
    const ron = r.rangeSwitch.onResistance;
    // readout step: ADC full scale / 2^bits (ADC textbooks; docs/model.md §3)
    const stepV = r.readout.kind === "adc" ? r.readout.fullScale / 2 ** r.readout.bits : NaN;
    e.ranges.forEach((x, k) => {
      const c = plan.ranges[k];
      if (!c) throw new Error("missing range");
      expect(x.feasible).toBe(true);
      expect(x.reasons).toEqual([]);
      // Ohm's law at the range's top, constant-current load: drop I·R, with the switch I·(R + Ron).
      expect(x.burdenV).toBeCloseTo(c.maxA * c.shuntOhms, 12);
      expect(x.worstBurdenV).toBeCloseTo(c.maxA * (c.shuntOhms + ron), 12);
      expect(x.worstBurdenV).toBeLessThanOrEqual(r.drop.max * (1 + 1e-9));
      expect(x.loadVoltageV).toBeCloseTo(r.supply.voltage - c.maxA * (c.shuntOhms + ron), 12);
      // Ideal output I·R·G (transimpedance times current), and Joule's law P = I²·R.
      expect(x.outputAtMaxV).toBeCloseTo(c.maxA * c.shuntOhms * c.gain, 9);
      expect(x.dissipationW).toBeCloseTo(c.maxA * c.maxA * c.shuntOhms, 15);
      expect(x.switchOhms).toBe(ron);
      // Counts at the bottom: Imin over one readout step referred to current, Vstep/(R·G); noise may make the step larger.
      const counts = c.minA / (stepV / (c.shuntOhms * c.gain));
      expect(x.countsAtBottom).toBeLessThanOrEqual(counts * (1 + 1e-9));
      expect(x.countsAtBottom).toBeGreaterThanOrEqual(r.resolution.countsAtMin * (1 - 1e-9));
      // A lower range's shunt carries at most the allowed drop's worth, dropMax/(R + Ron), until the bypass closes.
      const fault = k < plan.ranges.length - 1 ? r.drop.max / (c.shuntOhms + ron) : c.maxA;
      expect(x.faultCurrentA).toBeCloseTo(fault, 12);
      // ...and its rating covers I²·R at that current after derating (half the rating: common practice, no source).
      expect(fault * fault * c.shuntOhms).toBeLessThanOrEqual(x.ratingW * r.shunt.derating);
      // Bench rows: expected output I·R·G at each row, inside its band, at the range's ends.
      for (const row of x.benchCheck) {
        expect(row.expectedV).toBeCloseTo(row.currentA * c.shuntOhms * c.gain, 12);
        expect(row.minV).toBeLessThanOrEqual(row.expectedV);
        expect(row.maxV).toBeGreaterThanOrEqual(row.expectedV);
      }
      expect(x.benchCheck[0]?.currentA).toBe(c.minA);
      expect(x.benchCheck.at(-1)?.currentA).toBe(c.maxA);
    });
    // Each switch point is read on both sides: the lower range and the upper range both carry a row at it.
    plan.switchPoints.forEach((s, k) => {
      for (const side of [e.ranges[k], e.ranges[k + 1]])
        for (const at of [s.upA, s.downA])
          expect(side?.benchCheck.some((row) => Math.abs(row.currentA - at) <= 1e-12 * at)).toBe(true);
    });
    expect(e.switchPoints).toEqual(plan.switchPoints);
    expect(e.switchRule).toMatch(/hysteresis/);
    expect(e.protection).toMatch(/comparator/);
  });

  it("a switch point moved inside the overlap still passes and the rule names it", () => {
    const plan = edited(proposed(logger), (p) => {
      const s = p.switchPoints[0];
      const hi = p.ranges[1];
      if (s && hi) s.downA = (hi.minA + s.upA) / 2;
    });
    const e = evaluatePlan(logger, plan);
    expect(e.ok).toBe(true);
    if (!e.ok) return;
    expect(e.switchPoints[0]?.downA).toBe(plan.switchPoints[0]?.downA);
    expect(e.ranges[0]?.benchCheck.some((row) => row.currentA === plan.switchPoints[0]?.downA)).toBe(true);
  });

  it("figures of the demo logger's lowest range, by hand", () => {
    const plan = proposed(logger);
    const e = evaluatePlan(logger, plan);
    if (!e.ok) throw new Error(e.message);
    const low = e.ranges[0];
    const c = plan.ranges[0];
    if (!low || !c) throw new Error("no low range");
    // Transimpedance R·G (V/A); one 12-bit step of 2.5 V (the default readout) referred to current.
    expect(low.transimpedanceVPerA).toBeCloseTo(c.shuntOhms * c.gain, 9);
    expect(low.lsbA).toBeCloseTo(2.5 / 4096 / (c.shuntOhms * c.gain), 15);
    // Offset referred to current: the default 10 µV amplifier offset (DEFAULTS.md) over R.
    expect(low.offsetErrorA).toBeCloseTo(logger.amplifier.offset / c.shuntOhms, 15);
  });
});

describe("evaluatePlan refuses an unsound plan, naming the range at fault", () => {
  const plan = proposed(logger);
  const top = plan.ranges.length - 1;
  const refusal = (p: PlanChoice, r: Requirement = logger) => {
    const e = evaluatePlan(r, p);
    if (e.ok) throw new Error("expected a refusal");
    return e;
  };

  it("a shunt outside the sweep (275 is not an E96 value; IEC 60063)", () => {
    const e = refusal(edited(plan, (p) => void (p.ranges[top] && (p.ranges[top].shuntOhms = 0.275))));
    expect(e.path).toBe(`plan.ranges.${top}.shuntOhms`);
    expect(e.rangeIndex).toBe(top);
    expect(e.message).toMatch(/275 mΩ is not among the shunt values/);
  });

  it("a gain outside the sweep", () => {
    const e = refusal(edited(plan, (p) => void (p.ranges[1] && (p.ranges[1].gain = 37))));
    expect(e.path).toBe("plan.ranges.1.gain");
    expect(e.message).toMatch(/gain 37 is not among the gains/);
  });

  it("a range infeasible on its own sub-span, with the failing constraint in words", () => {
    // The middle range's 1.07 Ω on the top range's span: 180 mA · 1.07 Ω ≈ 193 mV, over the 60 mV allowed (Ohm's law).
    const mid = plan.ranges[1];
    if (!mid) throw new Error("no middle range");
    expect(0.18 * mid.shuntOhms).toBeGreaterThan(0.06);
    const e = refusal(
      edited(plan, (p) => {
        const t = p.ranges[top];
        if (t) Object.assign(t, { shuntOhms: mid.shuntOhms, gain: mid.gain });
      }),
    );
    expect(e.path).toBe(`plan.ranges.${top}`);
    expect(e.message).toMatch(/does not work on its own span/);
    expect(e.message).toMatch(/drop over the limit/);
  });

  it("ranges that do not cover the span, at either end", () => {
    const low = refusal(edited(plan, (p) => void (p.ranges[0] && (p.ranges[0].minA = 5e-6))));
    expect(low.path).toBe("plan.ranges.0.minA");
    expect(low.message).toMatch(/do not cover the span.*3 µA/);
    const high = refusal(edited(plan, (p) => void (p.ranges[top] && (p.ranges[top].maxA = 0.15))));
    expect(high.path).toBe(`plan.ranges.${top}.maxA`);
    expect(high.message).toMatch(/180 mA/);
  });

  it("ranges that do not overlap", () => {
    const e = refusal(
      edited(plan, (p) => {
        const a = p.ranges[0];
        const b = p.ranges[1];
        if (a && b) b.minA = a.maxA * 1.1;
      }),
    );
    expect(e.path).toBe("plan.ranges.1.minA");
    expect(e.rangeIndex).toBe(1);
    expect(e.message).toMatch(/do not overlap/);
  });

  it("a switch point outside the overlap", () => {
    const up = refusal(
      edited(plan, (p) => void (p.switchPoints[0] && (p.switchPoints[0].upA = (p.ranges[0]?.maxA ?? 0) * 1.2))),
    );
    expect(up.path).toBe("plan.switchPoints.0.upA");
    expect(up.message).toMatch(/outside the overlap of ranges 1 and 2/);
    const down = refusal(
      edited(plan, (p) => void (p.switchPoints[1] && (p.switchPoints[1].downA = (p.ranges[2]?.minA ?? 0) * 0.5))),
    );
    expect(down.path).toBe("plan.switchPoints.1.downA");
    expect(down.rangeIndex).toBe(1);
  });

  it("switching down at or above switching up", () => {
    const e = refusal(
      edited(plan, (p) => {
        const s = p.switchPoints[0];
        const t = p.ranges[0]?.maxA ?? 0;
        if (s) Object.assign(s, { upA: 0.9 * t, downA: 0.95 * t });
      }),
    );
    expect(e.path).toBe("plan.switchPoints.0.downA");
    expect(e.message).toMatch(/must be below switching up/);
  });

  it("a low range unprotected at the span's full current", () => {
    // Offer only 100 mW parts and allow 6 % of the rating: at most 6 mW in any shunt.
    const r = req({ ...demoLoggerInput, shunt: { ratings: ["100 mW"], derating: 0.06 } });
    const p = proposed(r);
    // Find a pair that works on the middle range's own span but whose shunt would burn before the bypass closes.
    const m = buildModel(r);
    const mid = p.ranges[1];
    if (!mid) throw new Error("no middle range");
    const sub = subModel(r, m, mid.minA, mid.maxA);
    const weak = seriesValues(r.shunt.series, r.shunt.min, r.shunt.max)
      .flatMap((R) => r.amplifier.gains.map((G) => ({ R, G })))
      .find(({ R, G }) => pairMask({ ...sub, clampV: 0 }, R, G).mask === 0 && pairMask(sub, R, G).mask !== 0);
    if (!weak) throw new Error("no such pair in the sweep");
    const e = refusal(
      edited(p, (x) => void (x.ranges[1] && Object.assign(x.ranges[1], { shuntOhms: weak.R, gain: weak.G }))),
      r,
    );
    expect(e.path).toBe("plan.ranges.1");
    expect(e.message).toMatch(/unprotected at the span's full current 180 mA/);
    // Independent arithmetic: fault current 60 mV/(R + Ron) (Ohm's law), its heat I²·R (Joule) beyond 100 mW · 0.06,
    // while at the range's own top the same shunt stays within it.
    const fault = 0.06 / (weak.R + r.rangeSwitch.onResistance);
    expect(fault * fault * weak.R).toBeGreaterThan(0.1 * 0.06);
    expect(mid.maxA * mid.maxA * weak.R).toBeLessThan(0.1 * 0.06);
  });

  it("a plan with one range, or a switch point missing", () => {
    const one = refusal({ ranges: plan.ranges.slice(0, 1), switchPoints: [] });
    expect(one.path).toBe("plan.ranges");
    const missing = refusal({ ranges: plan.ranges, switchPoints: plan.switchPoints.slice(0, 1) });
    expect(missing.path).toBe("plan.switchPoints");
  });
});
