import { combinations } from "mathjs";
import { describe, expect, it } from "vitest";
import { benchCheck, type BenchCheckRow } from "./bench-check";
import { binomialUpperTail, predictBench, simulateBench, spreadCheck } from "./unit-prediction";
import { req } from "./test-helpers";

// Every error source switched off but the shunt's tolerance, so a built unit reads I·R·(1 + ε)·G with
// ε uniform on ±0.5 % (the Monte Carlo's stated distribution, DEFAULTS.md) and nothing else:
// a 24-bit readout, no offset, bias, drift, tempco or amplifier noise, 200 dB CMRR.
const onlyTolerance = req({
  current: { min: "100 mA", max: "6 A" },
  supply: { voltage: "24 V", side: "high" },
  drop: { max: "150 mV" },
  readout: { kind: "adc", bits: 24, fullScale: "3.3 V" },
  shunt: { tolerance: "0.5 %", tempco: 0 },
  amplifier: {
    cmrrDb: 200,
    offset: 0,
    offsetDrift: 0,
    gainError: 0,
    gainDrift: 0,
    biasCurrent: 0,
    noiseDensity: 0,
  },
});
const choice = { shuntOhms: 0.0147, gain: 25 };
const tz = choice.shuntOhms * choice.gain;

describe("predicted spread and yield from the seeded Monte Carlo", () => {
  const currents = [0.6, 6];
  // Hand-set bands at ±0.25 %: a unit passes when |ε| ≤ 0.25 %, so P = 0.25/0.5 = 1/2 for a uniform ε.
  const bands: BenchCheckRow[] = currents.map((I) => ({
    label: `${I} A`,
    currentA: I,
    expectedV: I * tz,
    minV: I * tz * (1 - 0.0025),
    maxV: I * tz * (1 + 0.0025),
  }));
  const p = predictBench(onlyTolerance, choice, bands, { draws: 20_000, seed: 5 });

  it("yields P(|U| ≤ a) = a/t for a uniform tolerance (here 1/2), within sampling error", () => {
    // Binomial standard error √(0.25/20000) ≈ 0.0035: 4σ is 0.014.
    expect(p.yield).toBeGreaterThan(0.5 - 0.014);
    expect(p.yield).toBeLessThan(0.5 + 0.014);
  });
  it("puts the 1st and 99th percentiles at ∓0.98·t of the expected output (uniform quantiles)", () => {
    for (const pt of p.points) {
      const e = pt.currentA * tz;
      // Quantile q of U(−t, t) is −t + 2·t·q: 1 % → −0.98 t. Sampling error of a tail quantile ≈ 0.2 %·t here.
      expect((pt.p1V / e - 1) / 0.005).toBeCloseTo(-0.98, 1);
      expect((pt.p99V / e - 1) / 0.005).toBeCloseTo(0.98, 1);
      expect((pt.p50V / e - 1) / 0.005).toBeCloseTo(0, 1);
      const total = pt.histogram.reduce((s, b) => s + b.share, 0);
      expect(total).toBeCloseTo(0.99, 2); // p0.5 to p99.5
    }
  });
  it("expects about 2 % of units outside the p1–p99 spread when one ε moves every point together", () => {
    // One shared ε: a unit is outside at every point or at none, so the share is P(outside one point) = 2 %.
    expect(p.outsideSpread).toBeGreaterThan(0.02 - 0.004);
    expect(p.outsideSpread).toBeLessThan(0.02 + 0.004);
  });
  it("is reproducible from its seed", () => {
    expect(predictBench(onlyTolerance, choice, bands, { draws: 500, seed: 9 })).toEqual(
      predictBench(onlyTolerance, choice, bands, { draws: 500, seed: 9 }),
    );
  });
  it("predicts every unit of the full model inside the sheet's worst-case bands at 25 °C", () => {
    const full = req({
      current: { min: "100 mA", max: "6 A" },
      supply: { voltage: "24 V", side: "high" },
      drop: { max: "150 mV" },
      readout: { kind: "adc", bits: 12, fullScale: "3.3 V" },
      amplifier: { cmrrDb: 120 },
    });
    const bench = benchCheck(full, choice);
    const pred = predictBench(full, choice, bench, { draws: 3000 });
    // The worst-case band sums every term at the hottest ambient: a bench unit sits well inside it.
    expect(pred.yield).toBe(1);
    for (const pt of pred.points) {
      expect(pt.p1V).toBeGreaterThanOrEqual(pt.minV);
      expect(pt.p99V).toBeLessThanOrEqual(pt.maxV);
      expect(pt.p1V).toBeLessThanOrEqual(pt.p50V);
      expect(pt.p50V).toBeLessThanOrEqual(pt.p99V);
    }
  });
  it("moves a unit built with a 2 % high shunt by 2 % (Ohm's law)", () => {
    const good = simulateBench(onlyTolerance, choice, [6], { draws: 1, seed: 3 })[0]![0]!;
    const bad = simulateBench(onlyTolerance, choice, [6], {
      draws: 1,
      seed: 3,
      fault: { shuntOhms: 0.0147 * 1.02 },
    })[0]![0]!;
    expect(bad / good).toBeCloseTo(1.02, 6);
  });
});

describe("the flag: an exact one-sided binomial test", () => {
  it("sums the binomial upper tail: P(X ≥ 2 | 12, 0.06) = 1 − 0.94¹² − 12·0.06·0.94¹¹", () => {
    const byHand = 1 - 0.94 ** 12 - 12 * 0.06 * 0.94 ** 11;
    expect(binomialUpperTail(12, 2, 0.06)).toBeCloseTo(byHand, 12);
  });
  it("agrees with the pmf summed from mathjs's binomial coefficients", () => {
    const n = 40;
    const q = 0.03;
    let tail = 0;
    for (let i = 5; i <= n; i++) tail += (combinations(n, i) as number) * q ** i * (1 - q) ** (n - i);
    expect(binomialUpperTail(n, 5, q)).toBeCloseTo(tail, 12);
    expect(binomialUpperTail(n, 0, q)).toBe(1);
    expect(binomialUpperTail(n, n + 1, q)).toBe(0);
  });
  it("does not flag two of twelve outside at 1.85 % each, and flags three", () => {
    // P(X ≥ 2) ≈ 0.020 and P(X ≥ 3) ≈ 0.0012 against α = 0.01.
    const two = spreadCheck(12, 2, 0.0185);
    expect(two.flagged).toBe(false);
    expect(two.pValue).toBeCloseTo(0.0202, 3);
    const three = spreadCheck(12, 3, 0.0185);
    expect(three.flagged).toBe(true);
    expect(three.text).toMatch(/model or the parts data may be wrong/);
    expect(spreadCheck(0, 0, 0.02).flagged).toBe(false);
  });
});
