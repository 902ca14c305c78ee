// Signed spans (issue 14, item 1) against hand calculations: the output is the zero-current level
// plus I·R·G (Ohm's law and the amplifier's gain), and both ends must fit the output window with
// the worst-case errors included (docs/model.md §3 "Signed spans"; the window is common practice,
// no source). Each expected value is worked out by hand beside it.
import { describe, expect, it } from "vitest";
import { benchCheck } from "./bench-check";
import { evaluateCandidate } from "./candidate";
import { errorAt, errorCurve } from "./error-budget";
import { buildModel } from "./model";
import { monteCarlo } from "./monte-carlo";
import { pairMask, reasonsOf } from "./pair";
import { parseRequirement } from "./requirement";
import { solve } from "./solve";
import { req } from "./test-helpers";

// A battery pack: 10 A of discharge to 10 A of charge, low side, 16-bit ADC on 2.5 V, a 1.25 V zero level.
const pack = {
  current: { min: "-10 A", max: "10 A" },
  supply: { voltage: "48 V", side: "low" as const },
  drop: { max: "50 mV" },
  readout: { kind: "adc" as const, bits: 16, fullScale: "2.5 V" },
  amplifier: { gains: [20, 50, 100], reference: { voltage: "1.25 V" } },
};
const choice = { shuntOhms: 0.001, gain: 50 };

describe("the output over a signed span", () => {
  it("at −Imax, 0 and +Imax is 1.25 V ∓ 10 A × 1 mΩ × 50 = 0.75 V, 1.25 V, 1.75 V", () => {
    const rows = benchCheck(req(pack), choice);
    const at = (I: number) => rows.find((r) => r.currentA === I)?.expectedV;
    expect(at(-10)).toBeCloseTo(0.75, 12);
    expect(at(0)).toBeCloseTo(1.25, 12);
    expect(at(10)).toBeCloseTo(1.75, 12);
    // The band at zero is the offsets alone: the zero level's 0.2 % + 25 ppm/K × 45 K of 1.25 V is
    // 3.906 mV, the rest of the budget's offsets (amplifier 10 µV + 0.1 µV/K × 45 K, 20 nA × 1 mΩ,
    // common mode 0 on the low side) × 50: 1.25 V ± (3.906 mV + 0.7235 mV).
    const zero = rows.find((r) => r.currentA === 0)!;
    // Noise: 3 × √(40 nV² + 4kT·1 mΩ at 70 °C)/√Hz × √(π/2 × 500 Hz) × 50 (the ADC's anti-alias corner).
    const noise = 3 * Math.sqrt(40e-9 ** 2 + 4 * 1.380649e-23 * 343.15 * 0.001) * Math.sqrt((Math.PI / 2) * 500) * 50;
    const hand = 1.25 * (0.002 + 25e-6 * 45) + 50 * (10e-6 + 0.1e-6 * 45 + 20e-9 * 0.001) + 2.5 / 65536 / 2 + noise;
    expect(zero.maxV - 1.25).toBeCloseTo(hand, 9);
  });

  it("places the zero level by default in proportion to the two directions", () => {
    // Window 10 mV to min(2.5 V, 5 V − 50 mV) = 2.5 V; |Imin| share 4/(4 + 12): 10 mV + 2.49 V × 0.25 = 632.5 mV.
    const r = req({ ...pack, current: { min: "-4 A", max: "12 A" }, amplifier: { gains: [20] } });
    expect(r.amplifier.reference.voltage).toBeCloseTo(0.6325, 12);
    // One way: no zero level.
    expect(req({ ...pack, current: { min: "1 A", max: "10 A" }, amplifier: {} }).amplifier.reference.voltage).toBe(0);
  });

  it("refuses a pair whose negative end, errors included, passes below the floor, and keeps one that fits", () => {
    // 20 A of discharge at 1 mΩ × 50 swings 1 V below the zero level: at 0.5 V it would need −0.5 V.
    const low = req({
      ...pack,
      current: { min: "-20 A", max: "5 A" },
      drop: { max: "30 mV" },
      amplifier: { gains: [50], reference: { voltage: "0.5 V" } },
    });
    expect(reasonsOf(pairMask(buildModel(low), 0.001, 50).mask)).toContain("output");
    const fits = req({
      ...pack,
      current: { min: "-20 A", max: "5 A" },
      drop: { max: "30 mV" },
      amplifier: { gains: [50], reference: { voltage: "1.5 V" } },
    });
    // 1.5 V − 1 V = 0.5 V and 1.5 V + 0.25 V = 1.75 V: inside 10 mV … 2.5 V with room for the errors.
    expect(reasonsOf(pairMask(buildModel(fits), 0.001, 50).mask)).not.toContain("output");
    const d = evaluateCandidate(fits, { shuntOhms: 0.001, gain: 50 });
    expect(d.outputAtMaxWorstV).toBeGreaterThan(1.75);
    // The drop is taken at the larger direction: 20 A × 1 mΩ = 20 mV ≤ 30 mV; 20 A × 2 mΩ would not be.
    expect(reasonsOf(pairMask(buildModel(fits), 0.002, 50).mask)).toContain("drop");
  });

  it("applies accuracy to the magnitude either way: the error at −I equals the error at +I", () => {
    const r = req(pack);
    for (const I of [1, 3, 10])
      expect(errorAt(r, choice, -I).worstPercent).toBeCloseTo(errorAt(r, choice, I).worstPercent, 12);
    const curve = errorCurve(r, choice, 40);
    expect(curve[0]?.currentA).toBe(-10);
    expect(curve.at(-1)?.currentA).toBe(10);
    expect(curve.some((p) => p.currentA < 0) && curve.every((p) => p.currentA !== 0)).toBe(true);
  });

  it("reads the dead zone as the band around zero where the sign is uncertain (no floor term)", () => {
    const r = req(pack);
    const d = evaluateCandidate(r, choice);
    // (3.906 mV zero-level error)/(1 mΩ × 50) + (14.5 µV)/1 mΩ + 20 nA = 78.1 mA + 14.5 mA + 20 nA.
    const hand = (1.25 * (0.002 + 25e-6 * 45)) / 0.05 + (10e-6 + 0.1e-6 * 45) / 0.001 + 20e-9;
    expect(d.deadZoneA).toBeCloseTo(hand, 9);
  });

  it("finds feasible pairs for a pack calibrated at zero, where its uncalibrated zero level rules them out", () => {
    // The level's ±(0.2 % + 25 ppm/K × 45 K) of 1.25 V is ±3.9 mV at the output: 7.8 % of the 50 mV that
    // 1 A makes through 1 mΩ × 50. A one-point calibration at zero leaves its drift, 1.4 mV.
    const input = { ...pack, amplifier: { reference: { voltage: "1.25 V" } }, accuracy: { bandMin: "2 A" } };
    const raw = solve(req(input));
    expect(raw.feasibleCount).toBe(0);
    expect(raw.rangePlan).toBeNull();
    expect(solve(req({ ...input, calibration: "one-point" }), { diagnose: false }).feasibleCount).toBeGreaterThan(0);
  });

  it("Monte Carlo reads both directions within the worst case", () => {
    const r = req({ ...pack, amplifier: { gains: [50], reference: { voltage: "1.25 V" }, noiseDensity: "1 nV/rtHz" } });
    const mc = monteCarlo(r, choice, { currentsA: [-10, -2, 2, 10], draws: 1500 });
    for (const row of mc.rows) {
      const worst = errorAt(r, choice, row.currentA).worstPercent;
      expect(Math.max(Math.abs(row.min), Math.abs(row.max))).toBeLessThanOrEqual(worst);
    }
  });
});

describe("signed-span input rules", () => {
  it("refuses a zero minimum, a zero level outside the window and a band beyond the span, naming the field", () => {
    const zero = parseRequirement({ ...pack, current: { min: 0, max: "10 A" } });
    expect(!zero.ok && zero.fieldErrors["current.min"]).toBeTruthy();
    const outside = parseRequirement({ ...pack, amplifier: { reference: { voltage: "3 V" } } });
    expect(!outside.ok && outside.fieldErrors["amplifier.reference.voltage"]).toBeTruthy();
    const band = parseRequirement({ ...pack, accuracy: { bandMin: "20 A" } });
    expect(!band.ok && band.fieldErrors["accuracy.bandMin"]).toBeTruthy();
  });
});
