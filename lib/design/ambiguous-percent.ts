// Bare numbers a person may mean two ways (issue 11, item 9). `accuracy.percent: 0.02` is 0.02 %
// while `drop.fraction: 0.02` is 2 %, so a bare accuracy target below 0.1 reads like a fraction;
// `readout.accuracy.percentOfReading` is named in percent but a bare number there is a fraction
// (0.005 is 0.5 %), so any bare number but 0 can be read both ways. Client input (API bodies, the
// wizard) is refused with both readings; a stored, normalized requirement holds the same fields as
// bare numbers and is read by parseRequirement, which does not apply this (DEFAULTS.md).
import { parseRequirement, type FieldErrors, type ParseRequirementResult } from "./requirement";
import { isBareNumber, roundSig } from "./units";

import { AMBIGUOUS_PERCENT_BELOW } from "./accuracy-text";

export { AMBIGUOUS_PERCENT_BELOW, accuracyTargetText } from "./accuracy-text";

/** How the message tells the person to give the value: an API body sends, a form is typed into. */
export type Verb = "send" | "type";

const valueAt = (raw: unknown, path: readonly string[]): unknown =>
  path.reduce<unknown>(
    (node, k) => (node !== null && typeof node === "object" ? (node as Record<string, unknown>)[k] : undefined),
    raw,
  );

const shown = (x: number) => String(roundSig(x));

/** The ambiguous bare numbers in a client's requirement input, as field errors on their paths. */
export function ambiguousPercentErrors(raw: unknown, verb: Verb = "send"): FieldErrors {
  const out: FieldErrors = {};
  const target = valueAt(raw, ["accuracy", "percent"]);
  if (isBareNumber(target)) {
    const x = Number(target);
    if (x > 0 && x < AMBIGUOUS_PERCENT_BELOW) {
      const asPercent = shown(x * 100);
      out["accuracy.percent"] = [
        `Accuracy target (accuracy.percent): ${shown(x)} reads as ${shown(x)} %; if you meant ${asPercent} %, ` +
          `${verb} ${asPercent} or "${asPercent} %"; for ${shown(x)} %, ${verb} "${shown(x)} %"`,
      ];
    }
  }
  if (valueAt(raw, ["readout", "kind"]) === "meter") {
    const meter = valueAt(raw, ["readout", "accuracy", "percentOfReading"]);
    if (isBareNumber(meter)) {
      const x = Number(meter);
      if (Number.isFinite(x) && x !== 0) {
        const asPercent = shown(x * 100);
        out["readout.accuracy.percentOfReading"] = [
          `Meter accuracy (readout.accuracy.percentOfReading): a bare ${shown(x)} reads as a share of the reading, ` +
            `${asPercent} %, though the name says percent; for ${asPercent} %, ${verb} "${asPercent} %"; ` +
            `for ${shown(x)} %, ${verb} "${shown(x)} %"`,
        ];
      }
    }
  }
  return out;
}

/**
 * A requirement as a client gives it: the engine's schema, plus the refusal of ambiguous bare
 * numbers (which replaces any other message on the same field). Stored requirements use
 * parseRequirement.
 */
export function parseRequirementInput(raw: unknown, verb: Verb = "send"): ParseRequirementResult {
  const parsed = parseRequirement(raw);
  const ambiguous = ambiguousPercentErrors(raw, verb);
  if (Object.keys(ambiguous).length === 0) return parsed;
  const fieldErrors: FieldErrors = { ...ambiguous, ...(parsed.ok ? {} : parsed.fieldErrors), ...ambiguous };
  const message = Object.entries(fieldErrors)
    .map(([path, msgs]) => `${path}: ${msgs.join("; ")}`)
    .join("\n");
  return { ok: false, message, fieldErrors };
}
