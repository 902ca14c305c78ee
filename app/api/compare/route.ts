import { apiRoute } from "@/lib/auth/gate";
import { designViewFor } from "@/lib/saved-designs/access";
import { compareQuery } from "@/lib/saved-designs/compare";

/** Two to four of the team's designs with their requirement, choice and figures. */
export const GET = apiRoute(
  { action: "design.read", doing: "compare designs", query: compareQuery },
  async ({ caller, query }) => {
    const designs = [];
    for (const id of query.ids) designs.push(await designViewFor(caller, id));
    return {
      designs: designs.map((d) => ({
        id: d.id,
        name: d.name,
        project: d.project,
        status: d.status,
        revision: d.revision,
        authorName: d.authorName,
        updatedAt: d.updatedAt,
        requirement: d.requirement,
        choice: d.choice,
        metrics: d.metrics,
      })),
    };
  },
);
