// A saved design re-read under today's model. A revision keeps the figures it was saved with; the
// model can since have grown (issue 14: a readout whose own error is not stated now reads with its
// class's typical figures, not as ideal), so a choice that passed then can fail now. The design
// page and the build sheet say so, naming the failing constraint, instead of showing "feasible".
import { evaluateCandidate } from "./candidate";
import { rejectReasonLabels } from "./pair";
import { evaluatePlan } from "./plan-evaluation";
import type { PlanChoice } from "./plan-choice";
import { assumedReadoutText } from "./readout-error";
import type { Requirement } from "./requirement";
import type { Choice } from "./types";

export type SavedVerdict = { fails: false } | { fails: true; failing: string[]; statement: string };

function failing(req: Requirement, failing: string[], what: string): SavedVerdict {
  const assumed = assumedReadoutText(req.readout);
  const why = assumed
    ? ` Its requirement does not state all of the readout's own error, which is now read as ${assumed}. State the part's figures (or a calibration) or revise the ${what}.`
    : ` Revise the ${what}.`;
  return {
    fails: true,
    failing,
    statement: `Under the current model this saved ${what} fails: ${failing.join("; ")}.${why}`,
  };
}

/** A saved pair through the engine as it is today. */
export function savedPairVerdict(req: Requirement, choice: Choice): SavedVerdict {
  const m = evaluateCandidate(req, choice);
  if (m.feasible) return { fails: false };
  return failing(
    req,
    m.reasons.map((r) => rejectReasonLabels[r].toLowerCase()),
    "choice",
  );
}

/** A saved range plan through the engine as it is today (evaluatePlan names the range at fault). */
export function savedPlanVerdict(req: Requirement, plan: PlanChoice): SavedVerdict {
  const e = evaluatePlan(req, plan);
  if (e.ok) return { fails: false };
  return failing(req, [e.message], "range plan");
}
