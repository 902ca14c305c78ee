// Adjusting a proposed range plan: the pairs one range could use on its own sub-span, and
// moving a switch point. Whether the adjusted plan is sound stays evaluatePlan's call.
import { buildModel, operatingBurden, resolvableStepA } from "./model";
import { pairMask, reasonsOf, type RejectReason } from "./pair";
import type { PlanChoice, PlanRangeChoice } from "./plan-choice";
import { rangeScore, subModel, SWITCH_DOWN_FRACTION, type RangePlan } from "./range-plan";
import type { Requirement } from "./requirement";
import { sweepGrid, sweepValues } from "./sweep";
import { formatSI } from "./format";

/** A pair one range could use, with the figures that tell ranges apart. */
export type RangeCandidate = {
  shuntOhms: number;
  gain: number;
  /** Drop of the range's path (shunt and switch) at its own top, in the requirement's load model, V. */
  worstBurdenV: number;
  /** Resolvable steps at the range's bottom current. */
  countsAtBottom: number;
  /** Worst-case error at the range's bottom current, % of reading. */
  errorAtBottomPercent: number;
  /** The plan's ranking score on this range (lower first; range-plan.ts rangeScore). */
  score: number;
  feasible: boolean;
};

export type RangeCandidates = {
  rangeIndex: number;
  minA: number;
  maxA: number;
  /** Pairs swept on this sub-span and how many of them are feasible there. */
  evaluated: number;
  feasibleCount: number;
  /** The best feasible pairs, ranked as the plan's own pick is. */
  candidates: RangeCandidate[];
  /**
   * The pair the range has now, with its figures (feasible or not), its place in the ranking
   * (null: not feasible) and the constraints it fails on this sub-span.
   */
  current: RangeCandidate & { rank: number | null; reasons: RejectReason[] };
};

/** Default number of pairs listed per range: enough to choose from, short enough to read on a phone. */
export const RANGE_CANDIDATES_LISTED = 8;

/** The plan as the designer saves it: pairs, sub-spans and switch points, without the figures. */
export function planChoiceOf(plan: RangePlan): PlanChoice {
  return {
    ranges: plan.ranges.map(({ minA, maxA, shuntOhms, gain }) => ({ minA, maxA, shuntOhms, gain })),
    switchPoints: plan.switchPoints.map(({ upA, downA }) => ({ upA, downA })),
  };
}

/**
 * Every feasible pair on range k's own sub-span [minA, maxA] (drop and rating at its top with the
 * switch in series, counts and dead zone at its bottom, accuracy on its part of the band), best first.
 */
export function rangeCandidates(
  req: Requirement,
  plan: PlanChoice,
  k: number,
  limit = RANGE_CANDIDATES_LISTED,
): RangeCandidates {
  const range = plan.ranges[k];
  if (!range) throw new RangeError(`No range ${k + 1} in a plan of ${plan.ranges.length}`);
  const m = buildModel(req);
  const sub = subModel(req, m, range.minA, range.maxA);
  const values = sweepValues(req);
  const gains = Float64Array.from(req.amplifier.gains);
  const sw = sweepGrid(sub, values, gains);
  const nG = gains.length;
  const ron = req.rangeSwitch.onResistance;
  const figures = (R: number, G: number, errMin: number, feasible: boolean): RangeCandidate => ({
    shuntOhms: R,
    gain: G,
    worstBurdenV: operatingBurden(sub, R + ron),
    countsAtBottom: sub.iMin / resolvableStepA(sub, R, G),
    errorAtBottomPercent: 100 * errMin,
    score: rangeScore(sub, R, G, errMin),
    feasible,
  });
  const ranked: RangeCandidate[] = [];
  for (let p = 0; p < sw.mask.length; p++) {
    if (sw.mask[p] !== 0) continue;
    const i = Math.floor(p / nG);
    ranked.push(figures(values[i] as number, gains[p - i * nG] as number, sw.errMin[p] as number, true));
  }
  // Ties keep sweep order (shunt ascending, then gain), as the plan's own pick does.
  ranked.sort((a, b) => a.score - b.score);
  const same = (c: PlanRangeChoice | RangeCandidate) =>
    Math.abs(c.shuntOhms - range.shuntOhms) <= 1e-9 * range.shuntOhms &&
    Math.abs(c.gain - range.gain) <= 1e-9 * range.gain;
  const at = ranked.findIndex(same);
  const own = pairMask(sub, range.shuntOhms, range.gain);
  const current =
    at >= 0
      ? { ...(ranked[at] as RangeCandidate), rank: at + 1, reasons: [] }
      : {
          ...figures(range.shuntOhms, range.gain, own.errMinRatio, own.mask === 0),
          rank: null,
          reasons: reasonsOf(own.mask),
        };
  return {
    rangeIndex: k,
    minA: range.minA,
    maxA: range.maxA,
    evaluated: sw.mask.length,
    feasibleCount: sw.feasibleCount,
    candidates: ranked.slice(0, limit),
    current,
  };
}

/** Range k of the plan takes another pair; spans and switch points stay. */
export function withRangePair(plan: PlanChoice, k: number, pair: { shuntOhms: number; gain: number }): PlanChoice {
  return {
    ranges: plan.ranges.map((r, i) => (i === k ? { ...r, shuntOhms: pair.shuntOhms, gain: pair.gain } : r)),
    switchPoints: plan.switchPoints,
  };
}

export type MovedPlan = { ok: true; plan: PlanChoice } | { ok: false; path: string; message: string };

/**
 * Move switch point k (between ranges k and k+1) so that it switches up at upA: range k now tops
 * out at upA, the switch back down keeps the engine's hysteresis (SWITCH_DOWN_FRACTION of upA),
 * and range k+1 reads down to that switch-down current. Refused when the ranges would fall out of
 * order; whether each range still works on its new sub-span is evaluatePlan's call.
 */
export function moveSwitchPoint(plan: PlanChoice, k: number, upA: number): MovedPlan {
  const path = `switchPoints.${k}.upA`;
  const lower = plan.ranges[k];
  const upper = plan.ranges[k + 1];
  const label = `Switch point ${k + 1}`;
  if (!lower || !upper) return { ok: false, path, message: `${label}: the plan has no such switch point` };
  if (!Number.isFinite(upA) || upA <= 0)
    return { ok: false, path, message: `${label}: give a current above zero, such as 5 mA` };
  const downA = SWITCH_DOWN_FRACTION * upA;
  if (downA <= lower.minA)
    return {
      ok: false,
      path,
      message: `${label}: switching up at ${formatSI(upA, "A")} would switch back down at ${formatSI(downA, "A")}, at or below the bottom of range ${k + 1} (${formatSI(lower.minA, "A")}); move it above ${formatSI(lower.minA / SWITCH_DOWN_FRACTION, "A")}`,
    };
  if (upA >= upper.maxA)
    return {
      ok: false,
      path,
      message: `${label}: ${formatSI(upA, "A")} is at or above the top of range ${k + 2} (${formatSI(upper.maxA, "A")}); move it below that`,
    };
  const below = plan.switchPoints[k - 1];
  if (below && downA <= below.upA)
    return {
      ok: false,
      path,
      message: `${label}: its switch back down (${formatSI(downA, "A")}) must lie above switch point ${k}'s switch up (${formatSI(below.upA, "A")}), or range ${k + 1} would be skipped`,
    };
  const above = plan.switchPoints[k + 1];
  if (above && upA >= above.downA)
    return {
      ok: false,
      path,
      message: `${label}: ${formatSI(upA, "A")} must lie below switch point ${k + 2}'s switch back down (${formatSI(above.downA, "A")}), or range ${k + 2} would be skipped`,
    };
  return {
    ok: true,
    plan: {
      ranges: plan.ranges.map((r, i) => (i === k ? { ...r, maxA: upA } : i === k + 1 ? { ...r, minA: downA } : r)),
      switchPoints: plan.switchPoints.map((s, i) => (i === k ? { upA, downA } : s)),
    },
  };
}
