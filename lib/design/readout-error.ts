// The readout's own error (issue 14, item 2): an ADC's reference, offset, gain error and INL,
// or a meter's ±(% of reading + digits), and what a one- or two-point calibration takes out.
// Field names are API.md v2's; the defaults are a class of part, from memory (DEFAULTS.md).

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
 * The wizard offers them and the cautions measure a design against them; a request that leaves a
 * figure out is read with an ideal readout (half a step), as before issue 14, because these figures
 * turn every demo design and many saved ones infeasible (DEFAULTS.md says why).
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

/** Whether the request states any of the readout's own error (else it is read as ideal). */
export function readoutErrorStated(r: ReadoutWithErrors): boolean {
  if (r.kind === "meter") return r.accuracy?.percentOfReading !== undefined || r.accuracy?.digits !== undefined;
  return (
    r.reference?.tolerance !== undefined ||
    r.reference?.tempco !== undefined ||
    r.offsetLsb !== undefined ||
    r.gainError !== undefined ||
    r.inlLsb !== undefined
  );
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

export function readoutErrors(r: ReadoutWithErrors, dTamb: number): ReadoutErrors {
  if (r.kind === "adc") {
    const stepV = r.fullScale / 2 ** r.bits;
    return {
      stepV,
      refTol: r.reference?.tolerance ?? 0,
      refDrift: (r.reference?.tempco ?? 0) * dTamb,
      gain: r.gainError ?? 0,
      offsetV: (r.offsetLsb ?? 0) * stepV,
      inlV: (r.inlLsb ?? 0) * stepV,
      quantV: stepV / 2,
    };
  }
  const stepV = r.fullScale / r.counts;
  return {
    stepV,
    refTol: 0,
    refDrift: 0,
    gain: r.accuracy?.percentOfReading ?? 0,
    offsetV: 0,
    inlV: 0,
    quantV: Math.max(0.5, r.accuracy?.digits ?? 0) * stepV,
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
