// Side-by-side comparison: which of the compared designs has the best value in a row.
import { z } from "zod";
import type { FieldInfo } from "./figures";

/** ?ids=a,b,c: two to four distinct design ids. */
export const compareQuery = z.object({
  ids: z
    .string({ error: "ids: give two to four design ids separated by commas" })
    .transform((s) => [...new Set(s.split(",").map((x) => x.trim()).filter(Boolean))])
    .refine((ids) => ids.length >= 2 && ids.length <= 4, { error: "ids: compare two to four different designs" }),
});

/** Indexes holding the best value of the row (ties all marked); none when the row has no direction or one value. */
export function bestIndexes(values: (number | null | undefined)[], info: FieldInfo | undefined): number[] {
  if (!info?.better) return [];
  const nums = values.map((v) => (typeof v === "number" && Number.isFinite(v) ? v : null));
  const present = nums.filter((v): v is number => v !== null);
  if (present.length < 2) return [];
  const best = info.better === "lower" ? Math.min(...present) : Math.max(...present);
  if (present.every((v) => Math.abs(v - best) <= 1e-12 * Math.abs(best))) return [];
  return nums.flatMap((v, i) => (v !== null && Math.abs(v - best) <= 1e-12 * Math.abs(best) ? [i] : []));
}
