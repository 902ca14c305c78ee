import { describe, expect, it } from "vitest";
import { summarizePlanProfile, type PlanProfileDesign } from "@/lib/design/plan-switching";
import { decimateMinMax } from "./decimate";
import { planSeriesOverlay } from "./plan-series";

// Two ranges with round numbers: 10 Ω + 0.1 Ω switch up to 1 mA, 0.1 Ω + 0.1 Ω above; 3 V supply.
const d: PlanProfileDesign = {
  supplyV: 3,
  fullScaleV: 2.5,
  dropMaxV: 0.06,
  switchDelayS: 0,
  switchPoints: [{ upA: 1e-3, downA: 0.8e-3 }],
  ranges: [
    {
      minA: 1e-6,
      maxA: 1e-3,
      shuntOhms: 10,
      gain: 100,
      switchOhms: 0.1,
      lsbA: 1e-7,
      resolvableStepA: 0.2e-3,
      clipCurrentA: 2.5e-3,
    },
    {
      minA: 0.8e-3,
      maxA: 0.1,
      shuntOhms: 0.1,
      gain: 100,
      switchOhms: 0.1,
      lsbA: 1e-4,
      resolvableStepA: 1e-3,
      clipCurrentA: 0.25,
    },
  ],
};

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
