// Saved values laid over defaults: used for the wizard's draft and for a requirement read back
// into the form. Its own file, so draft.ts and form-values.ts need not import each other.
/** Plain objects merged key by key; arrays and scalars from `over` replace. */
export function deepMerge<T>(base: T, over: unknown): T {
  if (!over || typeof over !== "object" || Array.isArray(over)) return over === undefined ? base : (over as T);
  if (!base || typeof base !== "object" || Array.isArray(base)) return over as T;
  const out: Record<string, unknown> = { ...(base as Record<string, unknown>) };
  for (const [k, v] of Object.entries(over as Record<string, unknown>)) out[k] = deepMerge(out[k], v);
  return out as T;
}
