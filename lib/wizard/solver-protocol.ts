// Messages between the wizard and its solver worker.
import type { FieldErrors } from "@/lib/design/requirement";
import type { SolveResult } from "@/lib/design/solve";
import type { StepDifferences } from "./from-defaults";

export type SolveRequest = { id: number; input: unknown };

export type SolveReply =
  | { id: number; ok: true; result: SolveResult; solveMs: number }
  | { id: number; ok: false; fieldErrors: FieldErrors; message: string };

/** Sent after a solved reply: what its requirement sets differently from the documented defaults,
 * for the save summary (worked out once the result is on its way, so the chart does not wait). */
export type DifferencesReply = { id: number; differences: StepDifferences[] };
