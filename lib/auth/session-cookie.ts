// A fresh session cookie for the caller, carrying a new session version: after a password change the
// browser that made it stays signed in while every other session of the user ends.
import { encode } from "next-auth/jwt";
import type { Caller } from "./gate";
import { SESSION_MAX_AGE_S } from "./options";

/** The cookie next-auth reads: the __Secure- name when the app is served over https. */
function cookieName(): { name: string; secure: boolean } {
  const secure = (process.env.NEXTAUTH_URL ?? "").startsWith("https://");
  return { name: `${secure ? "__Secure-" : ""}next-auth.session-token`, secure };
}

/** A Set-Cookie value holding a new session for `caller` at `sessionVersion`. */
export async function renewedSessionCookie(caller: Caller, sessionVersion: number): Promise<string> {
  const secret = process.env.NEXTAUTH_SECRET ?? process.env.AUTH_SECRET;
  if (!secret) throw new Error("no session secret is configured");
  const token = await encode({
    secret,
    maxAge: SESSION_MAX_AGE_S,
    token: {
      sub: caller.userId,
      name: caller.name,
      email: caller.email,
      userId: caller.userId,
      teamId: caller.teamId,
      role: caller.role,
      sessionVersion,
    },
  });
  const { name, secure } = cookieName();
  return `${name}=${token}; Path=/; HttpOnly; SameSite=Lax; Max-Age=${SESSION_MAX_AGE_S}${secure ? "; Secure" : ""}`;
}
