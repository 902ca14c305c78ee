import { createShunt } from "@/db/queries/library";
import { apiRoute } from "@/lib/auth/gate";
import { json } from "@/lib/http";
import { shuntInput } from "@/lib/library/schema";
import { written } from "@/lib/library/service";

export const POST = apiRoute(
  { action: "library.edit", doing: "add parts to the library", body: shuntInput },
  async ({ caller, body }) => json(written(await createShunt(caller.teamId, body, caller.userId)), 201),
);
