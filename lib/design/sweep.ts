// The sweep's inner loop: every series value × every gain on plain numbers in typed arrays.
// No mathjs and no per-pair objects; results stay in the arrays for the front and ranking.
import { traceValues } from "./copper-trace";
import { seriesValues } from "./eseries";
import type { Model } from "./model";
import { gainFigures, rejectReasons, shuntFigures, sweepRow } from "./pair";
import type { Requirement } from "./requirement";

export type SweepArrays = {
  values: Float64Array;
  gains: Float64Array;
  /** Per pair (iR·nG + iG): bitmask of failed constraints, 0 = feasible. */
  mask: Uint8Array;
  /** Per pair: worst-case error at Imin, ratio of reading. */
  errMin: Float64Array;
  /** Per value: chosen rating (NaN: none covers it) and thermal resistance. */
  rating: Float64Array;
  theta: Float64Array;
  /** Pairs counted under their first failing constraint, in rejectReasons order. */
  rejectedCounts: Int32Array;
  feasibleCount: number;
};

/** The shunt values swept: the series between the bounds, or a copper trace's lengths on a drawing grid. */
export function sweepValues(req: Requirement): Float64Array {
  const t = req.shunt.trace;
  if (t) return Float64Array.from(traceValues(t.width, t.thickness, t.length));
  return Float64Array.from(seriesValues(req.shunt.series, req.shunt.min, req.shunt.max));
}

export function sweepGrid(m: Model, values: Float64Array, gains: Float64Array): SweepArrays {
  const nR = values.length;
  const nG = gains.length;
  const mask = new Uint8Array(nR * nG);
  const errMin = new Float64Array(nR * nG);
  const rating = new Float64Array(nR);
  const theta = new Float64Array(nR);
  const gf = gainFigures(m, gains);
  const rejectedCounts = new Int32Array(rejectReasons.length);
  let feasibleCount = 0;
  for (let i = 0; i < nR; i++) {
    const R = values[i] as number;
    const sf = shuntFigures(m, R);
    rating[i] = sf.rating;
    theta[i] = sf.theta;
    feasibleCount += sweepRow(m, R, sf, gf, mask, errMin, i * nG, rejectedCounts);
  }
  return { values, gains, mask, errMin, rating, theta, rejectedCounts, feasibleCount };
}
