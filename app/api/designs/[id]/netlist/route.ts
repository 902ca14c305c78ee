// GET /api/designs/[id]/netlist: the saved design's SPICE netlist, from the same generator as
// POST /api/netlist (the engine's buildNetlist); `?offset=0` leaves the amplifier offset out.
// A range plan: one `.op` deck per range with its switch state; `?range=N` gives range N's alone.
import { apiRoute } from "@/lib/auth/gate";
import { attachment, designNetlist, exportFileName } from "@/lib/build-sheet/exports";
import { designViewFor } from "@/lib/saved-designs/access";
import { planDesignNetlist } from "@/lib/build-sheet/plan-exports";
import { HttpError } from "@/lib/http";
import { designNetlistQuery } from "@/lib/route-schemas";

export const GET = apiRoute(
  { action: "design.read", doing: "download netlists", query: designNetlistQuery },
  async ({ caller, params, query }) => {
    const view = await designViewFor(caller, params.id ?? "");
    const includeOffset = query.offset !== "0";
    let text: string;
    if (view.kind === "plan") {
      const n = view.plan.ranges.length;
      if (query.range !== undefined && query.range > n)
        throw new HttpError(422, `range: this plan has ${n} ranges; ask for 1 to ${n}`, {
          range: [`this plan has ${n} ranges; ask for 1 to ${n}`],
        });
      text = planDesignNetlist(view.requirement, view.plan, { includeOffset, range: query.range });
    } else {
      if (query.range !== undefined) {
        const message = "range: this design is a single shunt and gain, not a range plan; leave range out";
        throw new HttpError(422, message, { range: [message] });
      }
      text = designNetlist(view, { includeOffset });
    }
    return new Response(text, {
      headers: {
        "content-type": "text/plain; charset=utf-8",
        "content-disposition": attachment(exportFileName(view, "cir")),
        "cache-control": "private, no-store",
      },
    });
  },
);
