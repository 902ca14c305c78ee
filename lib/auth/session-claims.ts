// The signed-in session's claims, read from the session cookie as next-auth's getServerSession reads
// them, without its work that a request of the App Router throws away: getServerSession decodes the
// token, then encodes a fresh one for a cookie it cannot set here (two key derivations and two
// ciphers per request). A token that decoded once decodes to the same claims until it expires (it
// is authenticated encryption under this process's secret), so its claims are kept by its exact text.
import "server-only";
import { cookies } from "next/headers";
import { decode, getToken, type JWT, type JWTDecodeParams } from "next-auth/jwt";
import { authOptions, type SessionClaims } from "./options";

/** Session tokens decoded in this process, by their text; bounded, oldest out first. */
const decoded = new Map<string, JWT>();
const KEEP = 2000;

/** next-auth's own check of a token's expiry (jwtDecrypt's clock tolerance, in seconds). */
const CLOCK_TOLERANCE_S = 15;

const expired = (jwt: JWT) => typeof jwt.exp === "number" && jwt.exp + CLOCK_TOLERANCE_S < Date.now() / 1000;

/** next-auth's decode, done once per token text: a kept token is still refused once it expires. */
export async function decodeOnce(params: JWTDecodeParams): Promise<JWT | null> {
  const { token, secret } = params;
  if (!token) return null;
  const key = `${typeof secret === "string" ? secret : secret.toString("base64")}\n${token}`;
  const kept = decoded.get(key);
  if (kept) {
    if (!expired(kept)) return kept;
    decoded.delete(key);
    return null;
  }
  const jwt = await decode(params);
  if (!jwt) return null;
  decoded.set(key, jwt);
  if (decoded.size > KEEP) decoded.delete(decoded.keys().next().value as string);
  return jwt;
}

/**
 * The claims of this request's session cookie, or null when there is none or it does not decode
 * (expired, forged, another secret's). The same cookie names, chunking and secret as next-auth.
 */
export async function sessionClaims(): Promise<SessionClaims | null> {
  const jar = await cookies();
  const req = { headers: {}, cookies: Object.fromEntries(jar.getAll().map((c) => [c.name, c.value])) };
  const secret = authOptions.secret ?? process.env.NEXTAUTH_SECRET ?? process.env.AUTH_SECRET;
  const jwt = await getToken({
    req: req as unknown as Parameters<typeof getToken>[0]["req"],
    secret,
    decode: decodeOnce,
  });
  if (!jwt) return null;
  return {
    userId: typeof jwt.userId === "string" ? jwt.userId : undefined,
    teamId: typeof jwt.teamId === "string" ? jwt.teamId : undefined,
    role: typeof jwt.role === "string" ? jwt.role : undefined,
    sessionVersion: typeof jwt.sessionVersion === "number" ? jwt.sessionVersion : 0,
  };
}
