import { listMembers } from "@/db/queries/users";
import { apiRoute } from "@/lib/auth/gate";

export const GET = apiRoute({ action: "team.read" }, async ({ caller }) => ({
  team: { id: caller.teamId, name: caller.teamName },
  members: await listMembers(caller.teamId),
}));
