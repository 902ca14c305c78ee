// When no pair is feasible: which constraints fail and how often, the pairs that come closest
// and by how much, and the smallest single changes to the requirement that make pairs feasible.
// Every suggestion is checked by re-running the sweep with the change applied, never estimated.
import { candidateFigures } from "./candidate";
import { seriesTables } from "./eseries";
import {
  buildModel,
  commonModeScale,
  deadZoneA,
  largestRating,
  operatingBurden,
  outputFloorWorstV,
  outputWorstV,
  resolvableStepA,
  signalBandwidth,
  TOPO_NONINV,
  worstErrorA,
  type Model,
} from "./model";
import { rejectReasons, shuntFigures, type RejectReason } from "./pair";
import { planRanges } from "./range-plan";
import { RANGE_SWITCH_DROP_SHARE, type Requirement } from "./requirement";
import { sweepGrid, sweepValues, type SweepArrays } from "./sweep";
import type { Candidate } from "./types";
import { formatSI } from "./format";

/** How far a pair misses each constraint it fails, as a ratio to that constraint's limit. */
export type Violations = Partial<Record<RejectReason, number>>;

/** What a change gives: single feasible pairs, or (no single pair, but) a plan of switched ranges. */
export type RelaxOutcome = "pairs" | "rangePlan";

export type RelaxSuggestion = {
  /** Dotted path of the requirement field to change. */
  field: string;
  /** The value it had (SI), and the value that makes pairs feasible (SI). */
  from: number;
  to: number;
  /** Feasible pairs with that one change, from a sweep with it applied (0 for a range plan). */
  feasibleCount: number;
  /** Whether the change makes single pairs feasible or only a range plan possible. */
  gives: RelaxOutcome;
  /** Ranges in the plan the change yields (0 when it gives single pairs). */
  rangeCount: number;
  /** The change in words. */
  says: string;
};

export type Diagnosis = {
  /** Every constraint with the number of pairs failing it, each failure counted. */
  failing: Record<RejectReason, number>;
  /** The pairs with the smallest total violation, nearest first. */
  closest: (Candidate & { violations: Violations })[];
  relax: RelaxSuggestion[];
  /** Why no range plan could be made, in words; null when there is a plan or no plan was asked. */
  rangePlan: string | null;
};

/** The closest pairs listed. */
export const CLOSEST_COUNT = 5;
/** At most this many pairs are scored for closeness (those with the fewest failures first). */
const CLOSEST_POOL = 20_000;
/** Relaxation stops trying further fields once its sweeps have examined this many pairs in all: a few seconds at most on the largest grid allowed, as /api/solve answers in the request. */
export const RELAX_PAIR_BUDGET = 20_000_000;

/** Every failure counted, not only the first per pair. */
function failingCounts(sw: SweepArrays): Record<RejectReason, number> {
  const counts = new Int32Array(rejectReasons.length);
  for (let p = 0; p < sw.mask.length; p++) {
    let bits = sw.mask[p] as number;
    while (bits) {
      const k = 31 - Math.clz32(bits & -bits);
      counts[k] = (counts[k] ?? 0) + 1;
      bits &= bits - 1;
    }
  }
  return Object.fromEntries(rejectReasons.map((r, k) => [r, counts[k] ?? 0])) as Record<RejectReason, number>;
}

/** Over by how much, as a share of the limit (0 when within). */
const over = (value: number, limit: number) => (value > limit ? (value - limit) / Math.abs(limit) : 0);
const under = (value: number, need: number) => (value < need ? (need - value) / Math.abs(need) : 0);

/** The violation of every constraint the pair fails, as a ratio to its limit. */
export function pairViolations(m: Model, R: number, G: number, mask: number): Violations {
  const sf = shuntFigures(m, R);
  const v: Violations = {};
  const put = (reason: RejectReason, x: number) => {
    if (mask & (1 << rejectReasons.indexOf(reason))) v[reason] = Number.isFinite(x) && x > 0 ? x : 1;
  };
  const path = R + m.switchOhms;
  const burden = operatingBurden(m, path);
  put(
    "drop",
    Math.max(
      over(Number.isNaN(burden) ? m.vBus : burden, m.dropMax),
      over(Math.max(m.iMax, m.iNeg) * path, m.dropMax),
      under(m.vBus - burden, m.loadMin),
    ),
  );
  const k = commonModeScale(m, G);
  const span = Math.max(m.cmMax - m.cmMin, 1e-9);
  const cmOut = Math.max(0, k * sf.vInHi - m.cmMax, m.cmMin - k * sf.vInLo);
  put("commonMode", m.topology === TOPO_NONINV && m.high ? Math.max(cmOut, m.vBus) / span : cmOut / span);
  const iOp = Number.isNaN(sf.iOp) ? m.iMax : sf.iOp;
  // A signed span's lower end, short of the floor: measured against the window's top (the floor may be 0 V).
  const floorV = outputFloorWorstV(m, R, G, sf.theta);
  put(
    "output",
    Math.max(
      over(outputWorstV(m, R, G, sf.theta, iOp), m.outCeil),
      m.signed ? under(floorV - m.swingLow + m.outCeil, m.outCeil) : 0,
    ),
  );
  put("counts", under(m.iMin / resolvableStepA(m, R, G), m.countsAtMin));
  const need = (iOp * iOp * R) / (m.derating * m.ambientDerate);
  const hot = m.tAmbMax + iOp * iOp * R * sf.theta;
  put("power", Math.max(over(need, largestRating(m)), over(hot, m.maxTempC)));
  put("bandwidth", under(signalBandwidth(m, G), m.bwReq));
  const band = Math.max(
    worstErrorA(m, R, G, sf.theta, m.bandLo) / m.bandLo,
    worstErrorA(m, R, G, sf.theta, m.bandHi) / m.bandHi,
  );
  put("accuracy", over(band, m.accRatio));
  put("deadZone", over(deadZoneA(m, R, G), m.iMin));
  return v;
}

function closestPairs(m: Model, sw: SweepArrays): (Candidate & { violations: Violations })[] {
  const nG = sw.gains.length;
  const n = sw.mask.length;
  // Score the pairs with the fewest failures first; closeness by total violation.
  const byCount: number[][] = rejectReasons.map(() => []);
  for (let p = 0; p < n; p++) {
    let c = 0;
    for (let b = sw.mask[p] as number; b; b &= b - 1) c++;
    if (c > 0) (byCount[c - 1] as number[]).push(p);
  }
  const pool: number[] = [];
  for (const group of byCount) {
    if (pool.length >= CLOSEST_POOL) break;
    const room = CLOSEST_POOL - pool.length;
    // Spread a sample evenly over a group too large to score whole.
    const step = group.length > room ? group.length / room : 1;
    for (let x = 0; x < group.length && pool.length < CLOSEST_POOL; x += step)
      pool.push(group[Math.floor(x)] as number);
  }
  const scored = pool.map((p) => {
    const i = Math.floor(p / nG);
    const R = sw.values[i] as number;
    const G = sw.gains[p - i * nG] as number;
    const violations = pairViolations(m, R, G, sw.mask[p] as number);
    const total = Object.values(violations).reduce((a, b) => a + b, 0);
    return { p, R, G, violations, total };
  });
  scored.sort((a, b) => a.total - b.total || a.p - b.p);
  return scored.slice(0, CLOSEST_COUNT).map(({ R, G, violations }) => ({ ...candidateFigures(m, R, G), violations }));
}

/** E24 steps (IEC 60063) across the decades from lo to hi, ascending, inside (lo, hi]. */
export function e24Ladder(lo: number, hi: number): number[] {
  const out: number[] = [];
  if (!(hi > lo) || !(lo > 0)) return out;
  for (let e = Math.floor(Math.log10(lo)) - 1; e <= Math.ceil(Math.log10(hi)); e++) {
    for (const v of seriesTables.E24) {
      const x = Number((v * 10 ** e).toPrecision(6));
      if (x > lo * (1 + 1e-9) && x <= hi * (1 + 1e-12)) out.push(x);
    }
  }
  return out;
}

/** 1-2-5 steps below hi down to lo, descending. */
function decadeStepsDown(hi: number, lo: number): number[] {
  const out: number[] = [];
  for (let e = Math.ceil(Math.log10(hi)); e >= Math.floor(Math.log10(lo)) - 1; e--) {
    for (const v of [5, 2, 1]) {
      const x = Number((v * 10 ** e).toPrecision(6));
      if (x < hi * (1 - 1e-9) && x >= lo) out.push(x);
    }
  }
  return out;
}

type Relaxable = {
  field: string;
  from: number;
  /** Candidate values, from the smallest change to the largest. */
  steps: number[];
  apply: (r: Requirement, x: number) => Requirement;
  /** The change in words, without what it gives. */
  says: (x: number) => string;
  /** The change alters the shunt values on offer (a trace's length), so each try sweeps them anew. */
  newValues?: true;
};

function pairsWord(n: number): string {
  return `${n.toLocaleString("en")} feasible pair${n === 1 ? "" : "s"}`;
}

/** What the change gives, in words appended to its own. */
function givesWords(o: Outcome): string {
  return o.feasibleCount > 0
    ? ` (${pairsWord(o.feasibleCount)})`
    : ` with a plan of ${o.ranges} switched ranges (no single pair covers it)`;
}

/** 1 %, 0.5 %: a fraction in percent without float noise. */
const pctText = (fraction: number) => `${Number((fraction * 100).toPrecision(4))} %`;

/** Steps below `from` on a fixed ladder, nearest first. */
const below = (from: number, ladder: number[]) => ladder.filter((x) => x < from * (1 - 1e-9)).sort((a, b) => b - a);

/**
 * Shunt tolerances and tempcos as parts are commonly stocked (common practice, no source):
 * metal-strip and foil shunts come down to 0.1 % or better and 50 → 5 ppm/K.
 */
const SHUNT_TOLERANCES = [0.0025, 0.001, 0.0005];
const SHUNT_TEMPCOS = [25e-6, 15e-6, 10e-6, 5e-6];

function relaxables(req: Requirement, m: Model): Relaxable[] {
  const list: Relaxable[] = [];
  const pct = req.accuracy.percent;
  const bandText =
    req.accuracy.bandMin === req.current.min && req.accuracy.bandMax === req.current.max
      ? "over the whole span"
      : `from ${formatSI(req.accuracy.bandMin, "A")} up`;
  list.push({
    field: "accuracy.percent",
    from: pct,
    steps: e24Ladder(pct, 100),
    apply: (r, x) => ({ ...r, accuracy: { ...r.accuracy, percent: x } }),
    says: (x) => `${x} % is reachable ${bandText}`,
  });
  list.push({
    field: "accuracy.bandMin",
    from: req.accuracy.bandMin,
    steps: e24Ladder(req.accuracy.bandMin, req.accuracy.bandMax),
    apply: (r, x) => ({ ...r, accuracy: { ...r.accuracy, bandMin: x } }),
    says: (x) => `${pct} % is reachable from ${formatSI(x, "A")} up`,
  });
  // With a drop fraction the tighter of the two wins, so raising drop.max alone would change nothing.
  if (req.drop.fraction === undefined) {
    // A range switch sized by default takes its share of the drop: it grows with the drop, as a re-read request's would.
    const switchIsDefault =
      Math.abs(req.rangeSwitch.onResistance - (RANGE_SWITCH_DROP_SHARE * req.drop.max) / req.current.max) <=
      1e-12 * req.rangeSwitch.onResistance;
    list.push({
      field: "drop.max",
      from: req.drop.max,
      steps: e24Ladder(req.drop.max, 0.5 * req.supply.voltage),
      apply: (r, x) => ({
        ...r,
        drop: { ...r.drop, max: x },
        rangeSwitch: switchIsDefault
          ? { ...r.rangeSwitch, onResistance: (RANGE_SWITCH_DROP_SHARE * x) / r.current.max }
          : r.rangeSwitch,
      }),
      says: (x) => `allow a drop of ${formatSI(x, "V")}`,
    });
  }
  // The minimum current may rise as far as the accuracy band's start and the typical current.
  const minCap = Math.min(req.accuracy.bandMin, req.current.typical ?? Infinity, req.current.max);
  list.push({
    field: "current.min",
    from: req.current.min,
    steps: e24Ladder(req.current.min, minCap),
    apply: (r, x) => ({ ...r, current: { ...r.current, min: x } }),
    says: (x) => `start the span at ${formatSI(x, "A")}`,
  });
  const counts = req.resolution.countsAtMin;
  list.push({
    field: "resolution.countsAtMin",
    from: counts,
    steps: e24Ladder(Math.min(1, counts / 10), counts)
      .filter((x) => x < counts * (1 - 1e-9) && x >= 1)
      .reverse(),
    apply: (r, x) => ({ ...r, resolution: { ...r.resolution, countsAtMin: x } }),
    says: (x) => `ask for ${x} counts at the minimum current`,
  });
  if (req.readout.kind === "adc") {
    const bits = req.readout.bits;
    const readout = req.readout;
    list.push({
      field: "readout.bits",
      from: bits,
      steps: Array.from({ length: Math.max(0, 24 - bits) }, (_, i) => bits + 1 + i),
      apply: (r, x) => ({ ...r, readout: { ...readout, bits: x } }),
      says: (x) => `use a ${x}-bit ADC`,
    });
  }
  // The band the noise sees now, at the lowest gain: a filter only helps below it.
  const minGain = req.amplifier.gains[0] ?? 1;
  const corner = signalBandwidth(m, minGain);
  const hasFilter = req.amplifier.filterHz !== null;
  list.push({
    field: "amplifier.filterHz",
    from: req.amplifier.filterHz ?? corner,
    steps: decadeStepsDown(corner, Math.max(req.bandwidth.min, 0.1)),
    apply: (r, x) => ({ ...r, amplifier: { ...r.amplifier, filterHz: x } }),
    says: (x) => `${hasFilter ? "lower the output filter to" : "add an output filter at"} ${formatSI(x, "Hz")}`,
  });
  const trace = req.shunt.trace;
  if (trace) {
    // A copper trace's tolerance is its etch and plating and its tempco is copper's: neither is a
    // part to choose. What the designer can change is how long a run the board allows (more ohms).
    list.push({
      field: "shunt.trace.length",
      from: trace.length,
      steps: [1.5, 2, 3, 5].map((k) => trace.length * k),
      apply: (r, x) => ({ ...r, shunt: { ...r.shunt, trace: r.shunt.trace && { ...r.shunt.trace, length: x } } }),
      says: (x) => `allow the trace up to ${formatSI(x, "m")} long at ${formatSI(trace.width, "m")} wide`,
      newValues: true,
    });
    return list;
  }
  list.push({
    field: "shunt.tolerance",
    from: req.shunt.tolerance,
    steps: below(req.shunt.tolerance, SHUNT_TOLERANCES),
    apply: (r, x) => ({ ...r, shunt: { ...r.shunt, tolerance: x } }),
    says: (x) => `use a ${pctText(x)} shunt`,
  });
  list.push({
    field: "shunt.tempco",
    from: req.shunt.tempco,
    steps: below(req.shunt.tempco, SHUNT_TEMPCOS),
    apply: (r, x) => ({ ...r, shunt: { ...r.shunt, tempco: x } }),
    says: (x) => `use a shunt of ${Number((x * 1e6).toPrecision(3))} ppm/K`,
  });
  return list;
}

/** What one change gives: feasible single pairs, else the ranges of a plan (0: none). */
type Outcome = { feasibleCount: number; ranges: number };
const works = (o: Outcome) => o.feasibleCount > 0 || o.ranges > 0;

/**
 * The smallest step whose outcome passes `ok`, by bisection over the steps (feasibility grows
 * with each step: every field here only loosens constraints as it moves). Null when even the
 * last step fails. Each step's outcome is computed once.
 */
function smallestStep(
  steps: number[],
  outcome: (i: number) => Outcome,
  ok: (o: Outcome) => boolean,
): { index: number; outcome: Outcome } | null {
  if (steps.length === 0) return null;
  const last = outcome(steps.length - 1);
  if (!ok(last)) return null;
  let lo = -1; // known to fail (the requirement as it stands)
  let hi = steps.length - 1; // known to pass
  let hiOutcome = last;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    const o = outcome(mid);
    if (ok(o)) {
      hi = mid;
      hiOutcome = o;
    } else lo = mid;
  }
  return { index: hi, outcome: hiOutcome };
}

/** A plan is worked out from several sweeps and a greedy search: charged as this many sweeps (measured: 13–17). */
const PLAN_COST_IN_SWEEPS = 16;

/**
 * The smallest single changes that work, each checked by solving again with it applied: the
 * change that first gives single pairs, and, where a smaller change already allows a plan of
 * switched ranges (the span being too wide for one pair), that one too, marked as a plan.
 */
function relaxations(req: Requirement, m: Model, sw: SweepArrays, tryPlans: boolean): RelaxSuggestion[] {
  const relax: RelaxSuggestion[] = [];
  let budget = RELAX_PAIR_BUDGET;
  const pairs = sw.mask.length;
  for (const r of relaxables(req, m)) {
    if (budget <= 0) break;
    const seen = new Map<number, Outcome>();
    const outcome = (i: number): Outcome => {
      const known = seen.get(i);
      if (known) return known;
      const changed = r.apply(req, r.steps[i] as number);
      const cm = buildModel(changed);
      const values = r.newValues ? sweepValues(changed) : sw.values;
      const s = sweepGrid(cm, values, sw.gains);
      budget -= values.length * sw.gains.length;
      if (s.feasibleCount > 0 || budget <= 0 || !tryPlans) {
        // Out of budget, a plan is not tried: the step counts as failing, so a step reported
        // still works (it was checked) but may not be the smallest. With a plan already, plans are no news.
        const o = { feasibleCount: s.feasibleCount, ranges: 0 };
        if (s.feasibleCount > 0) seen.set(i, o);
        return o;
      }
      budget -= PLAN_COST_IN_SWEEPS * pairs;
      const o = { feasibleCount: 0, ranges: planRanges(changed, cm, s)?.ranges.length ?? 0 };
      seen.set(i, o);
      return o;
    };
    const suggest = (index: number, o: Outcome) => {
      const to = r.steps[index] as number;
      relax.push({
        field: r.field,
        from: r.from,
        to,
        feasibleCount: o.feasibleCount,
        gives: o.feasibleCount > 0 ? "pairs" : "rangePlan",
        rangeCount: o.feasibleCount > 0 ? 0 : o.ranges,
        says: r.says(to) + givesWords(o),
      });
    };
    const first = smallestStep(r.steps, outcome, works);
    if (!first) continue;
    suggest(first.index, first.outcome);
    if (first.outcome.feasibleCount > 0) continue;
    // Only a plan so far: the further change, if any, at which single pairs work.
    const rest = r.steps.slice(first.index + 1);
    const more = smallestStep(
      rest,
      (i) => outcome(first.index + 1 + i),
      (o) => o.feasibleCount > 0,
    );
    if (more) suggest(first.index + 1 + more.index, more.outcome);
  }
  return relax;
}

export function diagnose(req: Requirement, m: Model, sw: SweepArrays, rangePlan: string | null): Diagnosis {
  // With a plan already (no reason given why none exists), only changes that give single pairs are news.
  const tryPlans = rangePlan !== null;
  return {
    failing: failingCounts(sw),
    closest: closestPairs(m, sw),
    relax: relaxations(req, m, sw, tryPlans),
    rangePlan,
  };
}
