// Switching a session's team. Sessions are next-auth JWTs in a cookie, so the switch re-issues
// that cookie with the new team (every other claim kept, the expiry renewed as on any sign-in);
// the gate re-reads the membership on every request, so the role that applies is always the
// one the person holds in the session's team now. Other sessions of the same person keep theirs.
import "server-only";
import { decode, encode } from "next-auth/jwt";
import { cookies } from "next/headers";
import { authOptions } from "./options";

function sessionCookie() {
  const secure = (process.env.NEXTAUTH_URL ?? "").startsWith("https://");
  return { name: `${secure ? "__Secure-" : ""}next-auth.session-token`, secure };
}

const secret = () => authOptions.secret ?? process.env.NEXTAUTH_SECRET ?? process.env.AUTH_SECRET ?? "";

/** Re-issues the caller's session cookie for `teamId`; false when there is no session cookie to re-issue. */
export async function reissueSessionForTeam(teamId: string): Promise<boolean> {
  const jar = await cookies();
  const { name, secure } = sessionCookie();
  const current = jar.get(name)?.value;
  if (!current) return false;
  const token = await decode({ token: current, secret: secret() });
  if (!token) return false;
  const maxAge = authOptions.session?.maxAge ?? 12 * 60 * 60;
  const { exp: _exp, iat: _iat, jti: _jti, ...claims } = token;
  const value = await encode({ token: { ...claims, teamId }, secret: secret(), maxAge });
  jar.set(name, value, { httpOnly: true, sameSite: "lax", path: "/", secure, maxAge });
  return true;
}
