import { describe, expect, it } from "vitest";
import { createWindowCounter } from "./token-throttle";

describe("per-token window counter", () => {
  it("allows `limit` requests per window, then says how long to wait, then allows again", () => {
    const c = createWindowCounter({ limit: 3, windowMs: 60_000, maxKeys: 10 });
    expect([c.hit("a", 0), c.hit("a", 1), c.hit("a", 2)]).toEqual([0, 0, 0]);
    expect(c.hit("a", 10_000)).toBe(50_000);
    expect(c.hit("b", 10_000)).toBe(0); // another token has its own window
    expect(c.hit("a", 60_000)).toBe(0);
  });

  it("keeps at most maxKeys windows", () => {
    const c = createWindowCounter({ limit: 1, windowMs: 60_000, maxKeys: 100 });
    for (let i = 0; i < 1000; i++) c.hit(`k${i}`, 0);
    expect(c.size()).toBe(100);
    expect(c.hit("k999", 1)).toBeGreaterThan(0); // the newest windows are the ones kept
  });
});
