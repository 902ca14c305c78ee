// POST /api/designs/import: a design file from GET /api/designs/[id]/export becomes a new draft
// design in the caller's team, through the same service as POST /api/designs (the engine
// re-evaluates it, so the figures are the engine's, not the file's).
import { apiRoute } from "@/lib/auth/gate";
import { designImportSchema } from "@/lib/build-sheet/exports";
import { saveNewDesign } from "@/lib/saved-designs/create";
import { json } from "@/lib/http";

export const POST = apiRoute(
  { action: "design.create", doing: "import designs", body: designImportSchema },
  async ({ caller, body }) => {
    const created = await saveNewDesign(caller, body);
    return json({ ...created, name: body.name }, 201);
  },
);
