// What a series resistance (a meter range, a shunt) does to a load on a supply path.
import { z } from "zod";
import { loadModels, type LoadModel } from "./requirement";
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
    current: positiveQ("current", "Load current"),
  }),
});
export type InsertionInput = z.input<typeof insertionSchema>;
export type Insertion = z.output<typeof insertionSchema>;

export type InsertionResult = {
  currentA: number;
  loadVoltageV: number;
  burdenV: number;
  currentChangePercent: number;
  powerInSeriesW: number;
};

/** No operating point: the load cannot be powered through that resistance. */
export class InsertionError extends Error {
  readonly field = "seriesOhms";
  constructor(message: string) {
    super(message);
    this.name = "InsertionError";
  }
}

function fmt(x: number): string {
  return String(Number(x.toPrecision(4)));
}

/** Current through the path for a load model, or an explanation of why there is none. */
export function operatingCurrent(
  supplyV: number,
  seriesOhms: number,
  model: LoadModel,
  nominalA: number,
): number | string {
  const R = seriesOhms;
  if (model === "resistive") return supplyV / (supplyV / nominalA + R);
  if (model === "constant-current") {
    if (nominalA * R > supplyV)
      return `A constant-current load of ${fmt(nominalA)} A cannot be powered through ${fmt(R)} Ω from ${fmt(supplyV)} V: the resistance alone would need ${fmt(nominalA * R)} V`;
    return nominalA;
  }
  const p = supplyV * nominalA;
  const disc = supplyV * supplyV - 4 * p * R;
  if (disc < 0)
    return `A constant-power load of ${fmt(p)} W cannot be powered through ${fmt(R)} Ω from ${fmt(supplyV)} V: there is no operating point (it needs V² ≥ 4·P·R, at most ${fmt((supplyV * supplyV) / (4 * R))} W)`;
  const vLoad = (supplyV + Math.sqrt(disc)) / 2;
  return p / vLoad;
}

export function insertion(input: Insertion): InsertionResult {
  const { supply, seriesOhms, load } = input;
  const i = operatingCurrent(supply, seriesOhms, load.model, load.current);
  if (typeof i === "string") throw new InsertionError(i);
  const burdenV = i * seriesOhms;
  return {
    currentA: i,
    loadVoltageV: supply - burdenV,
    burdenV,
    currentChangePercent: (100 * (i - load.current)) / load.current,
    powerInSeriesW: i * i * seriesOhms,
  };
}

export type InsertionCurvePoint = InsertionResult & { nominalA: number };

/**
 * The insertion result across load currents (log-spaced, nominal current at full supply),
 * from `fromA` to `toA`; currents with no operating point are left out.
 */
export function insertionCurve(
  input: Insertion,
  opts: { fromA?: number; toA?: number; points?: number } = {},
): InsertionCurvePoint[] {
  const from = opts.fromA ?? input.load.current / 100;
  const to = opts.toA ?? input.load.current * 2;
  const n = Math.max(2, Math.min(1000, opts.points ?? 50));
  const out: InsertionCurvePoint[] = [];
  for (let k = 0; k < n; k++) {
    const nominalA = from * (to / from) ** (k / (n - 1));
    const i = operatingCurrent(input.supply, input.seriesOhms, input.load.model, nominalA);
    if (typeof i === "string") continue;
    out.push({ nominalA, ...insertion({ ...input, load: { ...input.load, current: nominalA } }) });
  }
  return out;
}
