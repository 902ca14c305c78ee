// POST /api/solve: the stateless sweep (docs/api.md). Body: a requirement, plus an optional
// `rank` expression that orders the candidates after the Pareto front.
import { z } from "zod";
import { RankExpressionError, solve } from "@/lib/design";
import { apiRoute } from "@/lib/auth/gate";
import { HttpError } from "@/lib/http";
import { objectBody, requirementOr422 } from "@/lib/engine-requests";

export const POST = apiRoute({ action: "engine.use", body: z.unknown(), doing: "run the solver" }, async ({ body }) => {
  const { rank, ...rest } = objectBody(body);
  if (rank !== undefined && typeof rank !== "string") {
    throw new HttpError(422, "Invalid input at rank: expected a ranking expression as text", {
      rank: ['Ranking expression: expected text such as "burdenV * 1000 + errorAtMinPercent"'],
    });
  }
  const requirement = requirementOr422(rest);
  try {
    return solve(requirement, rank === undefined ? {} : { rankExpression: rank });
  } catch (e) {
    if (e instanceof RankExpressionError)
      throw new HttpError(422, `Invalid input at rank: ${e.message}`, { rank: [e.message] });
    throw e;
  }
});
