import { z } from "zod";
import { acceptInvitation, findInvitationByToken } from "@/db/queries/invitations";
import { currentCaller, parseWith, publicRoute } from "@/lib/auth/gate";
import { hashPassword } from "@/lib/auth/password-hash";
import { newPasswordSchema, PASSWORD_MAX_LENGTH } from "@/lib/auth/password-rules";
import { HttpError, json } from "@/lib/http";

const acceptSchema = z.object({
  token: z
    .string({ error: "token: the invitation link's code is missing" })
    .min(20, { error: "token: that is not an invitation code" })
    .max(200, { error: "token: that is not an invitation code" }),
  name: z.string().trim().max(100, { error: "name: at most 100 characters" }).default(""),
  // Only for a new account; an existing account joins by being signed in, never with a password.
  password: z
    .string()
    .max(PASSWORD_MAX_LENGTH, { error: `at most ${PASSWORD_MAX_LENGTH} characters` })
    .optional(),
});

const newAccountSchema = (email: string) =>
  z.object({
    name: z.string().trim().min(1, { error: "give your name: it is how the team sees you" }),
    password: newPasswordSchema(email),
  });

/**
 * Public. A new account: the invitee sets a name and a password (the app's password rules). An
 * existing account: the caller must be signed in as it, and sends the token alone. The token is
 * looked up before any password is hashed, and every refusal is audited.
 */
export const POST = publicRoute(async (request) => {
  const text = await request.text();
  if (text.length > 100_000) throw new HttpError(413, "The request body is too large.");
  let raw: unknown;
  try {
    raw = JSON.parse(text || "{}");
  } catch {
    throw new HttpError(422, "The request body is not valid JSON.", { "(body)": ["is not valid JSON"] });
  }
  const body = parseWith(acceptSchema, raw);
  const caller = await currentCaller();
  const invitation = await findInvitationByToken(body.token);

  let newAccount: { name: string; passwordHash: string } | undefined;
  if (invitation?.status === "pending" && !invitation.hasAccount && body.password !== undefined) {
    const chosen = parseWith(newAccountSchema(invitation.email), { name: body.name, password: body.password });
    newAccount = { name: chosen.name, passwordHash: await hashPassword(chosen.password) };
  }

  const result = await acceptInvitation({
    token: body.token,
    signedInUserId: caller?.userId ?? null,
    passwordOffered: body.password !== undefined,
    newAccount,
  });
  if (!result.ok) {
    // 410 (revoked, expired) reads as 409 to clients: the invitation exists but cannot be used.
    const status = result.status === 410 ? 409 : result.status;
    throw new HttpError(status, result.message, result.field ? { [result.field]: [result.message] } : undefined);
  }
  return json(
    { email: result.email, teamName: result.teamName, role: result.role, newAccount: result.newAccount },
    201,
  );
});
