// Feasibility of one (shunt, gain) pair, shared by the sweep and evaluateCandidate so the
// two can never disagree. Per-shunt figures are computed once per value, per-gain once per gain.
import {
  type Model,
  inputNoiseDensity,
  noiseBandwidth,
  offsetTermA,
  operatingBurden,
  ratingFor,
  signalBandwidth,
  thetaFor,
} from "./model";

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

/** Figures that depend on the gain alone, for every gain swept. */
export type GainFigures = { gains: Float64Array; bandwidth: Float64Array; sqrtNbw: Float64Array };

export function gainFigures(m: Model, gains: ArrayLike<number>): GainFigures {
  const n = gains.length;
  const g = Float64Array.from(gains);
  const bandwidth = new Float64Array(n);
  const sqrtNbw = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    bandwidth[j] = signalBandwidth(m, g[j] as number);
    sqrtNbw[j] = Math.sqrt(noiseBandwidth(m, g[j] as number));
  }
  return { gains: g, bandwidth, sqrtNbw };
}

/**
 * One shunt value against every gain: writes each pair's bitmask of failed constraints
 * (bit k = rejectReasons[k], 0 = feasible) and its worst-case error at Imin (ratio of
 * reading) from `offset`, counts each rejected pair under its first failure, and returns
 * how many were feasible. One tight loop, plain numbers: this is the sweep's inner loop.
 */
export function sweepRow(
  m: Model,
  R: number,
  sf: ShuntFigures,
  gf: GainFigures,
  mask: Uint8Array,
  errMin: Float64Array,
  offset: number,
  rejected: Int32Array,
): number {
  const { gains, bandwidth, sqrtNbw } = gf;
  const nG = gains.length;
  const rowBits = (sf.dropFails ? BIT_DROP : 0) | (Number.isNaN(sf.rating) ? BIT_POWER : 0);
  // Worst-case ratio at I: gainConst + heat·I² + fixed/I, with fixed the current-independent error (A).
  const heat = m.alphaR * R * sf.theta;
  const gainLo = m.gainConst + heat * m.bandLo * m.bandLo;
  const gainHi = m.gainConst + heat * m.bandHi * m.bandHi;
  const gainMin = m.gainConst + heat * m.iMin * m.iMin;
  const outLimit = m.outCeil * slack;
  const countsNeed = m.countsAtMin / slack;
  const bwNeed = m.bwReq / slack;
  const accLimit = m.accRatio * slack;
  const deadLimit = m.iMin * slack;
  const halfStep = m.lsbV / 2;
  const noiseK = m.crest * sf.noisePerR;
  let feasible = 0;
  for (let j = 0; j < nG; j++) {
    const rg = R * (gains[j] as number);
    let bits = rowBits;
    if (m.iMax * rg > outLimit) bits |= BIT_OUTPUT;
    if ((m.iMin * rg) / m.lsbV < countsNeed) bits |= BIT_COUNTS;
    if ((bandwidth[j] as number) < bwNeed) bits |= BIT_BANDWIDTH;
    const fixedA = sf.offsetA + halfStep / rg + noiseK * (sqrtNbw[j] as number);
    // a + b·I² + c/I is convex in I, so its largest value over the band is at an end.
    if (gainLo + fixedA / m.bandLo > accLimit || gainHi + fixedA / m.bandHi > accLimit) bits |= BIT_ACCURACY;
    if (m.swingLow / rg > deadLimit) bits |= BIT_DEADZONE;
    mask[offset + j] = bits;
    errMin[offset + j] = gainMin + fixedA / m.iMin;
    if (bits === 0) feasible++;
    else {
      const k = 31 - Math.clz32(bits & -bits);
      rejected[k] = (rejected[k] ?? 0) + 1;
    }
  }
  return feasible;
}

/** Bitmask and worst-case error at Imin (ratio) of a single pair, through the same loop. */
export function pairMask(m: Model, R: number, G: number): { mask: number; errMinRatio: number; sf: ShuntFigures } {
  const sf = shuntFigures(m, R);
  const mask = new Uint8Array(1);
  const errMin = new Float64Array(1);
  sweepRow(m, R, sf, gainFigures(m, [G]), mask, errMin, 0, new Int32Array(rejectReasons.length));
  return { mask: mask[0] ?? 0, errMinRatio: errMin[0] ?? NaN, sf };
}

export function reasonsOf(mask: number): RejectReason[] {
  const out: RejectReason[] = [];
  rejectReasons.forEach((r, k) => {
    if (mask & (1 << k)) out.push(r);
  });
  return out;
}
