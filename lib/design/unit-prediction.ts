// What the design predicts for the units built from it, from the engine's own Monte Carlo: the
// spread of the output at each bench-check test point, the share of units that pass the sheet, and
// whether the units measured so far fall outside that spread more often than chance allows.
import { lgamma } from "mathjs";
import type { BenchCheckRow } from "./bench-check";
import { buildModel, REFERENCE_C } from "./model";
import { DEFAULT_DRAWS, DEFAULT_SEED, drawUnit, percentile, type UnitFault } from "./monte-carlo";
import { gaussian, mulberry32 } from "./prng";
import type { Requirement } from "./requirement";
import type { Choice } from "./types";

/** The central share of the predicted outputs a unit's reading is expected to fall in, per test point. */
export const SPREAD_PERCENTILES = [1, 99] as const;
/** The flag's significance level: one-sided, P(at least k of n outside | the model) below this. */
export const SPREAD_ALPHA = 0.01;

export type PredictedPoint = {
  label: string;
  currentA: number;
  expectedV: number;
  minV: number;
  maxV: number;
  p1V: number;
  p5V: number;
  p50V: number;
  p95V: number;
  p99V: number;
  /** A histogram of the predicted outputs: equal-width bins from p0.5 to p99.5 (shares of all draws). */
  histogram: { fromV: number; toV: number; share: number }[];
};

export type BenchPrediction = {
  draws: number;
  seed: number;
  /** Bench ambient, °C: units are checked on the bench, not across the operating range. */
  ambientC: number;
  points: PredictedPoint[];
  /** Share of simulated units with every reading inside the sheet's accept band. */
  yield: number;
  /** Share of simulated units with some reading outside its point's p1–p99 spread. */
  outsideSpread: number;
};

/** The requirement as it stands on the bench: ambient at the 25 °C reference. */
export function benchRequirement(req: Requirement, ambientC = REFERENCE_C): Requirement {
  return { ...req, temperature: { min: ambientC, max: ambientC } };
}

/**
 * Simulated bench readings (output volts) of `draws` units at the sheet's test currents, each unit's
 * parts drawn as in monteCarlo (uniform within tolerance, Gaussian noise, clipped and quantised).
 */
export function simulateBench(
  req: Requirement,
  choice: Choice,
  currentsA: number[],
  opts: { draws?: number; seed?: number; fault?: UnitFault; ambientC?: number } = {},
): Float64Array[] {
  const draws = Math.max(1, Math.min(200_000, Math.floor(opts.draws ?? DEFAULT_DRAWS)));
  const bench = benchRequirement(req, opts.ambientC);
  const m = buildModel(bench);
  const rnd = mulberry32(opts.seed ?? DEFAULT_SEED);
  const normal = gaussian(rnd);
  const out = currentsA.map(() => new Float64Array(draws));
  for (let d = 0; d < draws; d++) {
    const unit = drawUnit(bench, m, choice, rnd, normal, opts.fault);
    currentsA.forEach((I, k) => ((out[k] as Float64Array)[d] = unit(I)));
  }
  return out;
}

const HISTOGRAM_BINS = 24;

function histogram(sorted: Float64Array): PredictedPoint["histogram"] {
  const lo = percentile(sorted, 0.5);
  const hi = percentile(sorted, 99.5);
  if (!(hi > lo)) return [{ fromV: lo, toV: hi, share: 1 }];
  const width = (hi - lo) / HISTOGRAM_BINS;
  const counts = new Array<number>(HISTOGRAM_BINS).fill(0);
  for (const v of sorted) {
    if (v < lo || v > hi) continue;
    counts[Math.min(HISTOGRAM_BINS - 1, Math.floor((v - lo) / width))]! += 1;
  }
  return counts.map((c, i) => ({ fromV: lo + i * width, toV: lo + (i + 1) * width, share: c / sorted.length }));
}

/** The predicted spread at each test point, the predicted yield and the chance a unit leaves the spread. */
export function predictBench(
  req: Requirement,
  choice: Choice,
  bench: BenchCheckRow[],
  opts: { draws?: number; seed?: number } = {},
): BenchPrediction {
  const draws = Math.max(1, Math.min(200_000, Math.floor(opts.draws ?? DEFAULT_DRAWS)));
  const seed = opts.seed ?? DEFAULT_SEED;
  const samples = simulateBench(
    req,
    choice,
    bench.map((b) => b.currentA),
    { draws, seed },
  );
  const points = bench.map((b, k) => {
    const sorted = Float64Array.from(samples[k] as Float64Array).sort();
    return {
      label: b.label,
      currentA: b.currentA,
      expectedV: b.expectedV,
      minV: b.minV,
      maxV: b.maxV,
      p1V: percentile(sorted, 1),
      p5V: percentile(sorted, 5),
      p50V: percentile(sorted, 50),
      p95V: percentile(sorted, 95),
      p99V: percentile(sorted, 99),
      histogram: histogram(sorted),
    };
  });
  let passing = 0;
  let outside = 0;
  for (let d = 0; d < draws; d++) {
    let allIn = true;
    let anyOutside = false;
    bench.forEach((b, k) => {
      const v = (samples[k] as Float64Array)[d] as number;
      if (v < b.minV || v > b.maxV) allIn = false;
      const p = points[k]!;
      if (v < p.p1V || v > p.p99V) anyOutside = true;
    });
    if (allIn) passing++;
    if (anyOutside) outside++;
  }
  return { draws, seed, ambientC: REFERENCE_C, points, yield: passing / draws, outsideSpread: outside / draws };
}

/** Whether a reading lies outside its point's predicted p1–p99 spread. */
export function outsideSpread(point: Pick<PredictedPoint, "p1V" | "p99V">, outputV: number): boolean {
  return outputV < point.p1V || outputV > point.p99V;
}

/** P(X ≥ k) for X ~ Binomial(n, p): the exact upper tail, summed in log space. */
export function binomialUpperTail(n: number, k: number, p: number): number {
  if (k <= 0) return 1;
  if (k > n) return 0;
  if (p <= 0) return 0;
  if (p >= 1) return 1;
  const lnN = lgamma(n + 1);
  let sum = 0;
  for (let i = k; i <= n; i++) {
    sum += Math.exp(lnN - lgamma(i + 1) - lgamma(n - i + 1) + i * Math.log(p) + (n - i) * Math.log1p(-p));
  }
  return Math.min(1, sum);
}

export type SpreadCheck = {
  units: number;
  outside: number;
  /** The model's chance of one unit landing outside its spread somewhere. */
  expectedShare: number;
  /** P(at least `outside` of `units` | the model): an exact one-sided binomial test. */
  pValue: number;
  flagged: boolean;
  text: string;
};

/**
 * The flag: the units measured so far fall outside the predicted spread more often than the model
 * allows. H0: each unit independently lands outside with the simulated probability q; flagged when
 * P(X ≥ k | n, q) < SPREAD_ALPHA (one-sided exact binomial test).
 */
export function spreadCheck(units: number, outside: number, expectedShare: number, alpha = SPREAD_ALPHA): SpreadCheck {
  const pValue = binomialUpperTail(units, outside, expectedShare);
  const flagged = units > 0 && pValue < alpha;
  const share = (x: number) => `${String(Number((100 * x).toPrecision(2)))} %`;
  const text =
    units === 0
      ? "No units recorded yet."
      : flagged
        ? `${outside} of ${units} units fall outside the predicted spread; the model expects about ${share(expectedShare)} of units to, and ${outside} or more would happen by chance with probability ${pValue.toPrecision(2)}. The model or the parts data may be wrong: check the parts fitted against their datasheets and the requirement's tolerances.`
        : `${outside} of ${units} units fall outside the predicted spread, consistent with the model (it expects about ${share(expectedShare)}; p = ${pValue.toPrecision(2)}).`;
  return { units, outside, expectedShare, pValue, flagged, text };
}
