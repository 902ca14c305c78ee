// Feasibility of one (shunt, gain) pair, shared by the sweep and evaluateCandidate so the
// two can never disagree. Per-shunt figures are computed once per value, per-gain once per gain.
import {
  type Model,
  TOPO_NONINV,
  calibratedPadShare,
  commonModeErrorV,
  commonModeScale,
  gainSetError,
  inputNoiseDensity,
  noiseBandwidth,
  operatingBurden,
  operatingCurrent,
  ratingFor,
  signalBandwidth,
  thetaFor,
  RESOLVABLE_NOISE_SIGMAS,
} from "./model";
import { filterCmErrorV, frontEndOffsetV, padShare, traceHeat } from "./front-end";
import { rejectReasons, type RejectReason } from "./reject-reasons";

export { rejectReasonLabels, rejectReasons, type RejectReason } from "./reject-reasons";

export const BIT_DROP = 1;
export const BIT_CM = 2;
export const BIT_OUTPUT = 4;
export const BIT_COUNTS = 8;
export const BIT_POWER = 16;
export const BIT_BANDWIDTH = 32;
export const BIT_ACCURACY = 64;
export const BIT_DEADZONE = 128;

/** Figures that depend on the shunt alone. */
export type ShuntFigures = {
  dropFails: boolean;
  /** Current through the shunt at full load in the load model (NaN: no operating point). */
  iOp: number;
  /** Chosen rating at iOp, NaN when no offered rating covers the dissipation at the hottest ambient. */
  rating: number;
  theta: number;
  /** Hot spot above the shunt's maximum temperature at the hottest ambient. */
  hot: boolean;
  /** The amplifier's inputs sit between these two voltages at full load, V. */
  vInLo: number;
  vInHi: number;
  /** Offset-type error without the common-mode terms, A: (Vos + αVos·ΔT + filter bias + thermal EMF)/R + Ib. */
  offsetA: number;
  /** The same for accuracy, after calibration (a one-point calibration leaves αVos·ΔT/R and the thermal EMF), A. */
  accOffsetA: number;
  /** A 2-terminal shunt's pads as a gain error, ratio (0: Kelvin). */
  padShare: number;
  /** The same after calibration (a gain calibration leaves the pads' drift), ratio. */
  accPadShare: number;
  /** Input noise density divided by R, A/√Hz. */
  noisePerR: number;
};

const slack = 1 + 1e-12;

export function shuntFigures(m: Model, R: number): ShuntFigures {
  // The load sees the shunt, a 2-terminal shunt's pads and any range switch in series with it.
  const path = R + m.fe.padOhms + m.switchOhms;
  const burden = operatingBurden(m, path);
  // A signed span's negative direction is set by its source (a charger): I·R at |current.min|.
  const dropFails =
    !(burden <= m.dropMax * slack) ||
    m.iMax * path > m.dropMax * slack ||
    m.iNeg * path > m.dropMax * slack ||
    m.vBus - burden < m.loadMin / slack;
  const iOp = operatingCurrent(m, path);
  // With no operating point the pair fails on drop; rate it at Imax so that only drop is reported.
  // A lower range's shunt carries up to the current at which its protection closes.
  const iRun = Number.isNaN(iOp) ? m.iMax : iOp;
  const iHeat = Math.max(m.clampV > 0 ? Math.max(iRun, m.clampV / path) : iRun, m.iNeg);
  const power = iHeat * iHeat * R;
  // A copper trace heats by IPC-2221, not by a resistor's rating and derating curve.
  const trace = m.fe.trace ? traceHeat(m.fe.trace, R, iHeat, m.tAmbMax, m.maxTempC) : null;
  const rating = trace ? trace.ratingW : ratingFor(m, power);
  const theta = trace ? trace.theta : thetaFor(m, rating);
  const b = Number.isNaN(burden) ? m.iMax * R : burden;
  return {
    dropFails,
    iOp,
    rating,
    theta,
    hot: m.tAmbMax + power * theta > m.maxTempC * slack,
    vInLo: m.high ? m.vBus - b : 0,
    vInHi: m.high ? m.vBus : b,
    offsetA: (m.vosWorst + frontEndOffsetV(m.fe)) / R + m.ib,
    accOffsetA:
      (m.accOffKeep * (m.vosRef + m.fe.filterBiasV) + (m.vosWorst - m.vosRef) + m.fe.thermalEmfV) / R +
      m.accOffKeep * m.ib,
    padShare: padShare(m.fe, R),
    accPadShare: calibratedPadShare(m, R),
    noisePerR: inputNoiseDensity(m, R) / R,
  };
}

/** Figures that depend on the gain alone, for every gain swept. */
export type GainFigures = {
  gains: Float64Array;
  bandwidth: Float64Array;
  sqrtNbw: Float64Array;
  /** Gain-setting resistors' gain error (ratio). */
  epsG: Float64Array;
  /** Share of the input voltage the amplifier's own inputs see. */
  cmScale: Float64Array;
  /** Common-mode error referred to the input, V. */
  cmErrV: Float64Array;
};

export function gainFigures(m: Model, gains: ArrayLike<number>): GainFigures {
  const n = gains.length;
  const g = Float64Array.from(gains);
  const bandwidth = new Float64Array(n);
  const sqrtNbw = new Float64Array(n);
  const epsG = new Float64Array(n);
  const cmScale = new Float64Array(n);
  const cmErrV = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    const G = g[j] as number;
    bandwidth[j] = signalBandwidth(m, G);
    sqrtNbw[j] = Math.sqrt(noiseBandwidth(m, G));
    epsG[j] = gainSetError(m, G);
    cmScale[j] = commonModeScale(m, G);
    cmErrV[j] = commonModeErrorV(m, G) + filterCmErrorV(m.fe, G);
  }
  return { gains: g, bandwidth, sqrtNbw, epsG, cmScale, cmErrV };
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
  const { gains, bandwidth, sqrtNbw, epsG, cmScale, cmErrV } = gf;
  const nG = gains.length;
  const cmAll = m.topology === TOPO_NONINV && m.high;
  const rowBits =
    (sf.dropFails ? BIT_DROP : 0) | (cmAll ? BIT_CM : 0) | (Number.isNaN(sf.rating) || sf.hot ? BIT_POWER : 0);
  // Worst-case ratio at I: gainConst + εset + heat·I² + fixed/I, with fixed the current-independent error (A).
  const heat = m.alphaR * R * sf.theta;
  // Accuracy after calibration; the output's swing uncalibrated (gainConst holds the filter's loading).
  const accGain = m.accGainConst + m.accEpsKeep * m.fe.filterLoading + sf.accPadShare;
  const gainLo = accGain + heat * m.bandLo * m.bandLo;
  const gainHi = accGain + heat * m.bandHi * m.bandHi;
  const gainMin = accGain + heat * m.iMin * m.iMin;
  const iOp = sf.iOp;
  const gainConst = m.gainConst + sf.padShare;
  const gainOp = 1 + gainConst + heat * iOp * iOp;
  // A signed span's other end: the zero level less the largest negative current, against the floor.
  const gainNeg = 1 + gainConst + heat * m.iNeg * m.iNeg;
  const floorLimit = m.swingLow / slack;
  const outLimit = m.outCeil * slack;
  const countsNeed = m.countsAtMin / slack;
  const bwNeed = m.bwReq / slack;
  const accLimit = m.accRatio * slack;
  const deadLimit = m.iMin * slack;
  // Accuracy's output-referred error: the readout's own (half a step for an ideal ADC) and the zero level's.
  const outErrV = m.accOutV;
  const deadV = m.deadFloorV + m.refErrV;
  const topV = m.vRef + m.refErrV;
  const botV = m.vRef - m.refErrV;
  const noiseSigmaPerNbw = RESOLVABLE_NOISE_SIGMAS * sf.noisePerR;
  const noiseK = m.crest * sf.noisePerR;
  const cmLo = m.cmMin / slack;
  const cmHi = m.cmMax * slack;
  const invR = 1 / R;
  let feasible = 0;
  for (let j = 0; j < nG; j++) {
    const rg = R * (gains[j] as number);
    const eps = epsG[j] as number;
    const k = cmScale[j] as number;
    const nbw = sqrtNbw[j] as number;
    let bits = rowBits;
    if (k * sf.vInHi > cmHi || k * sf.vInLo < cmLo) bits |= BIT_CM;
    const offA = sf.offsetA + (cmErrV[j] as number) * invR;
    const noiseA = noiseK * nbw;
    // Highest output at full load with every output error, against the ceiling (and the lowest, signed).
    if ((iOp * (gainOp + eps) + offA + noiseA) * rg + topV > outLimit) bits |= BIT_OUTPUT;
    if (m.signed && botV - (m.iNeg * (gainNeg + eps) + offA + noiseA) * rg < floorLimit) bits |= BIT_OUTPUT;
    // Steps at Imin: the readout step, or the noise where that is larger.
    const lsbA = m.lsbV / rg;
    const noiseStep = noiseSigmaPerNbw * nbw;
    if (m.iMin < countsNeed * (lsbA > noiseStep ? lsbA : noiseStep)) bits |= BIT_COUNTS;
    if ((bandwidth[j] as number) < bwNeed) bits |= BIT_BANDWIDTH;
    const accOffA = sf.accOffsetA + m.accOffKeep * (cmErrV[j] as number) * invR;
    const fixedA = accOffA + outErrV / rg + noiseA;
    const epsAcc = m.accEpsKeep * eps;
    // a + b·I² + c/I is convex in I, so its largest value over the band is at an end.
    if (gainLo + epsAcc + fixedA / m.bandLo > accLimit || gainHi + epsAcc + fixedA / m.bandHi > accLimit)
      bits |= BIT_ACCURACY;
    if (deadV / rg + offA > deadLimit) bits |= BIT_DEADZONE;
    mask[offset + j] = bits;
    errMin[offset + j] = gainMin + epsAcc + fixedA / m.iMin;
    if (bits === 0) feasible++;
    else {
      const b = 31 - Math.clz32(bits & -bits);
      rejected[b] = (rejected[b] ?? 0) + 1;
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
