import { describe, expect, it } from "vitest";
import { summarizePlanProfile, type PlanProfileDesign } from "@/lib/design/plan-switching";
import { twoRangeDesign } from "@/lib/design/test-helpers";
import { decimateMinMax } from "./decimate";
import { planSeriesOverlay } from "./plan-series";

const d: PlanProfileDesign = twoRangeDesign(0);

describe("planSeriesOverlay", () => {
  const t = Float64Array.from([0, 1, 2, 3, 4, 5], (ms) => ms * 1e-3);
  const i = Float64Array.from([0.1, 0.1, 50, 50, 0.1, 0.1], (mA) => mA * 1e-3);
  const { trace } = summarizePlanProfile(t, i, d);
  const series = decimateMinMax(t, i, { width: 100, clipA: Infinity, lsbA: -Infinity });
  const o = planSeriesOverlay(t, i, trace, d, series);

  it("marks the stretches read on each range, in time order", () => {
    expect(o.ranges.map((s) => s.range)).toEqual([0, 1, 0]);
    expect(o.rangeAt).toEqual([0, 0, 1, 1, 0, 0]);
  });

  it("gives the load voltage through the path in use (Ohm's law: 3 V − I·(R + Ron))", () => {
    expect(o.loadV[0]).toBeCloseTo(3 - 0.1e-3 * 10.1, 12);
    expect(o.loadV[2]).toBeCloseTo(3 - 50e-3 * 0.2, 12);
  });

  it("judges steps on the range each sample was read on: 0.1 mA is below range 0's 0.2 mA step", () => {
    expect(o.belowStep.length).toBeGreaterThan(0);
    expect(o.clipped).toEqual([]);
  });
});
