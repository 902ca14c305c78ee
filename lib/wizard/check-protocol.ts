// Messages between the wizard page and its check worker: the form's validation, and the few
// quantities the page reads to offer or convert a value.
import type { ParseResult, Dimension } from "@/lib/design/units";
import type { FormCheck } from "./form-check";
import type { WizardValues } from "./form-values";

export type CheckCall =
  | { kind: "form"; values: WizardValues }
  | { kind: "quantity"; input: string | number; dim: Dimension; label?: string }
  | { kind: "convertDrop"; values: WizardValues; to: "volts" | "share" };

export type CheckAnswer<C extends CheckCall> = C extends { kind: "form" }
  ? FormCheck
  : C extends { kind: "quantity" }
    ? ParseResult
    : string | null;

export type CheckRequest = { id: number; call: CheckCall };
export type CheckReply = { id: number; ok: true; answer: unknown } | { id: number; ok: false; message: string };
