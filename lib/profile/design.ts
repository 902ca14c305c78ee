// The figures of a saved design that a profile is judged against, taken from its requirement and
// the engine's metrics at that revision (the engine computed lsbA; nothing is recomputed here).
// A range plan's recording is judged through the engine's switching rule (lib/design/plan-switching.ts).
import type { DesignView, PairDesignView } from "@/lib/design-view";
import type { ProfileDesign, ProfileSummary } from "@/lib/design/profile";
import { summarizeProfile } from "@/lib/design/profile";
import {
  planProfileDesign,
  summarizePlanProfile,
  type PlanProfileDesign,
  type PlanProfileSummary,
  type RangeTrace,
} from "@/lib/design/plan-switching";

export function profileDesignOf(design: Pick<PairDesignView, "requirement" | "choice" | "metrics">): ProfileDesign {
  return {
    shuntOhms: design.choice.shuntOhms,
    gain: design.choice.gain,
    supplyV: design.requirement.supply.voltage,
    fullScaleV: design.requirement.readout.fullScale,
    lsbA: design.metrics.lsbA,
  };
}

/** A recording judged against a design of either kind: the summary, and for a plan the ranges read on. */
export type JudgedRecording =
  | { kind: "pair"; design: ProfileDesign; summary: ProfileSummary }
  | { kind: "plan"; design: PlanProfileDesign; summary: PlanProfileSummary; trace: RangeTrace };

export function judgeRecording(design: DesignView, timesS: Float64Array, currentsA: Float64Array): JudgedRecording {
  if (design.kind === "plan") {
    const d = planProfileDesign(design.requirement, design.plan);
    const { summary, trace } = summarizePlanProfile(timesS, currentsA, d);
    return { kind: "plan", design: d, summary, trace };
  }
  const d = profileDesignOf(design);
  return { kind: "pair", design: d, summary: summarizeProfile(timesS, currentsA, d) };
}
