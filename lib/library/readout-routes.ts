// The route handlers of the readout part kinds (ADCs, meter ranges): the same gate, policy action
// and write rules as the amplifier and shunt routes, one definition for both kinds.
import "server-only";
import { createReadoutPart, deletePart, getReadoutPart, updateReadoutPart } from "@/db/queries/library";
import { apiRoute } from "@/lib/auth/gate";
import { HttpError, json } from "@/lib/http";
import type { z } from "zod";
import { adcInput, adcPatch, meterInput, meterPatch, type AdcValues, type MeterValues } from "./schema";
import { mergePatch, partId, written } from "./service";

type Kind = "adcs" | "meters";
type Values = { adcs: AdcValues; meters: MeterValues };
const kinds: {
  [K in Kind]: { input: z.ZodType<Values[K]>; patch: z.ZodType<{ updatedAt?: string }>; word: string };
} = {
  adcs: { input: adcInput, patch: adcPatch, word: "ADC" },
  meters: { input: meterInput, patch: meterPatch, word: "meter range" },
};

/** POST /api/library/{adcs|meters} */
export function readoutCollectionRoutes<K extends Kind>(kind: K) {
  const k = kinds[kind] as (typeof kinds)[K];
  return {
    POST: apiRoute(
      { action: "library.edit", doing: "add parts to the library", body: k.input },
      async ({ caller, body }) => json(written(await createReadoutPart(kind, caller.teamId, body, caller.userId)), 201),
    ),
  };
}

/** PATCH and DELETE /api/library/{adcs|meters}/[id] */
export function readoutItemRoutes<K extends Kind>(kind: K) {
  const k = kinds[kind] as (typeof kinds)[K];
  const notFound = () => new HttpError(404, `That ${k.word} was not found in the library.`);
  return {
    PATCH: apiRoute(
      { action: "library.edit", doing: "edit the parts library", body: k.patch },
      async ({ caller, body, params }) => {
        const id = partId(params.id, k.word);
        const stored = await getReadoutPart(kind, caller.teamId, id);
        if (!stored) throw notFound();
        const values = mergePatch(stored, body, k.input);
        return written(await updateReadoutPart(kind, caller.teamId, id, values, body.updatedAt, caller.userId));
      },
    ),
    DELETE: apiRoute({ action: "library.edit", doing: "remove parts from the library" }, async ({ caller, params }) => {
      const id = partId(params.id, k.word);
      if (!(await deletePart(kind, caller.teamId, id, caller.userId))) throw notFound();
      return { deleted: true, id };
    }),
  };
}
