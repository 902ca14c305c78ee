// The recommended pair and why, in words: the top of the engine's ranking (lib/design/solve.ts
// ranks the front by how much of each limit a pair uses), described by those same shares.
import { defaultRankingText } from "@/lib/design/ranking-text";
import type { SolveResult } from "@/lib/design/solve";
import { formatPercent, formatSI } from "@/lib/design/format";
import type { Candidate } from "@/lib/design/types";

/** The top-ranked feasible pair of a solve, or null when none is feasible. */
export function recommendedOf(result: SolveResult | null): Candidate | null {
  const top = result?.candidates[0];
  return top && top.feasible ? top : null;
}

const share = (x: number, limit: number) => (limit > 0 ? `${Math.round((100 * x) / limit)} %` : "—");

/** Why the top pair leads, as a sentence a designer can check against the table. */
export function recommendationReason(c: Candidate, result: SolveResult): string {
  const req = result.requirement;
  const stepLimit = req.current.min / req.resolution.countsAtMin;
  return (
    `It uses the least of the three limits taken together among the pairs on the Pareto front: it drops ` +
    `${formatSI(c.burdenV, "V")} of the ${formatSI(req.drop.max, "V")} allowed (${share(c.burdenV, req.drop.max)}), ` +
    `one readout step is ${formatSI(c.lsbA, "A")} where ${formatSI(stepLimit, "A")} is needed ` +
    `(${share(c.lsbA, stepLimit)}), and its worst-case error at the smallest current, ` +
    `${formatSI(req.current.min, "A")}, is ${formatPercent(c.errorAtMinPercent / 100)} of reading ` +
    `(the ${formatPercent(req.accuracy.percent / 100)} target applies from ${formatSI(req.accuracy.bandMin, "A")} ` +
    `to ${formatSI(req.accuracy.bandMax, "A")}).`
  );
}

/** The ranking rule in words; a designer's own ranking expression is shown as written. */
export function rankingInWords(result: SolveResult): string {
  return result.ranking === defaultRankingText
    ? "Pairs on the Pareto front come first, ranked by how much of each limit they use — the error at the smallest current against the accuracy target, the drop against the allowed drop, and the readout step against the step needed — lowest total first; the best of the rest follow."
    : result.ranking;
}
