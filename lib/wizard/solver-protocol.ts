// Messages between the wizard and its solver worker.
import type { FieldErrors } from "@/lib/design/requirement";
import type { SolveResult } from "@/lib/design/solve";

export type SolveRequest = { id: number; input: unknown };

export type SolveReply =
  | { id: number; ok: true; result: SolveResult; solveMs: number }
  | { id: number; ok: false; fieldErrors: FieldErrors; message: string };
