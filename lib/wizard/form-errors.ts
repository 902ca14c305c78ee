// Reading react-hook-form's nested error tree by the engine's dotted paths.
import type { FieldErrors as RhfErrors, FieldValues } from "react-hook-form";
import { requirementFields } from "@/lib/saved-designs/figures";

type Node = { message?: unknown; [k: string]: unknown } | undefined;

function collect(node: unknown, out: string[]) {
  if (!node || typeof node !== "object") return;
  const n = node as Record<string, unknown>;
  if (typeof n.message === "string" && n.message) out.push(n.message);
  for (const [k, v] of Object.entries(n)) {
    if (k === "ref" || k === "message" || k === "type" || k === "types") continue;
    collect(v, out);
  }
}

/** Every message at `path` and below it (list items such as shunt.ratings.2), without repeats. */
export function errorText(errors: RhfErrors<FieldValues>, path: string): string | undefined {
  let node: unknown = errors;
  for (const key of path.split(".")) {
    node = (node as Record<string, Node> | undefined)?.[key];
    if (!node) return undefined;
  }
  const out: string[] = [];
  collect(node, out);
  return out.length ? [...new Set(out)].join("; ") : undefined;
}

/** Engine field errors (dotted) that fall inside one of the given field paths. */
export function engineErrorsFor(
  fieldErrors: Record<string, string[]>,
  path: string,
  /** The form's values, to quote what was typed (a list's entries are quoted from the list). */
  values?: unknown,
): string | undefined {
  const typedAt = (k: string) => (values === undefined ? undefined : valueAt(values, k.replace(/\.\d+$/, "")));
  const msgs = Object.entries(fieldErrors)
    .filter(([k]) => k === path || k.startsWith(`${path}.`))
    .flatMap(([k, v]) => v.map((m) => inWords(k, m, typedAt(k))));
  return msgs.length ? [...new Set(msgs)].join("; ") : undefined;
}

/** The dotted paths of every field that holds a message now (list items as their list). */
export function errorPaths(errors: RhfErrors<FieldValues>): string[] {
  const out: string[] = [];
  const walk = (node: unknown, path: string) => {
    if (!node || typeof node !== "object") return;
    const n = node as Record<string, unknown>;
    if (typeof n.message === "string" && n.message) {
      out.push(path);
      return;
    }
    for (const [k, v] of Object.entries(n)) {
      if (k === "ref" || k === "type" || k === "types") continue;
      if (/^\d+$/.test(k)) {
        if (!out.includes(path)) out.push(path);
        continue;
      }
      walk(v, path ? `${path}.${k}` : k);
    }
  };
  walk(errors, "");
  return out;
}

const zodDefault = /^Invalid input: expected (\w+), received (\w+)$/;

/** A schema's stock message ("Invalid input: expected number, received string") in the field's words. */
export function inWords(path: string, message: string, typed?: unknown): string {
  const m = zodDefault.exec(message);
  if (!m && message !== "Invalid input") return message;
  const listPath = path.replace(/\.\d+$/, "");
  const label = requirementFields[listPath]?.label ?? requirementFields[path]?.label ?? "This field";
  // For a list, quote the entry at fault, not the whole list.
  const entry = Array.isArray(typed) ? typed.find((x) => typeof x !== "number") : typed;
  const shown = entry === undefined || entry === null || entry === "" ? "" : `“${String(entry)}” `;
  // A list of numbers with a word in it: the list's own stock message, said of the word.
  if (!m && Array.isArray(typed) && typed.some((x) => typeof x === "number") && typeof entry === "string")
    return `${label}: ${shown}is not a number; give numbers separated by commas`;
  if (!m) return `${label}: ${shown}cannot be read as it stands`;
  if (m[1] === "number")
    return `${label}: ${shown}is not a number${listPath !== path ? "; give numbers separated by commas" : ""}`;
  return `${label}: ${shown}is not ${m[1] === "string" ? "text" : `a ${m[1]}`}`;
}

/** The value at a dotted path of the form's values (for quoting what was typed). */
export function valueAt(values: unknown, path: string): unknown {
  let node = values;
  for (const k of path.split(".")) node = (node as Record<string, unknown> | undefined)?.[k];
  return node;
}
