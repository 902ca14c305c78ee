import { describe, expect, it } from "vitest";
import { createLimiter } from "./rate-limit";

describe("sign-in limiter", () => {
  it("allows up to the limit, then asks to wait until the oldest failure leaves the window", () => {
    const l = createLimiter(3, 60_000);
    const t0 = 1_000_000;
    for (let i = 0; i < 3; i++) {
      expect(l.retryAfterMs("a", t0 + i)).toBe(0);
      l.fail("a", t0 + i);
    }
    expect(l.retryAfterMs("a", t0 + 10)).toBe(60_000 - 10);
    expect(l.retryAfterMs("b", t0 + 10)).toBe(0);
    expect(l.retryAfterMs("a", t0 + 60_001)).toBe(0);
  });

  it("forgets a key on reset (a successful sign-in)", () => {
    const l = createLimiter(1, 60_000);
    l.fail("a", 5);
    expect(l.retryAfterMs("a", 6)).toBeGreaterThan(0);
    l.reset("a");
    expect(l.retryAfterMs("a", 6)).toBe(0);
  });
});
