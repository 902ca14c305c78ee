// The engine's public surface (see docs/architecture.md). Pure TypeScript: mathjs, zod
// and this folder only, so it runs in a route handler and in a browser worker alike.
export * from "./units";
export * from "./format";
export * from "./eseries";
export * from "./gains";
export * from "./requirement";
export * from "./types";
export { BOLTZMANN, REFERENCE_C, SINGLE_POLE_NBW, readoutStepV } from "./model";
export {
  candidateFigures,
  evaluateCandidate,
  isInSweep,
  shuntInSweep,
  gainInSweep,
  rejectReasonLabels,
  rejectReasons,
  type RejectReason,
} from "./candidate";
export * from "./error-budget";
export { solve, defaultRankingText, type SolveResult, type SolveOptions } from "./solve";
export { RankExpressionError, compileRankExpression, rankFields, type RankField } from "./rank";
export { diagnose, e24Ladder, CLOSEST_COUNT, type Diagnosis, type RelaxSuggestion, type Violations } from "./diagnosis";
export {
  planRanges,
  whyNoPlan,
  SWITCH_DOWN_FRACTION,
  MAX_RANGES,
  type RangePlan,
  type PlannedRange,
} from "./range-plan";
export * from "./bench-check";
export { decadeScale, decadeScaleLabel } from "./decade";
export * from "./insertion";
export { insertionSchema } from "./insertion-schema";
export * from "./netlist";
export * from "./monte-carlo";
export { mulberry32 } from "./prng";
export * from "./unit-check";
export * from "./unit-prediction";
export * from "./calibrated-accuracy";
export * from "./cautions";
export * from "./profile";
export * from "./plan-choice";
export * from "./saved-verdict";
export { evaluatePlan, type PlanEvaluation, type PlanMetrics, type PlanRangeMetrics } from "./plan-evaluation";
export * from "./design-kind";
export * from "./plan-cautions";
export * from "./plan-stretches";
export * from "./plan-switching";
export * from "./plan-netlist";
export * from "./resistor-code";
export * from "./signed-output";
