import { createDesign, listDesigns } from "@/db/queries/designs";
import { apiRoute } from "@/lib/auth/gate";
import { json } from "@/lib/http";
import { createDesignSchema, evaluateDesign } from "@/lib/designs/service";

export const GET = apiRoute({ doing: "list designs" }, async ({ caller }) => ({
  designs: await listDesigns(caller.teamId, { approvedOnly: caller.role === "maker" }),
}));

export const POST = apiRoute(
  { roles: ["owner", "designer"], doing: "save designs", body: createDesignSchema },
  async ({ caller, body }) => {
    const evaluated = evaluateDesign(body.requirement, body.choice);
    const created = await createDesign({
      ...evaluated,
      teamId: caller.teamId,
      userId: caller.userId,
      name: body.name,
      project: body.project ?? null,
    });
    return json(created, 201);
  },
);
