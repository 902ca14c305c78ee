// The solver: sweep the grid, mark the Pareto front, rank, and propose ranges when no
// single pair can cover the span.
import { candidateFigures } from "./candidate";
import { buildModel, signalBandwidth, type Model } from "./model";
import { paretoFrontSorted } from "./pareto";
import { rejectReasons, type RejectReason } from "./pair";
import { compileRankExpression, type CompiledRank, type RankScope } from "./rank";
import { planRanges, type RangePlan } from "./range-plan";
import type { Requirement } from "./requirement";
import { sweepGrid, sweepValues, type SweepArrays } from "./sweep";
import type { Candidate } from "./types";

export type SolveResult = {
  requirement: Requirement;
  evaluated: number;
  feasibleCount: number;
  rejected: Record<RejectReason, number>;
  candidates: Candidate[];
  rangePlan: RangePlan | null;
  /** How the candidates after the front were ordered. */
  ranking: string;
};

export type SolveOptions = { rankExpression?: string };

export const defaultRankingText =
  "Sum of each objective as a share of its limit: errorAtMinPercent / accuracy target + burdenV / allowed drop + lsbA / (Imin / counts at Imin); lower first.";

/** The default ranking score: dimensionless, each objective measured against what the requirement allows. */
function defaultScore(m: Model, burdenV: number, lsbA: number, errMinRatio: number): number {
  return errMinRatio / m.accRatio + burdenV / m.dropMax + (lsbA * m.countsAtMin) / m.iMin;
}

function popcount(x: number): number {
  let c = 0;
  for (let v = x; v; v &= v - 1) c++;
  return c;
}

/** Indices of the k smallest scores (ties by index), ascending. */
function smallest(indices: Int32Array, scores: Float64Array, k: number): number[] {
  let pool = Array.from(indices);
  if (pool.length > k && k > 0) {
    const sorted = Float64Array.from(pool, (p) => scores[p] as number).sort();
    const threshold = sorted[k - 1] as number;
    pool = pool.filter((p) => (scores[p] as number) <= threshold);
  }
  pool.sort((a, b) => (scores[a] as number) - (scores[b] as number) || a - b);
  return pool.slice(0, Math.max(0, k));
}

function rankScope(m: Model, sw: SweepArrays, p: number, scope: RankScope): RankScope {
  const nG = sw.gains.length;
  const i = Math.floor(p / nG);
  const R = sw.values[i] as number;
  const G = sw.gains[p - i * nG] as number;
  const rg = R * G;
  const rating = sw.rating[i] as number;
  scope.shuntOhms = R;
  scope.gain = G;
  scope.transimpedanceVPerA = rg;
  scope.burdenV = m.iMax * R;
  scope.dissipationW = m.iMax * m.iMax * R;
  scope.ratingW = Number.isNaN(rating) ? (m.ratings[m.ratings.length - 1] ?? NaN) : rating;
  scope.outputAtMaxV = m.iMax * rg;
  scope.lsbA = m.lsbV / rg;
  scope.offsetErrorA = m.vosRef / R;
  scope.errorAtMinPercent = 100 * (sw.errMin[p] as number);
  scope.countsAtMin = (m.iMin * rg) / m.lsbV;
  scope.bandwidthHz = signalBandwidth(m, G);
  scope.deadZoneA = m.swingLow / rg;
  scope.headroomV = m.outCeil - m.iMax * rg;
  scope.selfHeatingK = scope.dissipationW * (sw.theta[i] as number);
  return scope;
}

function scoreAll(m: Model, sw: SweepArrays, indices: Int32Array, rank: CompiledRank | null): Float64Array {
  const nG = sw.gains.length;
  const scores = new Float64Array(sw.mask.length);
  if (rank) {
    const scope = {} as RankScope;
    for (const p of indices) scores[p] = rank.evaluate(rankScope(m, sw, p, scope));
    return scores;
  }
  for (const p of indices) {
    const i = Math.floor(p / nG);
    const R = sw.values[i] as number;
    const G = sw.gains[p - i * nG] as number;
    scores[p] = defaultScore(m, m.iMax * R, m.lsbV / (R * G), sw.errMin[p] as number);
  }
  return scores;
}

/** The front among feasible pairs, walking pairs in (burden, lsb) order: R ascending, G descending. */
export function frontOf(m: Model, sw: SweepArrays): Uint8Array {
  const nR = sw.values.length;
  const nG = sw.gains.length;
  const order = new Int32Array(sw.feasibleCount);
  const lsb = new Float64Array(nR * nG);
  let k = 0;
  for (let i = 0; i < nR; i++) {
    const R = sw.values[i] as number;
    for (let j = nG - 1; j >= 0; j--) {
      const p = i * nG + j;
      if (sw.mask[p] !== 0) continue;
      lsb[p] = m.lsbV / (R * (sw.gains[j] as number));
      order[k++] = p;
    }
  }
  return paretoFrontSorted(order, lsb, sw.errMin);
}

export function solve(req: Requirement, opts: SolveOptions = {}): SolveResult {
  // A bad expression fails before any work is done.
  const rank = opts.rankExpression !== undefined ? compileRankExpression(opts.rankExpression) : null;
  const m = buildModel(req);
  const sw = sweepGrid(m, sweepValues(req), Float64Array.from(req.amplifier.gains));
  const nPairs = sw.mask.length;
  const nG = sw.gains.length;

  const feasible = new Int32Array(sw.feasibleCount);
  let nf = 0;
  for (let p = 0; p < nPairs; p++) if (sw.mask[p] === 0) feasible[nf++] = p;
  const onFront = frontOf(m, sw);
  const scores = scoreAll(m, sw, feasible, rank);

  const front = Int32Array.from(Array.from(feasible).filter((p) => onFront[p] === 1));
  const rest = Int32Array.from(Array.from(feasible).filter((p) => onFront[p] !== 1));
  const chosen = smallest(front, scores, front.length);
  chosen.push(...smallest(rest, scores, req.limit - chosen.length));

  // Too few feasible pairs: show the nearest misses after them, fewest failed constraints first.
  if (chosen.length < req.limit && sw.feasibleCount < nPairs) {
    const failedCount = new Uint8Array(nPairs);
    for (let p = 0; p < nPairs; p++) failedCount[p] = popcount(sw.mask[p] as number);
    for (let failed = 1; failed <= rejectReasons.length && chosen.length < req.limit; failed++) {
      const group: number[] = [];
      for (let p = 0; p < nPairs; p++) if (failedCount[p] === failed) group.push(p);
      const indices = Int32Array.from(group);
      chosen.push(...smallest(indices, scoreAll(m, sw, indices, rank), req.limit - chosen.length));
    }
  }

  const candidates = chosen.map((p) => {
    const i = Math.floor(p / nG);
    const c = candidateFigures(m, sw.values[i] as number, sw.gains[p - i * nG] as number);
    c.pareto = onFront[p] === 1;
    return c;
  });

  const rejected = Object.fromEntries(rejectReasons.map((r, k) => [r, sw.rejectedCounts[k] ?? 0])) as Record<RejectReason, number>;
  return {
    requirement: req,
    evaluated: nPairs,
    feasibleCount: sw.feasibleCount,
    rejected,
    candidates,
    rangePlan: sw.feasibleCount === 0 ? planRanges(req, m, sw) : null,
    ranking: rank ? `By the expression ${rank.source}; lower first.` : defaultRankingText,
  };
}
