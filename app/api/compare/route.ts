import { apiRoute } from "@/lib/auth/gate";
import { designViewFor } from "@/lib/saved-designs/access";
import { compareQuery } from "@/lib/saved-designs/compare";

/**
 * Two to four of the team's designs with their requirement, choice or plan, and figures (a plan's
 * `metrics.ranges[k]` per range).
 */
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
        kind: d.kind,
        ...(d.kind === "plan" ? { plan: d.plan } : { choice: d.choice }),
        metrics: d.metrics,
      })),
    };
  },
);
