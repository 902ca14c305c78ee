// What a series resistance (a meter range, a shunt) does to a load on a supply path.
import type { LoadModel } from "./requirement-options";
import type { Insertion } from "./insertion-schema";

export type { Insertion, InsertionInput } from "./insertion-schema";

export type InsertionResult = {
  currentA: number;
  loadVoltageV: number;
  burdenV: number;
  currentChangePercent: number;
  powerInSeriesW: number;
};

/** No operating point: the load cannot be powered through that resistance. */
export class InsertionError extends Error {
  constructor(
    message: string,
    readonly field: "seriesOhms" | "load.model" = "seriesOhms",
  ) {
    super(message);
    this.name = "InsertionError";
  }
}

function fmt(x: number): string {
  return String(Number(x.toPrecision(4)));
}

/** A negative current through a resistive load: a resistor cannot drive current back. */
export const RESISTIVE_BACKFLOW =
  "A resistive load cannot send current back into the supply: describe a charge or regeneration current as a constant-current or constant-power load";

/**
 * Current through the path for a load model, or an explanation of why there is none. A negative
 * current flows back from the load side: a constant current is set by its source whatever the
 * series resistance; a constant power below zero is a source delivering |P|, whose terminal sits
 * at V_load = (V + √(V² − 4·P·R))/2 > V (the same quadratic, P·R < 0 keeps it real).
 */
export function operatingCurrent(
  supplyV: number,
  seriesOhms: number,
  model: LoadModel,
  nominalA: number,
): number | string {
  const R = seriesOhms;
  if (model === "resistive") return nominalA < 0 ? RESISTIVE_BACKFLOW : supplyV / (supplyV / nominalA + R);
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
  if (typeof i === "string") throw new InsertionError(i, i === RESISTIVE_BACKFLOW ? "load.model" : "seriesOhms");
  // The drop's size either way; the load side sits below the supply, or above it when the current flows back.
  return {
    currentA: i,
    loadVoltageV: supply - i * seriesOhms,
    burdenV: Math.abs(i) * seriesOhms,
    // Of the magnitude, so "−4 %" reads as less current either way round.
    currentChangePercent: (100 * (Math.abs(i) - Math.abs(load.current))) / Math.abs(load.current),
    powerInSeriesW: i * i * seriesOhms,
  };
}

export type InsertionCurvePoint = InsertionResult & { nominalA: number };

/**
 * The insertion result across load currents (log-spaced, nominal current at full supply),
 * from `fromA` to `toA`, both of one sign; currents with no operating point are left out.
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
