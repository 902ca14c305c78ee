// POST /api/designs/import: a design file from GET /api/designs/[id]/export becomes a new draft
// design in the caller's team, through the same service as POST /api/designs (the engine
// re-evaluates it, so the figures are the engine's, not the file's).
import { createDesign } from "@/db/queries/designs";
import { apiRoute } from "@/lib/auth/gate";
import { designImportSchema } from "@/lib/build-sheet/exports";
import { evaluateDesign } from "@/lib/designs/service";
import { json } from "@/lib/http";

export const POST = apiRoute(
  { roles: ["owner", "designer"], doing: "import designs", body: designImportSchema },
  async ({ caller, body }) => {
    const evaluated = evaluateDesign(body.requirement, body.choice);
    const created = await createDesign({
      ...evaluated,
      teamId: caller.teamId,
      userId: caller.userId,
      name: body.name,
      project: body.project ?? null,
    });
    return json({ ...created, name: body.name }, 201);
  },
);
