// A range plan read as one instrument across the span: at each current the range in use while the
// current rises (range k up to its switch-up point), its worst-case error and the drop on the load
// with its switch in series. Falling currents stay on the higher range down to the switch-down
// point; those readings lie between the curves of the two ranges at that current.
import { errorAtWith, logSpace } from "./error-budget";
import { buildModel, operatingBurden } from "./model";
import type { PlanChoice } from "./plan-choice";
import { subModel } from "./range-plan";
import type { Requirement } from "./requirement";

export type PlanCurvePoint = {
  currentA: number;
  /** 0-based index of the range in use on a rising current. */
  range: number;
  worstPercent: number;
  /** Drop across the range's shunt and its switch, V. */
  burdenV: number;
  loadVoltageV: number;
};

/** The range in use at current I on a rising current: the lowest whose switch-up point it has not passed. */
export function rangeInUse(plan: PlanChoice, I: number): number {
  const k = plan.switchPoints.findIndex((s) => I <= s.upA);
  return k < 0 ? plan.ranges.length - 1 : k;
}

export function planCurve(req: Requirement, plan: PlanChoice, points = 60): PlanCurvePoint[] {
  const m = buildModel(req);
  const subs = plan.ranges.map((r) => subModel(req, m, r.minA, r.maxA));
  return logSpace(req.current.min, req.current.max, points).map((I) => {
    const k = rangeInUse(plan, I);
    const r = plan.ranges[k];
    const sub = subs[k];
    if (!r || !sub) throw new Error("a plan without ranges");
    const choice = { shuntOhms: r.shuntOhms, gain: r.gain };
    const burdenV = operatingBurden({ ...sub, iMax: I }, r.shuntOhms + sub.switchOhms);
    return {
      currentA: I,
      range: k,
      worstPercent: errorAtWith(req, sub, choice, I).worstPercent,
      burdenV,
      loadVoltageV: m.vBus - burdenV,
    };
  });
}
