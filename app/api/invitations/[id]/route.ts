import { isUuid } from "@/db/queries/designs";
import { revokeInvitation } from "@/db/queries/invitations";
import { apiRoute } from "@/lib/auth/gate";
import { HttpError } from "@/lib/http";

/** Revokes a pending invitation: its link stops working. */
export const DELETE = apiRoute({ roles: ["owner"], doing: "revoke invitations" }, async ({ caller, params }) => {
  const id = params.id ?? "";
  if (!isUuid(id)) throw new HttpError(404, "That invitation was not found in your team.");
  const result = await revokeInvitation(caller.teamId, id, caller.userId);
  if (!result.ok) throw new HttpError(result.status, result.message);
  return { id, status: "revoked", revokedAt: result.revokedAt };
});
