// Feasibility of one (shunt, gain) pair, shared by the sweep and evaluateCandidate so the
// two can never disagree. Per-shunt figures are computed once per value, per-gain once per gain.
import { type Model, inputNoiseDensity, noiseBandwidth, offsetTermA, operatingBurden, ratingFor, signalBandwidth, thetaFor } from "./model";

/** Constraint order: a rejected pair is counted under the first one it fails. */
export const rejectReasons = ["drop", "output", "counts", "power", "bandwidth", "accuracy", "deadZone"] as const;
export type RejectReason = (typeof rejectReasons)[number];

export const rejectReasonLabels: Record<RejectReason, string> = {
  drop: "Drop over the limit, or load voltage under its minimum",
  output: "Output beyond the readout's full scale or the amplifier's swing",
  counts: "Too few readout counts at the minimum current",
  power: "Dissipation beyond the largest power rating on offer",
  bandwidth: "Bandwidth short of the requirement",
  accuracy: "Accuracy target missed in the accuracy band",
  deadZone: "Dead zone (output stuck at its floor) above the minimum current",
};

export const BIT_DROP = 1;
export const BIT_OUTPUT = 2;
export const BIT_COUNTS = 4;
export const BIT_POWER = 8;
export const BIT_BANDWIDTH = 16;
export const BIT_ACCURACY = 32;
export const BIT_DEADZONE = 64;

/** Figures that depend on the shunt alone. */
export type ShuntFigures = {
  dropFails: boolean;
  /** Chosen rating, NaN when no offered rating covers the dissipation. */
  rating: number;
  theta: number;
  /** Offset-type error, A. */
  offsetA: number;
  /** Input noise density divided by R, A/√Hz. */
  noisePerR: number;
};

const slack = 1 + 1e-12;

export function shuntFigures(m: Model, R: number): ShuntFigures {
  const burden = operatingBurden(m, R);
  const dropFails =
    !(burden <= m.dropMax * slack) || m.iMax * R > m.dropMax * slack || m.vBus - burden < m.loadMin / slack;
  const rating = ratingFor(m, m.iMax * m.iMax * R);
  return {
    dropFails,
    rating,
    theta: thetaFor(m, rating),
    offsetA: offsetTermA(m, R),
    noisePerR: inputNoiseDensity(m, R) / R,
  };
}

/** √(noise bandwidth) at gain G, √Hz. */
export function sqrtNoiseBandwidth(m: Model, G: number): number {
  return Math.sqrt(noiseBandwidth(m, G));
}

/** Current-independent error at a pair, A: offset-type + ½ LSB + crest·noise. */
export function fixedErrorA(m: Model, R: number, G: number, offsetA: number, noisePerR: number, sqrtNbw: number): number {
  return offsetA + m.lsbV / (2 * R * G) + m.crest * noisePerR * sqrtNbw;
}

/** Worst-case error at I as a ratio of reading, from the pair's fixed error. */
export function worstRatioAt(m: Model, R: number, theta: number, fixedA: number, I: number): number {
  return m.gainConst + m.alphaR * I * I * R * theta + fixedA / I;
}

/**
 * Bitmask of every failed constraint (bit k = rejectReasons[k]). `out[0]` receives the
 * worst-case error at Imin as a ratio of reading.
 */
export function pairMask(m: Model, R: number, G: number, sf: ShuntFigures, sqrtNbw: number, out: Float64Array): number {
  const rg = R * G;
  let mask = sf.dropFails ? BIT_DROP : 0;
  if (m.iMax * rg > m.outCeil * slack) mask |= BIT_OUTPUT;
  if ((m.iMin * rg) / m.lsbV < m.countsAtMin / slack) mask |= BIT_COUNTS;
  if (Number.isNaN(sf.rating)) mask |= BIT_POWER;
  if (signalBandwidth(m, G) < m.bwReq / slack) mask |= BIT_BANDWIDTH;
  const fixedA = fixedErrorA(m, R, G, sf.offsetA, sf.noisePerR, sqrtNbw);
  // a + b·I² + c/I is convex in I, so its largest value over the band is at an end.
  const lo = worstRatioAt(m, R, sf.theta, fixedA, m.bandLo);
  const hi = worstRatioAt(m, R, sf.theta, fixedA, m.bandHi);
  if (lo > m.accRatio * slack || hi > m.accRatio * slack) mask |= BIT_ACCURACY;
  if (m.swingLow / rg > m.iMin * slack) mask |= BIT_DEADZONE;
  out[0] = worstRatioAt(m, R, sf.theta, fixedA, m.iMin);
  return mask;
}

export function firstReasonIndex(mask: number): number {
  return 31 - Math.clz32(mask & -mask);
}

export function reasonsOf(mask: number): RejectReason[] {
  const out: RejectReason[] = [];
  rejectReasons.forEach((r, k) => {
    if (mask & (1 << k)) out.push(r);
  });
  return out;
}
