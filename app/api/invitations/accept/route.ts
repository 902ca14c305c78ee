import bcrypt from "bcryptjs";
import { z } from "zod";
import { acceptInvitation } from "@/db/queries/invitations";
import { parseWith, publicRoute, readJson } from "@/lib/auth/gate";
import { HttpError, json } from "@/lib/http";
import { textField } from "@/lib/text-field";

const acceptSchema = z.object({
  token: z
    .string({ error: "token: the invitation link's code is missing" })
    .min(20, { error: "token: that is not an invitation code" })
    .max(200),
  name: textField({ label: "name", max: 100 }).default(""),
  password: z
    .string({ error: "password: choose a password" })
    .min(10, { error: "password: at least 10 characters" })
    .max(200, { error: "password: at most 200 characters" }),
});

/** Public: the invitee (signed out) sets a name and password, or proves an existing account's password. */
export const POST = publicRoute(async (request) => {
  // Streamed with the gate's limits and 415 rule: a chunked body is never read whole first.
  const raw = await readJson(request);
  const body = parseWith(acceptSchema, raw);
  const passwordHash = await bcrypt.hash(body.password, 10);
  const result = await acceptInvitation({
    token: body.token,
    name: body.name,
    passwordHash,
    checkPassword: (hash) => bcrypt.compare(body.password, hash),
  });
  if (!result.ok) {
    if (result.status === 410) throw new HttpError(409, result.message);
    throw new HttpError(
      result.status,
      result.message,
      result.status === 422 ? { name: ["give your name"] } : undefined,
    );
  }
  return json({ email: result.email, teamName: result.teamName, role: result.role }, 201);
});
