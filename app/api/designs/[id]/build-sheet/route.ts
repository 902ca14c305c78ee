// GET /api/designs/[id]/build-sheet: the design's build sheet as a PDF download. Any team member
// may preview a draft's sheet (it says "not approved" on every page); makers see approved
// designs only, so for them an unapproved design is not found (the design service's rule).
// A range plan gets its own sheet: parts, switching rule and bench check for every range.
import { listLibrary } from "@/db/queries/library";
import { apiRoute } from "@/lib/auth/gate";
import { attachment, exportFileName } from "@/lib/build-sheet/exports";
import { renderBuildSheetOffThread } from "@/lib/build-sheet/render-pool";
import { designViewFor, refuseFailingPlan } from "@/lib/saved-designs/access";

export const GET = apiRoute({ action: "design.read", doing: "download build sheets" }, async ({ caller, params }) => {
  const view = await designViewFor(caller, params.id ?? "");
  refuseFailingPlan(view);
  // Off the request thread; a pair's parts are named after the team-library parts it came from.
  const library = view.kind === "plan" ? undefined : await listLibrary(caller.teamId);
  const pdf = await renderBuildSheetOffThread(view, { team: caller.teamName, generatedAt: new Date() }, library);
  return new Response(new Uint8Array(pdf), {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": attachment(exportFileName(view, "pdf")),
      "content-length": String(pdf.length),
      "cache-control": "private, no-store",
    },
  });
});
