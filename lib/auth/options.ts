// next-auth configuration: e-mail and password (credentials), JWT sessions carrying user, team and the
// user's session version (raised on sign-out, password change and removal, which ends every session).
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { z } from "zod";
import { recordAudit } from "@/db/queries/audit";
import { bumpSessionVersion, findUserByEmail, firstMembership } from "@/db/queries/users";
import { clientAddress } from "./client-address";
import { verifyPassword } from "./password-hash";
import { safeRedirectUrl } from "./safe-redirect";
import { recordSignInFailure, recordSignInSuccess, signInWaitMs, tryAgainIn } from "./sign-in-throttle";

export const credentialsSchema = z.object({
  email: z.string().trim().toLowerCase().email().max(320),
  password: z.string().min(1).max(200),
});

export const SESSION_MAX_AGE_S = 12 * 60 * 60;

export type SessionClaims = { userId?: string; teamId?: string; role?: string; sessionVersion?: number };

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: SESSION_MAX_AGE_S },
  pages: { signIn: "/sign-in" },
  providers: [
    CredentialsProvider({
      id: "credentials",
      name: "E-mail and password",
      credentials: {
        email: { label: "E-mail", type: "email" },
        password: { label: "Password", type: "password" },
      },
      async authorize(raw, req) {
        const parsed = credentialsSchema.safeParse(raw);
        if (!parsed.success) throw new Error("Enter your e-mail address and password.");
        const { email, password } = parsed.data;
        const address = clientAddress(req?.headers as Record<string, unknown> | undefined);
        // The route answers 429 before this runs; checked again for attempts that raced past it.
        const wait = await signInWaitMs(email, address);
        if (wait > 0) throw new Error(tryAgainIn(wait));
        const user = await findUserByEmail(email);
        const ok = await verifyPassword(password, user?.passwordHash);
        const membership = user ? await firstMembership(user.id) : null;
        if (!user || !ok || !membership) {
          await recordSignInFailure(email, address);
          await recordAudit({
            teamId: membership?.teamId ?? null,
            actorId: null,
            action: "sign-in.failed",
            targetType: "user",
            targetId: user?.id ?? email,
            details: { email, address, reason: !user ? "unknown e-mail" : !ok ? "wrong password" : "no team" },
          });
          throw new Error("That e-mail and password do not match an account.");
        }
        await recordSignInSuccess(email, address);
        return {
          id: user.id,
          email: user.email,
          name: user.name,
          teamId: membership.teamId,
          role: membership.role,
          sessionVersion: user.sessionVersion,
        };
      },
    }),
  ],
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        const u = user as typeof user & { teamId: string; role: string; sessionVersion: number };
        token.userId = u.id;
        token.teamId = u.teamId;
        token.role = u.role;
        token.sessionVersion = u.sessionVersion;
      }
      return token;
    },
    async session({ session, token }) {
      return {
        ...session,
        userId: token.userId as string,
        teamId: token.teamId as string,
        role: token.role as string,
        sessionVersion: typeof token.sessionVersion === "number" ? token.sessionVersion : 0,
      };
    },
    // Only ever back into the app; a malformed callbackUrl (a port of 99999) goes home, never throws.
    async redirect({ url, baseUrl }) {
      return safeRedirectUrl(url, baseUrl);
    },
  },
  events: {
    // Signing out ends every session of the user, not only this browser's cookie.
    async signOut({ token }) {
      const claims = token as SessionClaims | null;
      if (claims?.userId) await bumpSessionVersion(claims.userId, undefined, claims.sessionVersion ?? 0);
    },
  },
};
