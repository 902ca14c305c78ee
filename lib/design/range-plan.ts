// A multi-range plan for spans too wide for one shunt and gain: two or three ranges, each
// feasible on its own sub-span, overlapping so that switching has hysteresis.
import {
  deadZoneA,
  defaultScore,
  largestRating,
  operatingBurden,
  ratingFor,
  resolvableStepA,
  signalBandwidth,
  worstErrorA,
  type Model,
} from "./model";
import { pairMask, shuntFigures } from "./pair";
import type { Requirement } from "./requirement";
import { sweepGrid, type SweepArrays } from "./sweep";
import { formatSI } from "./format";

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
  /** On-resistance of the element that switches this range in, Ω. */
  switchOhms: number;
  /** Largest drop this range puts on the load while in use (shunt and switch, at its top), V. */
  worstBurdenV: number;
  /**
   * The most current this range's shunt can carry: its own top for the top range; for a lower
   * range, the current at which its path's drop reaches the allowed drop and the protection closes.
   */
  faultCurrentA: number;
  /** What this range's shunt dissipates at faultCurrentA: I²·R, W. */
  faultDissipationW: number;
  /** Power rating chosen for this range's shunt at faultCurrentA (after derating), W. */
  ratingW: number;
  /** Resolvable steps (readout step or noise, the larger) at this range's bottom current. */
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
  /** How a low range survives the span's full current, in words. */
  protection: string;
};

type Pick = { p: number; bottom: number };
type Span = { p: number; minA: number; maxA: number };

/**
 * The model for one range [lo, hi]: drop, output and rating at its own top, counts and dead
 * zone at its own bottom, accuracy only on the part of the accuracy band inside it.
 */
export function subModel(req: Requirement, m: Model, lo: number, hi: number): Model {
  const bLo = Math.max(req.accuracy.bandMin, lo);
  const bHi = Math.min(req.accuracy.bandMax, hi);
  // Outside the accuracy band nothing is asked of accuracy.
  const band = bLo <= bHi ? { bandLo: bLo, bandHi: bHi } : { bandLo: hi, bandHi: hi, accRatio: Infinity };
  // Every range has its switch in series; a range below the top must also be rated for the
  // current at which the protection closes (the path's drop at the allowed drop).
  const top = hi >= m.iMax * (1 - 1e-12);
  return {
    ...m,
    iMin: lo,
    iMax: hi,
    ...band,
    switchOhms: req.rangeSwitch.onResistance,
    clampV: top ? 0 : m.dropMax,
  };
}

/** The score that orders pairs on one range (the plan's own pick and the wizard's candidates alike). */
export function rangeScore(sub: Model, R: number, G: number, errMin: number): number {
  return defaultScore(sub, sub.iMax * R, sub.lsbV / (R * G), errMin);
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
    const score = rangeScore(sub, R, sw.gains[p - i * nG] as number, s.errMin[p] as number);
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
  const ron = req.rangeSwitch.onResistance;
  const atTop = subModel(req, m, top * SWITCH_DOWN_FRACTION, top);
  // The accuracy band's part that can fall inside a range ending at `top`.
  const bandTop = Math.min(top, req.accuracy.bandMax);
  const bandReached = bandTop >= req.accuracy.bandMin;
  for (let i = 0; i < sw.values.length; i++) {
    const R = sw.values[i] as number;
    if (top * (R + ron) > m.dropMax * (1 + 1e-12)) break; // values ascend: larger shunts drop more
    const theta = shuntFigures(atTop, R).theta;
    for (let j = 0; j < nG; j++) {
      const G = sw.gains[j] as number;
      const rg = R * G;
      if (top * rg > m.outCeil) continue;
      // The lowest this pair reads: counts through the noise, or the dead zone with its offset.
      let bottom = Math.max(m.iMin, m.countsAtMin * resolvableStepA(m, R, G), deadZoneA(m, R, G));
      if (bandReached) {
        // Worst-case error is c + I·k(I) with k rising in I: below c/(target − k(top)) the ratio
        // meets the target everywhere up to the band's top (a safe, closed-form bound).
        const c = worstErrorA(atTop, R, G, theta, 0);
        const k = (worstErrorA(atTop, R, G, theta, bandTop) - c) / bandTop;
        if (k >= m.accRatio) continue;
        const accurateFrom = c / (m.accRatio - k);
        if (accurateFrom > req.accuracy.bandMin) bottom = Math.max(bottom, accurateFrom);
      }
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
 * Why no plan exists, in words, when three ranges cannot cover the span: how low the greedy
 * ranges from the top reach, or that no pair works at the top at all.
 */
export function whyNoPlan(req: Requirement, m: Model, sw: SweepArrays): string {
  if (m.signed)
    return "No range plan: ranges switch shunts as the current climbs one way, and this span is bidirectional. Relax a limit below, or split the span.";
  let top = m.iMax;
  const reached: number[] = [];
  for (let k = 0; k < MAX_RANGES; k++) {
    const pick = bestRangeBelow(req, m, sw, top);
    if (!pick) break;
    reached.push(pick.bottom);
    top = pick.bottom / SWITCH_DOWN_FRACTION;
  }
  const ron = formatSI(req.rangeSwitch.onResistance, "Ω");
  if (reached.length === 0)
    return `No range plan: no shunt and gain works even for a range just below ${formatSI(m.iMax, "A")} (with a ${ron} range switch in series), so splitting the span cannot help; relax the requirement at the top (drop, output, accuracy or power).`;
  const lowest = reached[reached.length - 1] as number;
  return `No range plan: ${reached.length === MAX_RANGES ? `${MAX_RANGES} ranges` : `the ranges below ${formatSI(top, "A")} find no pair and`} reach down only to ${formatSI(lowest, "A")}, short of the minimum current ${formatSI(m.iMin, "A")}. Below that, the accuracy target, the counts through the noise, the dead zone or the drop limit (with a ${ron} range switch in series) rule every pair out.`;
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
  const ranges: PlannedRange[] = spans.map(({ p, minA, maxA }, k) => {
    const i = Math.floor(p / nG);
    const R = sw.values[i] as number;
    const G = sw.gains[p - i * nG] as number;
    return plannedRange(req, m, { minA, maxA, shuntOhms: R, gain: G }, k === spans.length - 1);
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
    protection: protectionText(req, m, ranges),
  };
}

/** One range's figures on its own sub-span; `top` is the range that carries the span's full current. */
export function plannedRange(
  req: Requirement,
  m: Model,
  r: { minA: number; maxA: number; shuntOhms: number; gain: number },
  top: boolean,
): PlannedRange {
  const { minA, maxA, shuntOhms: R, gain: G } = r;
  const ron = req.rangeSwitch.onResistance;
  const sub = subModel(req, m, minA, maxA);
  const fault = top ? maxA : m.dropMax / (R + ron);
  return {
    minA,
    maxA,
    shuntOhms: R,
    gain: G,
    burdenAtTopV: maxA * R,
    switchOhms: ron,
    worstBurdenV: operatingBurden(sub, R + ron),
    faultCurrentA: fault,
    faultDissipationW: fault * fault * R,
    ratingW: ratingFor(sub, fault * fault * R) || largestRating(sub),
    countsAtBottom: minA / resolvableStepA(sub, R, G),
    settlingS: settlingTime(req, m, G),
  };
}

/** How the lower ranges survive the span's full current, and what the protecting element carries. */
export function protectionText(req: Requirement, m: Model, ranges: PlannedRange[]): string {
  const topRange = ranges[ranges.length - 1] as PlannedRange;
  const lower = ranges.slice(0, -1);
  const ron = req.rangeSwitch.onResistance;
  const iFull = m.iMax;
  const lowerText = lower
    .map(
      (r) =>
        `the ${formatSI(r.shuntOhms, "Ω")} shunt carries at most ${formatSI(r.faultCurrentA, "A")} (${formatSI(r.faultDissipationW, "W")}, within its ${formatSI(r.ratingW, "W")} rating after derating)`,
    )
    .join("; ");
  return (
    `A lower range's shunt would drop far more than the allowed ${formatSI(m.dropMax, "V")} at the full ${formatSI(iFull, "A")}. ` +
    `A comparator across the shunt in use closes the top range's switch in hardware, without waiting for the firmware, when the drop reaches ${formatSI(m.dropMax, "V")}; ` +
    `the top range (${formatSI(topRange.shuntOhms, "Ω")} and its ${formatSI(ron, "Ω")} switch) then carries the current at no more than ${formatSI(topRange.worstBurdenV, "V")}. ` +
    `Until it closes, ${lowerText}. ` +
    `The top range's switch must carry ${formatSI(iFull, "A")} continuously (${formatSI(iFull * iFull * ron, "W")} in ${formatSI(ron, "Ω")}), and the comparator must act faster than the load's current can rise past the range; for inductive or fast-rising loads add a clamp diode across the lower shunts as a back-up.`
  );
}
