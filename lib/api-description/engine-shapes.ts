// The engine's answers as the API sends them (JSON, SI units with the unit in the field name), as
// zod schemas: responses.ts builds the route bodies from them, the OpenAPI document is generated
// from them, and engine-shapes.test.ts checks that each one is exactly its engine type.
import { z } from "zod";
import { budgetSourceLabels, type BudgetSource } from "@/lib/design/error-budget";
import { rejectReasons } from "@/lib/design/pair";
import { topologies } from "@/lib/design/requirement";

const reason = z.enum(rejectReasons);
/** The error budget's terms (error-budget.ts `BudgetSource`), listed by its table of labels. */
export const budgetSource = z.enum(Object.keys(budgetSourceLabels) as [BudgetSource, ...BudgetSource[]]);
const perReason = z.object(
  Object.fromEntries(rejectReasons.map((r) => [r, z.number()])) as Record<(typeof rejectReasons)[number], z.ZodNumber>,
);

export const choiceShape = z.object({ shuntOhms: z.number(), gain: z.number() });

/** One pair of the sweep (types.ts `Candidate`). */
export const candidateShape = z.object({
  shuntOhms: z.number(),
  gain: z.number(),
  transimpedanceVPerA: z.number(),
  burdenV: z.number(),
  operatingCurrentA: z.number().describe("current through the shunt at full load, A"),
  dissipationW: z.number(),
  ratingW: z.number(),
  outputAtMaxV: z.number(),
  outputAtMaxWorstV: z.number(),
  lsbA: z.number(),
  resolvableStepA: z.number(),
  deadZoneA: z.number(),
  offsetErrorA: z.number(),
  errorAtMinPercent: z.number(),
  feasible: z.boolean(),
  pareto: z.boolean(),
  reasons: z.array(reason),
});

/** A saved design's figures (types.ts `CandidateDetail`). */
export const candidateDetailShape = candidateShape.extend({
  loadVoltageV: z.number(),
  selfHeatingK: z.number(),
  bandwidthHz: z.number(),
  countsAtMin: z.number(),
  hotSpotC: z.number(),
  noiseA: z.number(),
  headroomV: z.number(),
  errorAtTypicalPercent: z.number().nullable(),
  errorAtMaxPercent: z.number(),
  rssAtMinPercent: z.number(),
  accuracyBandPercent: z.number(),
  lowestAccurateCurrentA: z.number().nullable(),
  inputFilterCornerHz: z.number().nullable(),
  traceLengthM: z.number().nullable(),
  thermalEmfV: z.number(),
});

/** A range plan's choice as saved (plan-choice.ts `PlanChoice`, API.md v2 "Designs"). */
export const planChoiceShape = z.object({
  ranges: z.array(z.object({ minA: z.number(), maxA: z.number(), shuntOhms: z.number(), gain: z.number() })),
  switchPoints: z.array(z.object({ upA: z.number(), downA: z.number() })),
});

/** range-plan.ts `RangePlan`. */
export const rangePlanShape = z.object({
  ranges: z.array(
    z.object({
      minA: z.number(),
      maxA: z.number(),
      shuntOhms: z.number(),
      gain: z.number(),
      burdenAtTopV: z.number(),
      switchOhms: z.number(),
      worstBurdenV: z.number(),
      faultCurrentA: z.number(),
      faultDissipationW: z.number(),
      ratingW: z.number(),
      countsAtBottom: z.number(),
      settlingS: z.number(),
    }),
  ),
  switchPoints: z.array(z.object({ upA: z.number(), downA: z.number() })),
  switchOver: z.string(),
  adds: z.string(),
  protection: z.string(),
});

/** diagnosis.ts `Diagnosis`: present when no pair is feasible. */
export const diagnosisShape = z.object({
  failing: perReason,
  closest: z.array(candidateShape.extend({ violations: z.partialRecord(reason, z.number()) })),
  relax: z.array(
    z.object({
      field: z.string(),
      from: z.number(),
      to: z.number(),
      feasibleCount: z.number(),
      gives: z.enum(["pairs", "rangePlan"]),
      rangeCount: z.number(),
      says: z.string(),
    }),
  ),
  rangePlan: z.string().nullable(),
});

const group = <T extends z.ZodRawShape>(shape: T) => z.object(shape).loose();

/**
 * The normalized requirement (requirement.ts `Requirement`): SI numbers, every default filled in.
 * Its groups are open, as optional fields of a group appear only when given.
 */
export const requirementShape = z
  .object({
    current: group({ min: z.number(), max: z.number() }),
    supply: group({ voltage: z.number(), side: z.enum(["low", "high"]) }),
    drop: group({ max: z.number() }),
    load: group({ model: z.string() }),
    readout: group({ kind: z.string() }),
    resolution: group({}),
    accuracy: group({ percent: z.number(), bandMin: z.number(), bandMax: z.number(), crestFactor: z.number() }),
    temperature: group({ min: z.number(), max: z.number() }),
    bandwidth: group({}),
    shunt: group({ series: z.string(), min: z.number(), max: z.number(), ratings: z.array(z.number()) }),
    amplifier: group({
      gains: z.array(z.number()),
      topology: z.enum(topologies),
      commonMode: z.object({ min: z.number(), max: z.number() }),
    }),
    rangeSwitch: group({ onResistance: z.number() }),
    limit: z.number(),
  })
  .loose();

/** solve.ts `SolveResult`. */
export const solveShape = z.object({
  requirement: requirementShape,
  evaluated: z.number(),
  feasibleCount: z.number(),
  rejected: perReason,
  candidates: z.array(candidateShape),
  rangePlan: rangePlanShape.nullable(),
  diagnosis: diagnosisShape.optional(),
  ranking: z.string(),
  decadeScales: z.array(candidateShape.extend({ scale: z.string() })),
  readoutFigures: z.array(
    z.object({
      field: z.string(),
      name: z.string(),
      value: z.number(),
      unit: z.enum(["ratio", "1/K", "LSB", "counts"]),
      stated: z.boolean(),
    }),
  ),
});

/** insertion.ts `InsertionResult`. */
export const insertionShape = z.object({
  currentA: z.number(),
  loadVoltageV: z.number(),
  burdenV: z.number(),
  currentChangePercent: z.number(),
  powerInSeriesW: z.number(),
});

/** bench-check.ts `BenchCheckRow`. */
export const benchCheckRowShape = z.object({
  label: z.string(),
  currentA: z.number(),
  expectedV: z.number(),
  minV: z.number(),
  maxV: z.number(),
});

/** profile.ts `ProfileSummary` (a plan design's adds per-range figures: API.md v2). */
export const profileSummaryShape = z.object({
  samples: z.number(),
  durationS: z.number(),
  chargeC: z.number(),
  chargeInC: z.number(),
  chargeOutC: z.number(),
  averageCurrentA: z.number(),
  peakCurrentA: z.number(),
  maxBurdenV: z.number(),
  minLoadVoltageV: z.number(),
  clippedPercent: z.number(),
  belowResolutionPercent: z.number(),
  clipCurrentA: z.number(),
  lsbA: z.number(),
});

/** profile.ts `ProfileDesign`. */
export const profileDesignShape = z.object({
  shuntOhms: z.number(),
  gain: z.number(),
  supplyV: z.number(),
  fullScaleV: z.number(),
  lsbA: z.number(),
  zeroLevelV: z.number().optional(),
});
