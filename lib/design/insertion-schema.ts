// The body of /api/insertion as a zod schema, apart from the physics in ./insertion so the meter
// page draws its curves without loading zod and the unit parser up front.
import "./zod-jitless";
import { z } from "zod";
import { loadModels } from "./requirement-options";
import { quantity } from "./units";

const positiveQ = (dim: Parameters<typeof quantity>[0], label: string) =>
  quantity(dim, label).check(
    z.superRefine((v: number, ctx) => {
      if (!(v > 0)) ctx.addIssue({ code: "custom", message: `${label} must be above zero` });
    }),
  );

/** Body of /api/insertion; the load is described by its current at the full supply. */
export const insertionSchema = z.object({
  supply: positiveQ("voltage", "Supply voltage"),
  seriesOhms: quantity("resistance", "Series resistance").check(
    z.superRefine((v: number, ctx) => {
      if (!(v >= 0)) ctx.addIssue({ code: "custom", message: "Series resistance cannot be negative" });
    }),
  ),
  load: z.object({
    model: z
      .enum(loadModels, { error: `Load model: expected one of ${loadModels.join(", ")}` })
      .default("constant-current"),
    // Signed: below zero the current flows back from the load side into the supply (a charger into
    // a battery, a regenerating motor), as in a bidirectional span (API.md v2).
    current: quantity("current", "Load current").check(
      z.superRefine((v: number, ctx) => {
        if (v === 0)
          ctx.addIssue({ code: "custom", message: "Load current cannot be zero: nothing flows to insert into" });
      }),
    ),
  }),
});
export type InsertionInput = z.input<typeof insertionSchema>;
export type Insertion = z.output<typeof insertionSchema>;
