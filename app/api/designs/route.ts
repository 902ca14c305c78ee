import { listDesigns } from "@/db/queries/designs";
import { apiRoute } from "@/lib/auth/gate";
import { can } from "@/lib/auth/policy";
import { json } from "@/lib/http";
import { saveNewDesign } from "@/lib/saved-designs/create";
import { createDesignSchema } from "@/lib/saved-designs/service";

export const GET = apiRoute({ action: "design.read", doing: "list designs" }, async ({ caller }) => ({
  designs: await listDesigns(caller.teamId, { approvedOnly: !can(caller, "design.read-unapproved") }),
}));

export const POST = apiRoute({ action: "design.create", body: createDesignSchema }, async ({ caller, body }) => {
  return json(await saveNewDesign(caller, body), 201);
});
