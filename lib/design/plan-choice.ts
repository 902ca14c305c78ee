// A range plan as a designer saves it (API.md v2, "Designs"): the ranges with their pairs and the
// switch points between neighbours. The engine re-derives every figure from this; nothing else
// about a plan is trusted from the client.
import { z } from "zod";
import { MAX_RANGES } from "./range-plan";
import { quantity } from "./units";

export type PlanRangeChoice = { minA: number; maxA: number; shuntOhms: number; gain: number };
/** Between ranges k and k+1: switch up above upA, back down below downA (downA < upA). */
export type SwitchPoint = { upA: number; downA: number };
export type PlanChoice = { ranges: PlanRangeChoice[]; switchPoints: SwitchPoint[] };

const rangeChoiceSchema = z.object({
  minA: quantity("current", "Range minimum"),
  maxA: quantity("current", "Range maximum"),
  shuntOhms: quantity("resistance", "Shunt"),
  gain: z.number({ error: "Gain: expected a number" }).positive({ error: "Gain must be above zero" }),
});

const switchPointSchema = z.object({
  upA: quantity("current", "Switch up at"),
  downA: quantity("current", "Switch down at"),
});

/** Shape only; whether the plan is sound is the engine's call (evaluatePlan). */
export const planChoiceSchema = z
  .object({
    ranges: z
      .array(rangeChoiceSchema)
      .min(2, { error: "A plan has at least two ranges" })
      .max(MAX_RANGES, { error: `A plan has at most ${MAX_RANGES} ranges` }),
    switchPoints: z.array(switchPointSchema),
  })
  .refine((p) => p.switchPoints.length === p.ranges.length - 1, {
    error: "switchPoints: give one switch point between each pair of neighbouring ranges",
    path: ["switchPoints"],
  });
