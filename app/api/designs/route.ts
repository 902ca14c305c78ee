import { listDesigns } from "@/db/queries/designs";
import { apiRoute } from "@/lib/auth/gate";
import { json } from "@/lib/http";
import { idempotencyKeyOf, saveNewDesign } from "@/lib/saved-designs/create";
import { createDesignSchema } from "@/lib/saved-designs/service";

export const GET = apiRoute({ doing: "list designs" }, async ({ caller }) => ({
  designs: await listDesigns(caller.teamId, { approvedOnly: caller.role === "maker" }),
}));

export const POST = apiRoute(
  { roles: ["owner", "designer"], doing: "save designs", body: createDesignSchema },
  async ({ caller, body, request }) => {
    // A repeat with the same Idempotency-Key answers as the first time (201, same id) and creates nothing.
    return json(await saveNewDesign(caller, body, idempotencyKeyOf(request)), 201);
  },
);
