// Who may see which design: every query is scoped by the caller's team, and makers see approved
// designs only. A design a caller may not see is reported as not found (404), so its existence
// does not leak to another team — nor, for makers, to someone who could not open it anyway.
import "server-only";
import { getDesign, getDesignView } from "@/db/queries/designs";
import type { Caller } from "@/lib/auth/gate";
import { can } from "@/lib/auth/policy";
import type { DesignView, PairDesignView } from "@/lib/design-view";
import { savedPlanVerdict } from "@/lib/design/saved-verdict";
import { HttpError } from "@/lib/http";

export const designNotFound = () => new HttpError(404, "That design was not found in your team.");
const notApprovedForMakers = () =>
  new HttpError(
    404,
    "That design was not found among your team's approved designs (makers see approved designs only).",
  );

/** The design row and its current revision, or 404. */
export async function designFor(caller: Caller, id: string) {
  const found = await getDesign(id, caller.teamId);
  if (!found) throw designNotFound();
  if (!can(caller, "design.read", found.design)) throw notApprovedForMakers();
  return found;
}

/** The DesignView for a caller, or 404 on the same rules. */
export async function designViewFor(caller: Caller, id: string) {
  const view = await getDesignView(id, caller.teamId);
  if (!view) throw designNotFound();
  if (!can(caller, "design.read", view)) throw notApprovedForMakers();
  return view;
}

/**
 * The one place that says what a range plan cannot do yet: the build sheet, netlist, parts list,
 * current profiles and built units read a single shunt and gain. 422 until they learn plans.
 */
export function rangePlanNotYet(what: string): HttpError {
  return new HttpError(
    422,
    `${what} is not available for a range plan yet; the design's ranges, figures and bench rows are on GET /api/designs/[id].`,
  );
}

/** The DesignView of a single-pair design, or 422 (rangePlanNotYet) for a range plan. */
export async function pairDesignViewFor(caller: Caller, id: string, what: string): Promise<PairDesignView> {
  const view = await designViewFor(caller, id);
  if (view.kind === "plan") throw rangePlanNotYet(what);
  return view;
}

/**
 * A saved range plan that fails under today's model has no build sheet or parts list (each range's
 * figures come from re-deriving the plan): 409, with the failing constraint named. A pair's sheet
 * prints with the same statement on its front page instead.
 */
export function refuseFailingPlan(view: DesignView): void {
  if (view.kind !== "plan") return;
  const verdict = savedPlanVerdict(view.requirement, view.plan);
  if (verdict.fails) throw new HttpError(409, verdict.statement, { plan: [verdict.statement] });
}
