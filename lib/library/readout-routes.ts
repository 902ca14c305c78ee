// The route handlers of the readout part kinds (ADCs, meter ranges): the same write rules as the
// amplifier and shunt routes, one definition for both kinds; the routes name their policy action.
import "server-only";
import { createReadoutPart, deletePart, getReadoutPart, updateReadoutPart } from "@/db/queries/library";
import type { Caller } from "@/lib/auth/gate";
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

/**
 * The handlers of /api/library/{adcs|meters} (POST) and …/[id] (PATCH, DELETE), with the schemas
 * they read. Each route file wraps them in `apiRoute` with its policy action named in the file.
 */
export function readoutPart<K extends Kind>(kind: K) {
  const k = kinds[kind] as (typeof kinds)[K];
  const notFound = () => new HttpError(404, `That ${k.word} was not found in the library.`);
  return {
    input: k.input,
    patch: k.patch,
    create: async ({ caller, body }: { caller: Caller; body: Values[K] }) =>
      json(written(await createReadoutPart(kind, caller.teamId, body, caller.userId)), 201),
    update: async ({
      caller,
      body,
      params,
    }: {
      caller: Caller;
      body: { updatedAt?: string };
      params: Record<string, string>;
    }) => {
      const id = partId(params.id, k.word);
      const stored = await getReadoutPart(kind, caller.teamId, id);
      if (!stored) throw notFound();
      const values = mergePatch(stored, body, k.input);
      return written(await updateReadoutPart(kind, caller.teamId, id, values, body.updatedAt, caller.userId));
    },
    remove: async ({ caller, params }: { caller: Caller; params: Record<string, string> }) => {
      const id = partId(params.id, k.word);
      if (!(await deletePart(kind, caller.teamId, id, caller.userId))) throw notFound();
      return { deleted: true, id };
    },
  };
}
