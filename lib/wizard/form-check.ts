// The wizard form's validation as one pure function: the engine's schema reads the typed text into
// a Requirement, stock schema messages become the field's own words, and the working range and
// ambiguous percents add their messages. It runs in the check worker (./check.worker.ts), so the
// page itself loads neither zod nor the unit parser; react-hook-form awaits it as its resolver.
import { zodResolver } from "@hookform/resolvers/zod";
import type { FieldErrors as RhfErrors, Resolver, ResolverOptions } from "react-hook-form";
import { z } from "zod";
import { ambiguousPercentErrors } from "@/lib/design/ambiguous-percent";
import { requirementSchema, type Requirement } from "@/lib/design/requirement";
import { errorPaths, inWords, valueAt } from "./form-errors";
import type { WizardValues } from "./form-values";
import { outOfRange, outOfRangeTyped } from "./ranges";

/** A valid form's Requirement, or react-hook-form's nested errors (plain data: no element refs). */
export type FormCheck = { ok: true; requirement: Requirement } | { ok: false; errors: RhfErrors<WizardValues> };

// The form's text is the schema's input at run time; the identity preprocess says so to the compiler.
const parse: Resolver<WizardValues, unknown, Requirement> = zodResolver(
  z.preprocess((typed: WizardValues) => typed, requirementSchema),
);
// No fields to attach as refs here: react-hook-form focuses its own registered fields.
const options: ResolverOptions<WizardValues> = { fields: {}, shouldUseNativeValidation: false };

/** Put a message on a dotted path of a nested error tree, making the branches it needs. */
function place(errors: Record<string, unknown>, path: string, message: string) {
  const keys = path.split(".");
  let node = errors;
  for (const k of keys.slice(0, -1)) node = (node[k] ??= {}) as Record<string, unknown>;
  node[keys.at(-1)!] = { type: "range", message };
}

export async function checkForm(values: WizardValues): Promise<FormCheck> {
  const r = await parse(values, undefined, options);
  const errors = r.errors as Record<string, unknown>;
  if (Object.keys(errors).length > 0) {
    // Stock schema messages become the field's own words, quoting what was typed.
    for (const path of errorPaths(r.errors)) {
      const walk = (node: unknown, at: string) => {
        const n = node as { message?: unknown } & Record<string, unknown>;
        if (!n || typeof n !== "object") return;
        if (typeof n.message === "string") n.message = inWords(at, n.message, valueAt(values, at));
        // A list carries one message per bad entry, and react-hook-form may add the list's own under
        // `root`: that one is the list's (its path is the list's), and says nothing an entry's
        // message does not, so it goes when an entry has one.
        const entries = Object.keys(n).filter((k) => /^\d+$/.test(k));
        if (n.root && entries.some((k) => (n[k] as { message?: unknown } | undefined)?.message)) delete n.root;
        for (const [k, v] of Object.entries(n))
          if (k !== "ref" && k !== "message" && k !== "type") walk(v, k === "root" ? at : `${at}.${k}`);
      };
      walk(valueAt(errors, path), path);
    }
    // A field typed far out of range says so even while another field is still incomplete; a bare
    // percent that reads two ways says so in place of any other message on its field.
    const ambiguous = ambiguousPercentErrors(values, "type");
    const far = { ...outOfRangeTyped(values), ...ambiguous };
    // The working range's words win over the schema's own limit on a value typed far out of range.
    for (const [path, msgs] of Object.entries(far)) place(errors, path, msgs[0]!);
    return { ok: false, errors: errors as RhfErrors<WizardValues> };
  }
  const requirement = r.values as Requirement;
  const far = { ...outOfRange(requirement), ...ambiguousPercentErrors(values, "type") };
  if (Object.keys(far).length === 0) return { ok: true, requirement };
  const out: Record<string, unknown> = {};
  for (const [path, msgs] of Object.entries(far)) place(out, path, msgs[0]!);
  return { ok: false, errors: out as RhfErrors<WizardValues> };
}
