// Side-by-side comparison: which of the compared designs has the best value in a row.
import { z } from "zod";
import { formatField, type FieldInfo } from "./figures";

/** ?ids=a,b,c: two to four distinct design ids. */
export const compareQuery = z.object({
  ids: z
    .string({ error: "ids: give two to four design ids separated by commas" })
    .transform((s) => [
      ...new Set(
        s
          .split(",")
          .map((x) => x.trim())
          .filter(Boolean),
      ),
    ])
    .refine((ids) => ids.length >= 2 && ids.length <= 4, { error: "ids: compare two to four different designs" }),
});

/**
 * Indexes holding the best value of the row. Ties are judged on the value as shown (two designs
 * both showing 2.95 V are equal to the reader), all tied ones are marked, and none when every
 * shown value is the same or the row has no better direction. Only the designs `ranked` says
 * (all when it is not given) take part: one whose saved figures fail under today's model is
 * never "best" on the strength of figures the engine no longer stands behind.
 */
export function bestIndexes(values: unknown[], info: FieldInfo | undefined, ranked?: boolean[]): number[] {
  if (!info?.better) return [];
  const nums = values.map((v, i) => (typeof v === "number" && Number.isFinite(v) && (ranked?.[i] ?? true) ? v : null));
  const present = nums.filter((v): v is number => v !== null);
  if (present.length < 2) return [];
  const best = info.better === "lower" ? Math.min(...present) : Math.max(...present);
  const shown = formatField(best, info);
  const tied = nums.flatMap((v, i) => (v !== null && formatField(v, info) === shown ? [i] : []));
  return tied.length === present.length ? [] : tied;
}
