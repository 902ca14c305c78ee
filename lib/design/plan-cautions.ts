// Safety cautions for a range plan: the single-range cautions taken at the range that runs hottest,
// and the plan's own hazard, a lower range's shunt left in the path at the span's full current.
import { designCautions, switchCautions, type Caution } from "./cautions";
import { formatSI } from "./format";
import type { PlanMetrics, PlanRangeMetrics } from "./plan-evaluation";
import type { Requirement } from "./requirement";

/**
 * What a lower range's shunt would take if its protection never acted: the full current through
 * it, or the whole supply across it when that cannot push the full current through (Ohm's law,
 * P = I²·R or V²/R, the smaller), against its rating.
 */
export function unprotectedShuntW(req: Requirement, r: Pick<PlanRangeMetrics, "shuntOhms">): number {
  const R = r.shuntOhms;
  return Math.min(req.current.max ** 2 * R, req.supply.voltage ** 2 / R);
}

/**
 * What a range switch dissipates carrying `currentA` through its on-resistance (Joule's law,
 * P = I²·Ron): the top range's switch carries the span's maximum continuously.
 */
export function rangeSwitchW(req: Requirement, currentA: number): number {
  return currentA ** 2 * req.rangeSwitch.onResistance;
}

export function planCautions(req: Requirement, metrics: PlanMetrics): Caution[] {
  const ranges = metrics.ranges;
  const hottest = ranges.reduce((k, r, i) => (r.selfHeatingK > (ranges[k]?.selfHeatingK ?? -Infinity) ? i : k), 0);
  const base = designCautions(req, ranges[hottest] as PlanRangeMetrics, `range ${hottest + 1}'s shunt`);
  const lower = ranges.slice(0, -1);
  const worst = lower.reduce(
    (k, r, i) => (unprotectedShuntW(req, r) > unprotectedShuntW(req, lower[k] ?? r) ? i : k),
    0,
  );
  const low = lower[worst];
  if (!low) return base;
  const w = unprotectedShuntW(req, low);
  const dropV = req.current.max * low.shuntOhms;
  const overSupply = dropV >= req.supply.voltage;
  const switchCaution: Caution = {
    key: "range-switch",
    severity: w > low.ratingW ? "bad" : "warn",
    title: "A low range left in at full current",
    text:
      `If the range switch or its protection fails, range ${worst + 1}'s ${formatSI(low.shuntOhms, "Ω")} shunt stays in the path at up to ${formatSI(req.current.max, "A")}: ` +
      (overSupply
        ? `it would take the whole ${formatSI(req.supply.voltage, "V")} supply (the load browns out) `
        : `it would drop ${formatSI(dropV, "V")} `) +
      `and dissipate up to ${formatSI(w, "W")}` +
      (w > low.ratingW
        ? `, ${formatSI(w / low.ratingW, "")} times its ${formatSI(low.ratingW, "W")} rating: it burns. `
        : `. `) +
      `Use make-before-break switching, and on the bench check that the top range's switch closes when the drop reaches ${formatSI(req.drop.max, "V")} before connecting a battery or a supply that can deliver the full current.`,
  };
  const at = base.findIndex((c) => c.severity === "note");
  // The protection that prevents it, and the top switch's heat (cautions.ts).
  const own = [switchCaution, ...switchCautions(req, ranges)];
  return at < 0 ? [...base, ...own] : [...base.slice(0, at), ...own, ...base.slice(at)];
}
