// The engine's verdict on an adjusted plan, worded for the wizard beside Save.
import { formatSI } from "@/lib/design/format";
import { rejectReasonLabels } from "@/lib/design/pair";
import type { PlanChoice } from "@/lib/design/plan-choice";
import type { RangeCandidates } from "@/lib/design/range-candidates";
import type { Requirement } from "@/lib/design/requirement";
import type { PlanVerdict } from "./plan-protocol";

export function planVerdict(_req: Requirement, plan: PlanChoice, candidates: RangeCandidates[]): PlanVerdict {
  for (const [k, c] of candidates.entries()) {
    if (c.current.feasible) continue;
    const r = plan.ranges[k]!;
    return {
      sound: false,
      path: `ranges.${k}`,
      message: `Range ${k + 1} (${formatSI(r.shuntOhms, "Ω")} × ${Number(r.gain.toPrecision(4))}) does not work on its own stretch, ${formatSI(r.minA, "A")} to ${formatSI(r.maxA, "A")}: ${c.current.reasons.map((x) => rejectReasonLabels[x].toLowerCase()).join("; ")}.`,
    };
  }
  return { sound: true };
}
