import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { evaluateCandidate, isInSweep } from "./candidate";
import { seriesValues } from "./eseries";
import { buildModel, operatingBurden } from "./model";
import { dominates } from "./pareto";
import { rejectReasons } from "./pair";
import { readoutFigures } from "./readout-error";
import { RankExpressionError } from "./rank";
import type { Requirement } from "./requirement";
import { solve } from "./solve";
import { req } from "./test-helpers";
import type { Candidate } from "./types";

/** Random requirements on small grids, so that every feasible pair fits in the candidate list. */
const requirementArb = fc
  .record({
    iMax: fc.double({ min: 0.01, max: 5, noNaN: true }),
    spanDecades: fc.double({ min: 0.3, max: 3, noNaN: true }),
    vBus: fc.double({ min: 1.8, max: 48, noNaN: true }),
    dropFrac: fc.double({ min: 0.005, max: 0.2, noNaN: true }),
    bits: fc.integer({ min: 8, max: 20 }),
    fullScale: fc.constantFrom(1.2, 2.5, 3.3),
    countsAtMin: fc.integer({ min: 1, max: 100 }),
    percent: fc.double({ min: 0.5, max: 10, noNaN: true }),
    side: fc.constantFrom("low" as const, "high" as const),
    model: fc.constantFrom("constant-current" as const, "resistive" as const, "constant-power" as const),
    series: fc.constantFrom("E6" as const, "E12" as const, "E24" as const),
  })
  .map((p) =>
    req({
      current: { min: p.iMax / 10 ** p.spanDecades, max: p.iMax },
      supply: { voltage: p.vBus, side: p.side },
      drop: { fraction: p.dropFrac },
      load: { model: p.model },
      readout: { kind: "adc", bits: p.bits, fullScale: p.fullScale },
      resolution: { countsAtMin: p.countsAtMin },
      accuracy: { percent: p.percent },
      shunt: { series: p.series, min: 1e-3, max: 100 },
      amplifier: { gains: [1, 2, 5, 10, 20, 25, 50, 60, 100, 200, 500, 1000], supply: 5 },
      limit: 10_000,
    }),
  );

const objectives = (c: Candidate) => [c.burdenV, c.lsbA, c.errorAtMinPercent];

function independentChecks(r: Requirement, c: ReturnType<typeof evaluateCandidate>): string[] {
  const m = buildModel(r);
  const failed: string[] = [];
  const tol = 1 + 1e-9;
  const burdenOp = operatingBurden(m, c.shuntOhms);
  if (c.burdenV > r.drop.max * tol || burdenOp > r.drop.max * tol) failed.push("drop");
  // Inputs between the two ends of the shunt; a difference stage's op-amp sees G/(1 + G) of them.
  const vIn = r.supply.side === "high" ? [r.supply.voltage - burdenOp, r.supply.voltage] : [0, burdenOp];
  const k = r.amplifier.topology === "difference" ? c.gain / (1 + c.gain) : 1;
  const cm = r.amplifier.commonMode;
  if (
    (r.amplifier.topology === "non-inverting" && r.supply.side === "high") ||
    vIn.some((v) => k * v > cm.max * tol || k * v * tol < cm.min)
  )
    failed.push("commonMode");
  // An ADC's last code comes early by its reference's tolerance and drift, its gain error and its
  // offset (docs/model.md §3); a figure not stated is its class's typical one (readout-error.ts).
  const fig = (field: string) => readoutFigures(r.readout).find((f) => f.field === field)?.value ?? 0;
  const dT = Math.max(Math.abs(r.temperature.max - 25), Math.abs(r.temperature.min - 25));
  const readTop =
    r.readout.kind === "adc"
      ? r.readout.fullScale *
          (1 - fig("readout.reference.tolerance") - fig("readout.reference.tempco") * dT - fig("readout.gainError")) -
        (fig("readout.offsetLsb") * r.readout.fullScale) / 2 ** r.readout.bits
      : r.readout.fullScale;
  if (c.outputAtMaxWorstV > Math.min(readTop, r.amplifier.supply - r.amplifier.swingHigh) * tol) failed.push("output");
  if ((r.current.min / Math.max(c.lsbA, c.noiseA)) * tol < r.resolution.countsAtMin) failed.push("counts");
  // Linear derating above the knee to none at the maximum temperature (the resistor derating curve).
  const tMax = r.temperature.max;
  const ambient =
    tMax <= r.shunt.deratingKneeC
      ? 1
      : Math.max(0, (r.shunt.maxTempC - tMax) / (r.shunt.maxTempC - r.shunt.deratingKneeC));
  if (c.ratingW * r.shunt.derating * ambient * tol < c.dissipationW || c.hotSpotC > r.shunt.maxTempC * tol)
    failed.push("power");
  if (c.bandwidthHz * tol < r.bandwidth.min) failed.push("bandwidth");
  if (c.accuracyBandPercent > r.accuracy.percent * tol) failed.push("accuracy");
  if (c.deadZoneA > r.current.min * tol) failed.push("deadZone");
  return failed;
}

describe("solve: properties", () => {
  it("counts add up: feasibleCount + Σ rejected = evaluated = values × gains", () => {
    fc.assert(
      fc.property(requirementArb, (r) => {
        const s = solve(r);
        const sum = Object.values(s.rejected).reduce((a, b) => a + b, 0);
        expect(Object.keys(s.rejected)).toEqual([...rejectReasons]);
        expect(s.feasibleCount + sum).toBe(s.evaluated);
        expect(s.evaluated).toBe(
          seriesValues(r.shunt.series, r.shunt.min, r.shunt.max).length * r.amplifier.gains.length,
        );
      }),
      { numRuns: 40 },
    );
  });

  it("every feasible pair satisfies every constraint, checked independently, and every listed infeasible one fails its first reason", () => {
    fc.assert(
      fc.property(requirementArb, (r) => {
        for (const c of solve(r).candidates.slice(0, 400)) {
          const d = evaluateCandidate(r, c);
          const failed = independentChecks(r, d);
          if (c.feasible) expect(failed).toEqual([]);
          else expect(failed).toContain(c.reasons[0]);
          expect(d.reasons).toEqual(c.reasons);
        }
      }),
      { numRuns: 30 },
    );
  });

  it("every front member is undominated and every feasible non-member is dominated", () => {
    let sawFront = 0;
    fc.assert(
      fc.property(requirementArb, (r) => {
        const s = solve(r);
        const feasible = s.candidates.filter((c) => c.feasible);
        expect(feasible.length).toBe(s.feasibleCount); // limit is large enough to list them all
        const front = feasible.filter((c) => c.pareto);
        if (front.length > 0) sawFront++;
        for (const c of feasible) {
          const dominated = feasible.some((o) => o !== c && dominates(objectives(o), objectives(c)));
          expect(dominated).toBe(!c.pareto);
        }
        expect(s.candidates.filter((c) => !c.feasible).every((c) => !c.pareto)).toBe(true);
      }),
      { numRuns: 40 },
    );
    expect(sawFront).toBeGreaterThan(0); // the generator does reach feasible requirements
  });

  it("burden rises with R for every load model, and LSB falls with G", () => {
    fc.assert(
      fc.property(
        requirementArb,
        fc.double({ min: 1e-3, max: 10, noNaN: true }),
        fc.double({ min: 1.01, max: 10, noNaN: true }),
        fc.double({ min: 1, max: 500, noNaN: true }),
        (r, R, k, G) => {
          const a = evaluateCandidate(r, { shuntOhms: R, gain: G });
          const b = evaluateCandidate(r, { shuntOhms: R * k, gain: G });
          const c = evaluateCandidate(r, { shuntOhms: R, gain: G * k });
          expect(b.burdenV).toBeGreaterThan(a.burdenV);
          const m = buildModel(r);
          const op1 = operatingBurden(m, R);
          const op2 = operatingBurden(m, R * k);
          if (Number.isFinite(op1) && Number.isFinite(op2)) expect(op2).toBeGreaterThan(op1);
          expect(c.lsbA).toBeLessThan(a.lsbA);
        },
      ),
      { numRuns: 100 },
    );
  });
});

describe("solve: the listing", () => {
  // 2.5 V full scale over a 20 mV output floor allows a 125:1 span on one range.
  const logger = req({
    current: { min: "2 mA", max: "180 mA" },
    supply: { voltage: "3.0 V" },
    drop: { max: "60 mV" },
    readout: { kind: "adc", bits: 16, fullScale: "2.5 V" },
    shunt: { series: "E96", min: "10 mohm", max: "1 ohm" },
    amplifier: { gains: { series: "E12", min: 2, max: 200 } },
  });

  it("lists the front first, then the rest by the default ranking, up to the limit", () => {
    const s = solve({ ...logger, limit: 12 });
    expect(s.feasibleCount).toBeGreaterThan(12);
    const frontCount = s.candidates.filter((c) => c.pareto).length;
    expect(frontCount).toBeGreaterThan(0);
    expect(s.candidates.slice(0, frontCount).every((c) => c.pareto)).toBe(true);
    expect(s.candidates.length).toBe(Math.max(12, frontCount));
    expect(s.candidates.every((c) => isInSweep(logger, c))).toBe(true);
    expect(s.rangePlan).toBeNull();
  });

  it("orders by a rank expression when one is given", () => {
    const s = solve({ ...logger, limit: 400 }, { rankExpression: "burdenV" });
    const rest = s.candidates.filter((c) => c.feasible && !c.pareto);
    expect(rest.length).toBeGreaterThan(5);
    for (let i = 1; i < rest.length; i++)
      expect((rest[i] as Candidate).burdenV).toBeGreaterThanOrEqual((rest[i - 1] as Candidate).burdenV);
    const t = solve({ ...logger, limit: 400 }, { rankExpression: "-lsbA" }).candidates.filter(
      (c) => c.feasible && !c.pareto,
    );
    for (let i = 1; i < t.length; i++)
      expect((t[i] as Candidate).lsbA).toBeLessThanOrEqual((t[i - 1] as Candidate).lsbA);
  });

  it.each([
    ["x = 1", /assignments/],
    ["f(x) = x", /assignments and function definitions/],
    ["burdenV; gain", /single expression/],
    ["voltage * 2", /unknown name "voltage"/],
    ["import({}, {})", /function "import" is not allowed/],
    ['evaluate("1")', /not allowed/],
    ["burdenV * 1000 +", /Ranking expression/],
    ["5 mV", /unknown name "mV"/],
    ["[1, 2]", /not allowed/],
    ["burdenV > 1 ? 1 : 0", /not allowed/],
    ["", /empty/],
  ])("refuses the rank expression %j", (expr, message) => {
    expect(() => solve(logger, { rankExpression: expr })).toThrow(RankExpressionError);
    expect(() => solve(logger, { rankExpression: expr })).toThrow(message);
  });

  it("accepts the documented example expression", () => {
    const s = solve({ ...logger, limit: 80 }, { rankExpression: "burdenV * 1000 + errorAtMinPercent" });
    expect(s.ranking).toMatch(/burdenV \* 1000/);
    const rest = s.candidates.filter((c) => c.feasible && !c.pareto);
    expect(rest.length).toBeGreaterThan(5);
    const score = (c: Candidate) => c.burdenV * 1000 + c.errorAtMinPercent;
    for (let i = 1; i < rest.length; i++)
      expect(score(rest[i] as Candidate)).toBeGreaterThanOrEqual(score(rest[i - 1] as Candidate) - 1e-12);
  });
});

describe("decade scale factors for bench-meter readouts", () => {
  it("labels powers of ten in the trade's words", async () => {
    const { decadeScaleLabel } = await import("./decade");
    expect(decadeScaleLabel(1)).toBe("1 mV per mA");
    expect(decadeScaleLabel(1000)).toBe("1 mV per µA");
    expect(decadeScaleLabel(1e6)).toBe("1 mV per nA");
    expect(decadeScaleLabel(100)).toBe("100 mV per mA");
    expect(decadeScaleLabel(0.1)).toBe("100 mV per A");
    expect(decadeScaleLabel(2)).toBeNull();
  });
  it("offers 1 mV per µA for the demo's meter adapter (docs/model.md §6), feasible", () => {
    // A meter's 200 mV range reading a current up to 200 µA at 1 mV per µA.
    const r = req({
      current: { min: "2 uA", max: "180 uA" },
      supply: { voltage: "3 V" },
      drop: { max: "30 mV" },
      readout: { kind: "meter", fullScale: "200 mV", counts: 2000 },
      resolution: { countsAtMin: 10 },
      accuracy: { percent: 5 },
      amplifier: { gains: [1, 10, 100, 1000], swingLow: 0 },
    });
    const s = solve(r);
    const micro = s.decadeScales.find((c) => c.scale === "1 mV per µA");
    expect(micro).toBeDefined();
    expect(micro?.feasible).toBe(true);
    expect(micro?.transimpedanceVPerA).toBeCloseTo(1000, 9);
    for (const c of s.decadeScales) expect(c.feasible).toBe(true);
  });
});

describe("solve: the rejection tally matches pair-by-pair evaluation", () => {
  it("counts each pair once, under the first constraint evaluateCandidate reports", () => {
    fc.assert(
      fc.property(requirementArb, (r0) => {
        const r = { ...r0, shunt: { ...r0.shunt, series: "E6" as const, min: 0.01, max: 10 } };
        const tally: Record<string, number> = Object.fromEntries(rejectReasons.map((k) => [k, 0]));
        let feasible = 0;
        for (const R of seriesValues(r.shunt.series, r.shunt.min, r.shunt.max))
          for (const G of r.amplifier.gains) {
            const c = evaluateCandidate(r, { shuntOhms: R, gain: G });
            if (c.feasible) feasible++;
            else tally[c.reasons[0] as string] = (tally[c.reasons[0] as string] ?? 0) + 1;
          }
        const s = solve(r);
        expect(s.feasibleCount).toBe(feasible);
        expect(s.rejected).toEqual(tally);
      }),
      { numRuns: 15 },
    );
  });

  it("isInSweep accepts swept pairs only", () => {
    const r = req({
      current: { min: "2 mA", max: "180 mA" },
      supply: { voltage: "3 V" },
      shunt: { series: "E24", min: "10 mohm", max: "1 ohm" },
      amplifier: { gains: [20, 50] },
    });
    expect(isInSweep(r, { shuntOhms: 0.47, gain: 50 })).toBe(true);
    expect(isInSweep(r, { shuntOhms: 0.475, gain: 50 })).toBe(false); // an E96 value, not E24
    expect(isInSweep(r, { shuntOhms: 4.7, gain: 50 })).toBe(false); // outside the bounds
    expect(isInSweep(r, { shuntOhms: 0.47, gain: 25 })).toBe(false); // not a swept gain
  });
});
