import { describe, expect, it } from "vitest";
import { errorAt } from "./error-budget";
import { monteCarlo, percentile } from "./monte-carlo";
import { mulberry32 } from "./prng";
import { req } from "./test-helpers";

const r = req({
  current: { min: "2 mA", max: "180 mA" },
  supply: { voltage: "3 V" },
  readout: { kind: "adc", bits: 16, fullScale: "2.5 V" },
});
const choice = { shuntOhms: 0.274, gain: 50 };

describe("mulberry32", () => {
  it("is reproducible from its seed and spreads over [0, 1)", () => {
    const a = mulberry32(42);
    const b = mulberry32(42);
    const xs = Array.from({ length: 10_000 }, () => a());
    expect(xs.slice(0, 5)).toEqual(Array.from({ length: 5 }, () => b()));
    expect(Math.min(...xs)).toBeGreaterThanOrEqual(0);
    expect(Math.max(...xs)).toBeLessThan(1);
    const mean = xs.reduce((s, x) => s + x, 0) / xs.length;
    expect(Math.abs(mean - 0.5)).toBeLessThan(0.01); // uniform mean 1/2, σ/√n ≈ 0.003
    expect(mulberry32(43)()).not.toBe(mulberry32(42)());
  });
});

describe("percentile", () => {
  it("interpolates between order statistics", () => {
    expect(percentile([1, 2, 3, 4, 5], 50)).toBe(3);
    expect(percentile([0, 10], 25)).toBe(2.5);
  });
});

describe("monteCarlo", () => {
  it("is reproducible with a seed and differs with another", () => {
    const a = monteCarlo(r, choice, { seed: 7 });
    expect(monteCarlo(r, choice, { seed: 7 })).toEqual(a);
    expect(monteCarlo(r, choice, { seed: 8 }).rows[0]?.mean).not.toBe(a.rows[0]?.mean);
    expect(a.draws).toBe(2000);
  });
  it("stays inside the worst-case budget, with ordered percentiles", () => {
    const res = monteCarlo(r, choice, { draws: 3000 });
    for (const row of res.rows) {
      expect(row.p1).toBeLessThanOrEqual(row.p5);
      expect(row.p5).toBeLessThanOrEqual(row.p50);
      expect(row.p50).toBeLessThanOrEqual(row.p95);
      expect(row.p95).toBeLessThanOrEqual(row.p99);
      // Gaussian noise can exceed the crest-factor bound on rare draws: compare the 1st/99th percentiles.
      const worst = errorAt(r, choice, row.currentA).worstPercent;
      expect(Math.max(Math.abs(row.p1), Math.abs(row.p99))).toBeLessThan(worst);
      // Uniform tolerances add up to far less than their sum most of the time.
      expect(row.std).toBeLessThan(worst / 2);
    }
  });
  it("shows the dead zone: below Vout_min/(R·G) the reading is stuck at the output floor", () => {
    const res = monteCarlo(r, choice, { currentsA: [0.5e-3], draws: 200 });
    // 10 mV floor / (0.274 Ω · 50) = 0.73 mA reads for a 0.5 mA current: about +46 %.
    expect(res.rows[0]?.p50).toBeGreaterThan(40);
  });
});
