import { removeMember } from "@/db/queries/invitations";
import { changeMemberRole, findUserById } from "@/db/queries/users";
import { apiRoute } from "@/lib/auth/gate";
import { HttpError, refused } from "@/lib/http";
import { mailRoleChanged } from "@/lib/mail/role-change";
import { isUuid } from "@/lib/ids";
import { roleChangeSchema } from "@/lib/team-schemas";

function memberId(params: Record<string, string>): string {
  const userId = params.userId ?? "";
  if (!isUuid(userId)) throw new HttpError(404, "That person is not a member of this team.");
  return userId;
}

export const PATCH = apiRoute(
  { action: "team.manage-members", doing: "change roles", body: roleChangeSchema },
  async ({ caller, body, params }) => {
    const userId = memberId(params);
    const result = await changeMemberRole(caller.teamId, userId, body.role, caller.userId);
    if (!result.ok) throw refused(result);
    // The member hears of it by mail, sent after this answer has gone.
    const member = await findUserById(userId);
    const mailed = member
      ? mailRoleChanged({
          teamId: caller.teamId,
          teamName: caller.teamName,
          actor: caller,
          member: { userId, email: member.email },
          from: result.before,
          to: body.role,
        })
      : 0;
    return { userId, role: body.role, mailed };
  },
);

// A team always keeps at least one owner: removeMember refuses the last one (409).
export const DELETE = apiRoute(
  { action: "team.manage-members", doing: "remove members" },
  async ({ caller, params }) => {
    const userId = memberId(params);
    const result = await removeMember(caller.teamId, userId, caller.userId);
    if (!result.ok) throw refused(result);
    return { userId, removed: true };
  },
);
