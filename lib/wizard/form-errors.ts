// Reading react-hook-form's nested error tree by the engine's dotted paths.
import type { FieldErrors as RhfErrors, FieldValues } from "react-hook-form";

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
export function engineErrorsFor(fieldErrors: Record<string, string[]>, path: string): string | undefined {
  const msgs = Object.entries(fieldErrors)
    .filter(([k]) => k === path || k.startsWith(`${path}.`))
    .flatMap(([, v]) => v);
  return msgs.length ? [...new Set(msgs)].join("; ") : undefined;
}
