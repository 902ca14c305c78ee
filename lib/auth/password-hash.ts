// Password hashing with bcrypt, at the cost the seed also uses (10 rounds).
import { randomBytes } from "node:crypto";
import bcrypt from "bcryptjs";

export const BCRYPT_ROUNDS = 10;

export const hashPassword = (password: string) => bcrypt.hash(password, BCRYPT_ROUNDS);

// A hash of a random secret nobody knows, compared against when an e-mail has no account, so an
// unknown e-mail costs the same bcrypt work as a known one and timing does not tell them apart.
let dummy: Promise<string> | undefined;
const dummyHash = () => (dummy ??= bcrypt.hash(randomBytes(18).toString("base64url"), BCRYPT_ROUNDS));

/** Compares against `hash`, or against the dummy hash when there is no account (always false then). */
export async function verifyPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  if (!hash) {
    await bcrypt.compare(password, await dummyHash());
    return false;
  }
  return bcrypt.compare(password, hash);
}
