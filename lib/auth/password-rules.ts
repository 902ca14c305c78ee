// The rules for a password set through the app (an invitation's new account, a password change).
// Server-side: it carries a list of about 49,000 common passwords. Seeded demo accounts are data and
// do not pass through here.
import { dictionary } from "@zxcvbn-ts/language-common";
import { z } from "zod";

export const PASSWORD_MIN_LENGTH = 12;
export const PASSWORD_MAX_LENGTH = 200;

// The common-password list of zxcvbn-ts (lower case), looked up case-insensitively.
const common = new Set(dictionary["passwords-common"]);

/** Whether a password appears in the shipped list of common passwords (case ignored). */
export const isCommonPassword = (password: string) => common.has(password.toLowerCase());

/** What is wrong with `password` for the account `email`, in plain words; empty when it is fine. */
export function passwordProblems(password: string, email: string): string[] {
  if (password.length < PASSWORD_MIN_LENGTH)
    return [`at least ${PASSWORD_MIN_LENGTH} characters (this one has ${password.length})`];
  if (password.length > PASSWORD_MAX_LENGTH) return [`at most ${PASSWORD_MAX_LENGTH} characters`];
  const problems: string[] = [];
  if (password.trim().toLowerCase() === email.trim().toLowerCase()) problems.push("must not be your e-mail address");
  if (isCommonPassword(password))
    problems.push("is on a list of common passwords that are guessed first; choose another");
  return problems;
}

/** A zod schema for a new password of the account `email` (put it under the field that carries it). */
export function newPasswordSchema(email: string) {
  return z.string({ error: "choose a password" }).superRefine((password, ctx) => {
    for (const problem of passwordProblems(password, email)) ctx.addIssue({ code: "custom", message: problem });
  });
}
