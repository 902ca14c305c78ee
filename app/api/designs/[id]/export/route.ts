// GET /api/designs/[id]/export: the whole design as our versioned JSON file
// ({format: "sensewright-design", version: 1, name, project, requirement, choice, …}),
// which POST /api/designs/import reads back as a new design.
import { apiRoute } from "@/lib/auth/gate";
import { attachment, designExport, exportFileName } from "@/lib/build-sheet/exports";
import { designViewFor } from "@/lib/saved-designs/access";

export const GET = apiRoute({ action: "design.read", doing: "export designs" }, async ({ caller, params }) => {
  const view = await designViewFor(caller, params.id ?? "");
  return Response.json(designExport(view, new Date()), {
    headers: {
      "content-disposition": attachment(exportFileName(view, "sensewright.json")),
      "cache-control": "private, no-store",
    },
  });
});
