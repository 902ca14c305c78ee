// POST /api/netlist: a SPICE netlist (text/plain) of a requirement and a chosen pair;
// `?offset=0` leaves the amplifier's offset out.
import { z } from "zod";
import { buildNetlist, type Choice, type Requirement } from "@/lib/design";
import { apiRoute, parseWith } from "@/lib/auth/gate";
import { HttpError, type FieldErrors } from "@/lib/http";
import { objectBody, requirementOr422 } from "@/lib/engine-requests";
import { netlistCandidateSchema, netlistQuery } from "@/lib/route-schemas";

/** Runs a parser that throws a 422, keeping its field errors so both halves of the body are reported. */
function collect<T>(errors: FieldErrors, parse: () => T): T | null {
  try {
    return parse();
  } catch (e) {
    if (!(e instanceof HttpError) || e.status !== 422) throw e;
    Object.assign(errors, e.fieldErrors);
    return null;
  }
}

export const POST = apiRoute(
  { action: "engine.use", body: z.unknown(), query: netlistQuery, doing: "write netlists" },
  async ({ body, query }) => {
    const raw = objectBody(body);
    const errors: FieldErrors = {};
    const requirement: Requirement | null = collect(errors, () =>
      requirementOr422(raw.requirement ?? {}, "requirement"),
    );
    const candidate: Choice | null = collect(errors, () =>
      parseWith(netlistCandidateSchema, raw.candidate, "candidate"),
    );
    if (!requirement || !candidate) {
      const [path, messages] = Object.entries(errors)[0] ?? ["(body)", ["is invalid"]];
      throw new HttpError(422, `Invalid input at ${path}: ${messages[0]}`, errors);
    }
    let text: string;
    try {
      text = buildNetlist(requirement, candidate, { includeOffset: query.offset !== "0" });
    } catch (e) {
      // A span so wide that a figure overflows (I·R·G past the largest number) has no netlist.
      if (!(e instanceof RangeError)) throw e;
      throw new HttpError(422, "Invalid input at requirement.current: a figure of this span overflows the netlist", {
        "requirement.current": ["The span is too wide to write as a netlist: a figure overflows"],
      });
    }
    return new Response(text, { headers: { "content-type": "text/plain; charset=utf-8" } });
  },
);
