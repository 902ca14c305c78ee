// The error budget of one pair across the current span: each source in amps, the worst
// case (sum) and the root-sum-square, as % of reading.
import {
  type Model,
  buildModel,
  commonModeErrorV,
  gainSetError,
  noiseRmsA,
  operatingBurden,
  REFERENCE_C,
  worstErrorA,
} from "./model";
import { frontEndSourceLabels, frontEndTerms, type FrontEndSource } from "./front-end-budget";
import { shuntFigures } from "./pair";
import { signedSpanCurrents } from "./bidirectional";
import {
  readoutLineBases,
  readoutSignedLabels,
  readoutSignedTerms,
  type ReadoutSignedSource,
} from "./budget-readout-signed";
import type { Requirement } from "./requirement";
import type { Choice } from "./types";

export type BudgetSource =
  | "gainError"
  | "gainSetResistors"
  | "shuntTolerance"
  | "shuntTempco"
  | "gainDrift"
  | "offset"
  | "offsetDrift"
  | "biasCurrent"
  | "commonMode"
  | "readout"
  | "noise"
  | ReadoutSignedSource
  | FrontEndSource;

export const budgetSourceLabels: Record<BudgetSource, string> = {
  gainError: "Amplifier gain error",
  gainSetResistors: "Gain-setting resistors' tolerance",
  shuntTolerance: "Shunt tolerance",
  shuntTempco: "Shunt tempco (ambient and self-heating)",
  gainDrift: "Amplifier gain drift",
  offset: `Amplifier offset at ${REFERENCE_C} °C`,
  offsetDrift: "Offset drift over temperature",
  biasCurrent: "Input bias current",
  commonMode: "Common-mode error (CMRR, resistor matching in a difference stage)",
  readout: "Readout step (half an LSB; a meter's ± digits)",
  noise: "Noise (crest factor × RMS)",
  ...readoutSignedLabels,
  ...frontEndSourceLabels,
};

/**
 * `removedA`: what the requirement's calibration took out of this term (absent: nothing).
 * `basis`: for the readout's own error, its figures and whether the request states them or they
 * are typical of a class of part (readout-error.ts).
 */
export type BudgetTerm = { source: BudgetSource; label: string; errorA: number; removedA?: number; basis?: string };
export type ErrorAtResult = {
  worstA: number;
  rssA: number;
  worstPercent: number;
  rssPercent: number;
  terms: BudgetTerm[];
};

/**
 * Budget terms at current magnitude I (A), after the requirement's calibration. The sum equals
 * worstErrorA from the model. A signed span's terms are the same either way.
 */
export function budgetTerms(req: Requirement, m: Model, choice: Choice, current: number): BudgetTerm[] {
  const { shuntOhms: R, gain: G } = choice;
  const I = Math.abs(current);
  const theta = shuntFigures(m, R).theta;
  const a = req.amplifier;
  const gainKeep = m.accEpsKeep;
  const offKeep = m.accOffKeep;
  // [before calibration, share kept]
  const values: [BudgetSource, number, number][] = [
    ["gainError", I * a.gainError, gainKeep],
    ["gainSetResistors", I * gainSetError(m, G), gainKeep],
    ["shuntTolerance", I * req.shunt.tolerance, gainKeep],
    ["shuntTempco", I * m.alphaR * (m.dTamb + I * I * R * theta), 1],
    ["gainDrift", I * a.gainDrift * m.dTamb, 1],
    ["offset", a.offset / R, offKeep],
    ["offsetDrift", (a.offsetDrift * m.dTamb) / R, 1],
    ["biasCurrent", a.biasCurrent, offKeep],
    ["commonMode", commonModeErrorV(m, G) / R, offKeep],
    ["readout", m.read.quantV / (R * G), 1],
    ["noise", m.crest * noiseRmsA(m, R, G), 1],
    ...readoutSignedTerms(req, m, R * G, I),
    ...frontEndTerms(m.fe, R, G, I).map((t): [BudgetSource, number, number] => [
      t.source,
      t.errorA,
      t.errorA > 0 ? t.keptA(m.accEpsKeep, m.accOffKeep) / t.errorA : 1,
    ]),
  ];
  const bases = readoutLineBases(req);
  return values.map(([source, full, keep]) => {
    const term: BudgetTerm = { source, label: budgetSourceLabels[source], errorA: full * keep };
    if (keep < 1 && full !== 0) term.removedA = full * (1 - keep);
    const basis = bases[source];
    if (basis) term.basis = basis;
    return term;
  });
}

function combine(terms: BudgetTerm[], I: number): ErrorAtResult {
  let worstA = 0;
  let sq = 0;
  for (const t of terms) {
    worstA += Math.abs(t.errorA);
    sq += t.errorA * t.errorA;
  }
  const rssA = Math.sqrt(sq);
  const mag = Math.abs(I);
  return { worstA, rssA, worstPercent: (100 * worstA) / mag, rssPercent: (100 * rssA) / mag, terms };
}

export function errorAt(req: Requirement, choice: Choice, currentA: number): ErrorAtResult {
  return errorAtWith(req, buildModel(req), choice, currentA);
}

/** errorAt with the model already built (for callers that ask at many currents). */
export function errorAtWith(req: Requirement, m: Model, choice: Choice, currentA: number): ErrorAtResult {
  return combine(budgetTerms(req, m, choice, currentA), currentA);
}

/** n currents spaced evenly on a log scale from a to b inclusive. */
export function logSpace(a: number, b: number, n: number): number[] {
  if (n <= 1 || a === b) return [a];
  const la = Math.log(a);
  const step = (Math.log(b) - la) / (n - 1);
  return Array.from({ length: n }, (_, i) => (i === 0 ? a : i === n - 1 ? b : Math.exp(la + i * step)));
}

export type ErrorCurvePoint = { currentA: number; worstPercent: number; rssPercent: number };

/**
 * Currents for a curve over the span: log-spaced; on a signed span log-spaced magnitudes each way
 * from a tenth of the smallest magnitude of interest, negative ones first.
 */
export function spanCurrents(req: Requirement, m: Model, points: number): number[] {
  if (!m.signed) return logSpace(req.current.min, req.current.max, points);
  return signedSpanCurrents(req.current.min, req.current.max, m.iMin / 10, Math.ceil(points / 2));
}

export function errorCurve(req: Requirement, choice: Choice, points = 60): ErrorCurvePoint[] {
  const m = buildModel(req);
  return spanCurrents(req, m, points).map((I) => {
    const r = combine(budgetTerms(req, m, choice, I), I);
    return { currentA: I, worstPercent: r.worstPercent, rssPercent: r.rssPercent };
  });
}

/** The breakdown per source across the span, for a stacked chart (% of reading). */
export function errorBreakdownCurve(
  req: Requirement,
  choice: Choice,
  points = 40,
): { currentA: number; terms: { source: BudgetSource; percent: number }[] }[] {
  const m = buildModel(req);
  return spanCurrents(req, m, points).map((I) => ({
    currentA: I,
    terms: budgetTerms(req, m, choice, I).map((t) => ({ source: t.source, percent: (100 * t.errorA) / Math.abs(I) })),
  }));
}

export type LoadCurvePoint = { currentA: number; burdenV: number; loadVoltageV: number };

/** Drop and load voltage across the span (the load drawing each current at full supply; a signed span by magnitude). */
export function loadCurve(req: Requirement, choice: Choice, points = 60): LoadCurvePoint[] {
  const m = buildModel(req);
  // A signed span by magnitude, up to its larger end: the drop is |I|·R either way (its source sets the current).
  const currents = m.signed ? logSpace(m.iMin / 10, Math.max(m.iMax, m.iNeg), points) : spanCurrents(req, m, points);
  return currents.map((I) => {
    const burdenV = operatingBurden({ ...m, iMax: I }, choice.shuntOhms);
    return { currentA: I, burdenV, loadVoltageV: m.vBus - burdenV };
  });
}

/**
 * Lowest current in the span whose worst-case error meets the accuracy target, or null.
 * The worst-case ratio a + b·I² + c/I is convex, so the currents that meet it form one interval.
 */
export function lowestAccurateCurrent(req: Requirement, m: Model, choice: Choice): number | null {
  const { shuntOhms: R, gain: G } = choice;
  const theta = shuntFigures(m, R).theta;
  const ratio = (I: number) => worstErrorA(m, R, G, theta, I) / I;
  const target = m.accRatio;
  if (ratio(m.iMin) <= target) return m.iMin;
  // Golden-section search for the minimum on a log scale (a signed span: magnitudes to its larger end).
  let lo = Math.log(m.iMin);
  let hi = Math.log(Math.max(m.iMax, m.iNeg));
  const phi = (Math.sqrt(5) - 1) / 2;
  for (let k = 0; k < 80; k++) {
    const x1 = hi - phi * (hi - lo);
    const x2 = lo + phi * (hi - lo);
    if (ratio(Math.exp(x1)) < ratio(Math.exp(x2))) hi = x2;
    else lo = x1;
  }
  const best = Math.exp((lo + hi) / 2);
  if (ratio(best) > target) return null;
  let a = m.iMin;
  let b = best;
  for (let k = 0; k < 100 && b - a > 1e-12 * b; k++) {
    const mid = Math.sqrt(a * b);
    if (ratio(mid) <= target) b = mid;
    else a = mid;
  }
  return b;
}

/**
 * A curve by current magnitude, for log axes that cannot show a sign: a signed span's worst case is
 * the same at −I and +I (docs/model.md §3), so its two branches fold onto one, out to its larger end.
 */
export function curveByMagnitude<T extends { currentA: number }>(curve: T[]): T[] {
  const out = curve.map((p) => ({ ...p, currentA: Math.abs(p.currentA) })).sort((a, b) => a.currentA - b.currentA);
  return out.filter((p, k) => k === 0 || p.currentA > (out[k - 1] as T).currentA * (1 + 1e-12));
}
