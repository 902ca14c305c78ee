// Both ends of a signed span's output, worst case, against hand calculations: the output is the
// zero level + I·R·G (Ohm's law and the stage's gain), moved by each error at its limit (a worst
// case, docs/model.md §3; the window of floor and ceiling is common practice, no source).
import { describe, expect, it } from "vitest";
import { evaluateCandidate } from "./candidate";
import { signedOutputEnds } from "./signed-output";
import { idealConverter, req } from "./test-helpers";

// An amplifier with no error of its own, so the hand figures hold only the shunt's tolerance and
// the zero level's: 10 A each way through 1 mΩ at gain 50 swings ±0.5 V about 1.25 V.
const ideal = {
  gains: [50],
  offset: "0 V",
  offsetDrift: "0 V/K",
  gainError: "0 %",
  gainDrift: "0 ppm/K",
  biasCurrent: "0 A",
  noiseDensity: "0 V/rtHz",
  reference: { voltage: "1.25 V", tolerance: "0.2 %", tempco: "0 ppm/K" },
};
const pack = {
  current: { min: "-10 A", max: "10 A" },
  supply: { voltage: "48 V", side: "low" as const },
  drop: { max: "50 mV" },
  // A converter with no error of its own, stated: the ceiling is its full scale exactly.
  readout: { kind: "adc" as const, bits: 16, fullScale: "2.5 V", ...idealConverter },
  shunt: { tolerance: "1 %", tempco: "0 ppm/K" },
  accuracy: { crestFactor: 0 },
  amplifier: ideal,
};
const choice = { shuntOhms: 0.001, gain: 50 };

describe("a signed span's output at both ends, worst case", () => {
  it("±10 A: 1.25 V ± (10 A × 1 mΩ × 1.01 × 50 + 0.2 % of 1.25 V) = 1.7575 V and 0.7425 V", () => {
    const r = req(pack);
    const ends = signedOutputEnds(r, choice)!;
    expect(ends.zeroV).toBe(1.25);
    expect(ends.highNominalV).toBeCloseTo(1.75, 12);
    expect(ends.lowNominalV).toBeCloseTo(0.75, 12);
    // Shunt 1 % high: 0.505 V of swing; the zero level 0.2 % × 1.25 V = 2.5 mV, both away from zero.
    expect(ends.highWorstV).toBeCloseTo(1.25 + 0.505 + 0.0025, 9);
    expect(ends.lowWorstV).toBeCloseTo(1.25 - 0.505 - 0.0025, 9);
    // The window: the amplifier's 10 mV floor (the default swing), the 2.5 V full scale as the ceiling
    // (an ideal readout, below the 5 V supply less its headroom).
    expect(ends.floorV).toBeCloseTo(0.01, 12);
    expect(ends.ceilV).toBeCloseTo(2.5, 12);
    expect(ends.lowMarginV).toBeCloseTo(0.7425 - 0.01, 9);
    expect(ends.highMarginV).toBeCloseTo(2.5 - 1.7575, 9);
    // The +Imax end is the candidate's own outputAtMaxWorstV: one figure, two places. Its ideal
    // output rides on the zero level too: 1.25 V + 0.5 V = 1.75 V, leaving 2.5 − 1.75 = 0.75 V of headroom.
    const d = evaluateCandidate(r, choice);
    expect(ends.highWorstV).toBeCloseTo(d.outputAtMaxWorstV, 12);
    expect(d.outputAtMaxV).toBeCloseTo(1.75, 12);
    expect(d.headroomV).toBeCloseTo(0.75, 12);
    // The negative end's drop and heat (Ohm's and Joule's laws): 10 A × 1 mΩ = 10 mV, (10 A)² × 1 mΩ = 100 mW.
    expect(ends.lowBurdenV).toBeCloseTo(0.01, 12);
    expect(ends.lowDissipationW).toBeCloseTo(0.1, 12);
  });

  it("−20 A to +5 A about 1.5 V: the negative end carries four times the swing and clips below the floor at 0.5 V", () => {
    const at = (zero: string) =>
      signedOutputEnds(
        req({
          ...pack,
          current: { min: "-20 A", max: "5 A" },
          amplifier: { ...ideal, reference: { ...ideal.reference, voltage: zero } },
        }),
        choice,
      )!;
    const e = at("1.5 V");
    // 1.5 V − 20 A × 1 mΩ × 1.01 × 50 − 0.2 % × 1.5 V = 1.5 − 1.01 − 0.003 = 0.487 V.
    expect(e.lowCurrentA).toBe(-20);
    expect(e.lowWorstV).toBeCloseTo(0.487, 9);
    // 1.5 V + 5 A × 1 mΩ × 1.01 × 50 + 0.003 V = 1.7555 V.
    expect(e.highWorstV).toBeCloseTo(1.7555, 9);
    // With the zero level at 1 V the negative end would need 1 − 1.01 − 0.002 = −12 mV, below the 10 mV floor.
    const low = at("1 V");
    expect(low.lowWorstV).toBeCloseTo(1 - 1.01 - 0.002, 9);
    expect(low.lowMarginV).toBeLessThan(0);
  });

  it("gives nothing for a one-way span", () => {
    expect(signedOutputEnds(req({ ...pack, current: { min: "1 A", max: "10 A" } }), choice)).toBeNull();
  });
});

describe("a signed span heats and drops most in its larger direction", () => {
  it("−30 A / +10 A through 1 mΩ: 30² × 1 mΩ = 0.9 W and 30 mV, not the +10 A end's 0.1 W and 10 mV", () => {
    // P = I²·R and V = I·R (Joule's and Ohm's laws) at the larger magnitude, |−30 A|.
    const r = req({ ...pack, current: { min: "-30 A", max: "10 A" }, drop: { max: "50 mV" } });
    const d = evaluateCandidate(r, choice);
    expect(d.dissipationW).toBeCloseTo(0.9, 12);
    expect(d.burdenV).toBeCloseTo(0.03, 12);
    // The hot spot is the hottest ambient plus that dissipation's rise.
    expect(d.hotSpotC - d.selfHeatingK).toBeCloseTo(r.temperature.max, 9);
  });
});
