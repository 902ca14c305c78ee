// The engine's check of a range plan a designer saves (API.md v2, "Designs"): every range is
// re-derived from the requirement, and a plan the engine would not propose as sound is refused
// with the range (or switch point) at fault and why, in words.
import { benchCheckAt, type BenchCheckRow } from "./bench-check";
import { candidateDetailWith, gainInSweep, shuntInSweep } from "./candidate";
import { formatSI } from "./format";
import { buildModel, ratingFor, type Model } from "./model";
import { pairMask, reasonsOf, rejectReasonLabels, shuntFigures } from "./pair";
import type { PlanChoice, PlanRangeChoice, SwitchPoint } from "./plan-choice";
import { plannedRange, protectionText, subModel, type PlannedRange } from "./range-plan";
import type { Requirement } from "./requirement";
import type { CandidateDetail } from "./types";

/**
 * One range's figures: the pair's candidate figures on its own sub-span (switch in series, a lower
 * range rated for the current at which its protection closes), the plan's per-range figures, and
 * the bench rows at its ends and at the switch points it takes part in.
 */
export type PlanRangeMetrics = CandidateDetail & PlannedRange & { benchCheck: BenchCheckRow[] };

/** A plan design's saved figures (API.md v2: `metrics` is `{ ranges: [...] }`, plus the rule and protection in words). */
export type PlanMetrics = {
  ranges: PlanRangeMetrics[];
  /** When the instrument changes range, with the hysteresis, in words. */
  switchRule: string;
  /** How a lower range survives the span's full current, in words. */
  protection: string;
};

export type PlanEvaluation =
  | ({ ok: true; switchPoints: SwitchPoint[] } & PlanMetrics)
  | {
      ok: false;
      /** The range at fault (0-based); for a switch point, the lower range of its boundary. */
      rangeIndex: number;
      /** Dotted path of the field at fault, e.g. "plan.ranges.1.shuntOhms". */
      path: string;
      message: string;
    };

type Refusal = Extract<PlanEvaluation, { ok: false }>;

/** Equal within rounding: quantities arrive as strings ("3 uA") or numbers derived from them. */
const REL = 1e-9;
const atMost = (a: number, b: number) => a <= b * (1 + REL);
const same = (a: number, b: number) => Math.abs(a - b) <= REL * Math.max(Math.abs(a), Math.abs(b));

const amps = (x: number) => formatSI(x, "A");
const rangeName = (k: number, r: PlanRangeChoice) => `Range ${k + 1} (${amps(r.minA)} to ${amps(r.maxA)})`;
const pairName = (r: PlanRangeChoice) => `${formatSI(r.shuntOhms, "Ω")} at gain ${r.gain}`;

function refuse(rangeIndex: number, path: string, message: string): Refusal {
  return { ok: false, rangeIndex, path, message };
}

/** The spans alone: ascending, covering the requirement's span, neighbours overlapping. */
function checkSpans(m: Model, ranges: PlanRangeChoice[]): Refusal | null {
  const last = ranges.length - 1;
  for (let k = 0; k <= last; k++) {
    const r = ranges[k] as PlanRangeChoice;
    if (!(r.minA < r.maxA))
      return refuse(k, `plan.ranges.${k}.maxA`, `${rangeName(k, r)}: the maximum must be above the minimum`);
  }
  const first = ranges[0] as PlanRangeChoice;
  const top = ranges[last] as PlanRangeChoice;
  if (!same(first.minA, m.iMin))
    return refuse(
      0,
      "plan.ranges.0.minA",
      `The ranges do not cover the span: range 1 starts at ${amps(first.minA)}, not at the minimum current ${amps(m.iMin)}`,
    );
  if (!same(top.maxA, m.iMax))
    return refuse(
      last,
      `plan.ranges.${last}.maxA`,
      `The ranges do not cover the span: the top range ends at ${amps(top.maxA)}, not at the maximum current ${amps(m.iMax)}`,
    );
  for (let k = 0; k < last; k++) {
    const lo = ranges[k] as PlanRangeChoice;
    const hi = ranges[k + 1] as PlanRangeChoice;
    if (!(hi.minA > lo.minA && hi.maxA > lo.maxA))
      return refuse(
        k + 1,
        `plan.ranges.${k + 1}`,
        `Ranges must ascend in current: ${rangeName(k + 1, hi)} does not lie above ${rangeName(k, lo)}`,
      );
    if (!(hi.minA < lo.maxA))
      return refuse(
        k + 1,
        `plan.ranges.${k + 1}.minA`,
        `${rangeName(k, lo)} and ${rangeName(k + 1, hi)} do not overlap: range ${k + 2} must reach below ${amps(lo.maxA)} so that switching has hysteresis`,
      );
  }
  return null;
}

/** Each switch point inside its boundary's overlap, down below up. */
function checkSwitchPoints(ranges: PlanRangeChoice[], points: SwitchPoint[]): Refusal | null {
  for (let k = 0; k < points.length; k++) {
    const { upA, downA } = points[k] as SwitchPoint;
    const lo = ranges[k] as PlanRangeChoice;
    const hi = ranges[k + 1] as PlanRangeChoice;
    const overlap = `the overlap of ranges ${k + 1} and ${k + 2}, ${amps(hi.minA)} to ${amps(lo.maxA)}`;
    const at = `plan.switchPoints.${k}`;
    if (!(atMost(hi.minA, upA) && atMost(upA, lo.maxA)))
      return refuse(k, `${at}.upA`, `Switch point ${k + 1}: switching up at ${amps(upA)} lies outside ${overlap}`);
    if (!(atMost(hi.minA, downA) && atMost(downA, lo.maxA)))
      return refuse(
        k,
        `${at}.downA`,
        `Switch point ${k + 1}: switching down at ${amps(downA)} lies outside ${overlap}`,
      );
    if (!(downA < upA))
      return refuse(
        k,
        `${at}.downA`,
        `Switch point ${k + 1}: switching down at ${amps(downA)} must be below switching up at ${amps(upA)}, or the range chatters`,
      );
  }
  return null;
}

/** One range's pair: in the sweep, working on its own sub-span, and surviving the full current. */
function checkRange(req: Requirement, m: Model, ranges: PlanRangeChoice[], k: number): Refusal | null {
  const r = ranges[k] as PlanRangeChoice;
  const isTop = k === ranges.length - 1;
  if (!shuntInSweep(req, r.shuntOhms))
    return refuse(
      k,
      `plan.ranges.${k}.shuntOhms`,
      `${rangeName(k, r)}: ${formatSI(r.shuntOhms, "Ω")} is not among the shunt values the requirement sweeps (${req.shunt.series}, ${formatSI(req.shunt.min, "Ω")} to ${formatSI(req.shunt.max, "Ω")})`,
    );
  if (!gainInSweep(req, r.gain))
    return refuse(
      k,
      `plan.ranges.${k}.gain`,
      `${rangeName(k, r)}: gain ${r.gain} is not among the gains the requirement sweeps (${req.amplifier.gains.join(", ")})`,
    );
  const sub = subModel(req, m, r.minA, r.maxA);
  // Its own span first, without the protection's duty, so the two failures read apart.
  const own = pairMask({ ...sub, clampV: 0 }, r.shuntOhms, r.gain).mask;
  if (own !== 0) {
    const why = reasonsOf(own).map((x) => rejectReasonLabels[x].toLowerCase());
    return refuse(
      k,
      `plan.ranges.${k}`,
      `${rangeName(k, r)} with ${pairName(r)} does not work on its own span (its ${formatSI(sub.switchOhms, "Ω")} range switch in series): ${why.join("; ")}`,
    );
  }
  if (isTop) return null;
  const protectedMask = pairMask(sub, r.shuntOhms, r.gain).mask;
  if (protectedMask === 0) return null;
  // Until the bypass closes at the allowed drop, the shunt carries dropMax/(R + Ron) (Ohm's law), I²·R (Joule).
  const fault = m.dropMax / (r.shuntOhms + sub.switchOhms);
  const powerW = fault * fault * r.shuntOhms;
  const sf = shuntFigures(sub, r.shuntOhms);
  const cause = Number.isNaN(ratingFor(sub, powerW))
    ? "more than any power rating on offer covers at the hottest ambient after derating"
    : sf.hot
      ? "enough to heat it past its maximum temperature"
      : `and then fails: ${reasonsOf(protectedMask)
          .map((x) => rejectReasonLabels[x].toLowerCase())
          .join("; ")}`;
  return refuse(
    k,
    `plan.ranges.${k}`,
    `${rangeName(k, r)} is unprotected at the span's full current ${amps(m.iMax)}: until the bypass closes at the allowed ${formatSI(m.dropMax, "V")}, its ${formatSI(r.shuntOhms, "Ω")} shunt carries ${amps(fault)} (${formatSI(powerW, "W")}), ${cause}`,
  );
}

/** Bench rows for one range: its ends and both switch points of every boundary it shares. */
function benchPoints(
  req: Requirement,
  ranges: PlanRangeChoice[],
  points: SwitchPoint[],
  k: number,
): { label: string; currentA: number }[] {
  const r = ranges[k] as PlanRangeChoice;
  const raw: { label: string; currentA: number }[] = [{ label: "Bottom of the range", currentA: r.minA }];
  const below = points[k - 1];
  if (below) {
    raw.push({ label: `Switch point ${k}, switching down`, currentA: below.downA });
    raw.push({ label: `Switch point ${k}, switching up`, currentA: below.upA });
  }
  const t = req.current.typical;
  if (t !== undefined && t >= r.minA && t <= r.maxA) raw.push({ label: "Typical current", currentA: t });
  const above = points[k];
  if (above) {
    raw.push({ label: `Switch point ${k + 1}, switching down`, currentA: above.downA });
    raw.push({ label: `Switch point ${k + 1}, switching up`, currentA: above.upA });
  }
  raw.push({ label: "Top of the range", currentA: r.maxA });
  raw.sort((a, b) => a.currentA - b.currentA);
  // One row per current: a switch point at a range's end is the same reading.
  const out: { label: string; currentA: number }[] = [];
  for (const p of raw) {
    const prev = out[out.length - 1];
    if (prev && same(prev.currentA, p.currentA)) prev.label = `${prev.label}; ${p.label.toLowerCase()}`;
    else out.push({ ...p });
  }
  return out;
}

function switchRuleText(points: SwitchPoint[]): string {
  const steps = points.map(
    ({ upA, downA }, k) =>
      `from range ${k + 1} to range ${k + 2} when the current rises above ${amps(upA)}, back to range ${k + 1} when it falls below ${amps(downA)} (hysteresis ${amps(upA - downA)})`,
  );
  return `Start on range 1. Switch ${steps.join("; ")}. Between the two points of a boundary both ranges read within their limits, so the reading does not chatter.`;
}

/** Re-derive every range of a saved plan from the engine, or say which range is at fault and why. */
export function evaluatePlan(req: Requirement, plan: PlanChoice): PlanEvaluation {
  const m = buildModel(req);
  const { ranges, switchPoints } = plan;
  if (ranges.length < 2)
    return refuse(0, "plan.ranges", "A plan has at least two ranges; a single pair is saved as a choice");
  if (switchPoints.length !== ranges.length - 1)
    return refuse(0, "plan.switchPoints", "Give one switch point between each pair of neighbouring ranges");
  const refusal =
    checkSpans(m, ranges) ??
    checkSwitchPoints(ranges, switchPoints) ??
    ranges.reduce<Refusal | null>((found, _r, k) => found ?? checkRange(req, m, ranges, k), null);
  if (refusal) return refusal;
  const last = ranges.length - 1;
  const planned = ranges.map((r, k) => plannedRange(req, m, r, k === last));
  const metrics = ranges.map((r, k) => {
    const sub = subModel(req, m, r.minA, r.maxA);
    const choice = { shuntOhms: r.shuntOhms, gain: r.gain };
    return {
      ...candidateDetailWith(req, sub, choice),
      ...(planned[k] as PlannedRange),
      benchCheck: benchCheckAt(req, sub, choice, benchPoints(req, ranges, switchPoints, k)),
    };
  });
  return {
    ok: true,
    ranges: metrics,
    switchPoints: switchPoints.map((p) => ({ ...p })),
    switchRule: switchRuleText(switchPoints),
    protection: protectionText(req, m, planned),
  };
}
