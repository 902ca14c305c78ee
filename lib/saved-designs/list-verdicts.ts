// The designs list flags a design whose current revision no longer passes under today's model, as
// its page does at the top: a list that shows "approved" beside a pair the engine now refuses would
// send it to the bench. Verdicts are kept per revision (saved-figures.ts), so a list page reads the
// requirements only of revisions it has not checked since the server started.
import { revisionBasesOf } from "@/db/queries/designs";
import { knownVerdict, savedVerdictOf } from "./saved-figures";
import type { SavedVerdict } from "@/lib/design/saved-verdict";

/** `rows` (each a design at its current revision), each with `failsCurrentModel`. */
export async function withCurrentModelVerdicts<T extends { id: string; revision: number }>(
  rows: T[],
): Promise<(T & { failsCurrentModel: boolean })[]> {
  const verdicts = new Map<string, SavedVerdict>();
  const unchecked: { designId: string; revision: number }[] = [];
  for (const r of rows) {
    const known = knownVerdict(r.id, r.revision);
    if (known) verdicts.set(r.id, known);
    else unchecked.push({ designId: r.id, revision: r.revision });
  }
  for (const { designId, ...basis } of await revisionBasesOf(unchecked))
    verdicts.set(designId, savedVerdictOf({ ...basis, id: designId }));
  // A design removed between the two reads is listed as it was read, unflagged.
  return rows.map((r) => ({ ...r, failsCurrentModel: verdicts.get(r.id)?.fails ?? false }));
}
