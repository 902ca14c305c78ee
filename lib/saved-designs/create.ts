// Saving a new design, shared by POST /api/designs and the import route: the engine evaluates
// the requirement and choice (422 when the choice is outside the sweep or infeasible), then one
// transaction writes the design and its first revision.
import { createDesign } from "@/db/queries/designs";
import type { Caller } from "@/lib/auth/gate";
import { evaluateDesign } from "./service";

export type NewDesign = {
  name: string;
  project?: string | null;
  requirement: unknown;
  choice: { shuntOhms: number; gain: number };
};

export async function saveNewDesign(caller: Pick<Caller, "teamId" | "userId">, body: NewDesign) {
  const evaluated = evaluateDesign(body.requirement, body.choice);
  return createDesign({
    ...evaluated,
    teamId: caller.teamId,
    userId: caller.userId,
    name: body.name,
    project: body.project ?? null,
  });
}
