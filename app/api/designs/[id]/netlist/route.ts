// GET /api/designs/[id]/netlist: the saved design's SPICE netlist, from the same generator as
// POST /api/netlist (the engine's buildNetlist); `?offset=0` leaves the amplifier offset out.
import { apiRoute } from "@/lib/auth/gate";
import { attachment, designNetlist, exportFileName } from "@/lib/build-sheet/exports";
import { pairDesignViewFor } from "@/lib/saved-designs/access";
import { netlistQuery } from "@/lib/route-schemas";

export const GET = apiRoute(
  { action: "design.read", doing: "download netlists", query: netlistQuery },
  async ({ caller, params, query }) => {
    const view = await pairDesignViewFor(caller, params.id ?? "", "The netlist");
    const text = designNetlist(view, { includeOffset: query.offset !== "0" });
    return new Response(text, {
      headers: {
        "content-type": "text/plain; charset=utf-8",
        "content-disposition": attachment(exportFileName(view, "cir")),
        "cache-control": "private, no-store",
      },
    });
  },
);
