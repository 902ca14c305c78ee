// The library's write rules shared by its routes: merge a PATCH into the stored part, check it
// whole, and turn a query's refusal into the API's error.
import "server-only";
import type { z } from "zod";
import type { WriteResult } from "@/db/queries/library";
import { HttpError, invalid, refused } from "@/lib/http";
import { isUuid } from "@/lib/ids";

/** The stored part with the patch's fields over it, checked by the full schema (422 on a bad mix). */
export function mergePatch<T>(
  stored: Record<string, unknown>,
  patch: Record<string, unknown>,
  schema: z.ZodType<T>,
): T {
  const { updatedAt: _u, ...fields } = patch;
  const merged: Record<string, unknown> = { ...stored };
  for (const [k, v] of Object.entries(fields)) {
    if (v === undefined) continue;
    // A readout's groups (reference, accuracy) take a patch of one figure without losing the other.
    merged[k] = isPlainObject(v) && isPlainObject(stored[k]) ? { ...stored[k], ...v } : v;
  }
  const parsed = schema.safeParse(merged);
  if (!parsed.success) throw invalid(parsed.error);
  return parsed.data;
}

const isPlainObject = (v: unknown): v is Record<string, unknown> =>
  typeof v === "object" && v !== null && !Array.isArray(v);

/** The written row, or the refusal as an HttpError. */
export function written<T>(result: WriteResult<T>): T {
  if (result.ok) return result.row;
  throw refused(result.field ? { ...result, fieldErrors: { [result.field]: [result.message] } } : result);
}

/** A part id from the URL: anything that is not a UUID names no part. */
export function partId(id: string | undefined, what: string): string {
  if (!id || !isUuid(id)) throw new HttpError(404, `That ${what} was not found in the library.`);
  return id;
}
