// The design service: turns what a client sends (a requirement in numbers or unit strings and
// either a shunt/gain choice or a range plan) into what is stored — the normalized requirement,
// the choice or plan and the engine's figures — or refuses with 422 naming the field at fault.
// No database access here.
import { z } from "zod";
import {
  evaluateCandidate,
  evaluatePlan,
  formatSI,
  gainInSweep,
  isInSweep,
  parseRequirement,
  quantity,
  rejectReasonLabels,
  shuntInSweep,
  planChoiceSchema,
  type Choice,
  type DesignKind,
  type PlanChoice,
  type Requirement,
} from "@/lib/design";
import { parseRequirementInput } from "@/lib/design/ambiguous-percent";
import { HttpError, type FieldErrors } from "@/lib/http";
import { textField } from "@/lib/text-field";

export const choiceSchema = z.object({
  shuntOhms: quantity("resistance", "Shunt"),
  gain: z.number({ error: "Gain: expected a number" }).positive({ error: "Gain must be above zero" }),
});

const nameSchema = textField({ label: "Name", min: 1, minMessage: "Give the design a name", max: 200 });
const projectSchema = textField({ label: "Project", max: 200 }).nullish();

/** A design saves one shunt and gain (`choice`) or a range plan (`plan`): exactly one of the two. */
export const oneOfChoiceOrPlan = (b: { choice?: unknown; plan?: unknown }, ctx: z.RefinementCtx, required: boolean) => {
  if (b.choice !== undefined && b.plan !== undefined)
    ctx.addIssue({
      code: "custom",
      path: ["plan"],
      message: "Send either choice (one shunt and gain) or plan (a range plan), not both",
    });
  else if (required && b.choice === undefined && b.plan === undefined)
    ctx.addIssue({
      code: "custom",
      path: ["choice"],
      message: "Send choice {shuntOhms, gain} or plan {ranges, switchPoints}",
    });
};

export const createDesignSchema = z
  .object({
    name: nameSchema,
    project: projectSchema,
    requirement: z.unknown().refine((v) => v !== undefined, { error: "A requirement is needed" }),
    choice: choiceSchema.optional(),
    plan: planChoiceSchema.optional(),
  })
  .superRefine((b, ctx) => oneOfChoiceOrPlan(b, ctx, true));
export type CreateDesignBody = z.infer<typeof createDesignSchema>;

export const patchDesignSchema = z
  .object({
    revision: z.number({ error: "revision: give the revision you are editing" }).int().min(1),
    name: nameSchema.optional(),
    project: projectSchema,
    requirement: z.unknown().optional(),
    choice: choiceSchema.optional(),
    plan: planChoiceSchema.optional(),
  })
  .superRefine((b, ctx) => oneOfChoiceOrPlan(b, ctx, false));
export type PatchDesignBody = z.infer<typeof patchDesignSchema>;

/** What a save stores: the normalized requirement and a pair or a plan with the engine's figures. */
export type EvaluatedDesign = { requirement: Requirement } & DesignKind;
export type EvaluatedPair = Extract<EvaluatedDesign, { kind: "pair" }>;
export type EvaluatedPlan = Extract<EvaluatedDesign, { kind: "plan" }>;
/** What the client picked: one pair, or a plan. */
export type Picked = { choice: Choice; plan?: undefined } | { plan: PlanChoice; choice?: undefined };

function prefixed(errors: FieldErrors, prefix: string): FieldErrors {
  return Object.fromEntries(Object.entries(errors).map(([k, v]) => [`${prefix}.${k}`, v]));
}

/**
 * Where a requirement comes from: a person's `input` (ambiguous bare percent numbers refused), or a
 * `stored` one (the saved revision, or an exported file, whose normalized accuracy.percent is a bare number).
 */
export type RequirementSource = "input" | "stored";

function parsedRequirement(requirementInput: unknown, from: RequirementSource): Requirement {
  const parsed = from === "input" ? parseRequirementInput(requirementInput) : parseRequirement(requirementInput);
  if (parsed.ok) return parsed.requirement;
  const fieldErrors = prefixed(parsed.fieldErrors, "requirement");
  const [path, msgs] = Object.entries(fieldErrors)[0] ?? ["requirement", ["is invalid"]];
  throw new HttpError(422, `Invalid requirement at ${path}: ${msgs[0]}`, fieldErrors);
}

/** The one of choice and plan a body carries (the schemas refuse both); 422 naming `choice` when neither. */
export function pickedOf(b: { choice?: Choice; plan?: PlanChoice }): Picked {
  if (b.plan && b.choice)
    throw new HttpError(422, "Send either choice or plan, not both.", {
      plan: ["Send either choice (one shunt and gain) or plan (a range plan), not both"],
    });
  if (b.plan) return { plan: b.plan };
  if (b.choice) return { choice: b.choice };
  throw new HttpError(422, "Send a choice (one shunt and gain) or a plan (a range plan).", {
    choice: ["Send choice {shuntOhms, gain} or plan {ranges, switchPoints}"],
  });
}

/** A pair or a plan, whichever was picked, through the engine. */
export function evaluatePicked(
  requirementInput: unknown,
  picked: Picked,
  from: RequirementSource = "input",
): EvaluatedDesign {
  return picked.plan
    ? evaluatePlanDesign(requirementInput, picked.plan, from)
    : evaluateDesign(requirementInput, picked.choice, from);
}

/**
 * Parses the requirement and re-derives every range of the plan from the engine; a plan the engine
 * would not propose as sound is refused with 422 on the range (or switch point) at fault.
 */
export function evaluatePlanDesign(
  requirementInput: unknown,
  plan: PlanChoice,
  from: RequirementSource = "input",
): EvaluatedPlan {
  const req = parsedRequirement(requirementInput, from);
  const e = evaluatePlan(req, plan);
  if (!e.ok) throw new HttpError(422, `The range plan is not sound: ${e.message}.`, { [e.path]: [e.message] });
  return {
    requirement: req,
    kind: "plan",
    choice: null,
    plan: { ranges: plan.ranges.map((r) => ({ ...r })), switchPoints: e.switchPoints },
    metrics: { ranges: e.ranges, switchRule: e.switchRule, protection: e.protection },
  };
}

/** Parses the requirement, checks the choice is one the sweep examines and passes every constraint. */
export function evaluateDesign(
  requirementInput: unknown,
  choice: Choice,
  from: RequirementSource = "input",
): EvaluatedPair {
  const req = parsedRequirement(requirementInput, from);
  if (!isInSweep(req, choice)) {
    const fieldErrors: FieldErrors = {};
    if (!shuntInSweep(req, choice.shuntOhms)) {
      fieldErrors["choice.shuntOhms"] = [
        `${formatSI(choice.shuntOhms, "Ω")} is not in the ${req.shunt.series} series between ${formatSI(req.shunt.min, "Ω")} and ${formatSI(req.shunt.max, "Ω")}`,
      ];
    }
    if (!gainInSweep(req, choice.gain)) {
      const list =
        req.amplifier.gains.length > 12
          ? `${req.amplifier.gains.length} gains from ${req.amplifier.gains[0]} to ${req.amplifier.gains.at(-1)}`
          : req.amplifier.gains.join(", ");
      fieldErrors["choice.gain"] = [`Gain ${choice.gain} is not one of the swept gains (${list})`];
    }
    throw new HttpError(
      422,
      "The choice is outside the requirement's sweep: pick a shunt and gain the solver examines.",
      fieldErrors,
    );
  }
  const metrics = evaluateCandidate(req, choice);
  if (!metrics.feasible) {
    const why = metrics.reasons.map((r) => rejectReasonLabels[r]);
    throw new HttpError(422, `That shunt and gain do not meet the requirement: ${why.join("; ")}.`, {
      "choice.shuntOhms": why,
      "choice.gain": why,
    });
  }
  return {
    requirement: req,
    kind: "pair",
    choice: { shuntOhms: choice.shuntOhms, gain: choice.gain },
    plan: null,
    metrics,
  };
}
