// The changes between two revisions of a design, read and worked out once per process: both
// revisions are immutable, so the answer never changes (the design page opens on its last pair).
import { listRevisions } from "@/db/queries/designs";
import { diffRevisions, type Change } from "./diff";
import { RevisionMemo, revisionKey } from "./revision-memo";

const changesOf = new RevisionMemo<Promise<Change[]>>(2000);

/**
 * What changed from revision `a` to `b` of a design the caller was already allowed to read; empty
 * when either is missing. Neither a failed read nor a missing revision is kept: the next request reads again.
 */
export function revisionChanges(designId: string, a: number, b: number): Promise<Change[]> {
  const key = `${revisionKey(designId, a)}>${b}`;
  return changesOf.get(key, () => {
    const changes = listRevisions(designId, [a, b]).then((pair) => {
      const from = pair.find((r) => r.revision === a);
      const to = pair.find((r) => r.revision === b);
      if (from && to) return diffRevisions(from, to);
      changesOf.delete(key);
      return [];
    });
    changes.catch(() => changesOf.delete(key));
    return changes;
  });
}
