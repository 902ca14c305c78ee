// Monte Carlo spread of the reading error for one pair: every part drawn uniformly within
// its tolerance band, noise Gaussian, the output quantised and clipped as the readout sees it.
import { drawReadout, drawZeroLevelV } from "./monte-carlo-readout";
import { readoutFigures, type ReadoutFigure } from "./readout-error";
import { buildModel, commonModeErrorV, gainSetError, type Model, noiseRmsA, REFERENCE_C } from "./model";
import { drawFrontEnd } from "./front-end";
import { shuntFigures } from "./pair";
import { gaussian, mulberry32 } from "./prng";
import type { Requirement } from "./requirement";
import type { Choice } from "./types";

export type MonteCarloRow = {
  currentA: number;
  /** Reading error percentiles, % of reading (signed: reading − true). */
  p1: number;
  p5: number;
  p50: number;
  p95: number;
  p99: number;
  mean: number;
  std: number;
  min: number;
  max: number;
  /** Share of draws within the accuracy target, %. */
  withinTargetPercent: number;
};

/**
 * `readoutFigures`: the readout's own error each unit was drawn with, and whether the requirement
 * states each figure or it is typical of a class of part, not stated (readout-error.ts).
 */
export type MonteCarloResult = { draws: number; seed: number; rows: MonteCarloRow[]; readoutFigures: ReadoutFigure[] };

export type MonteCarloOptions = { currentsA?: number[]; draws?: number; seed?: number };

export const DEFAULT_DRAWS = 2000;
export const DEFAULT_SEED = 20261201;

/** Percentile by linear interpolation between order statistics (sorted input). */
export function percentile(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  if (n === 0) return NaN;
  const pos = (p / 100) * (n - 1);
  const lo = Math.floor(pos);
  const hi = Math.min(n - 1, lo + 1);
  const a = sorted[lo] as number;
  const b = sorted[hi] as number;
  return a + (b - a) * (pos - lo);
}

export function defaultMonteCarloCurrents(req: Requirement): number[] {
  // A signed span: both ends, and the band's low end either way (zero has no % of reading).
  const signed = req.current.min < 0 ? [-req.accuracy.bandMin, -Math.min(req.accuracy.bandMax, -req.current.min)] : [];
  const list = [...signed, req.current.min, req.current.typical, req.accuracy.bandMin, req.current.max].filter(
    (x): x is number => x !== undefined,
  );
  return [...new Set(list)].sort((a, b) => a - b);
}

/** What a built unit deviates by from its drawing; the demo and the tests build faulty units with it. */
export type UnitFault = {
  /** The shunt actually fitted, Ω (a wrong value from the reel). */
  shuntOhms?: number;
  /** A fixed voltage added at the amplifier input, V (a sense-line fault, a leaky joint). */
  inputOffsetV?: number;
};

/**
 * One built unit: its parts and ambient drawn once from `rnd` (uniform within each tolerance band),
 * then its output voltage at any current — noise Gaussian per reading, clipped to the amplifier's
 * swing and the readout's full scale, quantised to one readout step.
 */
export function drawUnit(
  req: Requirement,
  m: Model,
  choice: Choice,
  rnd: () => number,
  normal: () => number,
  fault: UnitFault = {},
  /** Read through the design's own readout (its reference, gain, offset, INL): the Monte Carlo does; a bench meter does not. */
  withReadout = false,
): (currentA: number, at25?: boolean) => number {
  const { shuntOhms: R, gain: G } = choice;
  const fitted = fault.shuntOhms ?? R;
  const theta = shuntFigures(m, fitted).theta;
  const a = req.amplifier;
  const s = req.shunt;
  const noiseV = noiseRmsA(m, R, G) * R;
  const u = (half: number) => (2 * rnd() - 1) * half;
  const ambient = req.temperature.min + rnd() * (req.temperature.max - req.temperature.min);
  const dT = ambient - REFERENCE_C;
  const epsR = u(s.tolerance);
  // Copper's tempco is a property of the metal, not a spread: a trace's is taken as stated.
  const alphaR = m.fe.trace ? s.tempco : u(s.tempco);
  const epsG = u(a.gainError) + u(gainSetError(m, G));
  const alphaG = u(a.gainDrift);
  const vos0 = u(a.offset);
  const vosDrift = u(a.offsetDrift);
  const ib = u(a.biasCurrent);
  const cm = u(commonModeErrorV(m, G));
  const fe = drawFrontEnd(req, m.fe, G, rnd, ib, dT);
  const extra = fault.inputOffsetV ?? 0;
  const zero = drawZeroLevelV(req, u);
  const read = withReadout ? drawReadout(req, m, u) : null;
  // at25: the unit on a calibration bench, at 25 °C and averaged (no noise).
  return (I, at25 = false) => {
    const t = at25 ? 0 : dT;
    const dTs = I * I * fitted * theta;
    // The pads are drawn at the unit's ambient (drawFrontEnd); the bench at 25 °C sees nearly the same.
    const vShunt = I * (fitted * (1 + epsR + alphaR * (t + dTs)) + fe.padOhms);
    const noise = at25 ? 0 : normal() * noiseV;
    const vIn = vShunt + vos0 + vosDrift * t + ib * fitted + cm + fe.offsetV + extra + noise;
    const gainActual = G * (1 + epsG + alphaG * t) * fe.gainFactor;
    const vOut = Math.min(m.outCeil, Math.max(a.swingLow, zero(t) + gainActual * vIn));
    return read ? read(vOut, t) : Math.round(vOut / m.lsbV) * m.lsbV;
  };
}

/**
 * The requirement's calibration applied to one drawn unit, as a map from its raw reading to the
 * corrected one (V). The unit is read on the bench at 25 °C without noise: one point at zero current
 * on a signed span, at the smallest current of interest on a one-way span (at zero its output sits
 * on its floor and shows no offset); two points add 90 % of the maximum current.
 */
function calibrate(
  req: Requirement,
  m: Model,
  choice: Choice,
  unit: (I: number, at25?: boolean) => number,
): (raw: number) => number {
  if (req.calibration === "none") return (raw) => raw;
  const rg = choice.shuntOhms * choice.gain;
  const i1 = m.signed ? 0 : m.iMin;
  const shift = unit(i1, true) - (m.vRef + i1 * rg);
  if (req.calibration === "one-point") return (raw) => raw - shift;
  const i2 = 0.9 * m.iMax;
  const slope = (unit(i2, true) - unit(i1, true)) / ((i2 - i1) * rg);
  const at1 = m.vRef + i1 * rg;
  return (raw) => at1 + (raw - shift - at1) / slope;
}

export function monteCarlo(req: Requirement, choice: Choice, opts: MonteCarloOptions = {}): MonteCarloResult {
  const draws = Math.max(1, Math.min(200_000, Math.floor(opts.draws ?? DEFAULT_DRAWS)));
  const seed = opts.seed ?? DEFAULT_SEED;
  const currents = opts.currentsA ?? defaultMonteCarloCurrents(req);
  const m = buildModel(req);
  const { shuntOhms: R, gain: G } = choice;
  const rnd = mulberry32(seed);
  const normal = gaussian(rnd);
  const errors = currents.map(() => new Float64Array(draws));
  for (let d = 0; d < draws; d++) {
    // One built unit: parts and ambient drawn once, then read at every current.
    const unit = drawUnit(req, m, choice, rnd, normal, {}, true);
    const corrected = calibrate(req, m, choice, unit);
    currents.forEach((I, k) => {
      // Read back about the nominal zero level; a signed reading's error is a share of |I|.
      const reading = (corrected(unit(I)) - m.vRef) / (R * G);
      (errors[k] as Float64Array)[d] = (100 * (reading - I)) / Math.abs(I);
    });
  }
  const rows = currents.map((I, k) => {
    const e = (errors[k] as Float64Array).sort();
    let sum = 0;
    let sq = 0;
    let within = 0;
    for (const x of e) {
      sum += x;
      sq += x * x;
      if (Math.abs(x) <= req.accuracy.percent) within++;
    }
    const mean = sum / draws;
    return {
      currentA: I,
      p1: percentile(e, 1),
      p5: percentile(e, 5),
      p50: percentile(e, 50),
      p95: percentile(e, 95),
      p99: percentile(e, 99),
      mean,
      std: Math.sqrt(Math.max(0, sq / draws - mean * mean)),
      min: e[0] ?? NaN,
      max: e[draws - 1] ?? NaN,
      withinTargetPercent: (100 * within) / draws,
    };
  });
  return { draws, seed, rows, readoutFigures: readoutFigures(req.readout) };
}
