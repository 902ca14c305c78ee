// The plain-file exports of a saved range plan: its parts list as CSV (the same columns as a single
// range's) and its SPICE netlist, one deck per range.
import { writeCsv } from "@/lib/csv-write";
import { evaluatePlan, planNetlist, rangeDeck, type PlanChoice, type Requirement } from "@/lib/design";
import { csvCell, csvColumns } from "./exports";
import { planPartsList } from "./plan-parts";
import { UnsoundPlanError } from "./plan-sheet-data";

export function planPartsCsv(req: Requirement, plan: PlanChoice): string {
  const ev = evaluatePlan(req, plan);
  if (!ev.ok) throw new UnsoundPlanError(ev.message);
  const rows = planPartsList(req, ev.ranges);
  return writeCsv(
    csvColumns,
    rows.map((p) => csvColumns.map((c) => csvCell(p, c))),
    "\r\n",
  );
}

/**
 * The plan's netlist: every range's deck, or one (`range`, 1-based) that runs on its own in a
 * simulator. A range outside the plan is the caller's to refuse (planRangeOf).
 */
export function planDesignNetlist(
  req: Requirement,
  plan: PlanChoice,
  opts: { includeOffset: boolean; range?: number },
): string {
  if (opts.range === undefined) return planNetlist(req, plan, opts);
  return rangeDeck(req, plan, opts.range - 1, opts).netlist;
}
