import { revokeToken } from "@/db/queries/tokens";
import { isUuid } from "@/lib/ids";
import { apiRoute } from "@/lib/auth/gate";
import { HttpError } from "@/lib/http";

/** Revokes one of the caller's own tokens at once (another person's token is "not found"). */
export const DELETE = apiRoute({ action: "account.manage", doing: "revoke tokens" }, async ({ caller, params }) => {
  const id = params.id ?? "";
  if (!isUuid(id) || !(await revokeToken(caller.userId, id, caller.userId))) {
    throw new HttpError(404, "That token was not found among your tokens (it may be revoked already).");
  }
  return { revoked: true, id };
});
