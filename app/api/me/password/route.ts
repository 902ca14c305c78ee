import { z } from "zod";
import { changePassword, findUserById } from "@/db/queries/users";
import { clientAddress } from "@/lib/auth/client-address";
import { apiRoute, parseWith } from "@/lib/auth/gate";
import { hashPassword, verifyPassword } from "@/lib/auth/password-hash";
import { passwordChangeSchema as body } from "@/lib/auth/account-schemas";
import { newPasswordSchema } from "@/lib/auth/password-rules";
import { renewedSessionCookie } from "@/lib/auth/session-cookie";
import { recordSignInFailure, retryAfterSeconds, signInWaitMs, tryAgainIn } from "@/lib/auth/sign-in-throttle";
import { HttpError, json } from "@/lib/http";

const refuse = (field: "currentPassword" | "newPassword", problems: string[]) =>
  new HttpError(422, `Invalid input at ${field}: ${problems[0]}`, { [field]: problems });

/**
 * Changes the caller's password. Every other session of the user ends (the session version goes up);
 * the browser that made the change gets a renewed session cookie and stays signed in.
 */
export const PUT = apiRoute(
  { action: "account.manage", doing: "change your password", body },
  async ({ caller, body, request }) => {
    // A token is a script's credential, not a person's: only a signed-in session changes the password.
    if (caller.via === "token")
      throw new HttpError(403, "An API token cannot change a password; sign in to change it.");
    const user = await findUserById(caller.userId);
    if (!user) throw new HttpError(401, "Sign in first.");
    // Wrong current passwords count as failed sign-ins, so a borrowed session cannot guess the password.
    const address = clientAddress(request.headers);
    const wait = await signInWaitMs(user.email, address);
    if (wait > 0)
      return json(
        { message: tryAgainIn(wait) },
        { status: 429, headers: { "Retry-After": String(retryAfterSeconds(wait)) } },
      );
    if (!(await verifyPassword(body.currentPassword, user.passwordHash))) {
      await recordSignInFailure(user.email, address);
      throw refuse("currentPassword", ["that is not your current password"]);
    }
    parseWith(z.object({ newPassword: newPasswordSchema(user.email) }), { newPassword: body.newPassword });
    if (await verifyPassword(body.newPassword, user.passwordHash))
      throw refuse("newPassword", ["is the password you have now; choose a different one"]);
    const sessionVersion = await changePassword({
      userId: user.id,
      teamId: caller.teamId,
      expectedHash: user.passwordHash,
      newHash: await hashPassword(body.newPassword),
    });
    if (sessionVersion === null)
      throw new HttpError(409, "Your password was changed from somewhere else meanwhile; sign in again.");
    return json(
      { ok: true },
      { status: 200, headers: { "Set-Cookie": await renewedSessionCookie(caller, sessionVersion) } },
    );
  },
);
