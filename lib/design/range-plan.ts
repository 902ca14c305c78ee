// A multi-range plan for spans too wide for one shunt and gain: two or three ranges, each
// feasible on its own sub-span, overlapping so that switching has hysteresis.
import { signalBandwidth, type Model } from "./model";
import { pairMask } from "./pair";
import type { Requirement } from "./requirement";
import type { SweepArrays } from "./sweep";
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
    const lo = Math.max(req.accuracy.bandMin, pick.bottom);
    const hi = Math.min(req.accuracy.bandMax, top);
    // Outside the accuracy band nothing is asked of accuracy: a zero-width band at the top passes.
    const band = lo <= hi ? { bandLo: lo, bandHi: hi } : { bandLo: top, bandHi: top, accRatio: Infinity };
    const sub: Model = { ...m, iMax: top, iMin: pick.bottom * (1 + 1e-12), ...band };
    if (pairMask(sub, R, G).mask === 0) return pick;
  }
  return null;
}

function settlingTime(req: Requirement, m: Model, G: number): number {
  const steps = req.readout.kind === "adc" ? 2 ** req.readout.bits : req.readout.counts;
  return Math.log(2 * steps) / (2 * Math.PI * signalBandwidth(m, G));
}

export function planRanges(req: Requirement, m: Model, sw: SweepArrays): RangePlan | null {
  const nG = sw.gains.length;
  const picked: { pick: Pick; top: number }[] = [];
  let top = m.iMax;
  for (let k = 0; k < MAX_RANGES; k++) {
    const pick = bestRangeBelow(req, m, sw, top);
    if (!pick) return null;
    picked.push({ pick, top });
    if (pick.bottom <= m.iMin * (1 + 1e-9)) break;
    if (k === MAX_RANGES - 1) return null;
    top = pick.bottom / SWITCH_DOWN_FRACTION;
  }
  if (picked.length < 2) return null;
  const ranges: PlannedRange[] = picked
    .map(({ pick, top: t }) => {
      const i = Math.floor(pick.p / nG);
      const R = sw.values[i] as number;
      const G = sw.gains[pick.p - i * nG] as number;
      return {
        minA: pick.bottom <= m.iMin * (1 + 1e-9) ? m.iMin : pick.bottom,
        maxA: t,
        shuntOhms: R,
        gain: G,
        burdenAtTopV: t * R,
        countsAtBottom: (pick.bottom * R * G) / m.lsbV,
        settlingS: settlingTime(req, m, G),
      };
    })
    .reverse();
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
      "Both ranges read within their limits in the overlap, so the reading does not chatter at a boundary.",
    adds:
      "Each range switch (a MOSFET or relay selecting the shunt) puts its on-resistance in series with the measured path: keep it well below the shunt it switches, or count it in the allowed drop, and use make-before-break switching so the load never sees an open circuit. " +
      `After a switch the amplifier needs about ${formatSI(slowest, "s")} to settle within half a readout step; discard readings taken in that time.`,
  };
}
