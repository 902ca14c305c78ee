import { listRevisions } from "@/db/queries/designs";
import { apiRoute } from "@/lib/auth/gate";
import { HttpError } from "@/lib/http";
import { designFor } from "@/lib/saved-designs/access";
import { diffRevisions } from "@/lib/saved-designs/diff";
import { revisionsQuery } from "@/lib/route-schemas";

/** Every revision with its figures; with ?a=&b= also what changed from a to b. */
export const GET = apiRoute(
  { action: "design.read", doing: "read revisions", query: revisionsQuery },
  async ({ caller, params, query }) => {
    const { design } = await designFor(caller, params.id ?? "");
    if (query.a === undefined && query.b === undefined)
      return { id: design.id, revision: design.revision, revisions: await listRevisions(design.id) };
    if (query.a === undefined || query.b === undefined)
      throw new HttpError(422, "Give both revisions to compare: ?a=1&b=2.", {
        [query.a === undefined ? "a" : "b"]: ["is needed with the other"],
      });
    // A diff reads its two revisions only (the design page asks for one at every change of its pickers).
    const revisions = await listRevisions(design.id, [query.a, query.b]);
    const a = revisions.find((r) => r.revision === query.a);
    const b = revisions.find((r) => r.revision === query.b);
    if (!a || !b) {
      const missing = !a ? "a" : "b";
      throw new HttpError(
        404,
        `This design has no revision ${!a ? query.a : query.b} (it has 1 to ${design.revision}).`,
        { [missing]: ["no such revision"] },
      );
    }
    return { id: design.id, a, b, changes: diffRevisions(a, b) };
  },
);
