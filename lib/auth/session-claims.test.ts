import { encode } from "next-auth/jwt";
import { afterEach, describe, expect, it, vi } from "vitest";
import { decodeOnce } from "./session-claims";

// The tokens are next-auth's own (its encode); decodeOnce must give exactly what its decode gives,
// and refuse what it refuses, whether or not the token was seen before.
const secret = "a-test-secret-of-some-length-000000";
const claims = { userId: "u1", teamId: "t1", role: "designer", sessionVersion: 3 };

afterEach(() => vi.useRealTimers());

describe("decodeOnce", () => {
  it("gives the claims next-auth encoded, the first time and again", async () => {
    const token = await encode({ token: claims, secret, maxAge: 600 });
    const first = await decodeOnce({ token, secret });
    expect(first).toMatchObject(claims);
    expect(await decodeOnce({ token, secret })).toBe(first);
  });

  it("refuses a kept token once it has expired (15 s of clock tolerance, as next-auth)", async () => {
    vi.useFakeTimers({ now: new Date("2026-12-02T12:00:00Z") });
    const token = await encode({ token: claims, secret, maxAge: 60 });
    expect(await decodeOnce({ token, secret })).toMatchObject(claims);
    vi.setSystemTime(new Date("2026-12-02T12:01:10Z"));
    expect(await decodeOnce({ token, secret })).toMatchObject(claims);
    vi.setSystemTime(new Date("2026-12-02T12:01:20Z"));
    expect(await decodeOnce({ token, secret })).toBeNull();
  });

  it("does not take a token kept under one secret as valid under another, nor an altered one", async () => {
    const token = await encode({ token: claims, secret, maxAge: 600 });
    await decodeOnce({ token, secret });
    await expect(decodeOnce({ token, secret: `${secret}-other` })).rejects.toThrow();
    const altered = `${token.slice(0, -4)}${token.slice(-4) === "AAAA" ? "BBBB" : "AAAA"}`;
    await expect(decodeOnce({ token: altered, secret })).rejects.toThrow();
  });

  it("answers null to no token at all", async () => {
    expect(await decodeOnce({ token: undefined, secret })).toBeNull();
  });
});
