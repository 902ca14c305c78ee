// A saved design is either one shunt and gain (a "pair") or a range plan: the two kinds every
// reader of a saved design tells apart by `kind`.
import type { PlanChoice } from "./plan-choice";
import type { PlanMetrics } from "./plan-evaluation";
import type { CandidateDetail, Choice } from "./types";

export type PairDesign = { kind: "pair"; choice: Choice; plan: null; metrics: CandidateDetail };
export type PlanDesign = { kind: "plan"; choice: null; plan: PlanChoice; metrics: PlanMetrics };
export type DesignKind = PairDesign | PlanDesign;

/** The two kinds as stored: exactly one of choice and plan is set (a check constraint says so). */
export function designKindOf(stored: {
  choice: Choice | null;
  plan: PlanChoice | null;
  metrics: CandidateDetail | PlanMetrics;
}): DesignKind {
  const { choice, plan, metrics } = stored;
  if (plan && "ranges" in metrics) return { kind: "plan", choice: null, plan, metrics };
  if (choice && !("ranges" in metrics)) return { kind: "pair", choice, plan: null, metrics };
  throw new Error("a saved revision must hold either a choice with its figures or a plan with its ranges");
}
