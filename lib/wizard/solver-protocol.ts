// Messages between the wizard and its solver worker.
import type { FieldErrors, SolveResult } from "@/lib/design";

export type SolveRequest = { id: number; input: unknown };

export type SolveReply =
  | { id: number; ok: true; result: SolveResult; solveMs: number }
  | { id: number; ok: false; fieldErrors: FieldErrors; message: string };
