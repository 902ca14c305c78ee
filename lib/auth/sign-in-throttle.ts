// Sign-in throttling, kept in the database. Failures are counted per e-mail-and-address pair and per
// address, never per e-mail alone: a stranger elsewhere who types a user's e-mail wrong a thousand
// times locks only themselves out, never that user.
import { clearBucket, countFailure, readBuckets } from "@/db/queries/sign-in-throttle";

export const SIGN_IN_WINDOW_MS = 15 * 60 * 1000;
/** Wrong passwords for one e-mail from one address before that pair waits for its window to close. */
export const PAIR_LIMIT = 5;
/** Failures from one address, whatever the e-mails, before that address waits. */
export const ADDRESS_LIMIT = 100;

const pairBucket = (email: string, address: string) => `pair:${email.trim().toLowerCase()} ${address}`;
const addressBucket = (address: string) => `address:${address}`;

/** Milliseconds until this e-mail may try again from this address; 0 when it may try now. */
export async function signInWaitMs(email: string, address: string, now = new Date()): Promise<number> {
  const limits = new Map([
    [pairBucket(email, address), PAIR_LIMIT],
    [addressBucket(address), ADDRESS_LIMIT],
  ]);
  const rows = await readBuckets([...limits.keys()], SIGN_IN_WINDOW_MS, now);
  let wait = 0;
  for (const row of rows) {
    if (row.failures < (limits.get(row.bucket) ?? Infinity)) continue;
    wait = Math.max(wait, row.windowStartedAt.getTime() + SIGN_IN_WINDOW_MS - now.getTime());
  }
  return Math.max(0, wait);
}

export function recordSignInFailure(email: string, address: string, now = new Date()): Promise<void> {
  return countFailure([pairBucket(email, address), addressBucket(address)], SIGN_IN_WINDOW_MS, now);
}

/** A correct password clears its own pair; the address keeps its count (it is about other accounts too). */
export function recordSignInSuccess(email: string, address: string): Promise<void> {
  return clearBucket(pairBucket(email, address));
}

export const retryAfterSeconds = (ms: number) => Math.max(1, Math.ceil(ms / 1000));

/** "Try again in 14 minutes." */
export function tryAgainIn(ms: number): string {
  const minutes = Math.max(1, Math.ceil(ms / 60000));
  return `Too many failed sign-ins. Try again in ${minutes} minute${minutes === 1 ? "" : "s"}.`;
}
