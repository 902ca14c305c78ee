// How each library field is shown and typed on the screen: the label in the trade's words, the
// SI value formatted with a prefix for the table and the form, and how the form's text goes to the API.
import { formatSI } from "@/lib/design/format";
import { topologies, topologyLabels, type Topology } from "@/lib/design/topology";
import type { PartKind } from "./schema";

export type FieldKind = "text" | "quantity" | "numberList" | "quantityList" | "select" | "checkbox" | "number";

export type FieldSpec = {
  key: string;
  label: string;
  kind: FieldKind;
  /** SI number(s) → text for a table cell or an input. */
  show: (value: unknown) => string;
  hint?: string;
  options?: { value: string; label: string }[];
};

const si = (unit: string) => (v: unknown) => (typeof v === "number" ? formatSI(v, unit) : "");
const ppm = (v: unknown) => (typeof v === "number" ? `${Number((v * 1e6).toPrecision(3))} ppm/K` : "");
const percent = (v: unknown) => (typeof v === "number" ? `${Number((v * 100).toPrecision(3))} %` : "");
const list =
  (fmt: (v: unknown) => string, sep = ", ") =>
  (v: unknown) =>
    Array.isArray(v) ? v.map(fmt).join(sep) : "";
const plain = (v: unknown) => (v === undefined || v === null ? "" : String(v));

export const amplifierFields: FieldSpec[] = [
  { key: "name", label: "Name", kind: "text", show: plain },
  {
    key: "gainMode",
    label: "Gain mode",
    kind: "select",
    show: (v) => (v === "resistor-set" ? "resistor-set" : "fixed"),
    options: [
      { value: "fixed", label: "Fixed gains (a list)" },
      { value: "resistor-set", label: "Set by a resistor pair (lowest–highest)" },
    ],
  },
  {
    key: "gains",
    label: "Gains",
    kind: "numberList",
    show: list(plain),
    hint: "Fixed: each gain, e.g. 20, 50, 100. Resistor-set: lowest and highest, e.g. 1, 1000.",
  },
  { key: "offsetV", label: "Input offset", kind: "quantity", show: si("V"), hint: "e.g. 35 uV" },
  { key: "offsetDriftVPerK", label: "Offset drift", kind: "quantity", show: si("V/K"), hint: "e.g. 0.1 uV/K" },
  { key: "gainErrorFraction", label: "Gain error", kind: "quantity", show: percent, hint: "e.g. 0.2 %" },
  { key: "gainDriftPerK", label: "Gain drift", kind: "quantity", show: ppm, hint: "e.g. 10 ppm/K" },
  { key: "biasCurrentA", label: "Input bias current", kind: "quantity", show: si("A"), hint: "e.g. 20 nA" },
  {
    key: "noiseDensityVPerRtHz",
    label: "Input noise density",
    kind: "quantity",
    show: si("V/√Hz"),
    hint: "e.g. 40 nV/rtHz",
  },
  { key: "gbwHz", label: "Gain-bandwidth", kind: "quantity", show: si("Hz"), hint: "e.g. 400 kHz" },
  { key: "swingLowV", label: "Lowest output above ground", kind: "quantity", show: si("V"), hint: "e.g. 10 mV" },
  { key: "swingHighV", label: "Output headroom below the supply", kind: "quantity", show: si("V"), hint: "e.g. 30 mV" },
  { key: "cmrrDb", label: "CMRR (dB)", kind: "number", show: (v) => (typeof v === "number" ? `${v} dB` : "") },
  { key: "supplyMinV", label: "Lowest supply", kind: "quantity", show: si("V"), hint: "e.g. 2.7 V" },
  { key: "supplyMaxV", label: "Highest supply", kind: "quantity", show: si("V"), hint: "e.g. 5.5 V" },
  {
    key: "topology",
    label: "Topology",
    kind: "select",
    show: (v) => topologyLabels[v as Topology] ?? plain(v),
    options: topologies.map((t) => ({ value: t, label: topologyLabels[t] })),
  },
  {
    key: "commonModeMinV",
    label: "Lowest input common-mode voltage",
    kind: "quantity",
    show: si("V"),
    hint: "e.g. -0.3 V; blank: the topology's usual range",
  },
  {
    key: "commonModeMaxV",
    label: "Highest input common-mode voltage",
    kind: "quantity",
    show: si("V"),
    hint: "e.g. 26 V; blank: the topology's usual range",
  },
];

export const shuntFields: FieldSpec[] = [
  { key: "name", label: "Name", kind: "text", show: plain },
  {
    key: "series",
    label: "Series",
    kind: "select",
    show: plain,
    options: ["E6", "E12", "E24", "E48", "E96", "E192"].map((s) => ({ value: s, label: s })),
  },
  { key: "minOhms", label: "Smallest value", kind: "quantity", show: si("Ω"), hint: "e.g. 1 mohm" },
  { key: "maxOhms", label: "Largest value", kind: "quantity", show: si("Ω"), hint: "e.g. 100 mohm" },
  { key: "toleranceFraction", label: "Tolerance", kind: "quantity", show: percent, hint: "e.g. 1 %" },
  { key: "tempcoPerK", label: "Tempco", kind: "quantity", show: ppm, hint: "e.g. 50 ppm/K" },
  { key: "ratingsW", label: "Power ratings", kind: "quantityList", show: list(si("W")), hint: "e.g. 0.5 W, 1 W, 2 W" },
  { key: "fourTerminal", label: "4-terminal (Kelvin) connection", kind: "checkbox", show: (v) => (v ? "yes" : "no") },
];

// Readout parts: the keys are the requirement's readout names (API.md v2); a dotted key is a figure
// inside a group (reference.tolerance), as the API's field errors name it.
const lsbs = (v: unknown) => (typeof v === "number" ? `${v} LSB` : "");
// Six figures: a 4.096 V full scale must not come back from the edit form as 4.1 V.
const si6 = (unit: string) => (v: unknown) => (typeof v === "number" ? formatSI(v, unit, 6) : "");
const percent6 = (v: unknown) => (typeof v === "number" ? `${Number((v * 100).toPrecision(6))} %` : "");
const ppm6 = (v: unknown) => (typeof v === "number" ? `${Number((v * 1e6).toPrecision(6))} ppm/K` : "");

export const adcFields: FieldSpec[] = [
  { key: "name", label: "Name", kind: "text", show: plain },
  { key: "bits", label: "Resolution (bits)", kind: "number", show: (v) => (typeof v === "number" ? `${v} bit` : "") },
  { key: "fullScale", label: "Full scale", kind: "quantity", show: si6("V"), hint: "e.g. 2.5 V" },
  {
    key: "sampleRateHz",
    label: "Highest sample rate",
    kind: "quantity",
    show: si6("Hz"),
    hint: "e.g. 10 kHz; the wizard starts the design's rate here",
  },
  {
    key: "reference.tolerance",
    label: "Reference tolerance",
    kind: "quantity",
    show: percent6,
    hint: "Initial accuracy of its voltage reference, e.g. 0.1 %",
  },
  { key: "reference.tempco", label: "Reference tempco", kind: "quantity", show: ppm6, hint: "e.g. 20 ppm/K" },
  { key: "offsetLsb", label: "Offset error (LSB)", kind: "number", show: lsbs, hint: "e.g. 2" },
  {
    key: "gainError",
    label: "Gain error (reference excluded)",
    kind: "quantity",
    show: percent6,
    hint: "e.g. 0.05 %",
  },
  { key: "inlLsb", label: "Integral nonlinearity, INL (LSB)", kind: "number", show: lsbs, hint: "e.g. 1" },
];

export const meterFields: FieldSpec[] = [
  { key: "name", label: "Name", kind: "text", show: plain },
  { key: "fullScale", label: "Range full scale", kind: "quantity", show: si6("V"), hint: "e.g. 200 mV" },
  { key: "counts", label: "Counts", kind: "number", show: plain, hint: "Counts across the range, e.g. 2000" },
  {
    key: "accuracy.percentOfReading",
    label: "Accuracy, % of reading",
    kind: "quantity",
    show: percent6,
    hint: "e.g. 0.5 %",
  },
  {
    key: "accuracy.digits",
    label: "Accuracy, digits",
    kind: "number",
    show: plain,
    hint: "Counts added to the % of reading, e.g. 2",
  },
];

export const fieldsOf: Record<PartKind, FieldSpec[]> = {
  amplifiers: amplifierFields,
  shunts: shuntFields,
  adcs: adcFields,
  meters: meterFields,
};

/** A field's value in a part, following a dotted key into its group. */
export function valueAt(part: Record<string, unknown>, key: string): unknown {
  return key
    .split(".")
    .reduce<unknown>((o, k) => (typeof o === "object" && o !== null ? (o as never)[k] : undefined), part);
}

function setAt(target: Record<string, unknown>, key: string, value: unknown) {
  const [head, ...rest] = key.split(".");
  if (rest.length === 0) target[head!] = value;
  else setAt((target[head!] ??= {}) as Record<string, unknown>, rest.join("."), value);
}

export type TableColumn = { key: string; label: string; show: (part: Record<string, unknown>) => string };

const field = (kind: PartKind, key: string) => fieldsOf[kind].find((f) => f.key === key)!;
const column = (kind: PartKind, key: string, label?: string): TableColumn => {
  const f = field(kind, key);
  return { key, label: label ?? f.label, show: (p) => f.show(valueAt(p, key)) };
};

/** The tables show the figures that tell parts apart; the form holds every field. */
export const tableColumnsOf: Record<PartKind, TableColumn[]> = {
  amplifiers: [
    {
      key: "gains",
      label: "Gains",
      show: (p) =>
        p.gainMode === "resistor-set" && Array.isArray(p.gains)
          ? `${p.gains.join("–")} (resistor pair)`
          : list(plain)(p.gains),
    },
    column("amplifiers", "offsetV", "Offset"),
    column("amplifiers", "offsetDriftVPerK", "Drift"),
    column("amplifiers", "gainErrorFraction"),
    column("amplifiers", "biasCurrentA", "Bias current"),
    column("amplifiers", "noiseDensityVPerRtHz", "Noise"),
    column("amplifiers", "gbwHz", "GBW"),
    {
      key: "commonMode",
      label: "Common mode",
      show: (p) =>
        typeof p.commonModeMinV === "number" && typeof p.commonModeMaxV === "number"
          ? `${si("V")(p.commonModeMinV)} – ${si("V")(p.commonModeMaxV)}`
          : "usual for its topology",
    },
    { key: "supply", label: "Supply", show: (p) => `${si("V")(p.supplyMinV)} – ${si("V")(p.supplyMaxV)}` },
  ],
  shunts: [
    column("shunts", "series"),
    { key: "values", label: "Values", show: (p) => `${si("Ω")(p.minOhms)} – ${si("Ω")(p.maxOhms)}` },
    column("shunts", "toleranceFraction"),
    column("shunts", "tempcoPerK"),
    column("shunts", "ratingsW"),
    { key: "fourTerminal", label: "Connection", show: (p) => (p.fourTerminal ? "4-terminal" : "2-terminal") },
  ],
  adcs: [
    column("adcs", "bits", "Bits"),
    column("adcs", "fullScale"),
    column("adcs", "sampleRateHz", "Sample rate"),
    column("adcs", "reference.tolerance", "Reference"),
    column("adcs", "reference.tempco", "Ref. tempco"),
    column("adcs", "offsetLsb", "Offset"),
    column("adcs", "gainError"),
    column("adcs", "inlLsb", "INL"),
  ],
  meters: [
    column("meters", "fullScale", "Range"),
    column("meters", "counts"),
    {
      key: "accuracy",
      label: "Accuracy",
      show: (p) => {
        const a = valueAt(p, "accuracy.percentOfReading");
        const d = valueAt(p, "accuracy.digits");
        return typeof a === "number" && typeof d === "number" ? `±(${percent(a)} + ${d} digits)` : "";
      },
    },
  ],
};

/** The form's text for each field as the API body (unit strings are parsed on the server). */
export function formToBody(kind: PartKind, form: Record<string, string | boolean>): Record<string, unknown> {
  const body: Record<string, unknown> = {};
  for (const f of fieldsOf[kind]) {
    const raw = form[f.key];
    const text = String(raw ?? "").trim();
    let value: unknown;
    if (f.kind === "checkbox") value = raw === true;
    else if (f.kind === "numberList") value = splitItems(text).map((s) => (Number.isFinite(Number(s)) ? Number(s) : s));
    else if (f.kind === "quantityList") value = splitItems(text);
    // A word in a number box goes as typed, so the server's message names the field.
    else if (f.kind === "number") value = text === "" ? "" : Number.isFinite(Number(text)) ? Number(text) : text;
    else value = text;
    setAt(body, f.key, value);
  }
  return body;
}

function splitItems(text: string): string[] {
  return text
    .split(/[,;]/)
    .map((s) => s.trim())
    .filter(Boolean);
}

/** A stored part as the form's starting text. */
export function partToForm(kind: PartKind, part: Record<string, unknown> | null): Record<string, string | boolean> {
  const out: Record<string, string | boolean> = {};
  for (const f of fieldsOf[kind]) {
    if (f.kind === "checkbox") out[f.key] = part ? part[f.key] === true : false;
    else if (!part) out[f.key] = f.kind === "select" ? (f.options?.[kind === "shunts" ? 4 : 0]?.value ?? "") : "";
    else if (f.kind === "number") out[f.key] = plain(valueAt(part, f.key));
    else out[f.key] = f.show(valueAt(part, f.key));
  }
  return out;
}
