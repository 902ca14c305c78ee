import { changeMemberRole } from "@/db/queries/users";
import { apiRoute } from "@/lib/auth/gate";
import { HttpError } from "@/lib/http";
import { roleChangeSchema } from "@/lib/team-schemas";

export const PATCH = apiRoute(
  { roles: ["owner"], doing: "change roles", body: roleChangeSchema },
  async ({ caller, body, params }) => {
    const userId = params.userId ?? "";
    if (!/^[0-9a-f-]{36}$/i.test(userId)) throw new HttpError(404, "That person is not a member of this team.");
    const result = await changeMemberRole(caller.teamId, userId, body.role, caller.userId);
    if (!result.ok) throw new HttpError(result.status, result.message);
    return { userId, role: body.role };
  },
);
export { removeMemberRoute as DELETE } from "@/app/api/invitations/remove-member";
