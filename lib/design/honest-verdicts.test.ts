// The cases of issue 11 ("Honest verdicts"): pairs the earlier model called feasible that would
// fail on the bench. Every expected value is worked out by hand here or comes from a named
// published formula; the engine must agree and must refuse each pair for the right reason.
import { describe, expect, it } from "vitest";
import { benchCheck } from "./bench-check";
import { readoutOwnSources } from "./budget-readout-signed";
import { evaluateCandidate } from "./candidate";
import { errorAt } from "./error-budget";
import { BOLTZMANN, buildModel, derateAt } from "./model";
import { monteCarlo } from "./monte-carlo";
import { solve } from "./solve";
import { req } from "./test-helpers";

const rel = (actual: number, expected: number, tol: number) =>
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tol * Math.abs(expected));

describe("1. common mode and topology", () => {
  // 48 V on the high side, 0.5–5 A, resistor-pair gains from E24, a 5 V amplifier.
  const base = {
    current: { min: "0.5 A", max: "5 A" },
    supply: { voltage: "48 V", side: "high" as const },
    readout: { kind: "adc" as const, bits: 12, fullScale: "2.5 V" },
  };

  it("a resistor-pair gain is a non-inverting stage: every pair on the 48 V high side is refused for common mode", () => {
    const r = req({ ...base, amplifier: { gains: { series: "E24", min: 2, max: 1000 } } });
    expect(r.amplifier.topology).toBe("non-inverting");
    const s = solve(r);
    expect(s.feasibleCount).toBe(0);
    // Pairs whose drop is already too large count under drop (first failure); all others under commonMode.
    expect(s.rejected.commonMode + s.rejected.drop).toBe(s.evaluated);
    expect(s.rejected.commonMode).toBeGreaterThan(0);
    // The pair the earlier model put on top (10.2 mΩ × 49, 0.94 %) now says why it cannot work.
    expect(evaluateCandidate(r, { shuntOhms: 0.0102, gain: 49 }).reasons).toContain("commonMode");
  });

  it("the same stage on the low side sees 0 V to the drop and passes the common-mode check", () => {
    const r = req({ ...base, supply: { voltage: "48 V", side: "low" }, amplifier: { gains: [49] } });
    // A fixed list without a resistor set: an integrated current-sense part (−0.3…26 V, from memory).
    expect(r.amplifier.topology).toBe("current-sense");
    expect(evaluateCandidate(r, { shuntOhms: 0.0102, gain: 49 }).reasons).not.toContain("commonMode");
  });

  it("an integrated current-sense part rated to 26 V (the default, from memory) is refused at 48 V", () => {
    const r = req({ ...base, amplifier: { gains: [50] } });
    expect(r.amplifier.commonMode).toEqual({ min: -0.3, max: 26 });
    expect(evaluateCandidate(r, { shuntOhms: 0.01, gain: 50 }).reasons).toContain("commonMode");
    const rated = req({ ...base, amplifier: { gains: [50], commonMode: { min: "0 V", max: "80 V" } } });
    expect(evaluateCandidate(rated, { shuntOhms: 0.01, gain: 50 }).reasons).not.toContain("commonMode");
  });

  it("difference stage: CMRR from resistor matching is (1 + G)/(4·tol), about 82 dB for 0.1 % at G = 49", () => {
    // Standard op-amp circuit analysis. With R1 = Rg(1+t), R2 = Rf(1−t), R3 = Rg(1−t), R4 = Rf(1+t)
    // (the worst pattern), the common-mode gain is Acm = (R1·R4 − R2·R3)/(R1·(R3 + R4))
    // = 4t·Rf·Rg/(Rg(1+t)·(Rg(1−t) + Rf(1+t))) ≈ 4t·G/(1 + G); referred to the input (÷G),
    // 4t/(1 + G), so CMRR = (1 + G)/(4t).
    const t = 0.001;
    const G = 49;
    const exact = (() => {
      const Rg = 1;
      const Rf = G;
      const [R1, R2, R3, R4] = [Rg * (1 + t), Rf * (1 - t), Rg * (1 - t), Rf * (1 + t)];
      return (R1 * R4 - R2 * R3) / (R1 * (R3 + R4)) / G;
    })();
    rel(exact, (4 * t) / (1 + G), 2e-3); // the approximation holds to first order in t
    expect(20 * Math.log10((1 + G) / (4 * t))).toBeCloseTo(81.94, 2);
    // 48 V common mode: 48 · 4·0.001/50 = 3.84 mV, i.e. 376 mA on 10.2 mΩ.
    const r = req({
      ...base,
      amplifier: {
        topology: "difference",
        gains: [49],
        gainSet: { series: "E24", min: 49, max: 49, tolerance: "0.1 %" },
        cmrrDb: 200, // the op-amp's own CMRR out of the way: the resistors alone
        commonMode: { min: "-1 V", max: "60 V" },
      },
    });
    const cm = errorAt(r, { shuntOhms: 0.0102, gain: G }, 5).terms.find((x) => x.source === "commonMode");
    rel((cm?.errorA ?? NaN) * 0.0102, 3.84e-3, 1e-5);
    rel(cm?.errorA ?? NaN, 0.3765, 1e-3);
  });

  it("difference stage: the op-amp's own inputs see G/(1 + G) of the input; a 5 V op-amp cannot take 48 V", () => {
    const r = req({ ...base, amplifier: { topology: "difference", gains: { series: "E24", min: 10, max: 100 } } });
    // Default for a rail-to-rail op-amp (from memory): −0.1 V to supply + 0.1 V.
    expect(r.amplifier.commonMode).toEqual({ min: -0.1, max: 5.1 });
    // Difference gains are Rf/Rg: 10 = 10k/1k is in the set, as is 47 = 4.7k/100 (E24 ratios).
    expect(r.amplifier.gains).toContain(10);
    expect(r.amplifier.gains).toContain(47);
    const d = evaluateCandidate(r, { shuntOhms: 0.0102, gain: 47 });
    expect(d.reasons).toContain("commonMode"); // 48 · 47/48 = 47 V ≫ 5.1 V
  });
});

describe("2. gain-setting resistor tolerance", () => {
  const r = (amplifier: object) =>
    req({ current: { min: "10 mA", max: "1 A" }, supply: { voltage: "5 V" }, drop: { max: "100 mV" }, amplifier });
  const term = (rq: ReturnType<typeof r>, G: number) =>
    (errorAt(rq, { shuntOhms: 0.05, gain: G }, 1).terms.find((x) => x.source === "gainSetResistors")?.errorA ?? NaN) /
    1;

  it("non-inverting G = 1 + Rf/Rg with 1 % resistors at G = 49 is ±1.96 % (2·tol·(G − 1)/G)", () => {
    // dG/G = (G − 1)/G · (dRf/Rf − dRg/Rg), each ±tol: 2·0.01·48/49 = 0.019592 (any analogue textbook).
    const rq = r({ gains: { series: "E24", min: 49, max: 49, tolerance: "1 %" } });
    expect(rq.amplifier.gains).toEqual([49]);
    rel(term(rq, 49), (2 * 0.01 * 48) / 49, 1e-12);
    // The budget's worst case now includes it on top of the amplifier's own 0.1 %.
    expect(errorAt(rq, { shuntOhms: 0.05, gain: 49 }, 1).worstPercent).toBeGreaterThan(1.96 + 0.1);
  });
  it("a difference stage G = Rf/Rg is ±2·tol; an instrumentation amplifier's one resistor tol·(G − 1)/G", () => {
    rel(
      term(r({ topology: "difference", gains: { series: "E24", min: 47, max: 47, tolerance: "1 %" } }), 47),
      0.02,
      1e-12,
    );
    rel(
      term(r({ topology: "instrumentation", gains: { series: "E24", min: 49, max: 49, tolerance: "1 %" } }), 49),
      (0.01 * 48) / 49,
      1e-12,
    );
  });
  it("fixed gains of an integrated part add nothing", () => {
    expect(term(r({ gains: [50] }), 50)).toBe(0);
  });
});

describe("3. output and dead zone with the errors included; bench-check bands inside the readout", () => {
  it("a pair whose ideal output sits exactly at full scale is refused: every positive error would clip", () => {
    const r = req({
      current: { min: "5 mA", max: "1 A" },
      supply: { voltage: "5 V" },
      drop: { max: "100 mV" },
      readout: { kind: "adc", bits: 16, fullScale: "2.5 V" },
      amplifier: { gains: [50] },
    });
    const d = evaluateCandidate(r, { shuntOhms: 0.05, gain: 50 });
    expect(d.outputAtMaxV).toBeCloseTo(2.5, 12); // 1 A · 50 mΩ · 50
    // Worst output: (I + every error but the readout's half step and its own error, which act on
    // the reading, not on the output voltage)·R·G, by hand from the budget.
    const b = errorAt(r, { shuntOhms: 0.05, gain: 50 }, 1);
    const ofReading = b.terms
      .filter((x) => x.source === "readout" || readoutOwnSources.includes(x.source))
      .reduce((s, x) => s + x.errorA, 0);
    rel(d.outputAtMaxWorstV, (1 + b.worstA - ofReading) * 2.5, 1e-12);
    expect(d.outputAtMaxWorstV).toBeGreaterThan(2.5);
    expect(d.reasons).toContain("output");
  });

  it("dead zone includes the offset: 20 mΩ, G = 25, Vos = 200 µV reads nothing below 30.2 mA, not 20 mA", () => {
    const r = req({
      current: { min: "25 mA", max: "1 A" },
      supply: { voltage: "5 V" },
      drop: { max: "100 mV" },
      amplifier: { gains: [25], offset: "200 uV" },
    });
    const d = evaluateCandidate(r, { shuntOhms: 0.02, gain: 25 });
    // 10 mV floor / (20 mΩ · 25) = 20 mA; (200 µV + 0.1 µV/K · 45 K)/20 mΩ = 10.225 mA; + 20 nA bias.
    rel(d.deadZoneA, 0.02 + 0.010225 + 20e-9, 1e-12);
    expect(d.reasons).toContain("deadZone");
    // The engine's own Monte Carlo agrees: at 25 mA some built units read the floor (20 mA, −20 %).
    const mc = monteCarlo(r, { shuntOhms: 0.02, gain: 25 }, { currentsA: [0.025], draws: 2000 });
    expect(mc.rows[0]?.min ?? 0).toBeLessThan(-15);
  });

  it("bench-check bands stay between the amplifier's lowest output and what the readout can show", () => {
    const r = req({
      current: { min: "5 mA", max: "1 A" },
      supply: { voltage: "5 V" },
      drop: { max: "100 mV" },
      readout: { kind: "adc", bits: 12, fullScale: "3.3 V" },
      amplifier: { gains: [65] },
    });
    const rows = benchCheck(r, { shuntOhms: 0.0505, gain: 65 }); // 3.28 V at 1 A
    const top = rows.at(-1);
    expect(top?.expectedV).toBeCloseTo(3.28, 2);
    expect(top?.maxV).toBeLessThanOrEqual(3.3); // not 3.31 V
    for (const row of rows) expect(row.minV).toBeGreaterThanOrEqual(r.amplifier.swingLow);
  });
});

describe("4. loads that are not constant-current", () => {
  it("a 3.3 V, 1 A constant-power load through 0.33 Ω draws 1.127 A; at G = 7.5 the output is 2.789 V, over 2.5 V", () => {
    const r = req({
      current: { min: "10 mA", max: "1 A" },
      supply: { voltage: "3.3 V" },
      drop: { max: "400 mV" },
      load: { model: "constant-power" },
      readout: { kind: "adc", bits: 12, fullScale: "2.5 V" },
      amplifier: { gains: [7.5] },
    });
    // P = 3.3 W; V_load = (V + √(V² − 4PR))/2 = (3.3 + √(10.89 − 4.356))/2 = 2.92809 V; I = P/V_load.
    const vLoad = (3.3 + Math.sqrt(3.3 * 3.3 - 4 * 3.3 * 0.33)) / 2;
    const d = evaluateCandidate(r, { shuntOhms: 0.33, gain: 7.5 });
    rel(d.operatingCurrentA, 3.3 / vLoad, 1e-12);
    expect(d.operatingCurrentA).toBeCloseTo(1.127, 3);
    expect(d.outputAtMaxV).toBeCloseTo(2.789, 3);
    rel(d.dissipationW, (3.3 / vLoad) ** 2 * 0.33, 1e-12); // Joule at the real current
    expect(d.burdenV).toBeCloseTo(0.33, 12); // the API's definition stays Imax·R
    expect(d.reasons).toContain("output");
  });
  it("a resistive load draws less: V/(V/Imax + R)", () => {
    const r = req({
      current: { min: "10 mA", max: "1 A" },
      supply: { voltage: "3.3 V" },
      drop: { max: "400 mV" },
      load: { model: "resistive" },
    });
    rel(evaluateCandidate(r, { shuntOhms: 0.33, gain: 5 }).operatingCurrentA, 3.3 / 3.63, 1e-12);
  });
});

describe("5. ambient derating", () => {
  it("the derating line: full power to the knee, straight down to none at the maximum (resistor derating curve)", () => {
    expect(derateAt(25, 70, 155)).toBe(1);
    expect(derateAt(70, 70, 155)).toBe(1);
    expect(derateAt(112.5, 70, 155)).toBeCloseTo(0.5, 12); // half way down the line
    expect(derateAt(125, 70, 155)).toBeCloseTo(30 / 85, 12);
    expect(derateAt(155, 70, 155)).toBe(0);
    expect(derateAt(170, 70, 155)).toBe(0);
  });
  const hot = (ratings: string[]) =>
    req({
      current: { min: "10 mA", max: "1 A" },
      supply: { voltage: "12 V" },
      drop: { max: "200 mV" },
      temperature: { min: "0 degC", max: "125 degC" },
      shunt: { ratings },
      amplifier: { gains: [20] },
    });
  it("0.1 Ω at 1 A on a 0.25 W part at 125 °C is refused: a 159 °C hot spot, and 0.1 W needs 0.57 W of rating", () => {
    const d = evaluateCandidate(hot(["0.25 W"]), { shuntOhms: 0.1, gain: 20 });
    // θ = 85 K / 0.25 W = 340 K/W; 125 °C + 0.1 W · 340 K/W = 159 °C > 155 °C.
    expect(d.hotSpotC).toBeCloseTo(159, 9);
    expect(d.reasons).toContain("power");
  });
  it("with a 1 W part on offer it is chosen: 0.1 W / (0.5 · 30/85) = 0.567 W of rating needed", () => {
    const d = evaluateCandidate(hot(["0.25 W", "0.5 W", "1 W"]), { shuntOhms: 0.1, gain: 20 });
    expect(d.ratingW).toBe(1);
    expect(d.hotSpotC).toBeCloseTo(125 + 0.1 * 85, 9);
    expect(d.reasons).not.toContain("power");
  });
});

describe("6. noise against resolution", () => {
  it("24-bit ADC, 0.1 Ω, G = 20: a 74.5 nA step but 159 µA rms of noise; 10 counts at 2 µA is refused", () => {
    const r = req({
      current: { min: "2 uA", max: "1 A" },
      supply: { voltage: "5 V" },
      drop: { max: "200 mV" },
      // A fast ADC (anti-alias corner 500 kHz) leaves GBW/G = 100 kHz as the band limit, as in the review.
      readout: { kind: "adc", bits: 24, fullScale: "2.5 V", sampleRateHz: "1 MHz" },
      amplifier: { gains: [20] },
    });
    const d = evaluateCandidate(r, { shuntOhms: 0.1, gain: 20 });
    rel(d.lsbA, 2.5 / 2 ** 24 / 2, 1e-12); // 74.5 nA
    // √(en² + 4kTR) · √(π/2 · GBW/G) / R at 70 °C (Johnson–Nyquist; single-pole noise bandwidth π/2·f−3dB).
    const en = Math.sqrt(40e-9 ** 2 + 4 * BOLTZMANN * 343.15 * 0.1);
    const noise = (en * Math.sqrt((Math.PI / 2) * 1e5)) / 0.1;
    rel(d.noiseA, noise, 1e-12);
    expect(d.noiseA).toBeGreaterThan(158e-6);
    expect(d.noiseA).toBeLessThan(160e-6);
    rel(d.resolvableStepA, noise, 1e-12); // the noise, being larger, sets the step
    expect(d.countsAtMin).toBeCloseTo(2e-6 / noise, 12);
    expect(d.reasons).toContain("counts");
  });
});

describe("7. noise bandwidth from the readout", () => {
  const base = { current: { min: "1 mA", max: "100 mA" }, supply: { voltage: "5 V" }, drop: { max: "100 mV" } };
  it("an ADC's anti-alias corner is half its sample rate (1 kHz default → 500 Hz)", () => {
    const r = req(base);
    expect(r.readout).toMatchObject({ kind: "adc", sampleRateHz: 1000 });
    const d = evaluateCandidate(r, { shuntOhms: 0.5, gain: 20 });
    expect(d.bandwidthHz).toBe(500);
    const en = Math.sqrt(40e-9 ** 2 + 4 * BOLTZMANN * 343.15 * 0.5);
    rel(d.noiseA, (en * Math.sqrt((Math.PI / 2) * 500)) / 0.5, 1e-12);
  });
  it("an output filter below that corner sets it; a meter's own bandwidth does for a meter", () => {
    expect(
      evaluateCandidate(req({ ...base, amplifier: { filterHz: "100 Hz" } }), { shuntOhms: 0.5, gain: 20 }).bandwidthHz,
    ).toBe(100);
    const meter = req({ ...base, readout: { kind: "meter", fullScale: "200 mV", counts: 2000 } });
    expect(evaluateCandidate(meter, { shuntOhms: 0.5, gain: 2 }).bandwidthHz).toBe(10);
    expect(buildModel(meter).filterHz).toBe(10);
  });
});
