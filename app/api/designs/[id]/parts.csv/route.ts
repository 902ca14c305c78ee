// GET /api/designs/[id]/parts.csv: the parts list (designators, values, ratings, notes) as CSV.
import { apiRoute } from "@/lib/auth/gate";
import { attachment, exportFileName, partsCsv } from "@/lib/build-sheet/exports";
import { designViewFor } from "@/lib/saved-designs/access";
import { planPartsCsv } from "@/lib/build-sheet/plan-exports";

export const GET = apiRoute({ action: "design.read", doing: "download parts lists" }, async ({ caller, params }) => {
  const view = await designViewFor(caller, params.id ?? "");
  const csv = view.kind === "plan" ? planPartsCsv(view.requirement, view.plan) : partsCsv(view);
  return new Response(csv, {
    headers: {
      "content-type": "text/csv; charset=utf-8; header=present",
      "content-disposition": attachment(exportFileName(view, "parts.csv")),
      "cache-control": "private, no-store",
    },
  });
});
