// Messages between the wizard's plan editor and its worker: a plan to check on a requirement,
// answered with the engine's verdict, each range's own candidates and the plan's curves.
import type { PlanChoice } from "@/lib/design/plan-choice";
import type { PlanStretches } from "@/lib/design/plan-stretches";
import type { RangeCandidates } from "@/lib/design/range-candidates";
import type { Requirement } from "@/lib/design/requirement";

export type PlanCheckRequest = { id: number; requirement: Requirement; plan: PlanChoice };

/** The engine's word on a plan: sound, or refused with the field at fault and why. */
export type PlanVerdict =
  { sound: true; switchRule: string; protection: string } | { sound: false; path: string; message: string };

export type PlanCheckReply =
  | { id: number; ok: true; verdict: PlanVerdict; candidates: RangeCandidates[]; curves: PlanStretches }
  | { id: number; ok: false; message: string };
