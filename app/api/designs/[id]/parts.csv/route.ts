// GET /api/designs/[id]/parts.csv: the parts list (designators, values, ratings, notes) as CSV,
// the parts named after the team-library parts the pair came from, as on the build sheet.
import { listLibrary } from "@/db/queries/library";
import { apiRoute } from "@/lib/auth/gate";
import { attachment, exportFileName, partsCsv } from "@/lib/build-sheet/exports";
import { designViewFor } from "@/lib/saved-designs/access";

export const GET = apiRoute({ action: "design.read", doing: "download parts lists" }, async ({ caller, params }) => {
  const view = await designViewFor(caller, params.id ?? "");
  const library = await listLibrary(caller.teamId);
  return new Response(partsCsv(view, library), {
    headers: {
      "content-type": "text/csv; charset=utf-8; header=present",
      "content-disposition": attachment(exportFileName(view, "parts.csv")),
      "cache-control": "private, no-store",
    },
  });
});
