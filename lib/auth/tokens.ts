// Personal API tokens: making a secret, and turning `Authorization: Bearer <secret>` into a caller.
// A token acts as its owner in the team it was made in, with the owner's role there as it is now
// (re-read on every request, so a demotion or removal counts from the next request).
import "server-only";
import crypto from "node:crypto";
import { findTokenByHash, touchToken } from "@/db/queries/tokens";
import { getMember } from "@/db/queries/users";
import { HttpError } from "@/lib/http";
import { createWindowCounter } from "./token-throttle";

/** Secrets start with this, so a leaked one is easy to recognise in logs and scanners. */
export const TOKEN_PREFIX = "swt_";
const SECRET_SHAPE = /^swt_[A-Za-z0-9_-]{43}$/;

export function hashSecret(secret: string): string {
  return crypto.createHash("sha256").update(secret, "utf8").digest("hex");
}

/** A new secret: 32 random bytes, base64url. Returned once to its owner; only its hash is stored. */
export function newSecret(): { secret: string; secretHash: string; hint: string } {
  const secret = `${TOKEN_PREFIX}${crypto.randomBytes(32).toString("base64url")}`;
  return { secret, secretHash: hashSecret(secret), hint: secret.slice(0, TOKEN_PREFIX.length + 4) };
}

/** The bearer secret of an Authorization header; null when the header is not a bearer one. */
export function bearerSecret(authorization: string | null): string | null {
  if (!authorization) return null;
  const match = /^Bearer\s+(.*)$/i.exec(authorization.trim());
  return match ? (match[1] ?? "").trim() : null;
}

// Per-token throttle: a bounded in-memory window per process (lib/auth/token-throttle.ts). With
// several app processes each has its own window, so the limit is per process; one process is how
// the product is served (PGlite allows no other).
export const TOKEN_REQUESTS_PER_MINUTE = 300;
const g = globalThis as typeof globalThis & { __swTokenThrottle?: ReturnType<typeof createWindowCounter> };
const throttle = (g.__swTokenThrottle ??= createWindowCounter({
  limit: TOKEN_REQUESTS_PER_MINUTE,
  windowMs: 60_000,
  maxKeys: 10_000,
}));

const refused = () =>
  new HttpError(401, "That API token is not valid: it is unknown, revoked or expired. Create a new one on /account.");

/**
 * The caller a bearer secret stands for. 401 for an unknown, revoked or expired token or when its
 * owner is no longer a member of its team; 429 past the per-token limit. No message repeats the secret.
 */
export async function callerFromToken(secret: string) {
  if (!SECRET_SHAPE.test(secret)) throw refused();
  const token = await findTokenByHash(hashSecret(secret));
  if (!token || token.revokedAt || (token.expiresAt && token.expiresAt.getTime() <= Date.now())) throw refused();
  const wait = throttle.hit(token.id);
  if (wait > 0) {
    throw new HttpError(
      429,
      `This API token made more than ${TOKEN_REQUESTS_PER_MINUTE} requests in a minute; wait ${Math.ceil(wait / 1000)} s.`,
      undefined,
      { "retry-after": String(Math.ceil(wait / 1000)) },
    );
  }
  const member = await getMember(token.userId, token.teamId);
  if (!member) {
    throw new HttpError(401, "That API token's owner is no longer a member of its team, so the token no longer works.");
  }
  await touchToken(token.id);
  return { ...member, via: "token" as const, access: token.access, tokenId: token.id };
}
