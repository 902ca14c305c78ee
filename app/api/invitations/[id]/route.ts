import { isUuid } from "@/lib/ids";
import { revokeInvitation } from "@/db/queries/invitations";
import { apiRoute } from "@/lib/auth/gate";
import { HttpError, refused } from "@/lib/http";

/** Revokes a pending invitation: its link stops working. */
export const DELETE = apiRoute(
  { action: "team.manage-invitations", doing: "revoke invitations" },
  async ({ caller, params }) => {
    const id = params.id ?? "";
    if (!isUuid(id)) throw new HttpError(404, "That invitation was not found in your team.");
    const result = await revokeInvitation(caller.teamId, id, caller.userId);
    if (!result.ok) throw refused(result);
    return { id, status: "revoked", revokedAt: result.revokedAt };
  },
);
