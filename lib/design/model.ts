// The physical model of docs/model.md §3 on plain numbers. Everything the sweep needs per
// requirement is computed once here; the per-pair functions take numbers only.
import { buildFrontEnd, filterCmErrorV, frontEndOffsetV, padShare, type FrontEnd } from "./front-end";
import type { Requirement } from "./requirement";
import { readoutSignedFields, type ReadoutSignedFields } from "./model-readout-signed";

/** CODATA 2018 exact value (the SI defines it), J/K. */
export const BOLTZMANN = 1.380649e-23;
/** Reference temperature for tolerances, offsets and tempcos, °C. */
export const REFERENCE_C = 25;
/** Noise-equivalent bandwidth of a single pole over its −3 dB bandwidth. */
export const SINGLE_POLE_NBW = Math.PI / 2;

/**
 * The smallest current step a reading can tell apart through noise is taken as this many times
 * the RMS noise: one σ, the rms-based "effective resolution" of ADC textbooks (log2(FS/σ)).
 * The stricter peak-to-peak "noise-free" figure (about 6.6 σ) would suit single readings; the
 * accuracy budget counts noise separately as crest factor × RMS.
 */
export const RESOLVABLE_NOISE_SIGMAS = 1;
/**
 * An ADC input's anti-alias filter is taken with its corner at half the sample rate (the Nyquist
 * frequency): every real ADC input has one (common practice, no source).
 */
export const ANTI_ALIAS_FRACTION = 0.5;

export const TOPO_CS = 0;
export const TOPO_DIFF = 1;
export const TOPO_NONINV = 2;
export const TOPO_INST = 3;

export const LOAD_CC = 0;
export const LOAD_RES = 1;
export const LOAD_CP = 2;

export type Model = ReadoutSignedFields & {
  /** Smallest current of interest: current.min, or a signed span's accuracy-band low end (docs/model.md §3), A. */
  iMin: number;
  iMax: number;
  vBus: number;
  dropMax: number;
  loadMin: number;
  loadModel: number;
  /** One readout step in volts at the output. */
  lsbV: number;
  /** Highest usable output: the readout's full scale or the amplifier's swing. */
  outCeil: number;
  countsAtMin: number;
  /** Largest ambient excursion from 25 °C, K. */
  dTamb: number;
  /** Temperature for Johnson noise: the hottest ambient, K. */
  tNoiseK: number;
  /** Gain-type error that does not depend on current or gain: εG + εR + αR·ΔT + αG·ΔT + a difference stage's filter loading. */
  gainConst: number;
  topology: number;
  /** Tolerance of the gain-setting resistors (0: fixed gains, no resistors). */
  gainSetTol: number;
  high: boolean;
  /** The amplifier input's allowed common-mode range, V. */
  cmMin: number;
  cmMax: number;
  /** 10^(−CMRR/20) of the amplifier itself. */
  cmrrLin: number;
  /** Common-mode voltage the error model uses: the supply on the high side, 0 on the low side, V. */
  vCm: number;
  /** Hottest ambient, °C; the shunt's derating knee and maximum temperature, °C. */
  tAmbMax: number;
  kneeC: number;
  maxTempC: number;
  /** Share of its rating a shunt may carry at the hottest ambient (linear derating above the knee). */
  ambientDerate: number;
  /** On-resistance in series with the shunt (a range switch; 0 for a single range), Ω. */
  switchOhms: number;
  /**
   * A range below the top: a protective bypass closes when the path's drop reaches this (V), so the
   * shunt must be rated for the current that takes it there. 0: no such duty.
   */
  clampV: number;
  alphaR: number;
  ratings: number[];
  derating: number;
  thetaFixed: number | null;
  ratedRise: number;
  vosRef: number;
  vosWorst: number;
  ib: number;
  en2: number;
  fourKT: number;
  gbw: number;
  /** Lowest band limit after the amplifier: output filter or meter bandwidth, Hz (Infinity: none). */
  filterHz: number;
  crest: number;
  swingLow: number;
  bwReq: number;
  /** Accuracy target as a ratio (2 % → 0.02). */
  accRatio: number;
  bandLo: number;
  bandHi: number;
  /** Input filter, shunt terminals, copper trace and thermal EMF (front-end.ts). */
  fe: FrontEnd;
};

export function readoutStepV(req: Requirement): number {
  const r = req.readout;
  return r.kind === "adc" ? r.fullScale / 2 ** r.bits : r.fullScale / r.counts;
}

/** Highest usable output: the readout's full scale less its own worst errors, or the amplifier's swing, the lower, V. */
export function outputCeilingV(req: Requirement): number {
  return buildModel(req).outCeil;
}

export function buildModel(req: Requirement): Model {
  const a = req.amplifier;
  const s = req.shunt;
  const dTamb = Math.max(Math.abs(req.temperature.max - REFERENCE_C), Math.abs(req.temperature.min - REFERENCE_C));
  const tNoiseK = req.temperature.max + 273.15;
  const vCm = req.supply.side === "high" ? req.supply.voltage : 0;
  const topology = {
    "current-sense": TOPO_CS,
    difference: TOPO_DIFF,
    "non-inverting": TOPO_NONINV,
    instrumentation: TOPO_INST,
  }[a.topology];
  const antiAlias =
    req.readout.kind === "adc" ? ANTI_ALIAS_FRACTION * req.readout.sampleRateHz : req.readout.bandwidthHz;
  const fe = buildFrontEnd(req, dTamb, vCm, topology === TOPO_DIFF);
  return {
    iMax: req.current.max,
    vBus: req.supply.voltage,
    dropMax: req.drop.max,
    loadMin: req.drop.loadMin ?? -Infinity,
    loadModel: req.load.model === "resistive" ? LOAD_RES : req.load.model === "constant-power" ? LOAD_CP : LOAD_CC,
    lsbV: readoutStepV(req),
    countsAtMin: req.resolution.countsAtMin,
    dTamb,
    tNoiseK,
    gainConst: a.gainError + s.tolerance + s.tempco * dTamb + a.gainDrift * dTamb + fe.filterLoading,
    topology,
    gainSetTol: a.gainSet ? a.gainSet.tolerance : 0,
    high: req.supply.side === "high",
    cmMin: a.commonMode.min,
    cmMax: a.commonMode.max,
    cmrrLin: 10 ** (-a.cmrrDb / 20),
    vCm,
    tAmbMax: req.temperature.max,
    kneeC: s.deratingKneeC,
    maxTempC: s.maxTempC,
    ambientDerate: derateAt(req.temperature.max, s.deratingKneeC, s.maxTempC),
    switchOhms: 0,
    clampV: 0,
    alphaR: s.tempco,
    ratings: [...s.ratings].sort((x, y) => x - y),
    derating: s.derating,
    thetaFixed: s.thermalResistance,
    ratedRise: s.ratedRise,
    vosRef: a.offset,
    vosWorst: a.offset + a.offsetDrift * dTamb,
    ib: a.biasCurrent,
    // The filter's two leg resistors add their Johnson noise, 4kT·2R, to the amplifier's own.
    en2: a.noiseDensity * a.noiseDensity + 4 * BOLTZMANN * tNoiseK * 2 * fe.filterOhms,
    fourKT: 4 * BOLTZMANN * tNoiseK,
    gbw: a.gbw,
    filterHz: Math.min(a.filterHz ?? Infinity, antiAlias, fe.filterCornerHz),
    crest: req.accuracy.crestFactor,
    swingLow: a.swingLow,
    bwReq: req.bandwidth.min,
    accRatio: req.accuracy.percent / 100,
    bandLo: req.accuracy.bandMin,
    bandHi: req.accuracy.bandMax,
    // Signed spans, the zero-current level, the readout's own error and calibration (issue 14);
    // iMin and outCeil come from there too.
    ...readoutSignedFields(req, dTamb),
    fe,
  };
}

/**
 * Share of its rating a resistor may dissipate at ambient T: full up to the knee, falling on a
 * straight line to none at its maximum temperature (the usual resistor derating curve).
 */
export function derateAt(tC: number, kneeC: number, maxC: number): number {
  if (tC <= kneeC) return 1;
  if (tC >= maxC) return 0;
  return (maxC - tC) / (maxC - kneeC);
}

/** Smallest offered rating ≥ P/(derating · ambient derating), or NaN when none covers it. */
export function ratingFor(m: Model, powerW: number): number {
  if (!(m.ambientDerate > 0)) return NaN;
  const need = powerW / (m.derating * m.ambientDerate);
  for (const r of m.ratings) if (r >= need * (1 - 1e-12)) return r;
  return NaN;
}

export function largestRating(m: Model): number {
  return m.ratings[m.ratings.length - 1] ?? NaN;
}

/** Shunt thermal resistance, K/W: as given, or the rated rise spread over the rating. */
export function thetaFor(m: Model, ratingW: number): number {
  if (m.thetaFixed !== null) return m.thetaFixed;
  const r = Number.isFinite(ratingW) ? ratingW : largestRating(m);
  return m.ratedRise / r;
}

/**
 * Current through R at full load in the requirement's load model (the load drawing iMax at the
 * full supply): iMax for constant current, V/(V/Imax + R) for a resistive load, P/V_load for a
 * constant-power load. NaN: a constant-power load has no operating point through R.
 */
export function operatingCurrent(m: Model, R: number): number {
  if (m.loadModel === LOAD_CC) return m.iMax;
  if (m.loadModel === LOAD_RES) return m.vBus / (m.vBus / m.iMax + R);
  const p = m.vBus * m.iMax;
  const disc = m.vBus * m.vBus - 4 * p * R;
  if (disc < 0) return NaN;
  return p / ((m.vBus + Math.sqrt(disc)) / 2);
}

/**
 * Gain error from the gain-setting resistors' tolerance t, worst case (standard op-amp circuit
 * analysis): non-inverting G = 1 + Rf/Rg gives 2·t·(G − 1)/G; a difference stage G = Rf/Rg
 * 2·t; an instrumentation amplifier's single gain resistor t·(G − 1)/G.
 */
export function gainSetError(m: Model, G: number): number {
  if (m.gainSetTol === 0) return 0;
  if (m.topology === TOPO_DIFF) return 2 * m.gainSetTol;
  if (m.topology === TOPO_INST) return (m.gainSetTol * (G - 1)) / G;
  return (2 * m.gainSetTol * (G - 1)) / G;
}

/** What the amplifier's own inputs see of the stage's input voltage: Rf/(Rf + Rg) = G/(1 + G) in a difference stage. */
export function commonModeScale(m: Model, G: number): number {
  return m.topology === TOPO_DIFF ? G / (1 + G) : 1;
}

/**
 * Common-mode error referred to the input, V. A difference stage adds its resistors' mismatch:
 * CMRR = (1 + G)/(4·t) worst case (standard op-amp circuit analysis), i.e. Vcm·4·t/(1 + G),
 * on top of the op-amp's own CMRR at the common mode its inputs see. A non-inverting stage is
 * single-ended (ground-referenced, low side only): no common-mode term.
 */
export function commonModeErrorV(m: Model, G: number): number {
  if (m.topology === TOPO_NONINV) return 0;
  const own = m.vCm * commonModeScale(m, G) * m.cmrrLin;
  if (m.topology === TOPO_DIFF) return own + (m.vCm * 4 * m.gainSetTol) / (1 + G);
  return own;
}

/**
 * Voltage lost across R at the load's operating point, for a load drawing iMax at the
 * full supply. NaN: a constant-power load has no operating point through R.
 */
export function operatingBurden(m: Model, R: number): number {
  if (m.loadModel === LOAD_CC) return m.iMax * R;
  if (m.loadModel === LOAD_RES) {
    const rl = m.vBus / m.iMax;
    return (m.vBus * R) / (rl + R);
  }
  const p = m.vBus * m.iMax;
  const disc = m.vBus * m.vBus - 4 * p * R;
  if (disc < 0) return NaN;
  return m.vBus - (m.vBus + Math.sqrt(disc)) / 2;
}

/**
 * Offset-type error referred to current, A: (Vos + αVos·ΔT)/R + Ib + common-mode error/R, plus
 * the input filter's bias-current and common-mode errors and the joints' thermal EMF, over R.
 */
export function offsetTermA(m: Model, R: number, G: number): number {
  return (m.vosWorst + commonModeErrorV(m, G) + frontEndOffsetV(m.fe) + filterCmErrorV(m.fe, G)) / R + m.ib;
}

/** RMS input noise density including the shunt's Johnson noise, V/√Hz. */
export function inputNoiseDensity(m: Model, R: number): number {
  return Math.sqrt(m.en2 + m.fourKT * R);
}

/** −3 dB bandwidth at gain G: GBW/G, or the output filter's corner if that is lower, Hz. */
export function signalBandwidth(m: Model, G: number): number {
  return Math.min(m.gbw / G, m.filterHz);
}

/** Noise-equivalent bandwidth at gain G (treated as a single pole), Hz. */
export function noiseBandwidth(m: Model, G: number): number {
  return SINGLE_POLE_NBW * signalBandwidth(m, G);
}

/** RMS noise referred to current, A. */
export function noiseRmsA(m: Model, R: number, G: number): number {
  return (inputNoiseDensity(m, R) * Math.sqrt(noiseBandwidth(m, G))) / R;
}

/**
 * Worst-case error at current magnitude I, A (docs/model.md §3's default model): after any
 * calibration, the readout's own error and the zero-current level included; the same either way
 * of a signed span.
 */
export function worstErrorA(m: Model, R: number, G: number, theta: number, I: number): number {
  const gainPart =
    I *
    (m.accGainConst +
      m.accEpsKeep * (gainSetError(m, G) + m.fe.filterLoading) +
      calibratedPadShare(m, R) +
      m.alphaR * I * I * R * theta);
  const offA =
    (m.accOffKeep * (m.vosRef + commonModeErrorV(m, G) + m.fe.filterBiasV + filterCmErrorV(m.fe, G)) +
      (m.vosWorst - m.vosRef) +
      m.fe.thermalEmfV) /
      R +
    m.accOffKeep * m.ib;
  return gainPart + offA + m.accOutV / (R * G) + m.crest * noiseRmsA(m, R, G);
}

/**
 * The pads' gain-type error after calibration: a gain calibration takes out their value at 25 °C,
 * never their drift with copper's tempco over the ambient range.
 */
export function calibratedPadShare(m: Model, R: number): number {
  return (m.accEpsKeep * m.fe.padOhms + (m.fe.padOhmsWorst - m.fe.padOhms)) / R;
}

/** The smallest current step the readout can tell apart: one readout step, or the noise where larger, A. */
export function resolvableStepA(m: Model, R: number, G: number): number {
  return Math.max(m.lsbV / (R * G), RESOLVABLE_NOISE_SIGMAS * noiseRmsA(m, R, G));
}

/**
 * Below this current the output sits at its floor even with the worst offset, A. On a signed span
 * (no floor at zero current) it is the band around zero within which the worst offset, the
 * zero-current level's error included, can hide or flip the reading's sign.
 */
export function deadZoneA(m: Model, R: number, G: number): number {
  return (m.deadFloorV + m.refErrV) / (R * G) + offsetTermA(m, R, G);
}

/** The default ranking score: dimensionless, each objective measured against what the requirement allows. */
export function defaultScore(m: Model, burdenV: number, lsbA: number, errMinRatio: number): number {
  return errMinRatio / m.accRatio + burdenV / m.dropMax + (lsbA * m.countsAtMin) / m.iMin;
}

/**
 * Highest output the error budget allows at full load, V: the operating current plus every
 * error that moves the output (all but the readout's own half step), times R·G.
 */
export function outputWorstV(m: Model, R: number, G: number, theta: number, iOp: number): number {
  return outputSwingA(m, R, G, theta, iOp) * R * G + m.vRef + m.refErrV;
}

/**
 * Lowest output the error budget allows at the negative end of a signed span, V (the zero level
 * less the largest negative current and every error that moves the output down). NaN one way.
 */
export function outputFloorWorstV(m: Model, R: number, G: number, theta: number): number {
  if (!m.signed) return NaN;
  return m.vRef - m.refErrV - outputSwingA(m, R, G, theta, m.iNeg) * R * G;
}

/** Current magnitude I plus every amplifier-side error that moves the output with it, uncalibrated, A. */
function outputSwingA(m: Model, R: number, G: number, theta: number, I: number): number {
  const gain = m.gainConst + padShare(m.fe, R) + gainSetError(m, G) + m.alphaR * I * I * R * theta;
  return I + I * gain + offsetTermA(m, R, G) + m.crest * noiseRmsA(m, R, G);
}
