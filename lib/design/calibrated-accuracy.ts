// What a per-unit gain-and-offset calibration at the bench can and cannot remove from the error
// budget, and the accuracy a calibrated unit can reach across the span.
import { readoutOwnSources } from "./budget-readout-signed";
import { budgetSourceLabels, budgetTerms, logSpace, type BudgetSource, type BudgetTerm } from "./error-budget";
import { buildModel, type Model } from "./model";
import type { Requirement } from "./requirement";
import type { Choice } from "./types";

/**
 * Terms fixed once the unit is built and read at 25 °C on the bench at the operating common mode:
 * a fitted gain and offset take them out. Everything that moves after calibration stays.
 */
export const removedByCalibration: readonly BudgetSource[] = [
  "gainError",
  "gainSetResistors",
  "shuntTolerance",
  "offset",
  "biasCurrent",
  "commonMode",
  "inputFilterBias",
  "inputFilterResistors",
];

/** Why each remaining term survives calibration (shown beside it). */
export const remainsBecause: Partial<Record<BudgetSource, string>> = {
  shuntTempco: "drifts with ambient temperature, and self-heating grows as I³, which a straight-line fit cannot follow",
  gainDrift: "drifts with ambient temperature after calibration",
  offsetDrift: "drifts with ambient temperature after calibration",
  readout: "quantisation: half a readout step on every reading",
  noise: "random from reading to reading",
  readoutReference: "the bench fit reads the amplifier's output, not the reference of the readout that reads it in use",
  readoutGain: "the bench fit reads the amplifier's output, not the readout's own gain",
  readoutOffset: "the bench fit reads the amplifier's output, not the readout's own offset",
  readoutInl: "nonlinearity: a straight-line fit cannot follow it",
  zeroLevel: "its tolerance is fitted out; its drift with ambient temperature remains",
  shuntPads:
    "the pads' copper and solder move with temperature (about 3900 ppm/K); counted whole, as a calibration at 25 °C leaves the drift and the joints may change with time",
  thermalEmf: "the gradient across the shunt changes with load and airflow after calibration",
};

/**
 * The budget of a unit fitted at the bench: a two-point calibration of everything up to the
 * amplifier's output (lib/design/readout-error.ts says what that removes), with the readout's own
 * terms as the design has them.
 */
function benchCalibratedTerms(req: Requirement, m: Model, fitted: Model, choice: Choice, I: number): BudgetTerm[] {
  const raw = budgetTerms(req, m, choice, I);
  const cal = budgetTerms({ ...req, calibration: "two-point" }, fitted, choice, I);
  return cal.map((t, k) => (readoutOwnSources.includes(t.source) ? (raw[k] ?? t) : t));
}

function fittedModel(req: Requirement): Model {
  return buildModel({ ...req, calibration: "two-point" });
}

export type CalibratedAccuracy = {
  removed: { source: BudgetSource; label: string }[];
  remaining: { source: BudgetSource; label: string; why: string }[];
  /** Worst-case error of a calibrated unit, % of reading, at the span's ends and over the accuracy band. */
  atMinPercent: number;
  atMaxPercent: number;
  bandWorstPercent: number;
  /** The same for an uncalibrated unit, for comparison. */
  uncalibratedBandWorstPercent: number;
  /** Lowest current at which a calibrated unit meets the accuracy target (null: nowhere in the span). */
  lowestAccurateCurrentA: number | null;
  curve: { currentA: number; calibratedPercent: number; uncalibratedPercent: number }[];
};

/** Worst-case (sum) error of a calibrated unit at current I, A: the budget without the removed terms. */
export function calibratedErrorA(req: Requirement, choice: Choice, currentA: number): number {
  return benchCalibratedTerms(req, buildModel(req), fittedModel(req), choice, currentA).reduce(
    (s, t) => s + Math.abs(t.errorA),
    0,
  );
}

export function calibratedAccuracy(req: Requirement, choice: Choice, points = 80): CalibratedAccuracy {
  const m = buildModel(req);
  const fitted = fittedModel(req);
  // A signed span's figures are the same either way: its magnitudes up to the larger end.
  const top = Math.max(req.current.max, m.iNeg);
  const at = (I: number) => {
    let all = 0;
    let left = 0;
    for (const t of budgetTerms(req, m, choice, I)) all += Math.abs(t.errorA);
    for (const t of benchCalibratedTerms(req, m, fitted, choice, I)) left += Math.abs(t.errorA);
    return { calibratedPercent: (100 * left) / I, uncalibratedPercent: (100 * all) / I };
  };
  const curve = logSpace(m.iMin, top, points).map((I) => ({ currentA: I, ...at(I) }));
  const band = logSpace(req.accuracy.bandMin, req.accuracy.bandMax, points).map(at);
  // The calibrated ratio is still a + b·I² + c/I (convex in I): scan finely, then bisect the crossing.
  const target = req.accuracy.percent;
  let lowest: number | null = null;
  const fine = logSpace(m.iMin, top, 400);
  const firstOk = fine.findIndex((I) => at(I).calibratedPercent <= target);
  if (firstOk === 0) lowest = m.iMin;
  else if (firstOk > 0) {
    let a = fine[firstOk - 1]!;
    let b = fine[firstOk]!;
    for (let k = 0; k < 60; k++) {
      const mid = Math.sqrt(a * b);
      if (at(mid).calibratedPercent <= target) b = mid;
      else a = mid;
    }
    lowest = b;
  }
  // The sources this design has (a filter, pads or a thermal EMF only where it has them).
  const sources = budgetTerms(req, m, choice, top).map((t) => t.source);
  return {
    removed: sources
      .filter((s) => removedByCalibration.includes(s))
      .map((s) => ({ source: s, label: budgetSourceLabels[s] })),
    remaining: sources
      .filter((s) => !removedByCalibration.includes(s))
      .map((s) => ({ source: s, label: budgetSourceLabels[s], why: remainsBecause[s] ?? "" })),
    atMinPercent: at(m.iMin).calibratedPercent,
    atMaxPercent: at(top).calibratedPercent,
    bandWorstPercent: Math.max(...band.map((b) => b.calibratedPercent)),
    uncalibratedBandWorstPercent: Math.max(...band.map((b) => b.uncalibratedPercent)),
    lowestAccurateCurrentA: lowest,
    curve,
  };
}
