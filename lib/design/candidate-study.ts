// Everything a screen draws for one pair across the span, worked out in one call: the error
// curves (the pair and up to three pinned ones), the drop on the load, the error budget at the
// span's currents of interest, the figures and the cautions. The design page computes it on the
// server and hands it to the browser as data; the wizard computes it live as the pair changes.
import { evaluateCandidate } from "./candidate";
import { designCautions, type Caution } from "./cautions";
import {
  errorAt,
  errorCurve,
  loadCurve,
  type ErrorAtResult,
  type ErrorCurvePoint,
  type LoadCurvePoint,
} from "./error-budget";
import { outputCeilingV } from "./model";
import type { Requirement } from "./requirement";
import type { CandidateDetail, Choice } from "./types";

/** Where the error budget is split by source: the span's ends and, when the requirement gives one, its typical current. */
export type BudgetPoint = "min" | "typical" | "max";

export type CandidateStudyFigures = {
  detail: CandidateDetail;
  /** The pair's curve first, then each pinned pair's (other than the pair itself, three at most). */
  errorCurves: { choice: Choice; points: ErrorCurvePoint[] }[];
  load: LoadCurvePoint[];
  budgets: Partial<Record<BudgetPoint, { currentA: number; budget: ErrorAtResult }>>;
  cautions: Caution[];
  /** Highest usable output: the readout's full scale less its own worst errors, or the amplifier's swing, V. */
  outputCeilingV: number;
};

const sameChoice = (a: Choice, b: Choice) => a.shuntOhms === b.shuntOhms && a.gain === b.gain;

export function budgetCurrents(req: Requirement): Partial<Record<BudgetPoint, number>> {
  return {
    min: req.current.min,
    ...(req.current.typical !== undefined ? { typical: req.current.typical } : {}),
    max: req.current.max,
  };
}

/**
 * The figures of one pair. `saved` (the figures stored with a saved revision) is shown as it was
 * saved instead of a fresh evaluation, so a page shows what was reviewed.
 */
export function candidateStudy(
  req: Requirement,
  choice: Choice,
  { pinned = [], saved, points = 60 }: { pinned?: Choice[]; saved?: CandidateDetail; points?: number } = {},
): CandidateStudyFigures {
  const detail = saved ?? evaluateCandidate(req, choice);
  const others = pinned.filter((p) => !sameChoice(p, choice)).slice(0, 3);
  const budgets: CandidateStudyFigures["budgets"] = {};
  for (const [at, currentA] of Object.entries(budgetCurrents(req)) as [BudgetPoint, number][])
    budgets[at] = { currentA, budget: errorAt(req, choice, currentA) };
  return {
    detail,
    errorCurves: [choice, ...others].map((c) => ({ choice: c, points: errorCurve(req, c, points) })),
    load: loadCurve(req, choice, points),
    budgets,
    cautions: designCautions(req, detail),
    outputCeilingV: outputCeilingV(req),
  };
}
