// How the shunt is built and connected (API.md v2): a resistor or a copper trace, sensed at
// four (Kelvin) or two terminals, with the thermocouples its joints make. The schema fields
// join requirement.ts's `shunt` object; the normalized values feed front-end.ts.
import { z } from "zod";
import {
  copperTempcoAt,
  defaultTraceTolerance,
  traceLayers,
  traceLengths,
  type TraceGeometry,
  type TraceLayer,
} from "./copper-trace";
import { blank, nonNegative, positive, q } from "./quantity-rules";

export const shuntKinds = ["resistor", "copper-trace"] as const;
export type ShuntKind = (typeof shuntKinds)[number];
export const shuntKindLabels: Record<ShuntKind, string> = {
  resistor: "Resistor (a standard-value part)",
  "copper-trace": "Copper trace on the board",
};

/** Pad and solder resistance of a 2-terminal part when the request gives none, Ω (from memory: a small chip resistor's pads and fillets). */
export const DEFAULT_PAD_OHMS = 0.5e-3;
/**
 * Thermal EMF of the shunt's joints when the request gives none, V/K (from memory): about 1 µV/K
 * for a precision resistor alloy against its copper terminations; 0 for a copper trace, whose
 * taps are the trace's own copper (no dissimilar metal where the sense lines leave it).
 */
export const DEFAULT_THERMAL_EMF: Record<ShuntKind, number> = { resistor: 1e-6, "copper-trace": 0 };
/**
 * Temperature difference between the shunt's two ends when the request gives none, K: 0. The
 * two joints are opposed thermocouples, so only their difference counts, and a symmetrical
 * layout keeps it near zero (common practice, no source). Give the gradient an asymmetric
 * layout makes (one end on a hot device, the other on a plane) to see its cost.
 */
export const DEFAULT_GRADIENT_K = 0;

const traceSchema = z.object(
  {
    width: q("length", "Trace width", positive("Trace width")),
    length: q("length", "Longest trace the board allows", positive("Longest trace the board allows")),
    // 35 µm: the common "1 oz" outer-layer foil (common practice, no source).
    thickness: q("length", "Copper thickness", positive("Copper thickness")).default(35e-6),
    layer: z.enum(traceLayers, { error: `Trace layer: expected one of ${traceLayers.join(", ")}` }).default("external"),
    tolerance: z.preprocess(
      (v) => (blank(v) ? undefined : v),
      q(
        "fraction",
        "Trace resistance tolerance",
        (v) => (v >= 0 && v < 0.5) || "Trace resistance tolerance must be between 0 and 50 %",
      ).optional(),
    ),
  },
  { error: "Copper trace: expected an object with width, length and thickness" },
);

/** A form's "2" and "4" arrive as text; the API's as numbers. */
const terminalsField = z.preprocess(
  (v) => (typeof v === "string" && v.trim() !== "" ? Number(v) : v),
  z.union([z.literal(4), z.literal(2)], { error: "Shunt terminals: expected 4 (Kelvin) or 2" }).default(4),
);

/** Fields spread into requirement.ts's `shunt` object. */
export const shuntConstructionFields = {
  kind: z
    .preprocess(
      (v) => (v === "" ? undefined : v),
      z.enum(shuntKinds, { error: `Shunt kind: expected one of ${shuntKinds.join(", ")}` }).default("resistor"),
    )
    .default("resistor"),
  // A form's blank width and length (a resistor chosen) mean no trace, as leaving it out does.
  trace: z.preprocess(
    (v) =>
      v === null ||
      (typeof v === "object" && blank((v as { width?: unknown }).width) && blank((v as { length?: unknown }).length))
        ? undefined
        : v,
    traceSchema.optional(),
  ),
  terminals: terminalsField,
  padResistance: z.preprocess(
    (v) => (blank(v) ? undefined : v),
    q("resistance", "Pad and solder resistance", nonNegative("Pad and solder resistance")).optional(),
  ),
  thermalEmf: z.preprocess(
    (v) => (blank(v) ? undefined : v),
    q("voltageDrift", "Thermal EMF of the shunt's joints", nonNegative("Thermal EMF")).optional(),
  ),
  gradient: z.preprocess(
    (v) => (blank(v) ? undefined : v),
    q(
      "temperatureRise",
      "Temperature difference between the shunt's ends",
      nonNegative("Temperature difference between the shunt's ends"),
    ).default(DEFAULT_GRADIENT_K),
  ),
};

type RawConstruction = {
  kind: ShuntKind;
  trace?: { width: number; length: number; thickness: number; layer: TraceLayer; tolerance?: number | undefined };
  terminals: 4 | 2;
  padResistance?: number | undefined;
  thermalEmf?: number | undefined;
  gradient: number;
};

export type NormalizedTrace = TraceGeometry & { layer: TraceLayer; tolerance: number };

/** The normalized construction: every default filled in. */
export type ShuntConstruction = {
  kind: ShuntKind;
  /** The trace's width, copper thickness, layer and tolerance; `length` is the longest the board allows. */
  trace: NormalizedTrace | null;
  terminals: 4 | 2;
  /** Pad and solder resistance in series with the sensed value, Ω (0 with four terminals). */
  padResistance: number;
  thermalEmf: number;
  gradient: number;
};

/** Cross-field rules, each on the path of the field at fault. */
export function constructionIssues(s: RawConstruction): { path: string[]; message: string }[] {
  const out: { path: string[]; message: string }[] = [];
  if (s.kind === "copper-trace" && !s.trace)
    out.push({
      path: ["shunt", "trace"],
      message: "A copper-trace shunt needs its trace: width, longest length and copper thickness",
    });
  if (s.kind === "copper-trace" && s.terminals === 2)
    out.push({
      path: ["shunt", "terminals"],
      message: "A copper-trace shunt is sensed by its own Kelvin taps: use 4 terminals",
    });
  if (s.kind === "copper-trace" && s.trace && traceLengths(s.trace.width, s.trace.length).length === 0)
    out.push({
      path: ["shunt", "trace", "length"],
      message: "Longest trace must be at least two trace widths (the taps need that much straight copper)",
    });
  return out;
}

/**
 * Fill the defaults. A copper trace's tolerance and tempco replace the resistor's: the etch and
 * plating tolerance, and copper's own tempco at 25 °C (IEC 60028), so everything downstream that
 * reads `shunt.tolerance` and `shunt.tempco` sees the copper's.
 */
export function normalizeConstruction<S extends RawConstruction & { tolerance: number; tempco: number }>(
  s: S,
): Omit<S, keyof RawConstruction> & ShuntConstruction {
  const trace: NormalizedTrace | null =
    s.kind === "copper-trace" && s.trace
      ? {
          width: s.trace.width,
          length: s.trace.length,
          thickness: s.trace.thickness,
          layer: s.trace.layer,
          tolerance: s.trace.tolerance ?? defaultTraceTolerance(s.trace.width),
        }
      : null;
  return {
    ...s,
    kind: s.kind,
    trace,
    terminals: s.terminals,
    padResistance: s.terminals === 2 ? (s.padResistance ?? DEFAULT_PAD_OHMS) : 0,
    thermalEmf: s.thermalEmf ?? DEFAULT_THERMAL_EMF[s.kind],
    gradient: s.gradient,
    ...(trace ? { tolerance: trace.tolerance, tempco: copperTempcoAt(25) } : {}),
  };
}
