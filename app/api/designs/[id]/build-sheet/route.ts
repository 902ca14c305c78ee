// GET /api/designs/[id]/build-sheet: the design's build sheet as a PDF download. Any team member
// may preview a draft's sheet (it says "not approved" on every page); makers see approved
// designs only, so for them an unapproved design is not found (the design service's rule).
// A range plan gets its own sheet: parts, switching rule and bench check for every range.
import { listLibrary } from "@/db/queries/library";
import { apiRoute } from "@/lib/auth/gate";
import { attachment, exportFileName } from "@/lib/build-sheet/exports";
import { renderBuildSheet, renderPlanBuildSheet } from "@/lib/build-sheet/render";
import { designViewFor } from "@/lib/saved-designs/access";

export const GET = apiRoute({ action: "design.read", doing: "download build sheets" }, async ({ caller, params }) => {
  const view = await designViewFor(caller, params.id ?? "");
  const meta = { team: caller.teamName, generatedAt: new Date() };
  const pdf =
    view.kind === "plan"
      ? await renderPlanBuildSheet(view, view.requirement, view.plan, meta)
      : // The team library names the parts the pair came from.
        await renderBuildSheet(view, meta, await listLibrary(caller.teamId));
  return new Response(new Uint8Array(pdf), {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": attachment(exportFileName(view, "pdf")),
      "content-length": String(pdf.length),
      "cache-control": "private, no-store",
    },
  });
});
