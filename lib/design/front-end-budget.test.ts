// Properties of the budget with the front end's terms (fast-check, a general-purpose property
// testing library): the worst case is the sum of magnitudes, so it is never below the RSS nor
// below any single term; the Monte Carlo, whose every draw stays inside each term's bound,
// never reads beyond the worst case.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { evaluateCandidate } from "./candidate";
import { errorAt } from "./error-budget";
import { monteCarlo } from "./monte-carlo";
import { worstErrorA, buildModel } from "./model";
import { shuntFigures } from "./pair";
import { req } from "./test-helpers";

const arbitraryDesign = fc.record({
  topology: fc.constantFrom("current-sense", "difference", "instrumentation"),
  side: fc.constantFrom("low", "high"),
  filter: fc.option(
    fc.record({
      r: fc.double({ min: 1, max: 2000, noNaN: true }),
      c: fc.double({ min: 1e-9, max: 1e-5, noNaN: true }),
    }),
  ),
  terminals: fc.constantFrom(2, 4),
  pad: fc.double({ min: 0, max: 2e-3, noNaN: true }),
  emf: fc.double({ min: 0, max: 40e-6, noNaN: true }),
  gradient: fc.double({ min: 0, max: 5, noNaN: true }),
  R: fc.double({ min: 1e-3, max: 1, noNaN: true }),
  G: fc.double({ min: 2, max: 200, noNaN: true }),
  frac: fc.double({ min: 0, max: 1, noNaN: true }),
});

type DesignDraw = typeof arbitraryDesign extends fc.Arbitrary<infer T> ? T : never;

function build(d: DesignDraw) {
  return req({
    current: { min: "10 mA", max: "2 A" },
    supply: { voltage: "12 V", side: d.side },
    drop: { max: "2 V" },
    readout: { kind: "adc", bits: 14, fullScale: "2.5 V" },
    amplifier: {
      topology: d.topology,
      gains: [d.G],
      ...(d.topology === "difference" ? { gainSet: { series: "E24", min: 2, max: 200, tolerance: "0.1 %" } } : {}),
      commonMode: { min: "-1 V", max: "30 V" },
    },
    inputFilter: d.filter ? { resistance: d.filter.r, capacitance: d.filter.c } : null,
    shunt: { terminals: d.terminals as 2 | 4, padResistance: d.pad, thermalEmf: d.emf, gradient: d.gradient },
  });
}

describe("budget properties with the front end's terms", () => {
  it("worst case ≥ RSS, ≥ every single term, and equals the model's worst case", () => {
    fc.assert(
      fc.property(arbitraryDesign, (d) => {
        const r = build(d);
        const I = 0.01 * 200 ** d.frac;
        const choice = { shuntOhms: d.R, gain: d.G };
        const e = errorAt(r, choice, I);
        expect(e.worstA).toBeGreaterThanOrEqual(e.rssA * (1 - 1e-12));
        for (const t of e.terms) expect(e.worstA).toBeGreaterThanOrEqual(Math.abs(t.errorA) * (1 - 1e-12));
        const m = buildModel(r);
        expect(e.worstA).toBeCloseTo(worstErrorA(m, d.R, d.G, shuntFigures(m, d.R).theta, I), 9);
      }),
      { numRuns: 150 },
    );
  });

  it("the Monte Carlo never reads beyond the worst case (noise set to zero: it has no bound)", () => {
    fc.assert(
      fc.property(arbitraryDesign, (d) => {
        const r0 = build(d);
        const r = {
          ...r0,
          amplifier: { ...r0.amplifier, noiseDensity: 0 },
          readout: { kind: "adc" as const, bits: 24, fullScale: 1e6, sampleRateHz: 1000 },
        };
        const choice = { shuntOhms: d.R, gain: d.G };
        const I = 0.5;
        const mc = monteCarlo(r, choice, { currentsA: [I], draws: 200, seed: 7 });
        const worst = errorAt(r, choice, I).worstPercent;
        const row = mc.rows[0]!;
        // The output is clipped at the swing; stay where it is not.
        if (evaluateCandidate(r, choice).outputAtMaxWorstV > 0.9 * r.amplifier.supply) return;
        expect(Math.max(Math.abs(row.min), Math.abs(row.max))).toBeLessThanOrEqual(worst * 1.001 + 1e-9);
      }),
      { numRuns: 40 },
    );
  });

  it("the Monte Carlo spreads with the new sources: a 2 K gradient at 40 µV/K widens a 1 mΩ design at 1 A's spread", () => {
    const d = {
      topology: "current-sense",
      side: "low",
      filter: null,
      terminals: 4,
      pad: 0,
      emf: 40e-6,
      gradient: 0,
      R: 1e-3,
      G: 50,
      frac: 0,
    } as const;
    const calm = monteCarlo(build(d), { shuntOhms: 1e-3, gain: 50 }, { currentsA: [1], draws: 500 });
    const hot = monteCarlo(build({ ...d, gradient: 2 }), { shuntOhms: 1e-3, gain: 50 }, { currentsA: [1], draws: 500 });
    // 80 µV on 1 mΩ is ±80 mA at 1 A (±8 %): the spread must show it.
    expect(hot.rows[0]!.std).toBeGreaterThan(3 * calm.rows[0]!.std);
  });
});
