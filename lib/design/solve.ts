// The solver: sweep the grid, mark the Pareto front, rank, and propose ranges when no
// single pair can cover the span.
import { candidateFigures } from "./candidate";
import { decadePairs, decadeScaleLabel } from "./decade";
import {
  buildModel,
  deadZoneA,
  defaultScore,
  operatingCurrent,
  resolvableStepA,
  signalBandwidth,
  type Model,
} from "./model";
import { paretoFrontSorted } from "./pareto";
import { rejectReasons, type RejectReason } from "./pair";
import { defaultRankingText } from "./ranking-text";
import { compileRankExpression, type CompiledRank, type RankScope } from "./rank";
import { diagnose, type Diagnosis } from "./diagnosis";
import { planRanges, whyNoPlan, type RangePlan } from "./range-plan";
import type { Requirement } from "./requirement";
import { sweepGrid, sweepValues, type SweepArrays } from "./sweep";
import type { Candidate } from "./types";
import { readoutFigures, type ReadoutFigure } from "./readout-error";

export { defaultRankingText };

export type SolveResult = {
  requirement: Requirement;
  evaluated: number;
  feasibleCount: number;
  rejected: Record<RejectReason, number>;
  candidates: Candidate[];
  rangePlan: RangePlan | null;
  /** Present when no pair is feasible: what fails, the nearest pairs, and changes that work. */
  diagnosis?: Diagnosis;
  /** How the candidates after the front were ordered. */
  ranking: string;
  /** Feasible pairs with a decade scale factor (1 mV per mA, …), the best per decade. */
  decadeScales: (Candidate & { scale: string })[];
  /**
   * The readout's own error the sweep counted: each figure with `stated: false` where the request
   * leaves it out and it is typical of a class of part (readout-error.ts, from memory).
   */
  readoutFigures: ReadoutFigure[];
};

/** `diagnose: false` skips the diagnosis (its relaxations re-run the sweep many times). */
export type SolveOptions = { rankExpression?: string; diagnose?: boolean };

function popcount(x: number): number {
  let c = 0;
  for (let v = x; v; v &= v - 1) c++;
  return c;
}

/** Indices of the k smallest scores (ties by index), ascending. */
function smallest(indices: Int32Array, scores: Float64Array, k: number): number[] {
  if (k <= 0 || indices.length === 0) return [];
  let pool = indices;
  if (indices.length > k) {
    // Find the k-th smallest score with a native numeric sort, then keep only what can make the cut.
    const s = new Float64Array(indices.length);
    for (let i = 0; i < indices.length; i++) s[i] = scores[indices[i] as number] as number;
    s.sort();
    const threshold = s[k - 1] as number;
    const kept = new Int32Array(indices.length);
    let n = 0;
    for (let i = 0; i < indices.length; i++) {
      const p = indices[i] as number;
      if (!((scores[p] as number) > threshold)) kept[n++] = p;
    }
    pool = kept.subarray(0, n);
  }
  const out = Array.from(pool);
  out.sort((a, b) => (scores[a] as number) - (scores[b] as number) || a - b);
  return out.slice(0, k);
}

/** Indices p (ascending) where keep(p) holds. */
function indicesWhere(n: number, keep: (p: number) => boolean): Int32Array {
  const tmp = new Int32Array(n);
  let k = 0;
  for (let p = 0; p < n; p++) if (keep(p)) tmp[k++] = p;
  return tmp.slice(0, k);
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
  const iOpRaw = operatingCurrent(m, R);
  const iOp = Number.isNaN(iOpRaw) ? m.iMax : iOpRaw;
  scope.burdenV = m.iMax * R;
  scope.dissipationW = iOp * iOp * R;
  scope.ratingW = Number.isNaN(rating) ? (m.ratings[m.ratings.length - 1] ?? NaN) : rating;
  scope.outputAtMaxV = m.vRef + iOp * rg;
  scope.lsbA = m.lsbV / rg;
  scope.offsetErrorA = m.vosRef / R;
  scope.errorAtMinPercent = 100 * (sw.errMin[p] as number);
  scope.countsAtMin = m.iMin / resolvableStepA(m, R, G);
  scope.bandwidthHz = signalBandwidth(m, G);
  scope.deadZoneA = deadZoneA(m, R, G);
  scope.headroomV = m.outCeil - scope.outputAtMaxV;
  scope.selfHeatingK = scope.dissipationW * (sw.theta[i] as number);
  return scope;
}

/** Scores of the given pairs, written into `into` (a fresh array by default). */
function scoreAll(
  m: Model,
  sw: SweepArrays,
  indices: Int32Array,
  rank: CompiledRank | null,
  into?: Float64Array,
): Float64Array {
  const nG = sw.gains.length;
  const scores = into ?? new Float64Array(sw.mask.length);
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

  const onFront = frontOf(m, sw);
  const front = indicesWhere(nPairs, (p) => onFront[p] === 1);
  const rest = indicesWhere(nPairs, (p) => sw.mask[p] === 0 && onFront[p] !== 1);
  const scores = scoreAll(m, sw, front, rank, scoreAll(m, sw, rest, rank));
  const chosen = smallest(front, scores, front.length);
  chosen.push(...smallest(rest, scores, req.limit - chosen.length));

  // Too few feasible pairs: show the nearest misses after them, fewest failed constraints first.
  if (chosen.length < req.limit && sw.feasibleCount < nPairs) {
    const failedCount = new Uint8Array(nPairs);
    for (let p = 0; p < nPairs; p++) failedCount[p] = popcount(sw.mask[p] as number);
    for (let failed = 1; failed <= rejectReasons.length && chosen.length < req.limit; failed++) {
      const group = indicesWhere(nPairs, (p) => failedCount[p] === failed);
      chosen.push(...smallest(group, scoreAll(m, sw, group, rank), req.limit - chosen.length));
    }
  }

  const toCandidate = (p: number) => {
    const i = Math.floor(p / nG);
    const c = candidateFigures(m, sw.values[i] as number, sw.gains[p - i * nG] as number);
    c.pareto = onFront[p] === 1;
    return c;
  };
  const candidates = chosen.map(toCandidate);
  const decadeScales = decadePairs(sw, scores).map((p) => {
    const c = toCandidate(p);
    return { ...c, scale: decadeScaleLabel(c.transimpedanceVPerA) ?? "" };
  });

  const rejected = Object.fromEntries(rejectReasons.map((r, k) => [r, sw.rejectedCounts[k] ?? 0])) as Record<
    RejectReason,
    number
  >;
  // Ranges switch shunts as the current climbs one way; a signed span is not planned in ranges.
  const rangePlan = sw.feasibleCount === 0 && !m.signed ? planRanges(req, m, sw) : null;
  const result: SolveResult = {
    requirement: req,
    evaluated: nPairs,
    feasibleCount: sw.feasibleCount,
    rejected,
    candidates,
    rangePlan,
    ranking: rank ? `By the expression ${rank.source}; lower first.` : defaultRankingText,
    decadeScales,
    readoutFigures: readoutFigures(req.readout),
  };
  if (sw.feasibleCount === 0 && opts.diagnose !== false)
    result.diagnosis = diagnose(req, m, sw, rangePlan ? null : whyNoPlan(req, m, sw));
  return result;
}
