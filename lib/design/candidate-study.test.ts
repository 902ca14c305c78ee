import { describe, expect, it } from "vitest";
import { candidateStudy } from "./candidate-study";
import { evaluateCandidate } from "./candidate";
import { req } from "./test-helpers";

// The demo pump controller's span (docs/model.md §6), with a typical current, on a 10 mΩ × 25 pair.
const pump = req({
  current: { min: "100 mA", typical: "2 A", max: "6 A" },
  supply: { voltage: "24 V", side: "high" },
  drop: { max: "150 mV" },
  readout: { kind: "adc", bits: 12, fullScale: "3.3 V" },
  resolution: { countsAtMin: 10 },
});
const choice = { shuntOhms: 0.01, gain: 25 };

describe("one pair's figures across the span, in one call", () => {
  const f = candidateStudy(pump, choice, {
    pinned: [
      choice,
      { shuntOhms: 0.005, gain: 50 },
      { shuntOhms: 0.02, gain: 10 },
      { shuntOhms: 0.012, gain: 20 },
      { shuntOhms: 0.015, gain: 20 },
    ],
  });

  it("draws the pair first, then at most three pinned pairs other than itself", () => {
    expect(f.errorCurves.map((c) => c.choice)).toEqual([
      choice,
      { shuntOhms: 0.005, gain: 50 },
      { shuntOhms: 0.02, gain: 10 },
      { shuntOhms: 0.012, gain: 20 },
    ]);
    expect(f.errorCurves[0]!.points).toHaveLength(60);
  });

  it("drops I·R on a constant-current load (Ohm's law): 6 A × 10 mΩ = 60 mV at the top", () => {
    const top = f.load.at(-1)!;
    expect(top.currentA).toBeCloseTo(6, 12);
    expect(top.burdenV).toBeCloseTo(0.06, 12);
    expect(top.loadVoltageV).toBeCloseTo(24 - 0.06, 12);
  });

  it("splits the budget at Imin, the typical current and Imax, each budget's terms summing to its worst case", () => {
    expect(Object.keys(f.budgets).sort()).toEqual(["max", "min", "typical"]);
    expect(f.budgets.typical!.currentA).toBe(2);
    for (const b of Object.values(f.budgets)) {
      const sum = b.budget.terms.reduce((s, t) => s + Math.abs(t.errorA), 0);
      expect(sum).toBeCloseTo(b.budget.worstA, 12);
    }
    const noTypical = candidateStudy({ ...pump, current: { ...pump.current, typical: undefined } }, choice);
    expect(Object.keys(noTypical.budgets).sort()).toEqual(["max", "min"]);
  });

  it("shows a saved revision's figures as saved, and works them out when none are given", () => {
    expect(f.detail).toEqual(evaluateCandidate(pump, choice));
    const saved = { ...evaluateCandidate(pump, choice), burdenV: 0.123 };
    expect(candidateStudy(pump, choice, { saved }).detail.burdenV).toBe(0.123);
  });

  it("gives the output ceiling the figures compare against: at most the readout's 3.3 V full scale", () => {
    expect(f.outputCeilingV).toBeGreaterThan(3);
    expect(f.outputCeilingV).toBeLessThanOrEqual(3.3);
  });
});
