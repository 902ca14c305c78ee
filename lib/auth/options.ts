// next-auth configuration: e-mail and password (credentials), JWT sessions carrying user and team.
import bcrypt from "bcryptjs";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { z } from "zod";
import { recordAudit } from "@/db/queries/audit";
import { findUserByEmail, firstMembership } from "@/db/queries/users";
import { signInLimiters } from "./rate-limit";

const credentialsSchema = z.object({
  email: z.string().trim().toLowerCase().email(),
  password: z.string().min(1).max(200),
});

function clientAddress(headers: Record<string, unknown> | undefined): string {
  const forwarded = headers?.["x-forwarded-for"];
  if (typeof forwarded === "string" && forwarded) return forwarded.split(",")[0]!.trim();
  const real = headers?.["x-real-ip"];
  return typeof real === "string" && real ? real : "local";
}

const minutes = (ms: number) => Math.max(1, Math.ceil(ms / 60000));

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: 12 * 60 * 60 },
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
        const wait = Math.max(
          signInLimiters.byEmail.retryAfterMs(email),
          signInLimiters.byAddress.retryAfterMs(address),
        );
        if (wait > 0) {
          throw new Error(
            `Too many failed sign-ins. Try again in ${minutes(wait)} minute${minutes(wait) === 1 ? "" : "s"}.`,
          );
        }
        const user = await findUserByEmail(email);
        const ok = user ? await bcrypt.compare(password, user.passwordHash) : false;
        const membership = user && ok ? await firstMembership(user.id) : null;
        if (!user || !ok || !membership) {
          signInLimiters.byEmail.fail(email);
          signInLimiters.byAddress.fail(address);
          await recordAudit({
            teamId: membership?.teamId ?? (user ? ((await firstMembership(user.id))?.teamId ?? null) : null),
            actorId: null,
            action: "sign-in.failed",
            targetType: "user",
            targetId: user?.id ?? email,
            details: { email, address, reason: !user ? "unknown e-mail" : !ok ? "wrong password" : "no team" },
          });
          throw new Error("That e-mail and password do not match an account.");
        }
        signInLimiters.byEmail.reset(email);
        return { id: user.id, email: user.email, name: user.name, teamId: membership.teamId, role: membership.role };
      },
    }),
  ],
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        const u = user as typeof user & { teamId: string; role: string };
        token.userId = u.id;
        token.teamId = u.teamId;
        token.role = u.role;
      }
      return token;
    },
    async session({ session, token }) {
      return {
        ...session,
        userId: token.userId as string,
        teamId: token.teamId as string,
        role: token.role as string,
      };
    },
  },
};
