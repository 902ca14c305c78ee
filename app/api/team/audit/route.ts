import { listTeamAudit } from "@/db/queries/audit";
import { apiRoute } from "@/lib/auth/gate";
import { auditQuery } from "@/lib/route-schemas";

/** The team's audit log, newest first (owners). */
export const GET = apiRoute({ action: "team.read-log", query: auditQuery }, async ({ caller, query }) => ({
  events: (await listTeamAudit(caller.teamId, query.limit)).map((e) => ({ ...e, at: e.at.toISOString() })),
}));
