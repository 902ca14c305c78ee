// Plausible bounds for what a current-sense front end is designed for. The engine takes any
// finite number; a typo such as 1e30 A would otherwise come back as figures in "PA". These are the
// product's working range (common practice, no source), not physics: wide enough for a picoammeter
// front end and a welding-current shunt alike. Currents go as far as the engine takes them
// (MAX_CURRENT_A), so a design saved through the API can always be opened in the wizard.
import { formatSI } from "@/lib/design/format";
import { parseQuantity, type Dimension } from "@/lib/design/units";
import { MAX_CURRENT_A, type FieldErrors, type Requirement } from "@/lib/design/requirement";

type Bound = {
  path: string;
  label: string;
  unit: string;
  dim: Dimension;
  min: number;
  max: number;
  get: (r: Requirement) => number | undefined;
  /** A signed quantity (a bidirectional span's currents): the bounds hold for its magnitude. */
  signed?: boolean;
};

const bounds: Bound[] = [
  {
    path: "current.min",
    label: "Minimum current",
    unit: "A",
    dim: "current",
    min: 1e-12,
    max: MAX_CURRENT_A,
    get: (r) => r.current.min,
    signed: true,
  },
  {
    path: "current.max",
    label: "Maximum current",
    unit: "A",
    dim: "current",
    min: 1e-12,
    max: MAX_CURRENT_A,
    get: (r) => r.current.max,
  },
  {
    path: "current.typical",
    label: "Typical current",
    unit: "A",
    dim: "current",
    min: 1e-12,
    max: MAX_CURRENT_A,
    get: (r) => r.current.typical,
    signed: true,
  },
  {
    path: "supply.voltage",
    label: "Supply voltage",
    unit: "V",
    dim: "voltage",
    min: 1e-3,
    max: 1e5,
    get: (r) => r.supply.voltage,
  },
  {
    path: "drop.loadMin",
    label: "Minimum load voltage",
    unit: "V",
    dim: "voltage",
    min: 0,
    max: 1e5,
    get: (r) => r.drop.loadMin,
  },
  {
    path: "readout.fullScale",
    label: "Readout full scale",
    unit: "V",
    dim: "voltage",
    min: 1e-6,
    max: 1e3,
    get: (r) => r.readout.fullScale,
  },
  {
    path: "shunt.min",
    label: "Smallest shunt",
    unit: "Ω",
    dim: "resistance",
    min: 1e-6,
    max: 1e9,
    get: (r) => r.shunt.min,
  },
  {
    path: "shunt.max",
    label: "Largest shunt",
    unit: "Ω",
    dim: "resistance",
    min: 1e-6,
    max: 1e9,
    get: (r) => r.shunt.max,
  },
  {
    path: "amplifier.offset",
    label: "Input offset",
    unit: "V",
    dim: "voltage",
    min: 0,
    max: 1,
    get: (r) => r.amplifier.offset,
  },
  {
    path: "amplifier.biasCurrent",
    label: "Input bias current",
    unit: "A",
    dim: "current",
    min: 0,
    max: 1e-3,
    get: (r) => r.amplifier.biasCurrent,
  },
  {
    path: "amplifier.gbw",
    label: "Gain-bandwidth",
    unit: "Hz",
    dim: "frequency",
    min: 1,
    max: 1e11,
    get: (r) => r.amplifier.gbw,
  },
  {
    path: "amplifier.supply",
    label: "Amplifier supply",
    unit: "V",
    dim: "voltage",
    min: 0.5,
    max: 1e3,
    get: (r) => r.amplifier.supply,
  },
];

/** A value far outside the range is written plainly: 1e30 A as "1 × 10^30 A", never with a clamped prefix. */
function plainly(v: number, unit: string): string {
  const a = Math.abs(v);
  if (a !== 0 && (a >= 1e15 || a < 1e-21)) {
    const exp = Math.floor(Math.log10(a));
    return `${Number((v / 10 ** exp).toPrecision(3))} × 10^${exp} ${unit}`;
  }
  return formatSI(v, unit);
}

function message(b: Bound, v: number): string {
  const lo = b.min === 0 ? "0" : formatSI(b.min, b.unit);
  return `${b.label}: ${plainly(v, b.unit)} is outside the range this workbench designs for (${lo} to ${plainly(b.max, b.unit)})`;
}

function outside(b: Bound, v: number): boolean {
  const x = b.signed ? Math.abs(v) : v;
  // A signed field's zero is the schema's to refuse, with its own words.
  if (b.signed && x === 0) return false;
  return x < b.min || x > b.max;
}

/** A plain range message per field whose value lies outside the working range. */
export function outOfRange(req: Requirement): FieldErrors {
  const out: FieldErrors = {};
  for (const b of bounds) {
    const v = b.get(req);
    if (v !== undefined && outside(b, v)) out[b.path] = [message(b, v)];
  }
  return out;
}

/** The same check on what was typed, field by field, while other fields are still incomplete. */
export function outOfRangeTyped(values: unknown): FieldErrors {
  const out: FieldErrors = {};
  for (const b of bounds) {
    let node = values;
    for (const k of b.path.split(".")) node = (node as Record<string, unknown> | undefined)?.[k];
    if (typeof node !== "string" && typeof node !== "number") continue;
    const r = parseQuantity(node, b.dim);
    if (r.ok && outside(b, r.value)) out[b.path] = [message(b, r.value)];
  }
  return out;
}
