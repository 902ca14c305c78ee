// Labels, units and "which way is better" for the fields of a saved design, shared by the
// revision diff, the compare page and the mails. Pure: runs on the server and in the browser.
import { formatPercent, formatSI } from "@/lib/design/format";
import type { PlanChoice } from "@/lib/design/plan-choice";
import { frontEndMetricFields, frontEndRequirementFields } from "./front-end-fields";

export type FieldKind = "si" | "percent" | "fraction" | "ppm" | "plain" | "db" | "celsius" | "count" | "text";

export type FieldInfo = {
  label: string;
  kind: FieldKind;
  unit?: string;
  /** For figures: whether lower or higher is better (compare marks the best). */
  better?: "lower" | "higher";
};

/** Requirement fields, by dotted path of the normalized requirement. */
export const requirementFields: Record<string, FieldInfo> = {
  "current.min": { label: "Minimum current", kind: "si", unit: "A" },
  "current.max": { label: "Maximum current", kind: "si", unit: "A" },
  "current.typical": { label: "Typical current", kind: "si", unit: "A" },
  "supply.voltage": { label: "Supply voltage", kind: "si", unit: "V" },
  "supply.side": { label: "Sensing side", kind: "text" },
  "drop.max": { label: "Allowed drop", kind: "si", unit: "V" },
  "drop.fraction": { label: "Allowed drop (fraction of supply)", kind: "fraction" },
  "drop.loadMin": { label: "Minimum load voltage", kind: "si", unit: "V" },
  "load.model": { label: "Load model", kind: "text" },
  "readout.kind": { label: "Readout", kind: "text" },
  "readout.bits": { label: "ADC resolution", kind: "count", unit: "bits" },
  "readout.fullScale": { label: "Readout full scale", kind: "si", unit: "V" },
  "readout.counts": { label: "Meter counts", kind: "count" },
  "resolution.countsAtMin": { label: "Counts wanted at minimum current", kind: "count" },
  "accuracy.percent": { label: "Accuracy target", kind: "percent" },
  "accuracy.bandMin": { label: "Accuracy band, lowest current", kind: "si", unit: "A" },
  "accuracy.bandMax": { label: "Accuracy band, highest current", kind: "si", unit: "A" },
  "accuracy.crestFactor": { label: "Noise crest factor", kind: "plain" },
  "temperature.min": { label: "Lowest ambient temperature", kind: "celsius" },
  "temperature.max": { label: "Highest ambient temperature", kind: "celsius" },
  "bandwidth.min": { label: "Required bandwidth", kind: "si", unit: "Hz" },
  "shunt.series": { label: "Shunt series", kind: "text" },
  "shunt.min": { label: "Smallest shunt", kind: "si", unit: "Ω" },
  "shunt.max": { label: "Largest shunt", kind: "si", unit: "Ω" },
  "shunt.tolerance": { label: "Shunt tolerance", kind: "fraction" },
  "shunt.tempco": { label: "Shunt tempco", kind: "ppm" },
  "shunt.ratings": { label: "Power ratings on offer", kind: "si", unit: "W" },
  "shunt.derating": { label: "Derating", kind: "fraction" },
  "shunt.thermalResistance": { label: "Shunt thermal resistance", kind: "si", unit: "K/W" },
  "shunt.ratedRise": { label: "Temperature rise at full rating", kind: "si", unit: "K" },
  "shunt.deratingKneeC": { label: "Shunt derating knee", kind: "celsius" },
  "shunt.maxTempC": { label: "Shunt maximum temperature", kind: "celsius" },
  // Whole when not used (null); their fields are listed in front-end-fields.ts when they are.
  "shunt.trace": { label: "Copper-trace shunt", kind: "text" },
  inputFilter: { label: "Input filter", kind: "text" },
  "amplifier.gainSet": { label: "Gain set by a resistor pair", kind: "text" },
  "amplifier.gainSet.series": { label: "Gain resistor series", kind: "text" },
  "amplifier.gainSet.tolerance": { label: "Gain resistor tolerance", kind: "fraction" },
  "amplifier.gainSet.min": { label: "Lowest gain from the resistor pair", kind: "plain" },
  "amplifier.gainSet.max": { label: "Highest gain from the resistor pair", kind: "plain" },
  "amplifier.topology": { label: "Amplifier topology", kind: "text" },
  "amplifier.commonMode.min": { label: "Lowest input common-mode voltage", kind: "si", unit: "V" },
  "amplifier.commonMode.max": { label: "Highest input common-mode voltage", kind: "si", unit: "V" },
  "readout.sampleRateHz": { label: "ADC sample rate", kind: "si", unit: "Hz" },
  "rangeSwitch.onResistance": { label: "Range switch on-resistance", kind: "si", unit: "Ω" },
  "rangeSwitch.delay": { label: "Range switch delay", kind: "si", unit: "s" },
  "amplifier.gains": { label: "Gains swept", kind: "plain" },
  "amplifier.offset": { label: "Amplifier offset", kind: "si", unit: "V" },
  "amplifier.offsetDrift": { label: "Offset drift", kind: "si", unit: "V/K" },
  "amplifier.gainError": { label: "Amplifier gain error", kind: "fraction" },
  "amplifier.gainDrift": { label: "Gain drift", kind: "ppm" },
  "amplifier.biasCurrent": { label: "Input bias current", kind: "si", unit: "A" },
  "amplifier.noiseDensity": { label: "Input noise density", kind: "si", unit: "V/√Hz" },
  "amplifier.gbw": { label: "Gain-bandwidth", kind: "si", unit: "Hz" },
  "amplifier.supply": { label: "Amplifier supply", kind: "si", unit: "V" },
  "amplifier.swingLow": { label: "Lowest output (above ground)", kind: "si", unit: "V" },
  "amplifier.swingHigh": { label: "Output headroom below supply", kind: "si", unit: "V" },
  "amplifier.filterHz": { label: "Output filter corner", kind: "si", unit: "Hz" },
  "amplifier.cmrrDb": { label: "CMRR", kind: "db" },
  "amplifier.reference.voltage": { label: "Zero-current output level", kind: "si", unit: "V" },
  "amplifier.reference.tolerance": { label: "Zero-level tolerance", kind: "fraction" },
  "amplifier.reference.tempco": { label: "Zero-level tempco", kind: "ppm" },
  "readout.reference.tolerance": { label: "ADC reference tolerance", kind: "fraction" },
  "readout.reference.tempco": { label: "ADC reference tempco", kind: "ppm" },
  "readout.offsetLsb": { label: "ADC offset", kind: "count", unit: "LSB" },
  "readout.gainError": { label: "ADC gain error", kind: "fraction" },
  "readout.inlLsb": { label: "ADC INL", kind: "count", unit: "LSB" },
  "readout.accuracy.percentOfReading": { label: "Meter accuracy, % of reading", kind: "fraction" },
  "readout.accuracy.digits": { label: "Meter accuracy, digits", kind: "count", unit: "digits" },
  calibration: { label: "Calibration", kind: "text" },
  limit: { label: "Candidates kept", kind: "count" },
  ...frontEndRequirementFields,
};

export const choiceFields: Record<string, FieldInfo> = {
  shuntOhms: { label: "Shunt", kind: "si", unit: "Ω" },
  gain: { label: "Gain", kind: "plain" },
};

const rangeKeys: Record<string, FieldInfo> = {
  minA: { label: "lowest current", kind: "si", unit: "A" },
  maxA: { label: "highest current", kind: "si", unit: "A" },
  shuntOhms: { label: "shunt", kind: "si", unit: "Ω" },
  gain: { label: "gain", kind: "plain" },
};
const switchKeys: Record<string, FieldInfo> = {
  upA: { label: "switching up above", kind: "si", unit: "A" },
  downA: { label: "switching down below", kind: "si", unit: "A" },
};

/**
 * A range plan's fields by dotted path ("ranges.1.shuntOhms" → "Range 2, shunt";
 * "switchPoints.0.downA" → "Switch point 1, switching down below"; "ranges" → "Number of ranges").
 */
export function planFieldInfo(path: string): FieldInfo | undefined {
  if (path === "ranges") return { label: "Number of ranges", kind: "count" };
  const [list, index, key] = path.split(".");
  const k = Number(index);
  if (!Number.isInteger(k) || key === undefined) return undefined;
  const info = list === "ranges" ? rangeKeys[key] : list === "switchPoints" ? switchKeys[key] : undefined;
  if (!info) return undefined;
  return { ...info, label: `${list === "ranges" ? "Range" : "Switch point"} ${k + 1}, ${info.label}` };
}

/** A plan as dotted paths, each range and switch point field on its own (for the revision diff). */
export function flattenPlan(plan: PlanChoice | null | undefined): Record<string, unknown> {
  if (!plan) return {};
  const out: Record<string, unknown> = { ranges: plan.ranges.length };
  plan.ranges.forEach((r, k) => Object.assign(out, flatten(r, `ranges.${k}`)));
  plan.switchPoints.forEach((s, k) => Object.assign(out, flatten(s, `switchPoints.${k}`)));
  return out;
}

/** The engine's figures of a candidate, in the order a reviewer reads them. */
export const metricFields: Record<string, FieldInfo> = {
  transimpedanceVPerA: { label: "Transimpedance", kind: "si", unit: "V/A" },
  burdenV: { label: "Burden at maximum current", kind: "si", unit: "V", better: "lower" },
  loadVoltageV: { label: "Load voltage at maximum current", kind: "si", unit: "V", better: "higher" },
  operatingCurrentA: { label: "Current through the shunt at full load", kind: "si", unit: "A" },
  dissipationW: { label: "Shunt dissipation", kind: "si", unit: "W", better: "lower" },
  ratingW: { label: "Power rating", kind: "si", unit: "W", better: "lower" },
  selfHeatingK: { label: "Shunt self-heating", kind: "si", unit: "K", better: "lower" },
  outputAtMaxV: { label: "Output at maximum current", kind: "si", unit: "V" },
  outputAtMaxWorstV: { label: "Output at full load, worst case", kind: "si", unit: "V" },
  headroomV: { label: "Output headroom", kind: "si", unit: "V", better: "higher" },
  lsbA: { label: "One readout step (LSB)", kind: "si", unit: "A", better: "lower" },
  resolvableStepA: { label: "Smallest step it can tell apart (step or noise)", kind: "si", unit: "A" },
  countsAtMin: { label: "Counts at minimum current", kind: "plain", better: "higher" },
  deadZoneA: { label: "Dead zone", kind: "si", unit: "A", better: "lower" },
  offsetErrorA: { label: "Offset referred to current", kind: "si", unit: "A", better: "lower" },
  noiseA: { label: "Noise (RMS) referred to current", kind: "si", unit: "A", better: "lower" },
  bandwidthHz: { label: "Bandwidth", kind: "si", unit: "Hz", better: "higher" },
  errorAtMinPercent: { label: "Worst-case error at minimum current", kind: "percent", better: "lower" },
  rssAtMinPercent: { label: "RSS error at minimum current", kind: "percent", better: "lower" },
  errorAtTypicalPercent: { label: "Worst-case error at typical current", kind: "percent", better: "lower" },
  errorAtMaxPercent: { label: "Worst-case error at maximum current", kind: "percent", better: "lower" },
  accuracyBandPercent: { label: "Worst error in the accuracy band", kind: "percent", better: "lower" },
  lowestAccurateCurrentA: {
    label: "Lowest current meeting the accuracy target",
    kind: "si",
    unit: "A",
    better: "lower",
  },
  ...frontEndMetricFields,
};

/** A number without SI prefixes (for %, dB, °C, ppm where a prefix would read wrong). */
const plain = (v: number) => String(Number(v.toPrecision(4)));

function one(value: unknown, info: FieldInfo): string {
  if (value === null || value === undefined) return "—";
  if (typeof value !== "number") return String(value);
  switch (info.kind) {
    case "si":
      return formatSI(value, info.unit ?? "");
    case "percent":
      return formatPercent(value / 100);
    case "fraction":
      return formatPercent(value);
    case "ppm":
      return `${plain(value * 1e6)} ppm/K`;
    case "db":
      return `${plain(value)} dB`;
    case "celsius":
      return `${plain(value)} °C`;
    case "count":
      return info.unit ? `${value} ${info.unit}` : String(value);
    case "plain":
      return formatSI(value, "");
    default:
      return String(value);
  }
}

/** A field's value as shown on screen and in mail: SI prefixes and units, lists joined. */
export function formatField(value: unknown, info: FieldInfo | undefined): string {
  const i = info ?? { label: "", kind: "plain" as const };
  if (Array.isArray(value)) {
    if (value.length > 12) return `${value.length} values, ${one(value[0], i)} … ${one(value.at(-1), i)}`;
    return value.map((v) => one(v, i)).join(", ");
  }
  if (value && typeof value === "object") return JSON.stringify(value);
  return one(value, i);
}

/** Flattens an object into dotted paths; arrays and null stay whole. */
export function flatten(obj: unknown, prefix = ""): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  if (obj === null || typeof obj !== "object" || Array.isArray(obj)) {
    if (prefix) out[prefix] = obj;
    return out;
  }
  for (const [k, v] of Object.entries(obj as Record<string, unknown>)) {
    const path = prefix ? `${prefix}.${k}` : k;
    if (v !== null && typeof v === "object" && !Array.isArray(v)) Object.assign(out, flatten(v, path));
    else out[path] = v;
  }
  return out;
}
