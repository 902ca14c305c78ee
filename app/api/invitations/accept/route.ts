import bcrypt from "bcryptjs";
import { z } from "zod";
import { acceptInvitation } from "@/db/queries/invitations";
import { parseWith, publicRoute } from "@/lib/auth/gate";
import { HttpError, json, refused } from "@/lib/http";

const acceptSchema = z.object({
  token: z
    .string({ error: "token: the invitation link's code is missing" })
    .min(20, { error: "token: that is not an invitation code" })
    .max(200),
  name: z.string().trim().max(100, { error: "name: at most 100 characters" }).default(""),
  password: z
    .string({ error: "password: choose a password" })
    .min(10, { error: "password: at least 10 characters" })
    .max(200, { error: "password: at most 200 characters" }),
});

/** Public: the invitee (signed out) sets a name and password, or proves an existing account's password. */
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
  const passwordHash = await bcrypt.hash(body.password, 10);
  const result = await acceptInvitation({
    token: body.token,
    name: body.name,
    passwordHash,
    checkPassword: (hash) => bcrypt.compare(body.password, hash),
  });
  if (!result.ok) {
    throw refused(result.reason === "invalid" ? { ...result, fieldErrors: { name: ["give your name"] } } : result);
  }
  return json({ email: result.email, teamName: result.teamName, role: result.role }, 201);
});
