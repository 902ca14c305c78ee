// GET /api/designs/[id]/parts.csv: the parts list (designators, values, ratings, notes) as CSV.
import { apiRoute } from "@/lib/auth/gate";
import { attachment, exportFileName, partsCsv } from "@/lib/build-sheet/exports";
import { pairDesignViewFor } from "@/lib/saved-designs/access";

export const GET = apiRoute({ action: "design.read", doing: "download parts lists" }, async ({ caller, params }) => {
  const view = await pairDesignViewFor(caller, params.id ?? "", "The parts list");
  return new Response(partsCsv(view), {
    headers: {
      "content-type": "text/csv; charset=utf-8; header=present",
      "content-disposition": attachment(exportFileName(view, "parts.csv")),
      "cache-control": "private, no-store",
    },
  });
});
