// POST /api/solve: the stateless sweep (docs/api.md). Body: a requirement, plus an optional
// `rank` expression that orders the candidates after the Pareto front (lib/engine-requests.ts).
import { z } from "zod";
import { apiRoute } from "@/lib/auth/gate";
import { solveRequest } from "@/lib/engine-requests";
import { warmSolveRoute } from "@/lib/warm-up/solve-route";

// This route's own copy of the engine runs hot before a person's first call (lib/warm-up/run.ts).
warmSolveRoute();

export const POST = apiRoute({ action: "engine.use", body: z.unknown(), doing: "run the solver" }, async ({ body }) =>
  solveRequest(body),
);
