// The wizard's form shape: what the designer types (unit strings), one field per input.
// The engine's requirement schema validates it as it stands (extra keys are ignored).
import { accuracyTargetText } from "@/lib/design/accuracy-text";
import type { RelaxSuggestion } from "@/lib/design/diagnosis";
import { formatSI } from "@/lib/design/format";
import type { LoadModel, RequirementInput } from "@/lib/design/requirement";
import { deepMerge } from "./deep-merge";

export type WizardValues = {
  current: { min: string; max: string; typical?: string };
  supply: { voltage: string; side: "low" | "high" };
  drop: { max?: string; fraction?: string; loadMin?: string };
  load: { model: LoadModel };
  readout: {
    kind: "adc" | "meter";
    bits?: number;
    counts?: number;
    fullScale: string;
    sampleRateHz?: string;
    // The readout's own error (left out: its class's typical figures, lib/design/readout-error.ts).
    reference?: { tolerance?: string; tempco?: string };
    offsetLsb?: number;
    gainError?: string;
    inlLsb?: number;
    accuracy?: { percentOfReading?: string; digits?: number };
  };
  calibration: "none" | "one-point" | "two-point";
  resolution: { countsAtMin: number };
  accuracy: { percent: string; bandMin?: string; bandMax?: string };
  temperature: { min: string; max: string };
  shunt: {
    series: string;
    min: string;
    max: string;
    tolerance: string;
    tempco: string;
    ratings: string[];
    derating: number;
    deratingKneeC: string;
    maxTempC: string;
    kind: "resistor" | "copper-trace";
    trace: { width: string; length: string; thickness: string; layer: "external" | "internal"; tolerance?: string };
    terminals: "4" | "2";
    padResistance: string;
    thermalEmf?: string;
    gradient: string;
  };
  amplifier: {
    gains?: number[];
    gainSet?: { series: string; min: number; max: number; tolerance?: string };
    /** "" lets the engine decide from the gains (resistor pair: non-inverting; list: current-sense). */
    topology?: string;
    commonMode?: { min?: string; max?: string };
    filterHz?: string;
    offset: string;
    offsetDrift: string;
    gainError: string;
    gainDrift: string;
    biasCurrent: string;
    offsetCurrent?: string;
    noiseDensity: string;
    gbw: string;
    supply: string;
    swingLow: string;
    swingHigh: string;
    cmrrDb: number;
    /** A bidirectional span's zero-current output level; a blank voltage is placed by the engine. */
    reference: { voltage?: string; tolerance: string; tempco: string };
  };
  limit: number;
  /** The input filter's checkbox (not part of the requirement: the schema ignores it). */
  inputFilterOn: boolean;
  inputFilter: { resistance: string; capacitance: string; tolerance: string };
};

/** The engine's defaults (lib/design/requirement.ts), written the way an engineer types them. */
export const readableDefaults: WizardValues = {
  current: { min: "", max: "" },
  supply: { voltage: "", side: "low" },
  drop: { max: "60 mV" },
  load: { model: "constant-current" },
  readout: { kind: "adc", bits: 12, counts: 2000, fullScale: "2.5 V", sampleRateHz: "1 kHz" },
  calibration: "none",
  resolution: { countsAtMin: 10 },
  accuracy: { percent: "2" },
  temperature: { min: "0 °C", max: "70 °C" },
  shunt: {
    series: "E96",
    min: "1 mΩ",
    max: "1 kΩ",
    tolerance: "0.5 %",
    tempco: "50 ppm/K",
    ratings: ["0.1 W", "0.125 W", "0.25 W", "0.5 W", "1 W", "2 W", "3 W"],
    derating: 0.5,
    deratingKneeC: "70 °C",
    maxTempC: "155 °C",
    kind: "resistor",
    trace: { width: "", length: "", thickness: "35 µm", layer: "external", tolerance: "" },
    terminals: "4",
    padResistance: "0.5 mΩ",
    thermalEmf: "",
    gradient: "0 K",
  },
  amplifier: {
    gains: [10, 20, 25, 50, 60, 100, 200, 500],
    gainSet: { series: "E24", min: 2, max: 1000, tolerance: "0.1 %" },
    topology: "",
    commonMode: { min: "", max: "" },
    filterHz: "",
    offset: "10 µV",
    offsetDrift: "0.1 µV/K",
    gainError: "0.1 %",
    gainDrift: "10 ppm/K",
    biasCurrent: "20 nA",
    offsetCurrent: "",
    noiseDensity: "40 nV/rtHz",
    gbw: "2 MHz",
    supply: "5 V",
    swingLow: "10 mV",
    swingHigh: "50 mV",
    cmrrDb: 120,
    reference: { tolerance: "0.2 %", tempco: "25 ppm/K" },
  },
  limit: 200,
  inputFilterOn: false,
  inputFilter: { resistance: "", capacitance: "", tolerance: "1 %" },
};

/** A scenario's requirement input laid over the readable defaults (values of both modes kept;
 * only the fields on screen reach the schema). */
export function valuesFrom(input: RequirementInput): WizardValues {
  const i = JSON.parse(JSON.stringify(input)) as Record<string, Record<string, unknown>>;
  if (i.accuracy?.percent !== undefined) i.accuracy.percent = String(i.accuracy.percent);
  // Temperatures read as the trade writes them: "0 °C", never "0 degC".
  for (const k of ["min", "max"] as const) {
    const t = i.temperature?.[k];
    if (typeof t === "string") i.temperature![k] = t.replace(/\s*deg\s*C$/i, " °C");
    else if (typeof t === "number") i.temperature![k] = `${t} °C`;
  }
  // The form's radio holds the terminal count as text; a scenario's filter switches the filter on.
  if (typeof i.shunt?.terminals === "number") i.shunt.terminals = String(i.shunt.terminals);
  const merged = deepMerge(readableDefaults, i);
  return { ...merged, inputFilterOn: input.inputFilter !== undefined && input.inputFilter !== null };
}

/** A diagnosis suggestion as the form's own text, which the form reads back to exactly the value the engine tried. */
export function formValueFor(s: Pick<RelaxSuggestion, "field" | "to">): string | number {
  switch (s.field) {
    case "accuracy.percent":
      return accuracyTargetText(s.to);
    case "accuracy.bandMin":
    case "current.min":
      return formatSI(s.to, "A", 6);
    case "drop.max":
      return formatSI(s.to, "V", 6);
    case "amplifier.filterHz":
      return formatSI(s.to, "Hz", 6);
    case "shunt.trace.length":
      return formatSI(s.to, "m", 6);
    case "shunt.tolerance":
      return `${Number((s.to * 100).toPrecision(6))} %`;
    case "shunt.tempco":
      return `${Number((s.to * 1e6).toPrecision(6))} ppm/K`;
    default:
      return s.to;
  }
}
