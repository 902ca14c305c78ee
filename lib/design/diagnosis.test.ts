// "No answer is never the answer" (issue 11): when nothing is feasible the solver says what fails,
// which pairs come closest, and which single changes work — each one checked here by applying it
// to the request and solving again.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { BOLTZMANN } from "./model";
import { rejectReasons } from "./pair";
import { parseRequirement, type Requirement, type RequirementInput } from "./requirement";
import { solve } from "./solve";
import { req, sensorNodeInput } from "./test-helpers";
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

/** The client's own request with one dotted field set, as the API or the wizard would send it again. */
function appliedToInput(input: RequirementInput, s: RelaxSuggestion): Requirement {
  const copy = JSON.parse(JSON.stringify(input)) as Record<string, Record<string, unknown>>;
  const [group, key] = s.field.split(".") as [string, string];
  copy[group] = { ...(copy[group] ?? {}), [key]: s.to };
  const parsed = parseRequirement(copy);
  if (!parsed.ok) throw new Error(`${s.field} = ${s.to}: ${parsed.message}`);
  return parsed.requirement;
}

/** What a suggestion promised, checked by solving again: its pairs, or a plan of its ranges and no pair. */
function expectDelivers(r: Requirement, s: RelaxSuggestion) {
  const again = solve(r, { diagnose: false });
  expect(again.feasibleCount).toBe(s.feasibleCount);
  if (s.gives === "pairs") {
    expect(s.feasibleCount).toBeGreaterThan(0);
    expect(s.rangeCount).toBe(0);
  } else {
    expect(s.feasibleCount).toBe(0);
    expect(again.rangePlan?.ranges.length).toBe(s.rangeCount);
    expect(s.rangeCount).toBeGreaterThanOrEqual(2);
  }
}

describe("diagnosis: a 3.3 V sensor node, 5 µA–250 mA, 50 mV, 12-bit at 3.3 V, 1 % from 1 mA, −20…60 °C", () => {
  const input = sensorNodeInput;
  const r = req(input);
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

  it("still says what would work: no single pair spans 50,000 : 1, so the changes that work come with a range plan", () => {
    // Why no single change gives pairs, by hand: at 250 mA within 50 mV the shunt is at most 0.2 Ω and
    // R·G·250 mA ≤ 3.3 V, so R·G ≤ 13.2 V/A; one step of 3.3 V/2^12 = 806 µV is then ≥ 61 µA, and
    // 10 counts need ≥ 0.61 mA, not 5 µA; the 10 mV output floor alone is a 0.76 mA dead zone.
    expect(3.3 / 2 ** 12 / 13.2).toBeGreaterThan(5e-6 / 10);
    const relax = s.diagnosis?.relax ?? [];
    const fields = relax.map((x) => x.field);
    expect(fields).toContain("accuracy.percent");
    // No band start meets 1 %: the converter's own error is not stated, so its class's figures count
    // (from memory, readout-error.ts): 0.1 % + 20 ppm/K·45 K + 0.05 % = 0.24 % of reading, on top of
    // the 0.87 % above, is 1.11 % at every current.
    expect(0.001 + 20e-6 * 45 + 0.0005 + 0.0087).toBeGreaterThan(0.01);
    expect(fields).not.toContain("accuracy.bandMin");
    for (const x of relax) {
      expectDelivers(appliedToInput(input, x), x);
      expect(x.gives).toBe("rangePlan");
      expect(x.says).toMatch(/with a plan of \d switched ranges \(no single pair covers it\)$/);
    }
    const pct = relax.find((x) => x.field === "accuracy.percent") as RelaxSuggestion;
    expect(pct.says).toMatch(/^\d+(\.\d+)? % is reachable from 1 mA up with a plan of/);
    // The step before on the E24 ladder gives neither pairs nor a plan (the smallest working step).
    const ladder = [1, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2, 2.2, 2.4, 2.7, 3, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2];
    const before = ladder[ladder.indexOf(pct.to) - 1] as number;
    const atBefore = solve(appliedToInput(input, { ...pct, to: before }), { diagnose: false });
    expect(atBefore.feasibleCount).toBe(0);
    expect(atBefore.rangePlan).toBeNull();
  });
});

describe("diagnosis when a range plan already covers the span", () => {
  it("suggests only changes that give single pairs: a plan is no news (issue 11's hidden case, 2 µA–120 mA)", () => {
    const input: RequirementInput = {
      current: { min: "2 uA", max: "120 mA" },
      supply: { voltage: "3.0 V" },
      drop: { max: "50 mV" },
      readout: { kind: "adc", bits: 12, fullScale: "2.048 V" },
      resolution: { countsAtMin: 4 },
      // Zeroed once: without it the converter's typical offset (not stated) leaves no single change that works.
      calibration: "one-point",
    };
    const s = solve(req(input));
    expect(s.rangePlan).not.toBeNull();
    expect(s.diagnosis?.rangePlan).toBeNull();
    // Starting the span higher lets one pair read it (680 µA, found by the sweep): that is the news.
    expect(s.diagnosis?.relax.length).toBeGreaterThan(0);
    for (const x of s.diagnosis?.relax ?? []) {
      expect(x.gives).toBe("pairs");
      expectDelivers(appliedToInput(input, x), x);
    }
  });
});

describe("diagnosis: relaxations that work, each the smallest step on its ladder", () => {
  it("accuracy-limited: 1 % from 1 mA cannot be met; the target rises, or the band starts higher", () => {
    // The sensor node from 1 mA: one range spans it, but not at 1 %. Calibrated at two points, so
    // the 25 °C gain errors (the converter's typical figures, not stated, among them) are out and a
    // band that starts higher can meet 1 % (without, its drift and tolerances alone pass 1 %: above).
    const r = req({ ...sensorNodeInput, current: { min: "1 mA", max: "250 mA" }, calibration: "two-point" });
    const s = solve(r);
    const relax = s.diagnosis?.relax ?? [];
    const byField = Object.fromEntries(relax.map((x) => [x.field, x]));
    expect(byField["accuracy.percent"]).toBeDefined();
    expect(byField["accuracy.bandMin"]).toBeDefined();
    for (const x of relax) {
      expect(feasibleWith(r, x)).toBe(x.feasibleCount);
      if (x.gives === "pairs") expect(x.feasibleCount).toBeGreaterThan(0);
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
    const relax = solve(r).diagnosis?.relax ?? [];
    // A milder filter may already allow a plan of ranges; single pairs need 20 kHz.
    const filter = relax.find((x) => x.field === "amplifier.filterHz" && x.gives === "pairs");
    for (const x of relax.filter((y) => y.field === "amplifier.filterHz")) expectDelivers(applied(r, x), x);
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
  .map((p): RequirementInput => ({
    current: { min: p.iMax / 10 ** p.spanDecades, max: p.iMax },
    supply: { voltage: p.vBus, side: p.side },
    drop: { max: p.dropFrac * p.vBus },
    readout: { kind: "adc", bits: p.bits, fullScale: 2.5 },
    resolution: { countsAtMin: p.countsAtMin },
    accuracy: { percent: p.percent },
    shunt: { series: p.series, min: 1e-3, max: 100 },
    amplifier: { gains: [10, 20, 50, 100, 200, 500], filterHz: p.filter },
    limit: 20,
  }));

describe("diagnosis: property", () => {
  it("every relax suggestion, applied alone to the request as sent, gives exactly its feasibleCount or its plan (fast-check)", () => {
    let checked = 0;
    let plans = 0;
    fc.assert(
      fc.property(hardArb, (input) => {
        const s = solve(req(input));
        if (s.feasibleCount > 0) {
          expect(s.diagnosis).toBeUndefined();
          return;
        }
        for (const x of s.diagnosis?.relax ?? []) {
          expectDelivers(appliedToInput(input, x), x);
          checked++;
          if (x.gives === "rangePlan") plans++;
        }
      }),
      { numRuns: 40, seed: 20261202, examples: [[sensorNodeInput]] },
    );
    // The generator does reach requirements with suggestions, of both kinds.
    expect(checked).toBeGreaterThan(10);
    expect(plans).toBeGreaterThan(0);
  });
});
