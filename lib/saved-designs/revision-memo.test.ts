import { describe, expect, it } from "vitest";
import { RevisionMemo, revisionKey } from "./revision-memo";

describe("RevisionMemo", () => {
  it("works a value out once per key", () => {
    const memo = new RevisionMemo<number>(10);
    let calls = 0;
    const square = (n: number) => memo.get(revisionKey("d", n), () => (calls++, n * n));
    expect([square(3), square(3), square(4), square(3)]).toEqual([9, 9, 16, 9]);
    expect(calls).toBe(2);
  });

  it("drops the least recently used key past its bound, not the most recently read", () => {
    const memo = new RevisionMemo<string>(2);
    const computed: string[] = [];
    const get = (k: string) => memo.get(k, () => (computed.push(k), k.toUpperCase()));
    get("a");
    get("b");
    get("a"); // a is now the most recently used
    get("c"); // drops b
    expect(memo.size).toBe(2);
    get("a");
    get("b");
    expect(computed).toEqual(["a", "b", "c", "b"]);
  });

  it("forgets a deleted key", () => {
    const memo = new RevisionMemo<number>(4);
    let n = 0;
    memo.get("k", () => ++n);
    memo.delete("k");
    expect(memo.get("k", () => ++n)).toBe(2);
  });
});
