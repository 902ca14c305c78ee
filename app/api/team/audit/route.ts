import { z } from "zod";
import { listTeamAudit } from "@/db/queries/audit";
import { apiRoute } from "@/lib/auth/gate";

const query = z.object({
  limit: z.coerce
    .number()
    .int()
    .min(1, { error: "limit: at least 1" })
    .max(1000, { error: "limit: at most 1000" })
    .default(200),
});

/** The team's audit log, newest first (owners). */
export const GET = apiRoute({ action: "team.read-log", query }, async ({ caller, query }) => ({
  events: (await listTeamAudit(caller.teamId, query.limit)).map((e) => ({ ...e, at: e.at.toISOString() })),
}));
