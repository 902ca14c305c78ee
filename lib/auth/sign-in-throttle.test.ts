// The throttle against a real (in-memory) database: counts per pair and per address, windows that
// close, and two counters racing into one row. Limits are the app's own (common practice, no source:
// a handful of guesses per account and address, a larger allowance per address).
import { afterAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db/client";
import {
  ADDRESS_LIMIT,
  PAIR_LIMIT,
  SIGN_IN_WINDOW_MS,
  recordSignInFailure,
  recordSignInSuccess,
  signInWaitMs,
} from "./sign-in-throttle";

afterAll(() => closeDb());

const t0 = new Date("2026-01-05T10:00:00Z");
const at = (ms: number) => new Date(t0.getTime() + ms);

describe("sign-in throttle", () => {
  it("locks an e-mail-and-address pair after its limit, until its window closes", async () => {
    for (let i = 0; i < PAIR_LIMIT - 1; i++) await recordSignInFailure("User@a.example", "10.0.0.1", at(i * 1000));
    expect(await signInWaitMs("user@a.example", "10.0.0.1", at(5000))).toBe(0);
    await recordSignInFailure("user@a.example", "10.0.0.1", at(5000));
    expect(await signInWaitMs("user@a.example", "10.0.0.1", at(6000))).toBe(SIGN_IN_WINDOW_MS - 6000);
    // The same e-mail from another address is not held back: nobody can lock a user out from afar.
    expect(await signInWaitMs("user@a.example", "10.0.0.2", at(6000))).toBe(0);
    // The window closes and the pair may try again.
    expect(await signInWaitMs("user@a.example", "10.0.0.1", at(SIGN_IN_WINDOW_MS))).toBe(0);
  });

  it("starts a fresh count after the window, and a success clears the pair", async () => {
    for (let i = 0; i < PAIR_LIMIT; i++) await recordSignInFailure("b@a.example", "10.0.0.3", at(i));
    await recordSignInFailure("b@a.example", "10.0.0.3", at(SIGN_IN_WINDOW_MS + 1));
    expect(await signInWaitMs("b@a.example", "10.0.0.3", at(SIGN_IN_WINDOW_MS + 2))).toBe(0);
    for (let i = 0; i < PAIR_LIMIT; i++) await recordSignInFailure("c@a.example", "10.0.0.3", at(i));
    expect(await signInWaitMs("c@a.example", "10.0.0.3", at(10))).toBeGreaterThan(0);
    await recordSignInSuccess("c@a.example", "10.0.0.3");
    expect(await signInWaitMs("c@a.example", "10.0.0.3", at(10))).toBe(0);
  });

  it("holds back an address that fails across many e-mails, and only that address", async () => {
    const failures = [];
    for (let i = 0; i < ADDRESS_LIMIT; i++)
      failures.push(recordSignInFailure(`made-up-${i}@x.example`, "10.0.0.9", at(0)));
    // Counted concurrently: each increment is one statement, none is lost.
    await Promise.all(failures);
    expect(await signInWaitMs("real@a.example", "10.0.0.9", at(1000))).toBe(SIGN_IN_WINDOW_MS - 1000);
    expect(await signInWaitMs("real@a.example", "10.0.0.10", at(1000))).toBe(0);
  });
});
