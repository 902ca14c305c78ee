// POST /api/designs/import: a design file from GET /api/designs/[id]/export becomes a new draft
// design in the caller's team, through the same service as POST /api/designs (the engine
// re-evaluates its choice or range plan, so the figures are the engine's, not the file's; an
// unsound plan is 422 on the range at fault).
import { namesLike } from "@/db/queries/design-names";
import { apiRoute } from "@/lib/auth/gate";
import { designImportSchema } from "@/lib/build-sheet/exports";
import { saveNewDesign } from "@/lib/saved-designs/create";
import { HttpError, json } from "@/lib/http";
import { freeName } from "@/lib/saved-designs/free-name";
import { evaluatePicked, pickedOf } from "@/lib/saved-designs/service";

export const POST = apiRoute(
  { action: "design.create", doing: "import designs", body: designImportSchema },
  async ({ caller, body }) => {
    // A bad file is refused for what is wrong with it first (422 naming the field).
    // The file's requirement is the exported, normalized one (accuracy.percent a bare number in %),
    // so it is read as stored: a design exported at 0.05 % imports back (DEFAULTS.md).
    evaluatePicked(body.requirement, pickedOf(body), "stored");
    // Two designs of one name in a team are easy to confuse: say so and offer a free name.
    const taken = await namesLike(caller.teamId, body.name);
    if (taken.some((t) => t.toLowerCase() === body.name.toLowerCase())) {
      const suggested = freeName(body.name, taken);
      const e = new HttpError(
        409,
        `Your team already has a design named “${body.name}”. Import it as “${suggested}”, or give it another name.`,
        { name: [`already used in your team; “${suggested}” is free`] },
      );
      return json({ message: e.message, fieldErrors: e.fieldErrors, suggestedName: suggested }, 409);
    }
    const created = await saveNewDesign(caller, body, undefined, "stored");
    return json({ ...created, name: body.name }, 201);
  },
);
