// The design service: turns what a client sends (a requirement in numbers or unit strings and a
// shunt/gain choice) into what is stored — the normalized requirement, the choice and the engine's
// figures — or refuses with 422 naming the field at fault. No database access here.
import { z } from "zod";
import {
  evaluateCandidate,
  formatSI,
  isInSweep,
  parseRequirement,
  quantity,
  rejectReasonLabels,
  type CandidateDetail,
  type Choice,
  type Requirement,
} from "@/lib/design";
import { HttpError, type FieldErrors } from "@/lib/http";
import { textField } from "@/lib/text-field";

export const choiceSchema = z.object({
  shuntOhms: quantity("resistance", "Shunt"),
  gain: z.number({ error: "Gain: expected a number" }).positive({ error: "Gain must be above zero" }),
});

const nameSchema = textField({ label: "Name", min: 1, minMessage: "Give the design a name", max: 200 });
const projectSchema = textField({ label: "Project", max: 200 }).nullish();

export const createDesignSchema = z.object({
  name: nameSchema,
  project: projectSchema,
  requirement: z.unknown().refine((v) => v !== undefined, { error: "A requirement is needed" }),
  choice: choiceSchema,
});
export type CreateDesignBody = z.infer<typeof createDesignSchema>;

export const patchDesignSchema = z.object({
  revision: z.number({ error: "revision: give the revision you are editing" }).int().min(1),
  name: nameSchema.optional(),
  project: projectSchema,
  requirement: z.unknown().optional(),
  choice: choiceSchema.optional(),
});
export type PatchDesignBody = z.infer<typeof patchDesignSchema>;

export type EvaluatedDesign = { requirement: Requirement; choice: Choice; metrics: CandidateDetail };

function prefixed(errors: FieldErrors, prefix: string): FieldErrors {
  return Object.fromEntries(Object.entries(errors).map(([k, v]) => [`${prefix}.${k}`, v]));
}

/** Parses the requirement, checks the choice is one the sweep examines and passes every constraint. */
export function evaluateDesign(requirementInput: unknown, choice: Choice): EvaluatedDesign {
  const parsed = parseRequirement(requirementInput);
  if (!parsed.ok) {
    const fieldErrors = prefixed(parsed.fieldErrors, "requirement");
    const [path, msgs] = Object.entries(fieldErrors)[0] ?? ["requirement", ["is invalid"]];
    throw new HttpError(422, `Invalid requirement at ${path}: ${msgs[0]}`, fieldErrors);
  }
  const req = parsed.requirement;
  if (!isInSweep(req, choice)) {
    const fieldErrors: FieldErrors = {};
    const onSeries = isInSweep(req, { shuntOhms: choice.shuntOhms, gain: req.amplifier.gains[0] ?? choice.gain });
    if (!onSeries) {
      fieldErrors["choice.shuntOhms"] = [
        `${formatSI(choice.shuntOhms, "Ω")} is not in the ${req.shunt.series} series between ${formatSI(req.shunt.min, "Ω")} and ${formatSI(req.shunt.max, "Ω")}`,
      ];
    }
    if (!req.amplifier.gains.some((g) => Math.abs(g - choice.gain) <= 1e-9 * g)) {
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
  return { requirement: req, choice, metrics };
}
