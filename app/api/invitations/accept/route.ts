import { z } from "zod";
import { acceptInvitation, findInvitationByToken } from "@/db/queries/invitations";
import { currentCaller, parseWith, publicRoute, readJson } from "@/lib/auth/gate";
import { hashPassword } from "@/lib/auth/password-hash";
import { newPasswordSchema, PASSWORD_MAX_LENGTH } from "@/lib/auth/password-rules";
import { HttpError, json, refused } from "@/lib/http";
import { textField } from "@/lib/text-field";

const acceptSchema = z.object({
  token: z
    .string({ error: "token: the invitation link's code is missing" })
    .min(20, { error: "token: that is not an invitation code" })
    .max(200, { error: "token: that is not an invitation code" }),
  name: textField({ label: "name", max: 100 }).default(""),
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
  // Streamed with the gate's limits and 415 rule: a chunked body is never read whole first.
  const raw = await readJson(request);
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
    throw refused(result.field ? { ...result, fieldErrors: { [result.field]: [result.message] } } : result);
  }
  return json(
    { email: result.email, teamName: result.teamName, role: result.role, newAccount: result.newAccount },
    201,
  );
});
