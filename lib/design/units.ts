// Quantities at the edges: unit strings in, SI numbers out (and back to SI-prefixed text).
// mathjs parses units here only; the sweep never sees a Unit.
import "./zod-jitless";
import { create, unitDependencies, type Unit } from "mathjs";
import { z } from "zod";

export type Amps = number;
export type Volts = number;
export type Ohms = number;
export type Watts = number;
export type Kelvin = number;
export type Celsius = number;
export type Hertz = number;
export type Seconds = number;
/** A plain ratio: 0.01 is 1 %. */
export type Fraction = number;

export type Dimension =
  | "current"
  | "voltage"
  | "resistance"
  | "power"
  | "time"
  | "temperature"
  /** A temperature difference (a rise): "85 K" and "85 degC" are both 85. */
  | "temperatureRise"
  | "frequency"
  | "charge"
  | "fraction"
  | "tempco"
  | "voltageDrift"
  | "noiseDensity"
  | "thermalResistance"
  | "transimpedance"
  /** A length (trace width, length and copper thickness): "2 mm", "35 um", "20 mil". */
  | "length"
  | "capacitance";

/** The mathjs unit whose base dimension each of ours has (null: dimensionless). */
const referenceUnit: Record<Dimension, string | null> = {
  current: "A",
  voltage: "V",
  resistance: "ohm",
  power: "W",
  time: "s",
  temperature: "K",
  temperatureRise: "K",
  frequency: "Hz",
  charge: "C",
  fraction: null,
  tempco: "1/K",
  voltageDrift: "V/K",
  noiseDensity: "V/Hz^0.5",
  thermalResistance: "K/W",
  transimpedance: "V/A",
  length: "m",
  capacitance: "F",
};

const dimensionWords: Record<Dimension, string> = {
  current: "a current",
  voltage: "a voltage",
  resistance: "a resistance",
  power: "a power",
  time: "a time",
  temperature: "a temperature",
  temperatureRise: "a temperature difference",
  frequency: "a frequency",
  charge: "a charge",
  fraction: "a plain ratio or percentage",
  tempco: "a temperature coefficient",
  voltageDrift: "a voltage drift",
  noiseDensity: "a noise density",
  thermalResistance: "a thermal resistance",
  transimpedance: "a transimpedance",
  length: "a length",
  capacitance: "a capacitance",
};

// Resistance and transimpedance share a base dimension; name it by what was asked for.
const detectOrder: Dimension[] = [
  "current",
  "voltage",
  "resistance",
  "power",
  "time",
  "temperature",
  "frequency",
  "charge",
  "voltageDrift",
  "noiseDensity",
  "thermalResistance",
  "tempco",
  "length",
  "capacitance",
];

// A mathjs instance with the unit functions alone (a custom build): the pages that check
// quantities as they are typed load this, not the whole library.
const { unit: mathUnit } = create({ unitDependencies: unitDependencies as NonNullable<typeof unitDependencies> });

const referenceCache = new Map<string, Unit>();
function reference(name: string): Unit {
  let u = referenceCache.get(name);
  if (!u) {
    u = mathUnit(name);
    referenceCache.set(name, u);
  }
  return u;
}

/** mathjs gives unit("50 uA").toSI() = 4.9999…e-5: keep 12 significant digits. */
export function roundSig(value: number, digits = 12): number {
  if (value === 0 || !Number.isFinite(value)) return value;
  return Number(value.toPrecision(digits));
}

/**
 * The longest quantity text read: "-12.345678e-12 mV/rtHz" is 22 characters, so 64 leaves room
 * for any honest entry while keeping every regex and mathjs call below on short input.
 */
export const MAX_QUANTITY_CHARS = 64;

/** Spellings engineers type that mathjs does not know, rewritten to ones it does. */
function normalizeText(text: string): string {
  return text
    .trim()
    .replace(/\s+/g, " ")
    .replace(/[\u00b5\u03bc]/g, "u") // micro sign and Greek mu
    .replace(/[\u03a9\u2126]/g, "ohm") // Greek capital omega and ohm sign
    .replace(/Ohm/g, "ohm")
    .replace(/\u00b0 ?C/g, "degC")
    .replace(/\/ ?(?:\u221a|rt|sqrt ?)\(? ?Hz ?\)?/g, "/Hz^0.5");
}

export type ParseResult = { ok: true; value: number } | { ok: false; message: string };

// Each regex below has one way to match any text (no nested or adjacent repeats of the same
// characters), so it runs in time linear in the input, which the length cap keeps short anyway.
const plainNumber = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:e[+-]?\d+)?$/i;
const ratioText = /^([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:e[+-]?\d+)?) ?(%|ppm)(?: ?\/ ?(K|degC))?$/i;

/**
 * Parse a number (already SI) or a unit string into an SI number of the wanted dimension.
 * Temperatures come back in °C (the product's reference is 25 °C); "%" and "ppm" are ratios.
 */
export function parseQuantity(input: number | string, dim: Dimension, label?: string): ParseResult {
  const prefix = label ? `${label}: ` : "";
  if (typeof input === "number") {
    if (!Number.isFinite(input)) return { ok: false, message: `${prefix}${String(input)} is not a finite number` };
    return { ok: true, value: input };
  }
  if (typeof input !== "string")
    return { ok: false, message: `${prefix}expected a number or a quantity such as "150 mA"` };
  // Refused before any regex or mathjs sees it (issue 10: a long string must not stall the server).
  if (input.length > MAX_QUANTITY_CHARS)
    return {
      ok: false,
      message: `${prefix}at most ${MAX_QUANTITY_CHARS} characters (this is ${input.length}); write a number with its unit, e.g. ${example(dim)}`,
    };
  const raw = input.trim();
  if (raw === "") return { ok: false, message: `${prefix}a value is required` };
  const text = normalizeText(raw);
  if (plainNumber.test(text)) {
    const value = Number(text);
    // "1e999" reads as Infinity: refused like the number itself.
    if (!Number.isFinite(value)) return { ok: false, message: `${prefix}${raw} is not a finite number` };
    return { ok: true, value };
  }

  // Ratios: percent and parts per million, optionally per kelvin for tempcos.
  const ratio = ratioText.exec(text);
  if (ratio) {
    const scale = ratio[2] === "%" ? 1e-2 : 1e-6;
    const perKelvin = ratio[3] !== undefined;
    const value = roundSig(Number(ratio[1]) * scale);
    if (!Number.isFinite(value)) return { ok: false, message: `${prefix}${raw} is not a finite number` };
    if (dim === "fraction" && !perKelvin) return { ok: true, value };
    if (dim === "tempco" && (perKelvin || ratio[2] === "ppm")) return { ok: true, value };
    return {
      ok: false,
      message: `${prefix}${raw} is ${perKelvin ? "a temperature coefficient" : "a ratio"}, not ${dimensionWords[dim]}`,
    };
  }
  // A drift per degree Celsius is the same per kelvin; so is a rise of one degree Celsius.
  const unitText =
    dim === "temperature"
      ? text
      : dim === "temperatureRise"
        ? text.replace(/degC$/, "K")
        : text.replace(/\/ ?degC/g, "/K");
  if (dim === "temperatureRise" && /deg[FR]/.test(unitText))
    return { ok: false, message: `${prefix}write a temperature difference in K or °C (e.g. ${example(dim)})` };
  let parsed: Unit;
  try {
    parsed = mathUnit(unitText);
  } catch {
    return {
      ok: false,
      message: `${prefix}cannot read "${raw}" as ${dimensionWords[dim]} (try a number with a unit, e.g. ${example(dim)})`,
    };
  }
  const ref = referenceUnit[dim];
  const matches = ref === null ? parsed.dimensions.every((d) => d === 0) : parsed.equalBase(reference(ref));
  if (!matches) {
    const found = detectOrder.find((d) => {
      const r = referenceUnit[d];
      return r !== null && parsed.equalBase(reference(r));
    });
    const message = found
      ? `${prefix}${raw} is ${dimensionWords[found]}, not ${dimensionWords[dim]}`
      : `${prefix}${raw} has the wrong unit for ${dimensionWords[dim]}`;
    return { ok: false, message };
  }
  let value: number;
  if (dim === "temperature") {
    value = parsed.toNumber("degC");
  } else if (ref === null) {
    value = parsed.toNumber();
  } else {
    value = parsed.toSI().toNumber();
  }
  value = roundSig(value);
  if (!Number.isFinite(value)) return { ok: false, message: `${prefix}${raw} is not a finite value` };
  return { ok: true, value };
}

/** A number with no unit: a JSON number, or text holding only a number ("0.02", " 2 "). */
export function isBareNumber(input: unknown): input is number | string {
  return typeof input === "number" || (typeof input === "string" && plainNumber.test(normalizeText(input)));
}

/**
 * A field whose name says "percent" (accuracy.percent): a bare number, or text holding only a
 * number, is in percent as the name says ("2" is 2 %); text with a sign reads as in any ratio
 * field ("2 %", "20000 ppm"), so "2 %" means the same here and in drop.fraction. DEFAULTS.md.
 */
export function parsePercent(input: number | string, label?: string): ParseResult {
  const r = parseQuantity(input, "fraction", label);
  if (!r.ok) return r;
  if (isBareNumber(input)) return r;
  return { ok: true, value: roundSig(r.value * 100) };
}

function example(dim: Dimension): string {
  const examples: Record<Dimension, string> = {
    current: '"150 mA"',
    voltage: '"3.3 V"',
    resistance: '"4.7 mohm"',
    power: '"0.25 W"',
    time: '"10 us"',
    temperature: '"85 degC"',
    temperatureRise: '"85 K"',
    frequency: '"10 kHz"',
    charge: '"1 mC"',
    fraction: '"1 %"',
    tempco: '"50 ppm/K"',
    voltageDrift: '"0.1 uV/K"',
    noiseDensity: '"40 nV/rtHz"',
    thermalResistance: '"80 K/W"',
    transimpedance: '"1 V/A"',
    length: '"2.5 mm"',
    capacitance: '"100 nF"',
  };
  return examples[dim];
}

/** A zod field that accepts a number (SI) or a unit string and yields the SI number. */
export const quantity = (dim: Dimension, label: string) =>
  z
    .union([z.number(), z.string()], {
      error: (iss) =>
        iss.input === undefined || iss.input === null
          ? `${label} is required`
          : `${label}: expected a number in SI units or a quantity such as ${example(dim)}`,
    })
    .transform((input, ctx) => {
      const r = parseQuantity(input, dim, label);
      if (!r.ok) {
        ctx.addIssue({ code: "custom", message: r.message });
        return z.NEVER;
      }
      return r.value;
    });
