// The team's range-plan designs (the current revision holds a plan), for pickers such as the meter
// check's; makers see approved ones only.
import { and, desc, eq, isNotNull } from "drizzle-orm";
import { getDb } from "../client";
import { designRevisions, designs } from "../schema";

/** How many plan designs a picker lists (newest change first). */
export const PLAN_PICKER_LIMIT = 100;

export async function listPlanDesigns(teamId: string, opts: { approvedOnly?: boolean } = {}) {
  const db = await getDb();
  const team = eq(designs.teamId, teamId);
  return db
    .select({ id: designs.id, name: designs.name, revision: designs.revision })
    .from(designs)
    .innerJoin(
      designRevisions,
      and(eq(designRevisions.designId, designs.id), eq(designRevisions.revision, designs.revision)),
    )
    .where(and(opts.approvedOnly ? and(team, eq(designs.status, "approved")) : team, isNotNull(designRevisions.plan)))
    .orderBy(desc(designs.updatedAt), desc(designs.id))
    .limit(PLAN_PICKER_LIMIT);
}
