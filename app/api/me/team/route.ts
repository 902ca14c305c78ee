import { getMember } from "@/db/queries/users";
import { switchTeamSchema } from "@/lib/auth/account-schemas";
import { apiRoute } from "@/lib/auth/gate";
import { reissueSessionForTeam } from "@/lib/auth/session-team";
import { HttpError } from "@/lib/http";

/** {teamId} → 200 {currentTeamId, teamName, role}: the session now acts in that team of the caller's. */
export const PUT = apiRoute(
  { action: "account.manage", doing: "switch teams", body: switchTeamSchema },
  async ({ caller, body }) => {
    if (caller.via === "token") {
      throw new HttpError(403, "An API token acts in the team it was made in; create a token in the other team.");
    }
    const member = await getMember(caller.userId, body.teamId);
    if (!member) {
      throw new HttpError(404, "You are not a member of that team.", { teamId: ["is not one of your teams"] });
    }
    if (!(await reissueSessionForTeam(member.teamId))) throw new HttpError(401, "Sign in first.");
    return { currentTeamId: member.teamId, teamName: member.teamName, role: member.role };
  },
);
