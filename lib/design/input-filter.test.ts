// The input filter's figures against hand calculations (Ohm's law on each leg, the first-order
// RC corner, standard op-amp circuit analysis of a difference stage).
import { describe, expect, it } from "vitest";
import { errorAt } from "./error-budget";
import {
  DIFFERENCE_RG_OHMS,
  differenceLoading,
  filterBiasErrorV,
  filterCornerHz,
  suggestInputFilter,
} from "./input-filter";
import { buildModel, noiseBandwidth, SINGLE_POLE_NBW } from "./model";
import { parseRequirement } from "./requirement";
import { suggestedFilterFor } from "./front-end";
import { req } from "./test-helpers";

const base = {
  current: { min: "100 mA", max: "10 A" },
  supply: { voltage: "12 V" },
  drop: { max: "100 mV" },
  readout: { kind: "adc", bits: 16, fullScale: "2.5 V", sampleRateHz: "10 kHz" },
  temperature: { min: "25 degC", max: "25 degC" },
} as const;

describe("the filter's bias-current error (worked case by hand)", () => {
  // 100 Ω legs of 1 % resistors, Ib = 20 nA, Ios = 2 nA:
  // Ib·2·t·R = 20 nA·2·0.01·100 Ω = 40 nV; Ios·R·(1 + t) = 2 nA·101 Ω = 202 nV; total 242 nV.
  const f = { resistance: 100, capacitance: 1e-6, tolerance: 0.01 };
  it("is Ib·2·t·R + Ios·R·(1 + t) = 242 nV", () => {
    expect(filterBiasErrorV(f, 20e-9, 2e-9)).toBeCloseTo(242e-9, 15);
  });
  it("shows in the budget as 242 nV over the shunt: 24.2 µA on 10 mΩ", () => {
    const r = req({
      ...base,
      amplifier: { biasCurrent: "20 nA", offsetCurrent: "2 nA" },
      inputFilter: { resistance: "100 ohm", capacitance: "1 uF", tolerance: "1 %" },
    });
    const t = errorAt(r, { shuntOhms: 0.01, gain: 20 }, 5).terms.find((x) => x.source === "inputFilterBias");
    expect(t?.errorA).toBeCloseTo(24.2e-6, 12);
  });
  it("takes the offset current as the bias current when none is given (the conservative reading)", () => {
    const r = req({ ...base, inputFilter: { resistance: 100, capacitance: 1e-6 } });
    const t = errorAt(r, { shuntOhms: 0.01, gain: 20 }, 5).terms.find((x) => x.source === "inputFilterBias");
    // 20 nA·2·0.01·100 + 20 nA·101 = 40 nV + 2.02 µV.
    expect((t?.errorA ?? NaN) * 0.01).toBeCloseTo(2.06e-6, 14);
  });
  it("no filter: no filter terms, and nothing else changes", () => {
    const without = errorAt(req(base), { shuntOhms: 0.01, gain: 20 }, 5);
    expect(without.terms.map((t) => t.source)).not.toContain("inputFilterBias");
    // Eleven of the front end and four of the converter's own error (typical figures, not stated).
    expect(without.terms).toHaveLength(15);
  });
});

describe("the filter's corner limits the noise bandwidth", () => {
  it("100 Ω and 1 µF: 1/(2π·100·1e-6) = 1.5915 kHz, below the ADC's 5 kHz anti-alias corner", () => {
    expect(filterCornerHz({ resistance: 100, capacitance: 1e-6, tolerance: 0 })).toBeCloseTo(1591.549, 2);
    const r = req({ ...base, inputFilter: { resistance: 100, capacitance: 1e-6 } });
    const m = buildModel(r);
    expect(noiseBandwidth(m, 20)).toBeCloseTo(SINGLE_POLE_NBW * 1591.549, 1);
    // and the legs add 4kT·2R of Johnson noise: 8 kT·100 Ω at 25 °C on top of en².
    expect(m.en2 - 40e-9 ** 2).toBeCloseTo(4 * 1.380649e-23 * 298.15 * 200, 30);
  });
});

describe("the filter in a difference stage (standard op-amp circuit analysis)", () => {
  it("10 Ω in series with Rg = 10 kΩ lowers the gain by 10/10010 = 0.0999 %", () => {
    expect(DIFFERENCE_RG_OHMS).toBe(10_000);
    expect(differenceLoading({ resistance: 10, capacitance: 1e-6, tolerance: 0.01 })).toBeCloseTo(10 / 10_010, 15);
  });
  it("adds Vcm·2·t_f·R/((Rg + R)·(1 + G)) of common-mode error: 48 V, 1 %, 10 Ω, G = 49 gives 19.18 µV", () => {
    const r = req({
      ...base,
      supply: { voltage: "48 V", side: "high" },
      amplifier: {
        topology: "difference",
        gains: [49],
        gainSet: { series: "E24", min: 49, max: 49, tolerance: "0.1 %" },
        commonMode: { min: "-1 V", max: "60 V" },
      },
      inputFilter: { resistance: 10, capacitance: 1e-6, tolerance: "1 %" },
    });
    const t = errorAt(r, { shuntOhms: 0.01, gain: 49 }, 5).terms.find((x) => x.source === "inputFilterResistors");
    const cmV = (48 * 2 * 0.01 * 10) / (10_010 * 50);
    expect(cmV).toBeCloseTo(19.18e-6, 8);
    expect(t?.errorA).toBeCloseTo(5 * (10 / 10_010) + cmV / 0.01, 12);
  });
});

describe("the wizard's suggested filter", () => {
  it("10 kHz ADC, 10 µV offset, 20 nA: corner aim 1 kHz, R = 47 Ω (Ios·R ≤ 1 µV), C = 4.7 µF (E6 at or above 3.39 µF)", () => {
    const s = suggestInputFilter({ readoutHz: 1000, bandwidthMinHz: 0, offsetV: 10e-6, offsetCurrentA: 20e-9 });
    expect(s.resistance).toBe(47);
    expect(s.capacitance).toBeCloseTo(4.7e-6, 15);
    expect(s.cornerHz).toBeLessThanOrEqual(1000);
    expect(s.cornerHz).toBeCloseTo(720.5, 0);
  });
  it("follows the requirement's readout, and never cuts the required bandwidth", () => {
    const r = req({ ...base, bandwidth: { min: "2 kHz" } });
    const s = suggestedFilterFor(r);
    expect(s.cornerHz).toBeLessThanOrEqual(4000 * (1 + 1e-9));
    expect(s.cornerHz).toBeGreaterThan(2000);
  });
});

describe("refusals name the field", () => {
  it("a capacitance given as a voltage, a negative resistor", () => {
    const bad = parseRequirement({ ...base, inputFilter: { resistance: "-5 ohm", capacitance: "3 V" } });
    expect(bad.ok).toBe(false);
    if (bad.ok) return;
    expect(bad.fieldErrors["inputFilter.capacitance"]?.[0]).toMatch(/Input filter capacitor.*voltage/);
    expect(bad.fieldErrors["inputFilter.resistance"]?.[0]).toMatch(/above zero/);
  });
  it("blank boxes mean no filter", () => {
    const r = parseRequirement({ ...base, inputFilter: { resistance: "", capacitance: " " } });
    expect(r.ok && r.requirement.inputFilter).toBe(null);
  });
});
