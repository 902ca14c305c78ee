// A multi-range plan for spans too wide for one shunt and gain: two or three ranges, each
// feasible on its own sub-span, overlapping so that switching has hysteresis.
import { defaultScore, signalBandwidth, type Model } from "./model";
import { pairMask } from "./pair";
import type { Requirement } from "./requirement";
import { sweepGrid, type SweepArrays } from "./sweep";
import { formatSI } from "./units";

/** Switch down once the current falls below this share of the lower range's top. */
export const SWITCH_DOWN_FRACTION = 0.8;
export const MAX_RANGES = 3;

export type PlannedRange = {
  minA: number;
  maxA: number;
  shuntOhms: number;
  gain: number;
  /** Drop across this range's shunt at its own top current, V. */
  burdenAtTopV: number;
  /** Readout counts at this range's bottom current. */
  countsAtBottom: number;
  /** Time for the amplifier to settle within half a readout step after a switch, s. */
  settlingS: number;
};

export type RangePlan = {
  /** Ascending in current; neighbours overlap. */
  ranges: PlannedRange[];
  /** Per boundary (between ranges k and k+1): switch up above upA, back down below downA. */
  switchPoints: { upA: number; downA: number }[];
  switchOver: string;
  adds: string;
};

type Pick = { p: number; bottom: number };
type Span = { p: number; minA: number; maxA: number };

/**
 * The model for one range [lo, hi]: drop, output and rating at its own top, counts and dead
 * zone at its own bottom, accuracy only on the part of the accuracy band inside it.
 */
function subModel(req: Requirement, m: Model, lo: number, hi: number): Model {
  const bLo = Math.max(req.accuracy.bandMin, lo);
  const bHi = Math.min(req.accuracy.bandMax, hi);
  // Outside the accuracy band nothing is asked of accuracy.
  const band = bLo <= bHi ? { bandLo: bLo, bandHi: bHi } : { bandLo: hi, bandHi: hi, accRatio: Infinity };
  return { ...m, iMin: lo, iMax: hi, ...band };
}

/** The best-scoring feasible pair for the range [lo, hi], through the sweep's own loop. */
function bestPairFor(req: Requirement, m: Model, sw: SweepArrays, lo: number, hi: number): number | null {
  const sub = subModel(req, m, lo, hi);
  const s = sweepGrid(sub, sw.values, sw.gains);
  if (s.feasibleCount === 0) return null;
  const nG = sw.gains.length;
  let best = -1;
  let bestScore = Infinity;
  for (let p = 0; p < s.mask.length; p++) {
    if (s.mask[p] !== 0) continue;
    const i = Math.floor(p / nG);
    const R = sw.values[i] as number;
    const score = defaultScore(sub, hi * R, sub.lsbV / (R * (sw.gains[p - i * nG] as number)), s.errMin[p] as number);
    if (score < bestScore) {
      bestScore = score;
      best = p;
    }
  }
  return best >= 0 ? best : null;
}

/** n ranges splitting the span evenly in ratio, each overlapping the one below; null if one has no pair. */
function balancedPlan(req: Requirement, m: Model, sw: SweepArrays, n: number): Span[] | null {
  const ratio = m.iMax / m.iMin;
  const spans: Span[] = [];
  let bottom = m.iMin;
  for (let k = 0; k < n; k++) {
    const top = k === n - 1 ? m.iMax : m.iMin * ratio ** ((k + 1) / n);
    const p = bestPairFor(req, m, sw, bottom, top);
    if (p === null) return null;
    spans.push({ p, minA: bottom, maxA: top });
    bottom = SWITCH_DOWN_FRACTION * top;
  }
  return spans;
}

/** The pair that reaches lowest while staying feasible on [bottom, top]. */
function bestRangeBelow(req: Requirement, m: Model, sw: SweepArrays, top: number): Pick | null {
  const nG = sw.gains.length;
  const bottoms: Pick[] = [];
  for (let i = 0; i < sw.values.length; i++) {
    const R = sw.values[i] as number;
    if (top * R > m.dropMax * (1 + 1e-12)) break; // values ascend: larger shunts drop more
    for (let j = 0; j < nG; j++) {
      const rg = R * (sw.gains[j] as number);
      if (top * rg > m.outCeil) continue;
      const bottom = Math.max(m.iMin, (m.countsAtMin * m.lsbV) / rg, m.swingLow / rg);
      if (bottom < top * SWITCH_DOWN_FRACTION) bottoms.push({ p: i * nG + j, bottom });
    }
  }
  bottoms.sort((a, b) => a.bottom - b.bottom || a.p - b.p);
  for (const pick of bottoms) {
    const i = Math.floor(pick.p / nG);
    const R = sw.values[i] as number;
    const G = sw.gains[pick.p - i * nG] as number;
    if (pairMask(subModel(req, m, pick.bottom * (1 + 1e-12), top), R, G).mask === 0) return pick;
  }
  return null;
}

function settlingTime(req: Requirement, m: Model, G: number): number {
  const steps = req.readout.kind === "adc" ? 2 ** req.readout.bits : req.readout.counts;
  return Math.log(2 * steps) / (2 * Math.PI * signalBandwidth(m, G));
}

/** Greedy from the top: each range reaches as low as any pair allows. Fewest ranges, uneven spans. */
function greedyPlan(req: Requirement, m: Model, sw: SweepArrays): Span[] | null {
  const spans: Span[] = [];
  let top = m.iMax;
  for (let k = 0; k < MAX_RANGES; k++) {
    const pick = bestRangeBelow(req, m, sw, top);
    if (!pick) return null;
    const reachesBottom = pick.bottom <= m.iMin * (1 + 1e-9);
    spans.unshift({ p: pick.p, minA: reachesBottom ? m.iMin : pick.bottom, maxA: top });
    if (reachesBottom) return spans.length >= 2 ? spans : null;
    top = pick.bottom / SWITCH_DOWN_FRACTION;
  }
  return null;
}

/**
 * Two or three ranges covering the span, ascending: an even split in ratio when one works
 * (two ranges first), else the greedy plan; null when three ranges cannot cover it.
 */
export function planRanges(req: Requirement, m: Model, sw: SweepArrays): RangePlan | null {
  let spans: Span[] | null = null;
  for (let n = 2; n <= MAX_RANGES && !spans; n++) spans = balancedPlan(req, m, sw, n);
  spans ??= greedyPlan(req, m, sw);
  if (!spans) return null;
  const nG = sw.gains.length;
  const ranges: PlannedRange[] = spans.map(({ p, minA, maxA }) => {
    const i = Math.floor(p / nG);
    const R = sw.values[i] as number;
    const G = sw.gains[p - i * nG] as number;
    return {
      minA,
      maxA,
      shuntOhms: R,
      gain: G,
      burdenAtTopV: maxA * R,
      countsAtBottom: (minA * R * G) / m.lsbV,
      settlingS: settlingTime(req, m, G),
    };
  });
  const switchPoints = ranges.slice(0, -1).map((r) => ({ upA: r.maxA, downA: SWITCH_DOWN_FRACTION * r.maxA }));
  const pointsText = switchPoints
    .map((s) => `up above ${formatSI(s.upA, "A")}, back down below ${formatSI(s.downA, "A")}`)
    .join("; ");
  const slowest = Math.max(...ranges.map((r) => r.settlingS));
  return {
    ranges,
    switchPoints,
    switchOver:
      `Start on the lowest range. Switch to the next higher range when the current reaches the top of the range in use, and back down only when it falls below ${SWITCH_DOWN_FRACTION * 100} % of that top (${pointsText}). ` +
      (ranges.length === 2
        ? "Both ranges read within their limits in the overlap, so the reading does not chatter at a boundary."
        : `Each pair of neighbouring ranges (all ${ranges.length}) reads within its limits where the two overlap, so the reading does not chatter at a boundary.`),
    adds:
      "Each range switch (a MOSFET or relay selecting the shunt) puts its on-resistance in series with the measured path: keep it well below the shunt it switches, or count it in the allowed drop, and use make-before-break switching so the load never sees an open circuit. " +
      `After a switch the amplifier needs about ${formatSI(slowest, "s")} to settle within half a readout step; discard readings taken in that time.`,
  };
}
