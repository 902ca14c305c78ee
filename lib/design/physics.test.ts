// Checks of the engine against the outside world (docs/model.md §4); each names its source.
import { boltzmann } from "mathjs";
import { describe, expect, it } from "vitest";
import { evaluateCandidate } from "./candidate";
import { errorAt } from "./error-budget";
import { resistorPairFor, resistorPairGains } from "./gains";
import { insertion } from "./insertion";
import { BOLTZMANN, buildModel, inputNoiseDensity, readoutStepV } from "./model";
import { req } from "./test-helpers";

const simple = (extra: object = {}) =>
  req({ current: { min: "1 mA", max: "100 mA" }, supply: { voltage: "5 V" }, drop: { max: "1 V" }, ...extra });

describe("Johnson–Nyquist noise, 4kTR", () => {
  it("uses CODATA's exact Boltzmann constant 1.380649e-23 J/K, which mathjs also carries", () => {
    // CODATA 2018 / SI 2019: k = 1.380649e-23 J/K exactly.
    expect(BOLTZMANN).toBe(1.380649e-23);
    expect(boltzmann.toNumber("J/K")).toBeCloseTo(1.380649e-23, 35);
  });
  it("gives about 4.07 nV/√Hz for 1 kΩ at 300 K (Johnson–Nyquist formula)", () => {
    // A noiseless amplifier at a hottest ambient of 300 K leaves only the resistor's noise.
    const m = buildModel(simple({ amplifier: { noiseDensity: 0 }, temperature: { min: "0 degC", max: "300 K" } }));
    const en = inputNoiseDensity(m, 1000);
    expect(en).toBeCloseTo(Math.sqrt(4 * boltzmann.toNumber("J/K") * 300 * 1000), 20);
    expect(en).toBeGreaterThan(4.06e-9);
    expect(en).toBeLessThan(4.08e-9);
  });
});

describe("ideal ADC quantisation: SNR = 6.02·N + 1.76 dB for a full-scale sine (ADC textbooks)", () => {
  it.each([8, 12, 16, 24])("%d bits", (bits) => {
    const r = simple({ readout: { kind: "adc", bits, fullScale: "2.5 V" } });
    const lsb = readoutStepV(r);
    const noiseRms = lsb / Math.sqrt(12); // uniform quantisation error of one step
    const sineRms = 2.5 / 2 / Math.SQRT2; // full-scale sine, peak-to-peak = full scale
    const snr = 20 * Math.log10(sineRms / noiseRms);
    // 6.02 and 1.76 are rounded constants: agree to the rounding.
    expect(Math.abs(snr - (6.02 * bits + 1.76))).toBeLessThan((0.01 * bits) / 8 + 0.01);
  });
});

describe("non-inverting amplifier gain G = 1 + Rf/Rg (any analogue electronics textbook)", () => {
  it("Rf = 47 kΩ, Rg = 10 kΩ gives 5.7; Rf = 100 kΩ, Rg = 1 kΩ gives 101", () => {
    const g = resistorPairGains({ series: "E12", min: 2, max: 200 });
    expect(g).toContain(1 + 47e3 / 10e3);
    expect(g).toContain(1 + 100e3 / 1e3);
  });
  it("the pair proposed for a swept gain gives that gain back", () => {
    for (const gain of resistorPairGains({ series: "E24", min: 2, max: 500 }).filter((_, i) => i % 37 === 0)) {
      const pair = resistorPairFor(gain, "E24");
      expect(pair).not.toBeNull();
      if (pair) expect(1 + pair.rfOhms / pair.rgOhms).toBeCloseTo(gain, 9);
    }
  });
});

describe("Ohm's and Joule's laws on round numbers", () => {
  it("1 Ω at 100 mA drops 100 mV and dissipates 10 mW", () => {
    const c = evaluateCandidate(simple({ amplifier: { gains: [1] }, shunt: { min: 1, max: 1 } }), {
      shuntOhms: 1,
      gain: 1,
    });
    expect(c.burdenV).toBeCloseTo(0.1, 12);
    expect(c.dissipationW).toBeCloseTo(0.01, 12);
  });
  it("a 1 Ω shunt reads 1 mV per mA (common practice, no source)", () => {
    const c = evaluateCandidate(simple(), { shuntOhms: 1, gain: 1 });
    expect(c.transimpedanceVPerA * 1e-3).toBeCloseTo(1e-3, 12); // volts per milliamp
  });
});

describe("at most half a resistor's power rating (common practice, no source)", () => {
  it("90 mW in 1 Ω at 300 mA needs a 0.25 W part, not a 0.125 W one", () => {
    const r = req({ current: { min: "1 mA", max: "300 mA" }, supply: { voltage: "5 V" }, drop: { max: "1 V" } });
    const c = evaluateCandidate(r, { shuntOhms: 1, gain: 1 });
    expect(c.dissipationW).toBeCloseTo(0.09, 12);
    expect(c.ratingW).toBe(0.25);
    expect(c.dissipationW).toBeLessThanOrEqual(c.ratingW / 2);
  });
});

describe("bench meter current ranges (common practice, no source)", () => {
  const cc = (supply: number, seriesOhms: number, current: number) =>
    insertion({ supply, seriesOhms, load: { model: "constant-current", current } });
  it("~0.1 Ω on the 10 A range drops about 1 V at 10 A", () => {
    expect(cc(12, 0.1, 10).burdenV).toBeCloseTo(1, 9);
  });
  it("~1.8–2 Ω on the mA range: 200 mA from a 2 V rail arrives at about 1.6 V", () => {
    for (const r of [1.8, 1.9, 2.0]) {
      const v = cc(2, r, 0.2).loadVoltageV;
      expect(v).toBeGreaterThan(1.55);
      expect(v).toBeLessThan(1.7);
    }
  });
  it("~100 Ω on the µA range drops 10 mV at 100 µA (the burden in mV/mA equals R in Ω)", () => {
    expect(cc(3, 100, 100e-6).burdenV).toBeCloseTo(0.01, 12);
  });
  it("a resistive 10 Ω load on 2 V through the mA range draws less than the 200 mA it should", () => {
    const r = insertion({ supply: 2, seriesOhms: 1.9, load: { model: "resistive", current: 0.2 } });
    expect(r.currentA).toBeCloseTo(2 / 11.9, 12);
    expect(r.currentChangePercent).toBeLessThan(-15);
  });
});

describe("error model sanity (docs/model.md §3 default model)", () => {
  it("offset-type terms dominate at small currents and gain-type terms at large ones", () => {
    const r = simple();
    const c = { shuntOhms: 1, gain: 20 };
    const share = (I: number) => {
      const e = errorAt(r, c, I);
      const gainish = e.terms.filter((t) =>
        ["gainError", "shuntTolerance", "shuntTempco", "gainDrift"].includes(t.source),
      );
      return gainish.reduce((s, t) => s + t.errorA, 0) / e.worstA;
    };
    expect(share(1e-6)).toBeLessThan(0.1);
    expect(share(0.1)).toBeGreaterThan(0.5);
  });
  it("the worst case is the sum of the terms and the RSS their root-sum-square", () => {
    const e = errorAt(simple(), { shuntOhms: 0.5, gain: 50 }, 0.01);
    const sum = e.terms.reduce((s, t) => s + t.errorA, 0);
    const rss = Math.sqrt(e.terms.reduce((s, t) => s + t.errorA ** 2, 0));
    expect(e.worstA).toBeCloseTo(sum, 15);
    expect(e.rssA).toBeCloseTo(rss, 15);
    expect(e.rssA).toBeLessThan(e.worstA);
  });
  it("high-side sensing adds Vbus·10^(−CMRR/20)/R", () => {
    const low = errorAt(simple({ supply: { voltage: 24, side: "low" } }), { shuntOhms: 0.1, gain: 20 }, 0.01);
    const high = errorAt(
      simple({ supply: { voltage: 24, side: "high" }, amplifier: { cmrrDb: 80 } }),
      { shuntOhms: 0.1, gain: 20 },
      0.01,
    );
    const cm = high.terms.find((t) => t.source === "commonMode")?.errorA ?? NaN;
    expect(cm).toBeCloseTo((24 * 1e-4) / 0.1, 12);
    expect(low.terms.find((t) => t.source === "commonMode")?.errorA).toBe(0);
  });
});
