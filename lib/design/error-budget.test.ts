import { describe, expect, it } from "vitest";
import { evaluateCandidate } from "./candidate";
import { errorAt, errorBreakdownCurve, errorCurve, loadCurve, logSpace } from "./error-budget";
import { solve } from "./solve";
import { req } from "./test-helpers";

const r = req({
  current: { min: "2 mA", max: "180 mA" },
  supply: { voltage: "3 V" },
  readout: { kind: "adc", bits: 16, fullScale: "2.5 V" },
});
const choice = { shuntOhms: 0.274, gain: 50 };
// A pair the solver finds feasible, for the checks that need the target met somewhere.
const feasible = solve(r).candidates[0] ?? choice;

describe("error budget across the span", () => {
  it("logSpace runs from a to b, evenly in ratio", () => {
    const xs = logSpace(1e-6, 1, 7);
    expect(xs[0]).toBe(1e-6);
    expect(xs.at(-1)).toBe(1);
    expect((xs[1] ?? 0) / (xs[0] ?? 1)).toBeCloseTo(10, 9);
  });
  it("the curve is log-spaced over the span and RSS never exceeds the worst case", () => {
    const c = errorCurve(r, choice, 30);
    expect(c).toHaveLength(30);
    expect(c[0]?.currentA).toBe(r.current.min);
    expect(c.at(-1)?.currentA).toBe(r.current.max);
    for (const p of c) expect(p.rssPercent).toBeLessThanOrEqual(p.worstPercent);
    expect(c[0]?.worstPercent).toBeCloseTo(evaluateCandidate(r, choice).errorAtMinPercent, 9);
  });
  it("labels every source in plain words", () => {
    const t = errorAt(r, choice, 0.01).terms;
    // Eleven of the front end, four of the converter's own error (reference, gain, offset, INL).
    expect(t).toHaveLength(15);
    for (const term of t) expect(term.label).toMatch(/^(ADC |[A-Z][a-z])/); // the trade says ADC
    expect(errorBreakdownCurve(r, choice, 5)[0]?.terms).toHaveLength(15);
    // The converter's figures are not stated: each of its lines says so and names its class.
    const own = t.filter((x) => x.source.startsWith("readout") && x.source !== "readout");
    expect(own.map((x) => x.basis)).toEqual([
      "reference ±0.1 %, reference drift 20 ppm/K, typical of a general-purpose converter with a series reference, not stated",
      "±0.05 %, typical of a general-purpose converter with a series reference, not stated",
      "±2 LSB, typical of a general-purpose converter with a series reference, not stated",
      "±1 LSB, typical of a general-purpose converter with a series reference, not stated",
    ]);
    expect(t.filter((x) => x.basis === undefined)).toHaveLength(11);
  });
  it("the lowest accurate current meets the target, and a slightly lower one does not", () => {
    expect(solve(r).feasibleCount).toBeGreaterThan(0);
    const d = evaluateCandidate(r, feasible);
    const low = d.lowestAccurateCurrentA;
    expect(low).not.toBeNull();
    if (low === null) return;
    expect(errorAt(r, feasible, low).worstPercent).toBeLessThanOrEqual(r.accuracy.percent * (1 + 1e-9));
    if (low > r.current.min) expect(errorAt(r, feasible, low * 0.99).worstPercent).toBeGreaterThan(r.accuracy.percent);
  });
  it("the load curve drops I·R for a constant-current load", () => {
    for (const p of loadCurve(r, choice, 10)) {
      expect(p.burdenV).toBeCloseTo(p.currentA * 0.274, 14);
      expect(p.loadVoltageV).toBeCloseTo(3 - p.burdenV, 14);
    }
  });
});
