// Saving a new design, shared by POST /api/designs, the import route and the demo seed: the engine
// evaluates the requirement and the choice or plan (422 when the choice is outside the sweep or
// infeasible, or the plan unsound), then one transaction writes the design and its first revision.
import { createDesign } from "@/db/queries/designs";
import { withIdempotencyKey } from "@/db/queries/idempotency";
import type { Caller } from "@/lib/auth/gate";
import { HttpError } from "@/lib/http";
import { evaluatePicked, pickedOf, type RequirementSource } from "./service";
import type { Choice, PlanChoice } from "@/lib/design";

/** Exactly one of choice and plan (the request schemas see to it; pickedOf refuses otherwise). */
export type NewDesign = {
  name: string;
  project?: string | null;
  requirement: unknown;
  choice?: Choice;
  plan?: PlanChoice;
};

export async function saveNewDesign(
  caller: Pick<Caller, "teamId" | "userId">,
  body: NewDesign,
  idempotencyKey?: string,
  from: RequirementSource = "input",
) {
  const evaluated = evaluatePicked(body.requirement, pickedOf(body), from);
  const input = {
    ...evaluated,
    teamId: caller.teamId,
    userId: caller.userId,
    name: body.name,
    project: body.project ?? null,
  };
  if (idempotencyKey === undefined) return createDesign(input);
  const { answer } = await withIdempotencyKey(
    { userId: caller.userId, scope: "POST /api/designs", key: idempotencyKey },
    (tx) => createDesign(input, tx),
  );
  return answer;
}

/** The Idempotency-Key header, if sent: 1 to 255 visible characters, else 422 naming the header. */
export function idempotencyKeyOf(request: Request): string | undefined {
  const raw = request.headers.get("idempotency-key");
  if (raw === null) return undefined;
  const key = raw.trim();
  if (!/^[\x21-\x7e]{1,255}$/.test(key)) {
    throw new HttpError(422, "Idempotency-Key: send 1 to 255 visible characters, such as a UUID.", {
      "Idempotency-Key": ["1 to 255 visible characters, such as a UUID"],
    });
  }
  return key;
}
