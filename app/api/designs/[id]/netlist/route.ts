// GET /api/designs/[id]/netlist: the saved design's SPICE netlist, from the same generator as
// POST /api/netlist (the engine's buildNetlist); `?offset=0` leaves the amplifier offset out.
import { z } from "zod";
import { apiRoute } from "@/lib/auth/gate";
import { attachment, designNetlist, exportFileName } from "@/lib/build-sheet/exports";
import { designViewFor } from "@/lib/saved-designs/access";

const querySchema = z.object({
  offset: z.enum(["0", "1"], { error: 'offset: expected "0" (leave the offset out) or "1"' }).optional(),
});

export const GET = apiRoute(
  { action: "design.read", doing: "download netlists", query: querySchema },
  async ({ caller, params, query }) => {
    const view = await designViewFor(caller, params.id ?? "");
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
