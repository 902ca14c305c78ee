import { deletePart, getShunt, updateShunt } from "@/db/queries/library";
import { apiRoute } from "@/lib/auth/gate";
import { HttpError } from "@/lib/http";
import { shuntInput, shuntPatch } from "@/lib/library/schema";
import { mergePatch, partId, written } from "@/lib/library/service";

export const PATCH = apiRoute(
  { action: "library.edit", doing: "edit the parts library", body: shuntPatch },
  async ({ caller, body, params }) => {
    const id = partId(params.id, "shunt");
    const stored = await getShunt(caller.teamId, id);
    if (!stored) throw new HttpError(404, "That shunt was not found in the library.");
    const values = mergePatch(stored, body, shuntInput);
    return written(await updateShunt(caller.teamId, id, values, body.updatedAt, caller.userId));
  },
);

export const DELETE = apiRoute(
  { action: "library.edit", doing: "remove parts from the library" },
  async ({ caller, params }) => {
    const id = partId(params.id, "shunt");
    if (!(await deletePart("shunts", caller.teamId, id, caller.userId)))
      throw new HttpError(404, "That shunt was not found in the library.");
    return { deleted: true, id };
  },
);
