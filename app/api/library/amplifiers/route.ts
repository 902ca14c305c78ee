import { createAmplifier } from "@/db/queries/library";
import { apiRoute } from "@/lib/auth/gate";
import { json } from "@/lib/http";
import { amplifierInput } from "@/lib/library/schema";
import { written } from "@/lib/library/service";

export const POST = apiRoute(
  { action: "library.edit", doing: "add parts to the library", body: amplifierInput },
  async ({ caller, body }) => json(written(await createAmplifier(caller.teamId, body, caller.userId)), 201),
);
