// DELETE /api/team/members/[userId]: the team route file re-exports this handler (removal sits
// with invitations in the review feature; the route path stays the team's).
import { removeMember } from "@/db/queries/invitations";
import { apiRoute } from "@/lib/auth/gate";
import { HttpError } from "@/lib/http";

export const removeMemberRoute = apiRoute({ roles: ["owner"], doing: "remove members" }, async ({ caller, params }) => {
  const userId = params.userId ?? "";
  if (!/^[0-9a-f-]{36}$/i.test(userId)) throw new HttpError(404, "That person is not a member of this team.");
  const result = await removeMember(caller.teamId, userId, caller.userId);
  if (!result.ok) throw new HttpError(result.status, result.message);
  return { userId, removed: true };
});
