// GET /api/designs/[id]/parts.csv: the parts list (designators, values, ratings, notes) as CSV,
// the parts named after the team-library parts the pair came from, as on the build sheet.
import { listLibrary } from "@/db/queries/library";
import { apiRoute } from "@/lib/auth/gate";
import { attachment, exportFileName, partsCsv } from "@/lib/build-sheet/exports";
import { designViewFor, refuseFailingPlan } from "@/lib/saved-designs/access";
import { planPartsCsv } from "@/lib/build-sheet/plan-exports";

export const GET = apiRoute({ action: "design.read", doing: "download parts lists" }, async ({ caller, params }) => {
  const view = await designViewFor(caller, params.id ?? "");
  refuseFailingPlan(view);
  const csv =
    view.kind === "plan" ? planPartsCsv(view.requirement, view.plan) : partsCsv(view, await listLibrary(caller.teamId));
  return new Response(csv, {
    headers: {
      "content-type": "text/csv; charset=utf-8; header=present",
      "content-disposition": attachment(exportFileName(view, "parts.csv")),
      "cache-control": "private, no-store",
    },
  });
});
