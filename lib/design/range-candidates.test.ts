import { describe, expect, it } from "vitest";
import { evaluatePlan } from "./plan-evaluation";
import { moveSwitchPoint, planChoiceOf, rangeCandidates, withRangePair } from "./range-candidates";
import { solve } from "./solve";
import { demoLoggerInput, req } from "./test-helpers";

// docs/model.md §6: the demo logger, 3 µA asleep to 180 mA transmitting, from a 3.0 V cell.
const logger = req(demoLoggerInput);
// The hidden-style case of issue 13: 2 µA–120 mA, 50 mV, 12-bit.
const hidden = req({
  current: { min: "2 uA", max: "120 mA" },
  supply: { voltage: "3.0 V" },
  drop: { max: "50 mV" },
  readout: { kind: "adc", bits: 12, fullScale: "2.048 V" },
  resolution: { countsAtMin: 4 },
});

describe.each([
  ["the demo logger", logger, 0.06, 2.5, 10],
  ["2 µA–120 mA, 50 mV, 12-bit at 2.048 V", hidden, 0.05, 2.048, 4],
] as const)("each range's own candidates: %s", (_name, r, dropMax, fullScale, counts) => {
  const proposed = solve(r, { diagnose: false }).rangePlan;
  if (!proposed) throw new Error("the engine proposes a plan for this span (range-plan.test.ts)");
  const plan = planChoiceOf(proposed);
  const ron = r.rangeSwitch.onResistance;

  it.each(plan.ranges.map((_, k) => [k]))("range %i: every listed pair works on the range's own sub-span", (k) => {
    const c = rangeCandidates(r, plan, k);
    const range = plan.ranges[k]!;
    // IEC 60063: E96 has 96 values a decade; 1 mΩ..1 kΩ is six decades plus the closing 1 kΩ.
    // Eight gains (DEFAULTS.md). So 577 × 8 pairs are swept on every sub-span.
    expect(c.evaluated).toBe((6 * 96 + 1) * r.amplifier.gains.length);
    expect(c.candidates.length).toBeGreaterThan(0);
    expect(c.feasibleCount).toBeGreaterThanOrEqual(c.candidates.length);
    for (const x of c.candidates) {
      expect(x.feasible).toBe(true);
      // Ohm's law on the path at the range's top, constant-current load: I·(R + Ron) within the allowed drop.
      const drop = range.maxA * (x.shuntOhms + ron);
      expect(x.worstBurdenV).toBeCloseTo(drop, 12);
      expect(drop).toBeLessThanOrEqual(dropMax * (1 + 1e-9));
      // Counts at the bottom: the resolvable step is at least one ADC step Vfs/(2^bits·R·G)
      // (ideal ADC quantisation, any ADC textbook), so counts ≤ Imin·2^bits·R·G/Vfs.
      const idealCounts = (range.minA * 2 ** 12 * x.shuntOhms * x.gain) / fullScale;
      expect(x.countsAtBottom).toBeLessThanOrEqual(idealCounts * (1 + 1e-9));
      expect(x.countsAtBottom).toBeGreaterThanOrEqual(counts * (1 - 1e-9));
    }
    // Ranked best first, and the plan's own pair is the best (the plan picks the best-scoring pair).
    for (let i = 1; i < c.candidates.length; i++)
      expect(c.candidates[i]!.score).toBeGreaterThanOrEqual(c.candidates[i - 1]!.score);
    expect(c.current.feasible).toBe(true);
    expect(c.current.rank).not.toBeNull();
  });
});

describe("adjusting a plan", () => {
  const plan = planChoiceOf(solve(logger, { diagnose: false }).rangePlan!);

  it("moving a switch point moves the lower range's top, and the upper range's bottom to 80 % of it", () => {
    const moved = moveSwitchPoint(plan, 0, 200e-6);
    expect(moved.ok).toBe(true);
    if (!moved.ok) return;
    expect(moved.plan.ranges[0]!.maxA).toBe(200e-6);
    // 80 % of 200 µA is 160 µA (the engine's hysteresis, DEFAULTS.md; arithmetic).
    expect(moved.plan.ranges[1]!.minA).toBeCloseTo(160e-6, 15);
    expect(moved.plan.switchPoints[0]).toEqual({ upA: 200e-6, downA: moved.plan.ranges[1]!.minA });
    // The other range and switch point stay as they were.
    expect(moved.plan.ranges[2]).toEqual(plan.ranges[2]);
    expect(moved.plan.switchPoints[1]).toEqual(plan.switchPoints[1]);
    // The plan it was made from is untouched.
    expect(plan.ranges[0]!.maxA).not.toBe(200e-6);
  });

  it("a switch point moved so far that the low range's pair drops too much leaves that pair infeasible there", () => {
    const moved = moveSwitchPoint(plan, 0, 2e-3);
    expect(moved.ok).toBe(true);
    if (!moved.ok) return;
    const c = rangeCandidates(logger, moved.plan, 0);
    const R = plan.ranges[0]!.shuntOhms;
    // Ohm's law: 2 mA through the low range's tens of ohms plus the switch is far above 60 mV.
    expect(2e-3 * (R + logger.rangeSwitch.onResistance)).toBeGreaterThan(0.06);
    expect(c.current.feasible).toBe(false);
    expect(c.current.rank).toBeNull();
    // Its own candidates there are the smaller shunts that keep 2 mA within 60 mV.
    for (const x of c.candidates)
      expect(2e-3 * (x.shuntOhms + logger.rangeSwitch.onResistance)).toBeLessThanOrEqual(0.06 + 1e-12);
  });

  it("refuses a switch point that would put the ranges out of order, naming the switch point", () => {
    const low = plan.ranges[0]!;
    const tooLow = moveSwitchPoint(plan, 0, low.minA);
    expect(tooLow).toMatchObject({ ok: false, path: "switchPoints.0.upA" });
    expect(!tooLow.ok && tooLow.message).toMatch(/^Switch point 1: .*bottom of range 1/);
    const tooHigh = moveSwitchPoint(plan, 1, 0.2);
    expect(!tooHigh.ok && tooHigh.message).toMatch(
      /^Switch point 2: 200 mA is at or above the top of range 3 \(180 mA\)/,
    );
    // Past the next switch point's switch back down: range 2 would be skipped.
    const crossing = moveSwitchPoint(plan, 0, plan.switchPoints[1]!.downA * 1.01);
    expect(!crossing.ok && crossing.message).toMatch(/range 2 would be skipped/);
    expect(moveSwitchPoint(plan, 0, Number.NaN)).toMatchObject({ ok: false });
    expect(moveSwitchPoint(plan, 5, 1e-3)).toMatchObject({ ok: false, path: "switchPoints.5.upA" });
  });

  it("picking another pair for a range changes that range only", () => {
    const c = rangeCandidates(logger, plan, 1);
    const other = c.candidates.find(
      (x) => x.shuntOhms !== plan.ranges[1]!.shuntOhms || x.gain !== plan.ranges[1]!.gain,
    );
    expect(other).toBeDefined();
    const next = withRangePair(plan, 1, other!);
    expect(next.ranges[1]).toEqual({ ...plan.ranges[1], shuntOhms: other!.shuntOhms, gain: other!.gain });
    expect(next.ranges[0]).toEqual(plan.ranges[0]);
    expect(next.switchPoints).toEqual(plan.switchPoints);
    // On its own sub-span the picked pair is listed, at its rank.
    const after = rangeCandidates(logger, next, 1);
    expect(after.current.rank).toBe(c.candidates.indexOf(other!) + 1);
  });

  it("every adjustment goes back through evaluatePlan: a moved switch point, a refusal, and the pair that mends it", () => {
    expect(evaluatePlan(logger, plan).ok).toBe(true);
    const down = moveSwitchPoint(plan, 0, 100e-6);
    expect(down.ok && evaluatePlan(logger, down.plan).ok).toBe(true);
    const moved = moveSwitchPoint(plan, 0, 300e-6);
    if (!moved.ok) throw new Error(moved.message);
    const low = plan.ranges[0]!;
    // Ohm's law times the gain: 300 µA through the low range's pair would ask for volts more than
    // the 2.5 V full scale (DEFAULTS.md readout) can show.
    expect(300e-6 * low.shuntOhms * low.gain).toBeGreaterThan(2.5);
    const refused = evaluatePlan(logger, moved.plan);
    expect(refused).toMatchObject({ ok: false, rangeIndex: 0, path: "plan.ranges.0" });
    // Range 1's best pair on its new stretch, 3 µA to 300 µA, mends it.
    const best = rangeCandidates(logger, moved.plan, 0).candidates[0]!;
    expect(300e-6 * best.shuntOhms * best.gain).toBeLessThanOrEqual(2.5);
    const mended = evaluatePlan(logger, withRangePair(moved.plan, 0, best));
    expect(mended.ok).toBe(true);
    if (mended.ok) expect(mended.ranges[0]!.maxA).toBe(300e-6);
  });
});
