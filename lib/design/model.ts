// The physical model of docs/model.md §3 on plain numbers. Everything the sweep needs per
// requirement is computed once here; the per-pair functions take numbers only.
import type { Requirement } from "./requirement";

/** CODATA 2018 exact value (the SI defines it), J/K. */
export const BOLTZMANN = 1.380649e-23;
/** Reference temperature for tolerances, offsets and tempcos, °C. */
export const REFERENCE_C = 25;
/** Noise-equivalent bandwidth of a single pole over its −3 dB bandwidth. */
export const SINGLE_POLE_NBW = Math.PI / 2;

export const LOAD_CC = 0;
export const LOAD_RES = 1;
export const LOAD_CP = 2;

export type Model = {
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
  /** Gain-type error that does not depend on current: εG + εR + αR·ΔT + αG·ΔT. */
  gainConst: number;
  alphaR: number;
  ratings: number[];
  derating: number;
  thetaFixed: number | null;
  ratedRise: number;
  vosRef: number;
  vosWorst: number;
  ib: number;
  /** Common-mode voltage times 10^(−CMRR/20), V. */
  cmV: number;
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
};

export function readoutStepV(req: Requirement): number {
  const r = req.readout;
  return r.kind === "adc" ? r.fullScale / 2 ** r.bits : r.fullScale / r.counts;
}

export function buildModel(req: Requirement): Model {
  const a = req.amplifier;
  const s = req.shunt;
  const dTamb = Math.max(Math.abs(req.temperature.max - REFERENCE_C), Math.abs(req.temperature.min - REFERENCE_C));
  const tNoiseK = req.temperature.max + 273.15;
  const vCm = req.supply.side === "high" ? req.supply.voltage : 0;
  return {
    iMin: req.current.min,
    iMax: req.current.max,
    vBus: req.supply.voltage,
    dropMax: req.drop.max,
    loadMin: req.drop.loadMin ?? -Infinity,
    loadModel: req.load.model === "resistive" ? LOAD_RES : req.load.model === "constant-power" ? LOAD_CP : LOAD_CC,
    lsbV: readoutStepV(req),
    outCeil: Math.min(req.readout.fullScale, a.supply - a.swingHigh),
    countsAtMin: req.resolution.countsAtMin,
    dTamb,
    tNoiseK,
    gainConst: a.gainError + s.tolerance + s.tempco * dTamb + a.gainDrift * dTamb,
    alphaR: s.tempco,
    ratings: [...s.ratings].sort((x, y) => x - y),
    derating: s.derating,
    thetaFixed: s.thermalResistance,
    ratedRise: s.ratedRise,
    vosRef: a.offset,
    vosWorst: a.offset + a.offsetDrift * dTamb,
    ib: a.biasCurrent,
    cmV: vCm * 10 ** (-a.cmrrDb / 20),
    en2: a.noiseDensity * a.noiseDensity,
    fourKT: 4 * BOLTZMANN * tNoiseK,
    gbw: a.gbw,
    filterHz: Math.min(a.filterHz ?? Infinity, req.readout.kind === "meter" ? req.readout.bandwidthHz : Infinity),
    crest: req.accuracy.crestFactor,
    swingLow: a.swingLow,
    bwReq: req.bandwidth.min,
    accRatio: req.accuracy.percent / 100,
    bandLo: req.accuracy.bandMin,
    bandHi: req.accuracy.bandMax,
  };
}

/** Smallest offered rating ≥ P/derating, or NaN when none covers it. */
export function ratingFor(m: Model, powerW: number): number {
  const need = powerW / m.derating;
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

/** Offset-type error referred to current, A: (Vos + αVos·ΔT)/R + Ib + Vcm·10^(−CMRR/20)/R. */
export function offsetTermA(m: Model, R: number): number {
  return (m.vosWorst + m.cmV) / R + m.ib;
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

/** Worst-case error at current I, A (docs/model.md §3's default model). */
export function worstErrorA(m: Model, R: number, G: number, theta: number, I: number): number {
  const gainPart = I * (m.gainConst + m.alphaR * I * I * R * theta);
  return gainPart + offsetTermA(m, R) + m.lsbV / (2 * R * G) + m.crest * noiseRmsA(m, R, G);
}

/** The default ranking score: dimensionless, each objective measured against what the requirement allows. */
export function defaultScore(m: Model, burdenV: number, lsbA: number, errMinRatio: number): number {
  return errMinRatio / m.accRatio + burdenV / m.dropMax + (lsbA * m.countsAtMin) / m.iMin;
}
