// The readout's own error (issue 14, item 2): an ADC's reference, offset, gain error and INL,
// or a meter's ±(% of reading + digits), and what a one- or two-point calibration takes out.
// Field names are API.md v2's; the defaults are a class of part, from memory (DEFAULTS.md).
import { formatPercent } from "./format";

/** A reading's calibration before use (DEFAULTS.md, docs/model.md §3 "Calibration"). */
export const calibrations = ["none", "one-point", "two-point"] as const;
export type Calibration = (typeof calibrations)[number];

export const calibrationLabels: Record<Calibration, string> = {
  none: "None: every part as built",
  "one-point": "One point, at zero current (takes out the offsets at 25 °C)",
  "two-point": "Two points, zero and near full scale (takes out offsets and gain errors at 25 °C)",
};

/**
 * Typical figures of a class of part (from memory): an ADC fed by a general-purpose series voltage
 * reference (±0.1 %, 20 ppm/K) with ±2 LSB offset, ±0.05 % gain error (reference excluded) and
 * ±1 LSB INL; a handheld-class meter on its DC millivolt ranges, ±(0.5 % of reading + 2 digits).
 * A figure the request leaves out is read with these, never as ideal: a wrong "feasible" is the
 * worst failure of a design tool, and a real converter or meter always has its own error. A figure
 * the request states, 0 included, is used as stated (DEFAULTS.md says why).
 */
export const DEFAULT_ADC_REFERENCE = { tolerance: 0.001, tempco: 20e-6 } as const;
export const DEFAULT_ADC_OFFSET_LSB = 2;
export const DEFAULT_ADC_GAIN_ERROR = 0.0005;
export const DEFAULT_ADC_INL_LSB = 1;
export const DEFAULT_METER_ACCURACY = { percentOfReading: 0.005, digits: 2 } as const;

/** The readout as the normalized requirement holds it (only what this module reads). */
export type ReadoutWithErrors =
  | {
      kind: "adc";
      bits: number;
      fullScale: number;
      reference?: { tolerance?: number; tempco?: number };
      offsetLsb?: number;
      gainError?: number;
      inlLsb?: number;
    }
  | {
      kind: "meter";
      fullScale: number;
      counts: number;
      accuracy?: { percentOfReading?: number; digits?: number };
    };

/** The class of part whose typical figures stand in for what the request leaves out. */
export const readoutClassNames = {
  adc: "a general-purpose converter with a series reference",
  meter: "a handheld meter's DC millivolt ranges",
} as const;

/** One figure of the readout's own error, as the model reads it. */
export type ReadoutFigure = {
  /** Dotted path in the requirement (API.md v2). */
  field: string;
  name: string;
  value: number;
  unit: "ratio" | "1/K" | "LSB" | "counts";
  /** false: left out of the request, read with the class figure (DEFAULTS.md). */
  stated: boolean;
};

/** Every figure of the readout's own error, each with whether the request states it. */
export function readoutFigures(r: ReadoutWithErrors): ReadoutFigure[] {
  if (r.kind === "meter") {
    const a = r.accuracy ?? {};
    const t = DEFAULT_METER_ACCURACY;
    return [
      figure("readout.accuracy.percentOfReading", "accuracy", "ratio", a.percentOfReading, t.percentOfReading),
      figure("readout.accuracy.digits", "plus", "counts", a.digits, t.digits),
    ];
  }
  const ref = DEFAULT_ADC_REFERENCE;
  return [
    figure("readout.reference.tolerance", "reference", "ratio", r.reference?.tolerance, ref.tolerance),
    figure("readout.reference.tempco", "reference drift", "1/K", r.reference?.tempco, ref.tempco),
    figure("readout.offsetLsb", "offset", "LSB", r.offsetLsb, DEFAULT_ADC_OFFSET_LSB),
    figure("readout.gainError", "gain error", "ratio", r.gainError, DEFAULT_ADC_GAIN_ERROR),
    figure("readout.inlLsb", "INL", "LSB", r.inlLsb, DEFAULT_ADC_INL_LSB),
  ];
}

function figure(
  field: string,
  name: string,
  unit: ReadoutFigure["unit"],
  given: number | undefined,
  typical: number,
): ReadoutFigure {
  return { field, name, unit, value: given ?? typical, stated: given !== undefined };
}

/** "typical of <class>, not stated": the words for a figure the request left out. */
export function assumedBasis(kind: ReadoutWithErrors["kind"]): string {
  return `typical of ${readoutClassNames[kind]}, not stated`;
}

/** A figure as a person reads it: "±0.1 %", "20 ppm/K", "±2 LSB", "±2 digits". */
export function formatReadoutFigure(f: ReadoutFigure): string {
  if (f.unit === "ratio") return `±${formatPercent(f.value)}`;
  if (f.unit === "1/K") return `${Number((f.value * 1e6).toPrecision(3))} ppm/K`;
  if (f.unit === "LSB") return `±${Number(f.value.toPrecision(3))} LSB`;
  const n = Number(f.value.toPrecision(3));
  return `±${n} digit${n === 1 ? "" : "s"}`;
}

/**
 * The figures behind some of the readout's figures, and where they come from:
 * "±2 LSB, typical of a general-purpose converter with a series reference, not stated" or "±2 LSB, stated".
 * Figures of mixed origin name which is which.
 */
export function readoutFiguresBasis(r: ReadoutWithErrors, fields: readonly string[]): string {
  const fs = readoutFigures(r).filter((f) => fields.includes(f.field));
  const stated = fs.filter((f) => f.stated);
  const assumed = fs.filter((f) => !f.stated);
  const words = (list: ReadoutFigure[]) =>
    list.map((f) => (fs.length > 1 ? `${f.name} ${formatReadoutFigure(f)}` : formatReadoutFigure(f))).join(", ");
  const parts: string[] = [];
  if (stated.length) parts.push(`${words(stated)}, stated`);
  if (assumed.length) parts.push(`${words(assumed)}, ${assumedBasis(r.kind)}`);
  return parts.join("; ");
}

/** The figures the request leaves out, in words (empty: it states them all). */
export function assumedReadoutText(r: ReadoutWithErrors): string {
  const assumed = readoutFigures(r).filter((f) => !f.stated);
  if (!assumed.length) return "";
  return `${assumed.map((f) => `${f.name} ${formatReadoutFigure(f)}`).join(", ")}: ${assumedBasis(r.kind)} (from memory; DEFAULTS.md)`;
}

/** The same readout with the class-of-part figures in every figure it leaves out. */
export function withTypicalReadoutErrors<T extends ReadoutWithErrors>(r: T): T {
  if (r.kind === "meter") return { ...r, accuracy: { ...DEFAULT_METER_ACCURACY, ...stated(r.accuracy ?? {}) } };
  return {
    ...r,
    reference: { ...DEFAULT_ADC_REFERENCE, ...stated(r.reference ?? {}) },
    offsetLsb: r.offsetLsb ?? DEFAULT_ADC_OFFSET_LSB,
    gainError: r.gainError ?? DEFAULT_ADC_GAIN_ERROR,
    inlLsb: r.inlLsb ?? DEFAULT_ADC_INL_LSB,
  };
}

function stated<T extends object>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;
}

/**
 * The readout's errors as the model uses them. Gain-type figures are ratios of reading; the rest
 * are volts at the readout's input (the amplifier's output). A worst case: each at its limit.
 */
export type ReadoutErrors = {
  /** One step: ADC full scale / 2^bits, meter range / counts, V. */
  stepV: number;
  /** Reference tolerance (ADC), ratio. */
  refTol: number;
  /** Reference tempco × the largest ambient excursion from 25 °C (ADC), ratio. */
  refDrift: number;
  /** ADC gain error (reference excluded) or the meter's % of reading, ratio. */
  gain: number;
  /** ADC offset, V. */
  offsetV: number;
  /** ADC integral nonlinearity, V. */
  inlV: number;
  /**
   * Quantisation: half a step for an ADC; a meter's ± digits, which include its last digit's
   * rounding (a meter's accuracy is stated with it; common practice, no source), at least half a count.
   */
  quantV: number;
};

/** The model's figures: what the request states, and the class figures for what it leaves out. */
export function readoutErrors(r: ReadoutWithErrors, dTamb: number): ReadoutErrors {
  const v = Object.fromEntries(readoutFigures(r).map((f) => [f.field, f.value]));
  const at = (field: string) => v[field] ?? 0;
  if (r.kind === "adc") {
    const stepV = r.fullScale / 2 ** r.bits;
    return {
      stepV,
      refTol: at("readout.reference.tolerance"),
      refDrift: at("readout.reference.tempco") * dTamb,
      gain: at("readout.gainError"),
      offsetV: at("readout.offsetLsb") * stepV,
      inlV: at("readout.inlLsb") * stepV,
      quantV: stepV / 2,
    };
  }
  const stepV = r.fullScale / r.counts;
  return {
    stepV,
    refTol: 0,
    refDrift: 0,
    gain: at("readout.accuracy.percentOfReading"),
    offsetV: 0,
    inlV: 0,
    quantV: Math.max(0.5, at("readout.accuracy.digits")) * stepV,
  };
}

/**
 * What a calibration keeps of each kind of error (1: all, 0: none). One point at zero current and
 * 25 °C measures and subtracts every offset present then (the amplifier's offset, bias current ×
 * source, common-mode error at the working common mode, the ADC's offset, the zero-current
 * reference level's tolerance). Two points (zero, and a known current near full scale) also scale
 * out every gain error present then (amplifier, gain-setting resistors, shunt tolerance, the ADC's
 * reference tolerance and gain error). Neither removes drift with temperature, self-heating, INL,
 * noise, quantisation or a meter's accuracy band (a meter's spec is a band over its own
 * conditions, not a fixed error to subtract). The calibration standard's own uncertainty is taken
 * as small beside what remains (common practice, no source).
 */
export function calibrationKeeps(c: Calibration): { offset: 0 | 1; gain: 0 | 1 } {
  return { offset: c === "none" ? 1 : 0, gain: c === "two-point" ? 0 : 1 };
}

/** Which budget sources a calibration removes, in words for the budget table and the build sheet. */
export function calibrationRemoves(c: Calibration): string {
  if (c === "none") return "Nothing: every term counts at its limit.";
  const off =
    "the amplifier's offset at 25 °C, bias current, common-mode error, the ADC's offset and the zero-current reference's tolerance";
  if (c === "one-point") return `All of ${off}. Drift, gain errors, INL, noise and quantisation remain.`;
  return `All of ${off}; and the amplifier's gain error, the gain-setting resistors, the shunt's tolerance, the ADC's reference tolerance and gain error. Drift with temperature, self-heating, INL, noise, quantisation and a meter's accuracy band remain.`;
}
