// Designs for tests and the benchmark, built from the engine: the demo team's soil-moisture
// logger (its radio-burst range, low side) and its pump controller (high side, 24 V, 6 A), each
// with its converter's own error and calibration as the demo states them (db/seed/designs.ts).
import {
  evaluateCandidate,
  parseRequirement,
  solve,
  type Choice,
  type PlanChoice,
  type Requirement,
  type RequirementInput,
} from "@/lib/design";
import { planChoiceOf } from "@/lib/design/range-candidates";
import { demoLoggerReadout, demoPumpReadout } from "@/lib/design/test-helpers";
import type { PairDesignView as DesignView } from "@/lib/design-view";
import type { DesignStatus } from "@/db/schema";

export const loggerRequirement: RequirementInput = {
  current: { min: "1 mA", max: "180 mA", typical: "45 mA" },
  supply: { voltage: "3.0 V", side: "low" },
  drop: { max: "60 mV" },
  ...demoLoggerReadout,
  resolution: { countsAtMin: 10 },
};

export const pumpRequirement: RequirementInput = {
  current: { min: "300 mA", max: "6 A", typical: "2.5 A" },
  supply: { voltage: "24 V", side: "high" },
  drop: { max: "100 mV" },
  ...demoPumpReadout,
  resolution: { countsAtMin: 10 },
  accuracy: { percent: 3 },
};

export function parsed(input: RequirementInput): Requirement {
  const r = parseRequirement(input);
  if (!r.ok) throw new Error(r.message);
  return r.requirement;
}

/** The solver's first feasible candidate (the front comes first). */
export function firstFeasible(req: Requirement): Choice {
  const c = solve(req).candidates.find((x) => x.feasible);
  if (!c) throw new Error("no feasible candidate for the fixture requirement");
  return { shuntOhms: c.shuntOhms, gain: c.gain };
}

export function fixtureView(
  input: RequirementInput,
  opts: { name?: string; status?: DesignStatus; revision?: number; choice?: Choice; project?: string | null } = {},
): DesignView {
  const requirement = parsed(input);
  const choice = opts.choice ?? firstFeasible(requirement);
  const status = opts.status ?? "draft";
  const revision = opts.revision ?? 2;
  return {
    id: "00000000-0000-4000-8000-000000000001",
    name: opts.name ?? "Soil logger, radio range",
    project: opts.project === undefined ? "Soil-moisture logger" : opts.project,
    status,
    revision,
    requirement,
    kind: "pair",
    choice,
    plan: null,
    metrics: evaluateCandidate(requirement, choice),
    authorId: "00000000-0000-4000-8000-000000000002",
    authorName: "Demo Designer",
    updatedAt: "2026-11-30T10:00:00.000Z",
    approval: status === "approved" ? { byName: "Demo Reviewer", at: "2026-11-30T15:42:00.000Z", revision } : null,
    revisions: [{ revision, authorName: "Demo Designer", createdAt: "2026-11-30T10:00:00.000Z" }],
  };
}

/**
 * The demo team's pack monitor (invented, DESIGN.md §6): a 48 V battery's discharge current on a
 * copper trace of the power board, filtered at the amplifier's inputs, read by a 16-bit ADC.
 */
export const packMonitorRequirement: RequirementInput = {
  current: { min: "1 A", max: "30 A", typical: "8 A" },
  supply: { voltage: "48 V", side: "low" },
  drop: { max: "50 mV" },
  readout: { kind: "adc", bits: 16, fullScale: "2.5 V", sampleRateHz: "1 kHz" },
  resolution: { countsAtMin: 10 },
  accuracy: { percent: 30 },
  temperature: { min: "0 degC", max: "40 degC" },
  shunt: { kind: "copper-trace", trace: { width: "10 mm", length: "40 mm", thickness: "70 um" } },
  inputFilter: { resistance: "47 ohm", capacitance: "33 uF" },
  amplifier: { gains: [20, 50, 100, 200] },
};
/** The demo logger's whole span, 3 µA asleep to 180 mA transmitting: too wide for one range. */
export const loggerPlanRequirement: RequirementInput = {
  current: { min: "3 uA", max: "180 mA" },
  supply: { voltage: "3.0 V", side: "low" },
  drop: { max: "60 mV" },
  ...demoLoggerReadout,
  resolution: { countsAtMin: 10 },
};

/** The plan the engine proposes for a requirement, in the shape a designer saves. */
export function proposedPlan(req: Requirement): PlanChoice {
  const plan = solve(req).rangePlan;
  if (!plan) throw new Error("the engine proposed no range plan for the fixture requirement");
  return planChoiceOf(plan);
}
