// Request bodies of the account routes (tokens, /api/me), shared by the routes and their forms.
import { z } from "zod";
import { PASSWORD_MAX_LENGTH } from "./password-rules";

export const createTokenSchema = z
  .object({
    name: z
      .string({ error: "name: expected text" })
      .trim()
      .min(1, { error: "Give the token a name (what will use it)" })
      .max(80, { error: "name: at most 80 characters" }),
    access: z.enum(["read", "write"], { error: 'access must be "read" or "write"' }),
    /** Days from now; null or absent (with no expiresAt) for a token that does not expire. */
    expiresInDays: z
      .number({ error: "expiresInDays: expected a whole number of days, or null for no expiry" })
      .int({ error: "expiresInDays: expected a whole number of days" })
      .min(1, { error: "expiresInDays: at least 1" })
      .max(3650, { error: "expiresInDays: at most 3650" })
      .nullish(),
    /** Or an exact moment (ISO 8601 with offset), in the future. */
    expiresAt: z.iso
      .datetime({ offset: true, error: "expiresAt: expected an ISO 8601 date and time, e.g. 2027-01-31T18:00:00Z" })
      .refine((v) => Date.parse(v) > Date.now(), { error: "expiresAt: must be in the future" })
      .nullish(),
  })
  .refine((v) => !(v.expiresAt && v.expiresInDays), {
    path: ["expiresAt"],
    error: "Give expiresAt or expiresInDays, not both",
  });

/** When a token made from this body expires (null: never). */
export function tokenExpiry(body: z.infer<typeof createTokenSchema>, now = Date.now()): Date | null {
  if (body.expiresAt) return new Date(body.expiresAt);
  return body.expiresInDays ? new Date(now + body.expiresInDays * 86_400_000) : null;
}

export const mailPreferencesSchema = z
  .object({
    submitted: z.boolean({ error: "mail.submitted: expected true or false" }),
    returned: z.boolean({ error: "mail.returned: expected true or false" }),
    approved: z.boolean({ error: "mail.approved: expected true or false" }),
    comments: z.boolean({ error: "mail.comments: expected true or false" }),
  })
  .partial()
  .strict();

export const updateAccountSchema = z
  .object({
    name: z
      .string({ error: "name: expected text" })
      .trim()
      .min(1, { error: "Give your name: it is how the team sees you" })
      .max(120, { error: "name: at most 120 characters" })
      .optional(),
    mail: mailPreferencesSchema.optional(),
  })
  .strict();

export const switchTeamSchema = z.object({
  teamId: z.uuid({ error: "teamId: expected the id of one of your teams (GET /api/me lists them)" }),
});

/** PUT /api/me/password: the current password proves it is you; the new one meets the password rules. */
export const passwordChangeSchema = z.object({
  currentPassword: z
    .string({ error: "enter your current password" })
    .min(1, { error: "enter your current password" })
    .max(PASSWORD_MAX_LENGTH, { error: "that is not your current password" }),
  newPassword: z
    .string({ error: "choose a new password" })
    .max(PASSWORD_MAX_LENGTH, { error: `at most ${PASSWORD_MAX_LENGTH} characters` }),
});
