// Demo designs of the invented Harbourline scenario (docs/model.md §6), each built through the design
// service so every figure comes from the engine, with the choice taken from the solver's Pareto front.
//
// Adjusted scenarios (the engine finds no single shunt and gain for the literal ones):
// - Soil-moisture logger: 3 µA to 180 mA is far wider than one range can read (the amplifier's
//   output floor alone hides everything below about 1/125 of full scale); the solver proposes a
//   three-range plan. The demo design is the radio-burst range, 2 mA to 180 mA, and says so.
// - Pump controller: 100 mA to 6 A with a 150 mV drop and a 120 dB CMRR amplifier; at 24 V common
//   mode a 100 dB part leaves too much offset at the bottom of the accuracy band.
// - Bench adapter: 2 µA to 180 µA, an amplifier whose output reaches 1 mV of ground, a 10 Hz output
//   filter (a meter reads slowly) and a 3 % target; the choice nearest 1 mV per µA is taken.
// And the logger as the whole instrument: 3 µA asleep to 180 mA transmitting, saved as the range plan
// the engine proposes for it (through the same service as POST /api/designs) and approved.
//
// Each design states its readout's own error as its designer would from the part's data (invented
// figures of an ordinary part of its class), and the calibration its bench really does:
// - the logger reads an external 2.5 V reference (±0.05 %, 10 ppm/K) into its microcontroller's
//   12-bit converter (±2 LSB offset, ±0.1 % gain error, ±1 LSB INL); its production test zeroes
//   each board with the load disconnected (a one-point calibration);
// - the pump controller's 3.3 V converter and reference (±0.1 %, 25 ppm/K; ±3 LSB, ±0.2 %,
//   ±1.5 LSB) are calibrated at the end of the line at zero and at a known 5 A (two points);
// - the bench adapter's handheld meter states ±(0.5 % of reading + 2 digits) on its 200 mV range,
//   and the adapter is zeroed with no current before each session (one point).
// Without them the engine reads each readout with its class's typical figures (DEFAULTS.md).
import { demoLoggerReadout, demoPumpReadout } from "@/lib/design/demo-converters";
import { planChoiceOf } from "@/lib/design/range-candidates";
import { parseRequirement, solve, type Candidate, type PlanChoice, type RequirementInput } from "@/lib/design";
import { saveNewDesign } from "@/lib/saved-designs/create";
import { changedFields } from "@/lib/saved-designs/diff";
import { evaluateDesign } from "@/lib/saved-designs/service";
import { changeDesignStatus, createDesign, reviseDesign } from "../queries/designs";
import { addReview } from "../queries/reviews";
import type { DemoIds } from "./team";

type DemoDesign = {
  name: string;
  project: string;
  requirement: RequirementInput;
  pick: (front: Candidate[]) => Candidate | undefined;
  revisedPick?: (front: Candidate[]) => Candidate | undefined;
  state: "draft" | "in-review" | "approved";
  /** The reviewer's words when approving (the final revision). */
  approvalNote?: string;
};

export const demoDesigns: DemoDesign[] = [
  {
    name: "Logger radio-burst range",
    project: "Soil-moisture logger",
    requirement: {
      current: { min: "2 mA", max: "180 mA" },
      supply: { voltage: "3.0 V", side: "low" },
      drop: { max: "60 mV" },
      ...demoLoggerReadout,
      resolution: { countsAtMin: 10 },
    },
    pick: (front) => front[0],
    state: "approved",
  },
  {
    name: "Pump motor current, high side",
    project: "Pump controller",
    requirement: {
      current: { min: "100 mA", max: "6 A" },
      supply: { voltage: "24 V", side: "high" },
      drop: { max: "150 mV" },
      ...demoPumpReadout,
      resolution: { countsAtMin: 10 },
      amplifier: { cmrrDb: 120 },
    },
    pick: (front) => front[0],
    // Returned once (too much drop at 6 A), revised to the front's lowest-burden pair, submitted again.
    revisedPick: (front) => [...front].sort((a, b) => a.burdenV - b.burdenV)[0],
    // Approved at revision 2 and built: twelve units recorded (db/seed/units.ts).
    state: "approved",
    approvalNote: "The drop at 6 A now leaves the motor its headroom; approved for a first batch of twelve.",
  },
  {
    name: "Meter adapter, 1 mV per µA",
    project: "Bench adapter",
    requirement: {
      current: { min: "2 uA", max: "180 uA" },
      supply: { voltage: "3.3 V", side: "low" },
      drop: { max: "20 mV" },
      readout: {
        kind: "meter",
        fullScale: "200 mV",
        counts: 2000,
        accuracy: { percentOfReading: "0.5 %", digits: 2 },
      },
      resolution: { countsAtMin: 10 },
      calibration: "one-point",
      accuracy: { percent: 3 },
      amplifier: { swingLow: "1 mV", filterHz: "10 Hz" },
    },
    pick: (front) =>
      [...front].sort(
        (a, b) => Math.abs(Math.log(a.transimpedanceVPerA / 1000)) - Math.abs(Math.log(b.transimpedanceVPerA / 1000)),
      )[0],
    state: "draft",
  },
];

/** The logger from sleep to radio burst: one instrument, several ranges. */
export const demoPlanDesign = {
  name: "Logger, sleep to radio burst",
  project: "Soil-moisture logger",
  requirement: {
    current: { min: "3 uA", max: "180 mA" },
    supply: { voltage: "3.0 V", side: "low" },
    drop: { max: "60 mV" },
    ...demoLoggerReadout,
    resolution: { countsAtMin: 10 },
  } satisfies RequirementInput,
  approvalNote:
    "Each range reads within its limits on its own span, the switch points overlap, and the comparator keeps the low ranges alive at 180 mA; approved for a first build.",
};

/** The range plan the engine proposes for a requirement, as a designer saves it. */
export function demoPlan(input: RequirementInput): PlanChoice {
  const parsed = parseRequirement(input);
  if (!parsed.ok) throw new Error(`demo plan: ${parsed.message}`);
  const plan = solve(parsed.requirement).rangePlan;
  if (!plan) throw new Error("demo plan: the engine proposed no range plan for the logger");
  return planChoiceOf(plan);
}

/** The Pareto candidate a demo design uses, or an error naming the scenario. */
export function demoChoice(d: DemoDesign, pick = d.pick) {
  const parsed = parseRequirement(d.requirement);
  if (!parsed.ok) throw new Error(`demo design "${d.name}": ${parsed.message}`);
  const front = solve(parsed.requirement).candidates.filter((c) => c.pareto && c.feasible);
  const chosen = pick(front);
  if (!chosen) throw new Error(`demo design "${d.name}": the solver found no feasible candidate`);
  return { shuntOhms: chosen.shuntOhms, gain: chosen.gain };
}

export async function seedDemoDesigns(ids: DemoIds): Promise<void> {
  const designer = ids.userIds.designer;
  // First, so it is the oldest change on the list: the single-pair demo designs stay on top.
  await seedDemoPlanDesign(ids);
  for (const d of demoDesigns) {
    const evaluated = evaluateDesign(d.requirement, demoChoice(d));
    const { id } = await createDesign({
      ...evaluated,
      teamId: ids.teamId,
      userId: designer,
      name: d.name,
      project: d.project,
    });
    if (d.state === "draft") continue;
    await submit(ids, id, d.name, 1);
    if (d.revisedPick) await returnAndRevise(ids, id, d, d.revisedPick);
    if (d.state === "approved")
      await approve(
        ids,
        id,
        d.name,
        d.revisedPick ? 2 : 1,
        d.approvalNote ??
          "Burden and error at the bottom of the burst range are within target; approved for the first build.",
      );
  }
}

/** The designer submits a revision for review. */
async function submit(ids: DemoIds, id: string, name: string, revision: number) {
  const submitted = await changeDesignStatus({
    designId: id,
    teamId: ids.teamId,
    actorId: ids.userIds.designer,
    revision,
    from: ["draft"],
    to: "in-review",
    action: "design.submitted",
  });
  if (!submitted.ok) throw new Error(`demo design "${name}": ${submitted.message}`);
}

/** The reviewer approves a revision in review. */
async function approve(ids: DemoIds, id: string, name: string, revision: number, body: string) {
  const approved = await addReview({
    designId: id,
    teamId: ids.teamId,
    actorId: ids.userIds.reviewer,
    verdict: "approve",
    body,
    revision,
  });
  if (!approved.ok) throw new Error(`demo design "${name}": ${approved.message}`);
}

/** The reviewer returns revision 1 with a reason; the designer answers, saves revision 2 and submits it. */
async function returnAndRevise(ids: DemoIds, id: string, d: DemoDesign, pick: NonNullable<DemoDesign["revisedPick"]>) {
  const { designer, reviewer } = ids.userIds;
  const returned = await addReview({
    designId: id,
    teamId: ids.teamId,
    actorId: reviewer,
    verdict: "return",
    body: "The drop at 6 A eats into the motor's headroom; take the lowest-burden pair the front offers and resubmit.",
    revision: 1,
  });
  if (!returned.ok) throw new Error(`demo design "${d.name}": ${returned.message}`);
  await addReview({
    designId: id,
    teamId: ids.teamId,
    actorId: designer,
    verdict: "comment",
    body: "Done in revision 2: smaller shunt, same gain range.",
    revision: 1,
    parentId: returned.id,
  });
  const evaluated = evaluateDesign(d.requirement, demoChoice(d, pick));
  const before = evaluateDesign(d.requirement, demoChoice(d));
  const changed = changedFields(
    { requirement: before.requirement, choice: before.choice },
    { requirement: evaluated.requirement, choice: evaluated.choice },
  );
  const revised = await reviseDesign({
    ...evaluated,
    designId: id,
    teamId: ids.teamId,
    userId: designer,
    expectedRevision: 1,
    name: d.name,
    project: d.project,
    changed,
  });
  if (!revised.ok) throw new Error(`demo design "${d.name}": ${revised.message}`);
  await submit(ids, id, d.name, 2);
}

/** The logger's range plan: saved as the API saves it, submitted, approved by the reviewer. */
async function seedDemoPlanDesign(ids: DemoIds) {
  const d = demoPlanDesign;
  const { id } = await saveNewDesign(
    { teamId: ids.teamId, userId: ids.userIds.designer },
    { name: d.name, project: d.project, requirement: d.requirement, plan: demoPlan(d.requirement) },
  );
  await submit(ids, id, d.name, 1);
  await approve(ids, id, d.name, 1, d.approvalNote);
}
