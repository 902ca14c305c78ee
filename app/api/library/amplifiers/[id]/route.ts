import { deletePart, getAmplifier, updateAmplifier } from "@/db/queries/library";
import { apiRoute } from "@/lib/auth/gate";
import { HttpError } from "@/lib/http";
import { amplifierInput, amplifierPatch } from "@/lib/library/schema";
import { mergePatch, partId, written } from "@/lib/library/service";

export const PATCH = apiRoute(
  { action: "library.edit", doing: "edit the parts library", body: amplifierPatch },
  async ({ caller, body, params }) => {
    const id = partId(params.id, "amplifier");
    const stored = await getAmplifier(caller.teamId, id);
    if (!stored) throw new HttpError(404, "That amplifier was not found in the library.");
    const values = mergePatch(stored, body, amplifierInput);
    return written(await updateAmplifier(caller.teamId, id, values, body.updatedAt, caller.userId));
  },
);

export const DELETE = apiRoute(
  { action: "library.edit", doing: "remove parts from the library" },
  async ({ caller, params }) => {
    const id = partId(params.id, "amplifier");
    if (!(await deletePart("amplifiers", caller.teamId, id, caller.userId)))
      throw new HttpError(404, "That amplifier was not found in the library.");
    return { deleted: true, id };
  },
);
