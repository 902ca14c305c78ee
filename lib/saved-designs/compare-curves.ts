// The compare page's curves of one saved design, worked out by the engine once per revision: the
// curves depend on the revision's requirement and choice (or plan) alone, and those never change.
import { errorCurve, loadCurve, planCurve } from "@/lib/design";
import { curveByMagnitude } from "@/lib/design/error-budget";
import type { DesignView } from "@/lib/design-view";
import { toDisplayDigits } from "@/lib/display-digits";
import { RevisionMemo, revisionKey } from "./revision-memo";

type Point = { x: number; y: number };
export type CompareCurves = { error: Point[]; burden: Point[] };

/** Points across the span: enough for a smooth log–log line at the page's chart width. */
const POINTS = 60;

/** Kept at the digits a chart shows (lib/display-digits.ts): the points are only drawn. */
const curves = new RevisionMemo<CompareCurves>(1000);

/**
 * Worst-case error (% of reading, by magnitude: a bidirectional design's error is the same either
 * way) and burden voltage against current. A range plan is drawn as one instrument: at each
 * current, the range in use on a rising current.
 */
export function compareCurves(d: DesignView): CompareCurves {
  return curves.get(revisionKey(d.id, d.revision), () => toDisplayDigits(curvesOf(d)));
}

function curvesOf(d: DesignView): CompareCurves {
  if (d.kind === "plan") {
    const plan = planCurve(d.requirement, d.plan, POINTS);
    return {
      error: plan.map((p) => ({ x: p.currentA, y: p.worstPercent })),
      burden: plan.map((p) => ({ x: p.currentA, y: p.burdenV })),
    };
  }
  return {
    error: curveByMagnitude(errorCurve(d.requirement, d.choice, POINTS)).map((p) => ({
      x: p.currentA,
      y: p.worstPercent,
    })),
    burden: loadCurve(d.requirement, d.choice, POINTS).map((p) => ({ x: p.currentA, y: p.burdenV })),
  };
}
