// A range plan as one instrument across the span, the one place its curves are worked out: each
// range's error, drop and load voltage over its own stretch (the wizard's plan charts), the same
// figures along the span with the range in use on a rising current (the compare page), and the
// voltage a plan leaves the load beside a bench meter's current ranges on the same load.
import { errorAtWith, logSpace } from "./error-budget";
import { buildModel, operatingBurden, type Model } from "./model";
import { operatingCurrent } from "./insertion";
import type { PlanChoice, SwitchPoint } from "./plan-choice";
import { subModel } from "./range-plan";
import type { Requirement } from "./requirement";

export type PlanStretchPoint = {
  currentA: number;
  worstPercent: number;
  rssPercent: number;
  /** Drop of the range's path, shunt and switch, with the load drawing currentA at full supply, V. */
  burdenV: number;
  loadVoltageV: number;
};

export type PlanStretch = {
  index: number;
  minA: number;
  maxA: number;
  shuntOhms: number;
  gain: number;
  points: PlanStretchPoint[];
};

export type PlanStretches = {
  ranges: PlanStretch[];
  switchPoints: SwitchPoint[];
  supplyV: number;
  dropMaxV: number;
  loadMinV?: number;
  accuracyPercent: number;
  bandMinA: number;
  bandMaxA: number;
};

/**
 * One range read at current I: the worst-case and RSS error of docs/model.md §3 with that range's
 * pair, rating and self-heating (`sub`, range-plan.ts subModel), and the drop I·(R + Ron) of its
 * path in the requirement's load model (operatingBurden with the load drawing I at full supply).
 */
function rangeAt(req: Requirement, sub: Model, r: PlanChoice["ranges"][number], I: number): PlanStretchPoint {
  const e = errorAtWith(req, sub, { shuntOhms: r.shuntOhms, gain: r.gain }, I);
  const burdenV = operatingBurden({ ...sub, iMax: I }, r.shuntOhms + sub.switchOhms);
  return {
    currentA: I,
    worstPercent: e.worstPercent,
    rssPercent: e.rssPercent,
    burdenV,
    loadVoltageV: sub.vBus - burdenV,
  };
}

/** Each range over its own stretch [minA, maxA] (the stretches overlap in the hysteresis bands). */
export function planStretches(req: Requirement, plan: PlanChoice, pointsPerRange = 40): PlanStretches {
  const m = buildModel(req);
  const ranges = plan.ranges.map((r, index) => {
    const sub = subModel(req, m, r.minA, r.maxA);
    const points = logSpace(r.minA, r.maxA, pointsPerRange).map((I) => rangeAt(req, sub, r, I));
    return { index, minA: r.minA, maxA: r.maxA, shuntOhms: r.shuntOhms, gain: r.gain, points };
  });
  return {
    ranges,
    switchPoints: plan.switchPoints,
    supplyV: req.supply.voltage,
    dropMaxV: req.drop.max,
    ...(req.drop.loadMin !== undefined ? { loadMinV: req.drop.loadMin } : {}),
    accuracyPercent: req.accuracy.percent,
    bandMinA: req.accuracy.bandMin,
    bandMaxA: req.accuracy.bandMax,
  };
}

/** A point of the plan along the span: the figures of the range in use there on a rising current. */
export type PlanCurvePoint = PlanStretchPoint & {
  /** 0-based index of the range in use on a rising current. */
  range: number;
};

/** The range in use at current I on a rising current: the lowest whose switch-up point it has not passed. */
export function rangeInUse(plan: PlanChoice, I: number): number {
  const k = plan.switchPoints.findIndex((s) => I <= s.upA);
  return k < 0 ? plan.ranges.length - 1 : k;
}

/**
 * The plan read as one instrument along the span: at each current the range in use while the
 * current rises (range k up to its switch-up point). Falling currents stay on the higher range
 * down to the switch-down point; those readings lie between the two ranges' curves there
 * (planStretches draws both).
 */
export function planCurve(req: Requirement, plan: PlanChoice, points = 60): PlanCurvePoint[] {
  const m = buildModel(req);
  const subs = plan.ranges.map((r) => subModel(req, m, r.minA, r.maxA));
  return logSpace(req.current.min, req.current.max, points).map((I) => {
    const range = rangeInUse(plan, I);
    const r = plan.ranges[range];
    const sub = subs[range];
    if (!r || !sub) throw new Error("a plan without ranges");
    return { ...rangeAt(req, sub, r, I), range };
  });
}

/**
 * Typical resistance a handheld meter puts in series on each of its current ranges (DESIGN.md §1;
 * common practice, no source): about 0.1 Ω on the amps range, 1.8–2 Ω on the milliamp range and
 * about 100 Ω on the microamp range.
 */
export const benchMeterRanges = [
  { key: "amps", label: "Meter, amps range", seriesOhms: 0.1 },
  { key: "milliamps", label: "Meter, milliamp range", seriesOhms: 1.9 },
  { key: "microamps", label: "Meter, microamp range", seriesOhms: 100 },
] as const;

export type LoadVoltagePoint = { currentA: number; loadVoltageV: number };
export type LoadVoltageSeries = {
  key: string;
  label: string;
  /** Ω in series: the meter range's, or the plan's largest path (shunt and switch). */
  seriesOhms: number;
  /** Currents where the load cannot be powered through it are left out. */
  points: LoadVoltagePoint[];
};

/** Voltage at the load through a series resistance, for a load drawing nominalA at full supply; null: no operating point. */
function loadVoltage(req: Requirement, seriesOhms: number, nominalA: number): number | null {
  const i = operatingCurrent(req.supply.voltage, seriesOhms, req.load.model, nominalA);
  return typeof i === "string" ? null : req.supply.voltage - i * seriesOhms;
}

/**
 * The voltage left to the load across the requirement's span for each bench-meter range in series
 * and for the plan. The plan's figure at a current is the lowest of the ranges that may be in use
 * there: inside a hysteresis band either neighbour may be (which one depends on the way the current
 * came), so the worse is shown. A range is "in use" where the current through its own path lies on
 * its stretch. Meter ranges are drawn across the whole span; a meter also limits each range's
 * current, which its own manual gives.
 */
export function meterBesidePlan(
  req: Requirement,
  plan: PlanChoice,
  meter: readonly { key: string; label: string; seriesOhms: number }[] = benchMeterRanges,
  points = 80,
): LoadVoltageSeries[] {
  const currents = logSpace(req.current.min, req.current.max, points);
  const ron = req.rangeSwitch.onResistance;
  const series: LoadVoltageSeries[] = meter.map((r) => ({
    key: r.key,
    label: r.label,
    seriesOhms: r.seriesOhms,
    points: currents.flatMap((a) => {
      const v = loadVoltage(req, r.seriesOhms, a);
      return v === null ? [] : [{ currentA: a, loadVoltageV: v }];
    }),
  }));
  const planPoints = currents.flatMap((a) => {
    let worst: number | null = null;
    for (let k = 0; k < plan.ranges.length; k++) {
      const r = plan.ranges[k] as PlanChoice["ranges"][number];
      const ohms = r.shuntOhms + ron;
      const i = operatingCurrent(req.supply.voltage, ohms, req.load.model, a);
      if (typeof i === "string") continue;
      // The lowest range is in use below its stretch too, the top one above it; slack for rounding.
      if (k > 0 && i < r.minA * (1 - 1e-9)) continue;
      if (k < plan.ranges.length - 1 && i > r.maxA * (1 + 1e-9)) continue;
      const v = req.supply.voltage - i * ohms;
      worst = worst === null ? v : Math.min(worst, v);
    }
    return worst === null ? [] : [{ currentA: a, loadVoltageV: worst }];
  });
  const largest = Math.max(...plan.ranges.map((r) => r.shuntOhms + ron));
  series.push({ key: "plan", label: "The range plan", seriesOhms: largest, points: planPoints });
  return series;
}
