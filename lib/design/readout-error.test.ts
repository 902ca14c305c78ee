// The readout's own error (issue 14, item 2) against hand calculations from the definitions a
// part's accuracy is stated in: ±(% of reading + digits) for a meter (common practice, no source),
// and a reference's tolerance plus tempco × temperature excursion for an ADC (common practice,
// no source). Each expected value is worked out by hand in the comment beside it.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { errorAt } from "./error-budget";
import { monteCarlo } from "./monte-carlo";
import { solve } from "./solve";
import { idealLoggerAdc, loggerBurstInput, req } from "./test-helpers";

const termOf = (terms: { source: string; errorA: number }[], source: string) =>
  terms.find((t) => t.source === source)?.errorA ?? NaN;

describe("a meter's ±(% of reading + digits)", () => {
  // A 2000-count meter on its 200 mV range: one count is 200 mV / 2000 = 0.1 mV.
  const meter = (accuracy?: { percentOfReading?: string; digits?: number }) =>
    req({
      current: { min: "2 uA", max: "180 uA" },
      supply: { voltage: "3.3 V" },
      drop: { max: "20 mV" },
      readout: { kind: "meter", fullScale: "200 mV", counts: 2000, ...(accuracy ? { accuracy } : {}) },
      amplifier: { gains: [10] },
    });
  // 20 µA through 100 Ω at gain 10 reads 20 µA × 100 Ω × 10 = 20 mV.
  const choice = { shuntOhms: 100, gain: 10 };
  const I = 20e-6;

  it("reading 20 mV at ±(0.5 % + 2 digits) is ±1.5 %, not the half count's ±0.25 %", () => {
    const terms = errorAt(meter({ percentOfReading: "0.5 %", digits: 2 }), choice, I).terms;
    // 0.5 % of reading + 2 × 0.1 mV / 20 mV = 0.5 % + 1 % = 1.5 %.
    const readingShare = (termOf(terms, "readoutGain") + termOf(terms, "readout")) / I;
    expect(readingShare).toBeCloseTo(0.015, 12);
    // The half-count model, an ideal meter stated as ±(0 % + 0 digits): ½ × 0.1 mV / 20 mV = 0.25 %.
    const ideal = errorAt(meter({ percentOfReading: "0 %", digits: 0 }), choice, I).terms;
    expect(termOf(ideal, "readout") / I).toBeCloseTo(0.0025, 12);
    expect(termOf(ideal, "readoutGain")).toBe(0);
  });
  it("a meter whose accuracy is not stated reads with its class's ±(0.5 % + 2 digits): 1.5 % at 20 mV", () => {
    // The class figures are from memory (a handheld meter's DC millivolt ranges; readout-error.ts).
    const terms = errorAt(meter(), choice, I).terms;
    expect((termOf(terms, "readoutGain") + termOf(terms, "readout")) / I).toBeCloseTo(0.015, 12);
    const basis = (s: string) => terms.find((t) => t.source === s)?.basis;
    expect(basis("readoutGain")).toBe("±0.5 %, typical of a handheld meter's DC millivolt ranges, not stated");
    expect(basis("readout")).toBe("±2 digits, typical of a handheld meter's DC millivolt ranges, not stated");
    // Half stated: the stated figure as stated, the other typical.
    const half = errorAt(meter({ digits: 1 }), choice, I).terms;
    expect((termOf(half, "readoutGain") + termOf(half, "readout")) / I).toBeCloseTo(0.005 + 0.005, 12);
    expect(half.find((t) => t.source === "readout")?.basis).toBe("±1 digit, stated");
  });
});

describe("a converter whose own error is not stated reads with its class's typical figures, never as ideal", () => {
  // The class figures (from memory; readout-error.ts, DEFAULTS.md): reference ±0.1 %, 20 ppm/K;
  // offset ±2 LSB; gain error ±0.05 %; INL ±1 LSB. 16 bits at 2.5 V: 1 LSB = 2.5 V / 65536.
  // Default ambient 0…70 °C: 45 K from 25 °C at the hot end (DEFAULTS.md).
  const choice = { shuntOhms: 0.05, gain: 20 };
  const rg = 0.05 * 20;
  const lsb = 2.5 / 65536;
  it("adds each class figure to the budget, worked by hand at 0.5 A", () => {
    const t = errorAt(req(adcInput), choice, 0.5).terms;
    expect(termOf(t, "readoutReference")).toBeCloseTo(0.5 * (0.001 + 20e-6 * 45), 15); // 0.95 mA
    expect(termOf(t, "readoutGain")).toBeCloseTo(0.5 * 0.0005, 15); // 0.25 mA
    expect(termOf(t, "readoutOffset")).toBeCloseTo((2 * lsb) / rg, 15); // 76.3 µA
    expect(termOf(t, "readoutInl")).toBeCloseTo(lsb / rg, 15); // 38.1 µA
    for (const x of t.filter((x) =>
      ["readoutReference", "readoutGain", "readoutOffset", "readoutInl"].includes(x.source),
    ))
      expect(x.basis).toMatch(/typical of a general-purpose converter with a series reference, not stated$/);
  });
  it("uses a stated figure as stated, 0 included, and the class figure for the rest", () => {
    const r = req({ ...adcInput, readout: { ...adcInput.readout, offsetLsb: 0, gainError: "0.2 %" } });
    const t = errorAt(r, choice, 0.5).terms;
    expect(termOf(t, "readoutOffset")).toBe(0);
    expect(termOf(t, "readoutGain")).toBeCloseTo(0.5 * 0.002, 15);
    expect(termOf(t, "readoutInl")).toBeCloseTo(lsb / rg, 15);
    expect(t.find((x) => x.source === "readoutOffset")?.basis).toBe("±0 LSB, stated");
    expect(t.find((x) => x.source === "readoutGain")?.basis).toBe("±0.2 %, stated");
  });
  it("the demo logger's burst range is feasible only with an ideal converter, which must now be stated to count", () => {
    // docs/model.md §6: 2 mA–180 mA from 3.0 V, 60 mV, 12 bits at 2.5 V, 2 % from 18 mA.
    const burst = loggerBurstInput;
    const ideal = idealLoggerAdc;
    expect(solve(req({ ...burst, readout: ideal })).feasibleCount).toBeGreaterThan(0);
    // 12 bits: 3.5 LSB of fixed error (offset, INL, half a step) where half a step was counted.
    const unstated = solve(req({ ...burst, readout: { kind: "adc", bits: 12, fullScale: "2.5 V" } }));
    expect(unstated.feasibleCount).toBe(0);
    // The sweep says what it counted: every figure typical of the class, none stated.
    expect(unstated.readoutFigures.map((f) => [f.field, f.value, f.stated])).toEqual([
      ["readout.reference.tolerance", 0.001, false],
      ["readout.reference.tempco", 20e-6, false],
      ["readout.offsetLsb", 2, false],
      ["readout.gainError", 0.0005, false],
      ["readout.inlLsb", 1, false],
    ]);
    // Zeroed once (a one-point calibration), the class's offset is out and pairs are feasible again.
    expect(
      solve(req({ ...burst, readout: { kind: "adc", bits: 12, fullScale: "2.5 V" }, calibration: "one-point" }))
        .feasibleCount,
    ).toBeGreaterThan(0);
  });
});

describe("an ADC's reference", () => {
  const adc = req({
    current: { min: "10 mA", max: "1 A" },
    supply: { voltage: "12 V" },
    drop: { max: "100 mV" },
    temperature: { min: "0 °C", max: "70 °C" }, // 45 K from 25 °C at the hot end
    readout: { kind: "adc", bits: 16, fullScale: "2.5 V", reference: { tolerance: "0.2 %", tempco: "25 ppm/K" } },
    amplifier: { gains: [20] },
  });
  it("±0.2 % with 25 ppm/K over 45 K adds 0.31 % of reading", () => {
    // 0.2 % + 25e-6/K × 45 K = 0.2 % + 0.1125 % = 0.3125 %, at any current.
    for (const I of [0.01, 0.3, 1]) {
      const t = errorAt(adc, { shuntOhms: 0.05, gain: 20 }, I).terms;
      expect(termOf(t, "readoutReference") / I).toBeCloseTo(0.003125, 12);
    }
  });
  it("offset and INL are steps at the output: (2 + 1) LSB of 2.5 V / 65536, referred to the input", () => {
    const r = req({ ...adcInput, readout: { ...adcInput.readout, offsetLsb: 2, inlLsb: 1, gainError: "0.05 %" } });
    const t = errorAt(r, { shuntOhms: 0.05, gain: 20 }, 0.5).terms;
    const lsb = 2.5 / 65536;
    expect(termOf(t, "readoutOffset")).toBeCloseTo((2 * lsb) / (0.05 * 20), 15);
    expect(termOf(t, "readoutInl")).toBeCloseTo(lsb / (0.05 * 20), 15);
    expect(termOf(t, "readoutGain")).toBeCloseTo(0.5 * 0.0005, 15);
  });
});

const adcInput = {
  current: { min: "10 mA", max: "1 A" },
  supply: { voltage: "12 V" },
  drop: { max: "100 mV" },
  readout: { kind: "adc" as const, bits: 16, fullScale: "2.5 V" },
  amplifier: { gains: [20] },
};

describe("calibration: which terms it removes, and by how much", () => {
  const full = {
    ...adcInput,
    current: { min: "-1 A", max: "1 A" },
    readout: {
      ...adcInput.readout,
      reference: { tolerance: "0.1 %", tempco: "20 ppm/K" },
      offsetLsb: 2,
      gainError: "0.05 %",
      inlLsb: 1,
    },
    amplifier: { gains: [20], reference: { voltage: "1.25 V" } },
  };
  const choice = { shuntOhms: 0.05, gain: 20 };
  const at = (calibration: "none" | "one-point" | "two-point") =>
    Object.fromEntries(errorAt(req({ ...full, calibration }), choice, 0.5).terms.map((t) => [t.source, t]));
  const none = at("none");
  const one = at("one-point");
  const two = at("two-point");

  it("one point at zero takes out the 25 °C offsets, and only those", () => {
    for (const s of ["offset", "biasCurrent", "commonMode", "readoutOffset"]) {
      expect(one[s]?.errorA).toBe(0);
      expect(one[s]?.removedA ?? 0).toBeCloseTo(none[s]?.errorA ?? NaN, 15);
    }
    // The zero level keeps its drift: 1.25 V × 25 ppm/K × 45 K of the 1.25 V × (0.2 % + 25 ppm/K × 45 K).
    const rg = 0.05 * 20;
    expect(one.zeroLevel?.errorA).toBeCloseTo((1.25 * 25e-6 * 45) / rg, 12);
    expect(none.zeroLevel?.errorA).toBeCloseTo((1.25 * (0.002 + 25e-6 * 45)) / rg, 12);
    for (const s of ["gainError", "shuntTolerance", "readoutReference", "readoutGain", "offsetDrift", "readoutInl"])
      expect(one[s]?.errorA).toBe(none[s]?.errorA);
  });
  it("two points also take out the 25 °C gain errors; drift, INL, noise and quantisation remain", () => {
    for (const s of ["gainError", "shuntTolerance", "readoutGain"]) expect(two[s]?.errorA).toBe(0);
    // The reference keeps only its drift: 0.5 A × 20 ppm/K × 45 K.
    expect(two.readoutReference?.errorA).toBeCloseTo(0.5 * 20e-6 * 45, 15);
    for (const s of ["shuntTempco", "gainDrift", "offsetDrift", "readoutInl", "noise", "readout"])
      expect(two[s]?.errorA).toBe(none[s]?.errorA);
  });
});

describe("the budget's worst case against its RSS and its terms (property)", () => {
  it("is never below the RSS nor below any single term, with the readout's and the zero level's sources", () => {
    fc.assert(
      fc.property(
        fc.record({
          top: fc.double({ min: 0.01, max: 10, noNaN: true }),
          negShare: fc.double({ min: 0, max: 2, noNaN: true }),
          meter: fc.boolean(),
          tol: fc.double({ min: 0, max: 0.01, noNaN: true }),
          lsb: fc.double({ min: 0, max: 8, noNaN: true }),
          digits: fc.integer({ min: 0, max: 20 }),
          cal: fc.constantFrom("none" as const, "one-point" as const, "two-point" as const),
          share: fc.double({ min: 0.01, max: 1, noNaN: true }),
        }),
        (p) => {
          const r = req({
            current: { min: p.negShare > 0.05 ? -p.negShare * p.top : p.top / 100, max: p.top },
            supply: { voltage: "12 V" },
            drop: { max: "200 mV" },
            readout: p.meter
              ? {
                  kind: "meter",
                  fullScale: "2 V",
                  counts: 20000,
                  accuracy: { percentOfReading: p.tol, digits: p.digits },
                }
              : {
                  kind: "adc",
                  bits: 12,
                  fullScale: "2.5 V",
                  reference: { tolerance: p.tol, tempco: "30 ppm/K" },
                  offsetLsb: p.lsb,
                  gainError: p.tol / 2,
                  inlLsb: p.lsb / 2,
                },
            calibration: p.cal,
          });
          const e = errorAt(r, { shuntOhms: 0.01, gain: 50 }, p.share * p.top * (p.negShare > 0.5 ? -1 : 1));
          expect(e.worstA).toBeGreaterThanOrEqual(e.rssA * (1 - 1e-12));
          for (const t of e.terms) expect(e.worstA).toBeGreaterThanOrEqual(Math.abs(t.errorA) * (1 - 1e-12));
        },
      ),
      { numRuns: 150 },
    );
  });
});

describe("Monte Carlo with the readout's own error", () => {
  it("every drawn unit stays inside the worst case, and the spread grows with the readout's error", () => {
    const base = {
      ...adcInput,
      amplifier: { gains: [20], noiseDensity: "1 nV/rtHz" }, // noise out of the way: the bands are hard limits
    };
    const withErr = req({
      ...base,
      readout: { ...adcInput.readout, reference: { tolerance: "1 %", tempco: "50 ppm/K" }, gainError: "0.5 %" },
    });
    // An ideal converter, stated (left out, it would read with its class's typical figures).
    const ideal = req({
      ...base,
      readout: { ...adcInput.readout, reference: { tolerance: 0, tempco: 0 }, offsetLsb: 0, gainError: 0, inlLsb: 0 },
    });
    const choice = { shuntOhms: 0.05, gain: 20 };
    const mc = monteCarlo(withErr, choice, { currentsA: [0.5], draws: 3000 });
    const row = mc.rows[0]!;
    const worst = errorAt(withErr, choice, 0.5).worstPercent;
    expect(Math.max(Math.abs(row.min), Math.abs(row.max))).toBeLessThanOrEqual(worst);
    const rowIdeal = monteCarlo(ideal, choice, { currentsA: [0.5], draws: 3000 }).rows[0]!;
    expect(row.std).toBeGreaterThan(2 * rowIdeal.std);
    // It says which figures it drew from the requirement and which from the class (not stated).
    expect(mc.readoutFigures.filter((f) => f.stated).map((f) => f.field)).toEqual([
      "readout.reference.tolerance",
      "readout.reference.tempco",
      "readout.gainError",
    ]);
    expect(mc.readoutFigures.find((f) => f.field === "readout.offsetLsb")).toMatchObject({ value: 2, stated: false });
  });
});
