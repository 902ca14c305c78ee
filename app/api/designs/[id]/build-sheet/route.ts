// GET /api/designs/[id]/build-sheet: the design's build sheet as a PDF download. Any team member
// may preview a draft's sheet (it says "not approved" on every page); makers see approved
// designs only, so for them an unapproved design is not found (the design service's rule).
import { listLibrary } from "@/db/queries/library";
import { apiRoute } from "@/lib/auth/gate";
import { attachment, exportFileName } from "@/lib/build-sheet/exports";
import { renderBuildSheetOffThread } from "@/lib/build-sheet/render-pool";
import { designViewFor } from "@/lib/saved-designs/access";

export const GET = apiRoute({ action: "design.read", doing: "download build sheets" }, async ({ caller, params }) => {
  const view = await designViewFor(caller, params.id ?? "");
  // The team library names the parts the pair came from.
  const library = await listLibrary(caller.teamId);
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
