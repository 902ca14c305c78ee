// Thin adapters between raw request bodies and the engine's parsers, shared by the stateless
// engine routes: the engine's own dotted field errors come back unchanged (or under a prefix).
import { RankExpressionError, solve, type Requirement, type SolveResult } from "@/lib/design";
import { parseRequirementInput } from "@/lib/design/ambiguous-percent";
import { HttpError, type FieldErrors } from "@/lib/http";

/** The client's requirement in `raw`, or a 422 carrying the engine's field errors (paths under `prefix`). */
export function requirementOr422(raw: unknown, prefix = ""): Requirement {
  const parsed = parseRequirementInput(raw);
  if (parsed.ok) return parsed.requirement;
  const fieldErrors: FieldErrors = {};
  for (const [path, messages] of Object.entries(parsed.fieldErrors)) {
    const key = prefix ? (path === "(requirement)" ? prefix : `${prefix}.${path}`) : path;
    fieldErrors[key] = messages.map((m) => (m === "Invalid input" ? clearer(path) : m));
  }
  const [firstPath, firstMessages] = Object.entries(fieldErrors)[0] ?? ["(body)", ["is invalid"]];
  throw new HttpError(422, `Invalid requirement at ${firstPath}: ${firstMessages[0]}`, fieldErrors);
}

/** zod's bare union refusal (e.g. 1e999, which JSON reads as Infinity) said in words. */
function clearer(path: string): string {
  return `${path}: expected a finite number in SI units or a quantity with its unit, such as "150 mA" or "3.3 V"`;
}

/** A JSON object body, or a 422 saying the body must be one. */
export function objectBody(raw: unknown): Record<string, unknown> {
  if (raw === null || typeof raw !== "object" || Array.isArray(raw)) {
    throw new HttpError(422, "The request body must be a JSON object.", { "(body)": ["expected a JSON object"] });
  }
  return raw as Record<string, unknown>;
}

/**
 * POST /api/solve's work on its body: a requirement, plus an optional `rank` expression that orders
 * the candidates after the Pareto front. 422 with the field at fault.
 */
export function solveRequest(body: unknown): SolveResult {
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
}
