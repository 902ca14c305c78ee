// What is worked out from a saved revision, kept by that revision. A revision is an immutable row
// (a save writes a new one, never updates one), so anything computed from it alone (its parsed
// requirement, the changes between two of its design's revisions, its curves) stays right for as
// long as the process runs. Bounded, least recently used out first, so a large team's history
// cannot grow the server without end. Only for values that depend on the revision alone: never a
// design's status, approvals or name, which change without a new revision.

/** A Map kept in order of use: a hit moves its key to the end, an insert past `max` drops the first. */
export class RevisionMemo<V> {
  private readonly entries = new Map<string, V>();
  constructor(private readonly max: number) {}

  get size() {
    return this.entries.size;
  }

  /** The value kept for `key`, else `compute()` kept and returned. */
  get(key: string, compute: () => V): V {
    if (this.entries.has(key)) {
      const hit = this.entries.get(key) as V;
      this.entries.delete(key);
      this.entries.set(key, hit);
      return hit;
    }
    const value = compute();
    this.entries.set(key, value);
    if (this.entries.size > this.max) this.entries.delete(this.entries.keys().next().value as string);
    return value;
  }

  /** The value kept for `key`, if any, without computing one (and without counting it as a use). */
  peek(key: string): V | undefined {
    return this.entries.get(key);
  }

  delete(key: string) {
    this.entries.delete(key);
  }
}

/** The key of one revision of one design: design ids are never reused, revision numbers never rewritten. */
export const revisionKey = (designId: string, revision: number) => `${designId}#${revision}`;
