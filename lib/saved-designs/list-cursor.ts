// The designs list's `cursor`: a keyset position signed for one team, so a cursor copied from another
// team's list (or edited by hand) is refused rather than read as a position in this one.
import "server-only";
import crypto from "node:crypto";
import type { DesignListKey } from "@/db/queries/designs";

// AUTH_SECRET is set before the first request (lib/auth/secret.ts); a per-process key otherwise,
// which only means cursors do not survive a restart.
const fallbackKey = crypto.randomBytes(32).toString("base64url");
const key = () => process.env.AUTH_SECRET ?? process.env.NEXTAUTH_SECRET ?? fallbackKey;

const sign = (teamId: string, payload: string) =>
  crypto.createHmac("sha256", key()).update(`designs-list\n${teamId}\n${payload}`).digest("base64url");

export function encodeListCursor(teamId: string, position: DesignListKey): string {
  const payload = Buffer.from(JSON.stringify([position.updatedAt, position.id])).toString("base64url");
  return `${payload}.${sign(teamId, payload)}`;
}

const TIMESTAMP = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{6}Z$/;
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The position a cursor names for this team, or null when it was not issued to this team's list. */
export function decodeListCursor(teamId: string, cursor: string): DesignListKey | null {
  const [payload, mac, ...rest] = cursor.split(".");
  if (!payload || !mac || rest.length) return null;
  const expected = Buffer.from(sign(teamId, payload));
  const given = Buffer.from(mac);
  if (expected.length !== given.length || !crypto.timingSafeEqual(expected, given)) return null;
  try {
    const value: unknown = JSON.parse(Buffer.from(payload, "base64url").toString("utf8"));
    if (!Array.isArray(value) || value.length !== 2) return null;
    const [updatedAt, id] = value as unknown[];
    if (typeof updatedAt !== "string" || !TIMESTAMP.test(updatedAt)) return null;
    if (typeof id !== "string" || !UUID.test(id)) return null;
    return { updatedAt, id };
  } catch {
    return null;
  }
}
