// "No answer is never the answer" (issue 11): when nothing is feasible the solver says what fails,
// which pairs come closest, and which single changes work — each one checked here by applying it
// to the request and solving again.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { BOLTZMANN } from "./model";
import { rejectReasons } from "./pair";
import { parseRequirement, type Requirement } from "./requirement";
import { solve } from "./solve";
import { req } from "./test-helpers";
import type { RelaxSuggestion } from "./diagnosis";

/** The request with one dotted field set, parsed again as a client would send it. */
function applied(r: Requirement, s: RelaxSuggestion): Requirement {
  const copy = JSON.parse(JSON.stringify(r)) as Record<string, unknown>;
  const path = s.field.split(".");
  let at = copy;
  for (const key of path.slice(0, -1)) at = at[key] as Record<string, unknown>;
  at[path[path.length - 1] as string] = s.to;
  const parsed = parseRequirement(copy);
  if (!parsed.ok) throw new Error(`${s.field} = ${s.to}: ${parsed.message}`);
  return parsed.requirement;
}

const feasibleWith = (r: Requirement, s: RelaxSuggestion, to = s.to) =>
  solve(applied(r, { ...s, to }), { diagnose: false }).feasibleCount;

describe("diagnosis: a 3.3 V sensor node, 5 µA–250 mA, 50 mV, 12-bit at 3.3 V, 1 % from 1 mA, −20…60 °C", () => {
  const r = req({
    current: { min: "5 uA", max: "250 mA" },
    supply: { voltage: "3.3 V" },
    drop: { max: "50 mV" },
    readout: { kind: "adc", bits: 12, fullScale: "3.3 V" },
    accuracy: { percent: 1, bandMin: "1 mA" },
    temperature: { min: "-20 degC", max: "60 degC" },
  });
  const s = solve(r);

  it("counts every failure of every pair, not only the first", () => {
    expect(s.feasibleCount).toBe(0);
    const d = s.diagnosis;
    expect(d).toBeDefined();
    if (!d) return;
    expect(Object.keys(d.failing)).toEqual([...rejectReasons]);
    for (const reason of rejectReasons) expect(d.failing[reason]).toBeGreaterThanOrEqual(s.rejected[reason]);
    // 1 % cannot be met anywhere: the gain-type errors alone are 0.1 + 0.5 + 50 ppm/K·45 K + 10 ppm/K·45 K
    // = 0.87 %, leaving 0.13 % (1.3 µA at 1 mA) for offset and noise, while 14.5 µV of offset on the
    // largest shunt that keeps 50 mV at 250 mA (0.2 Ω) is already 72 µA.
    expect(d.failing.accuracy).toBe(s.evaluated);
  });

  it("names the closest pairs with each violation as a ratio to its limit", () => {
    const closest = s.diagnosis?.closest ?? [];
    expect(closest.length).toBeGreaterThan(0);
    for (const c of closest) {
      expect(Object.keys(c.violations).sort()).toEqual([...c.reasons].sort());
      for (const v of Object.values(c.violations)) expect(v).toBeGreaterThan(0);
      // The accuracy ratio is (band error − target)/target, from the candidate's own figures.
      expect(c.violations.accuracy).toBeGreaterThan(0);
    }
    const totals = closest.map((c) => Object.values(c.violations).reduce((a, b) => a + b, 0));
    for (let i = 1; i < totals.length; i++) expect(totals[i]).toBeGreaterThanOrEqual(totals[i - 1] as number);
  });

  it("says why no range plan exists", () => {
    expect(s.rangePlan).toBeNull();
    expect(s.diagnosis?.rangePlan).toMatch(/No range plan/);
  });
});

describe("diagnosis: relaxations that work, each the smallest step on its ladder", () => {
  it("accuracy-limited: 1 % from 1 mA cannot be met; the target rises, or the band starts higher", () => {
    const r = req({
      current: { min: "1 mA", max: "250 mA" },
      supply: { voltage: "3.3 V" },
      drop: { max: "50 mV" },
      readout: { kind: "adc", bits: 12, fullScale: "3.3 V" },
      accuracy: { percent: 1, bandMin: "1 mA" },
      temperature: { min: "-20 degC", max: "60 degC" },
    });
    const s = solve(r);
    const relax = s.diagnosis?.relax ?? [];
    const byField = Object.fromEntries(relax.map((x) => [x.field, x]));
    expect(byField["accuracy.percent"]).toBeDefined();
    expect(byField["accuracy.bandMin"]).toBeDefined();
    for (const x of relax) {
      expect(feasibleWith(r, x)).toBe(x.feasibleCount);
      expect(x.feasibleCount).toBeGreaterThan(0);
    }
    // The step before each on the E24 ladder still gives none.
    const pct = byField["accuracy.percent"] as RelaxSuggestion;
    const e24 = [
      1, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2, 2.2, 2.4, 2.7, 3, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1,
    ];
    const ladder = [...e24, ...e24.map((x) => x * 10)].map((x) => Number(x.toPrecision(6)));
    const below = ladder[ladder.indexOf(pct.to) - 1] as number;
    expect(feasibleWith(r, pct, below)).toBe(0);
    expect(pct.says).toMatch(/% is reachable/);
    expect(byField["accuracy.bandMin"]?.says).toMatch(/1 % is reachable from .*A up/);
  });

  it("noise-limited: an output filter at 20 kHz, worked out by hand from the noise formulas", () => {
    const r = req({
      current: { min: "2 mA", max: "100 mA" },
      supply: { voltage: "5 V" },
      drop: { max: "10 mV" },
      readout: { kind: "adc", bits: 16, fullScale: "2.5 V", sampleRateHz: "1 MHz" },
      accuracy: { percent: 5 },
      amplifier: { gains: [100], gbw: "20 MHz" },
    });
    // By hand for 0.1 Ω (the largest E96 value within 10 mV at 100 mA), G = 100, at 10 mA (the band's
    // bottom): gain-type 0.1 % + 0.5 % + 50 ppm/K·45 K + 10 ppm/K·45 K = 0.87 %; offset
    // (10 µV + 0.1 µV/K·45 K)/0.1 Ω + 20 nA; half a step 2.5 V/2^16/2/(0.1·100); noise
    // 3·√(en² + 4kTR)·√(π/2·f)/R (Johnson–Nyquist, single-pole noise bandwidth).
    const en = Math.sqrt(40e-9 ** 2 + 4 * BOLTZMANN * 343.15 * 0.1);
    const errorAt10mA = (f: number) =>
      0.0087 + (14.5e-6 / 0.1 + 20e-9 + 2.5 / 2 ** 16 / 2 / 10 + (3 * en * Math.sqrt((Math.PI / 2) * f)) / 0.1) / 0.01;
    expect(errorAt10mA(50e3)).toBeGreaterThan(0.05);
    expect(errorAt10mA(20e3)).toBeLessThan(0.05);
    const filter = solve(r).diagnosis?.relax.find((x) => x.field === "amplifier.filterHz");
    expect(filter?.to).toBe(20_000);
    expect(filter?.says).toBe(`add an output filter at 20 kHz (${filter?.feasibleCount} feasible pairs)`);
    if (filter) expect(feasibleWith(r, filter)).toBe(filter.feasibleCount);
  });
});

/** Random requirements on small grids, most of them with nothing feasible. */
const hardArb = fc
  .record({
    iMax: fc.double({ min: 0.01, max: 5, noNaN: true }),
    spanDecades: fc.double({ min: 1, max: 4, noNaN: true }),
    vBus: fc.double({ min: 1.8, max: 24, noNaN: true }),
    dropFrac: fc.double({ min: 0.002, max: 0.05, noNaN: true }),
    bits: fc.integer({ min: 8, max: 16 }),
    countsAtMin: fc.integer({ min: 2, max: 50 }),
    percent: fc.double({ min: 0.5, max: 5, noNaN: true }),
    side: fc.constantFrom("low" as const, "high" as const),
    series: fc.constantFrom("E6" as const, "E12" as const),
    filter: fc.option(fc.double({ min: 10, max: 1e5, noNaN: true }), { nil: null }),
  })
  .map((p) =>
    req({
      current: { min: p.iMax / 10 ** p.spanDecades, max: p.iMax },
      supply: { voltage: p.vBus, side: p.side },
      drop: { max: p.dropFrac * p.vBus },
      readout: { kind: "adc", bits: p.bits, fullScale: 2.5 },
      resolution: { countsAtMin: p.countsAtMin },
      accuracy: { percent: p.percent },
      shunt: { series: p.series, min: 1e-3, max: 100 },
      amplifier: { gains: [10, 20, 50, 100, 200, 500], filterHz: p.filter },
      limit: 20,
    }),
  );

describe("diagnosis: property", () => {
  it("every relax suggestion, applied alone to the request, gives exactly its feasibleCount (fast-check)", () => {
    let checked = 0;
    fc.assert(
      fc.property(hardArb, (r) => {
        const s = solve(r);
        if (s.feasibleCount > 0) {
          expect(s.diagnosis).toBeUndefined();
          return;
        }
        for (const x of s.diagnosis?.relax ?? []) {
          expect(x.feasibleCount).toBeGreaterThan(0);
          expect(feasibleWith(r, x)).toBe(x.feasibleCount);
          checked++;
        }
      }),
      { numRuns: 40, seed: 20261202 },
    );
    expect(checked).toBeGreaterThan(10); // the generator does reach requirements with suggestions
  });
});
