// The requirement: one zod schema shared by the API and the wizard form. It reads unit
// strings, fills every documented default (DEFAULTS.md) and checks the cross-field rules,
// putting each error on the dotted path of the field at fault.
import { z } from "zod";
import { isSeriesName, seriesNames, seriesValues, type SeriesName } from "./eseries";
import { commonFixedGains, resistorPairGains, type GainSet } from "./gains";
import { TRACE_GRID_M, traceLengths } from "./copper-trace";
import { blank, nonNegative, positive, q } from "./quantity-rules";
import {
  constructionIssues,
  normalizeConstruction,
  shuntConstructionFields,
  type ShuntConstruction,
} from "./shunt-construction";
import { parsePercent, quantity } from "./units";
import {
  adcErrorFields,
  calibrationField,
  inputFilterField,
  meterErrorFields,
  zeroReferenceField,
} from "./requirement-fields";
import {
  defaultZeroLevelV,
  isSigned,
  largestMagnitude,
  outputWindow,
  signedSpanIssues,
  type ZeroReference,
} from "./bidirectional";
import { defaultRequirementInput as startValues, loadModels, topologies, type Topology } from "./requirement-options";

// The choices and start values live in a module without zod, for screens that only list them.
export { loadModels, topologies, topologyLabels, type LoadModel, type Topology } from "./requirement-options";

/**
 * Input common-mode range by topology when the request gives none, V (from memory: typical of
 * each class, to replace with the chosen part's figures). `supply` is the amplifier's own supply.
 */
export function defaultCommonMode(topology: Topology, supply: number): { min: number; max: number } {
  switch (topology) {
    case "current-sense":
      return { min: -0.3, max: 26 }; // integrated current-sense parts commonly take 0–26 V
    case "instrumentation":
      return { min: -0.1, max: supply - 1 }; // in-amp inputs commonly stop about 1 V below the supply
    default:
      return { min: -0.1, max: supply + 0.1 }; // a rail-to-rail-input op-amp
  }
}

/** Tolerance of gain-setting resistors when the request gives none (from memory: thin-film 0.1 %). */
export const defaultGainSetTolerance = 0.001;

/**
 * Time from the current leaving a range to the switch having acted, when the request names none:
 * a MOSFET range switch driven by a window comparator and its logic acts in about 100 µs (from
 * memory). A relay takes milliseconds; a firmware decision waits for the next reading.
 */
export const RANGE_SWITCH_DELAY_S = 100e-6;

/** Largest grid the solver will sweep in one request (values × gains). */
export const maxSweepPairs = 2_000_000;

const seriesField = z
  .string({ error: "Series: expected a series name such as E96" })
  .refine(isSeriesName, {
    error: (iss) => `Series: unknown series "${String(iss.input)}"; use one of ${seriesNames.join(", ")}`,
  })
  .transform((s) => s as SeriesName);

const count = (label: string, min: number, max: number) =>
  z
    .number({ error: `${label}: expected a whole number` })
    .int({ error: `${label} must be a whole number` })
    .min(min, { error: `${label} must be at least ${min}` })
    .max(max, { error: `${label} must be at most ${max}` });

const adcReadout = z.object({
  kind: z.literal("adc"),
  bits: count("ADC resolution (bits)", 4, 32),
  fullScale: q("voltage", "ADC full scale", positive("ADC full scale")),
  // The ADC input's anti-alias corner is taken at half this (DEFAULTS.md): it bounds the noise bandwidth.
  sampleRateHz: q("frequency", "ADC sample rate", positive("ADC sample rate")).default(1000),
  ...adcErrorFields,
});
const meterReadout = z.object({
  kind: z.literal("meter"),
  fullScale: q("voltage", "Meter range full scale", positive("Meter range full scale")),
  counts: count("Meter counts", 10, 10_000_000),
  // A bench meter averages each reading; what it sees is band-limited to about this.
  bandwidthHz: q("frequency", "Meter bandwidth", positive("Meter bandwidth")).default(10),
  ...meterErrorFields,
});

const gainSetSchema = z.object({
  series: seriesField,
  min: z.number().min(1, { error: "Lowest gain must be at least 1 (a non-inverting stage)" }).default(2),
  max: z.number().max(100_000, { error: "Highest gain must be at most 100000" }).default(1000),
  tolerance: q(
    "fraction",
    "Gain-setting resistor tolerance",
    (v) => (v >= 0 && v < 0.2) || "Gain-setting resistor tolerance must be between 0 and 20 %",
  ).default(defaultGainSetTolerance),
});

const isBlankRange = (v: unknown) =>
  typeof v === "object" && v !== null && blank((v as { min?: unknown }).min) && blank((v as { max?: unknown }).max);

const group = (what: string) => ({
  error: (iss: { input?: unknown }) =>
    iss.input === undefined ? `${what} is required` : `${what}: expected an object`,
});

/** The largest current magnitude a requirement may state, A: far beyond any shunt this sizes. */
export const MAX_CURRENT_A = 1e5;
const withinCurrentLimit = (what: string) => (v: number) =>
  Math.abs(v) <= MAX_CURRENT_A || `${what} must be within ±100 kA`;

const baseSchema = z.object(
  {
    current: z.object(
      {
        // Below zero: a bidirectional span (API.md v2), read around amplifier.reference.
        min: q("current", "Minimum current", (v) =>
          v === 0
            ? "Minimum current cannot be zero: give the smallest current to read, or a negative one for a bidirectional span"
            : withinCurrentLimit("Minimum current")(v),
        ),
        max: q("current", "Maximum current", (v) =>
          v > 0 ? withinCurrentLimit("Maximum current")(v) : positive("Maximum current")(v),
        ),
        typical: quantity("current", "Typical current").optional(),
      },
      group("Current span (min and max)"),
    ),
    supply: z.object(
      {
        voltage: q("voltage", "Supply voltage", positive("Supply voltage")),
        side: z.enum(["low", "high"], { error: 'Sensing side: expected "low" or "high"' }).default("low"),
      },
      group("Supply (voltage)"),
    ),
    drop: z
      .object({
        max: q("voltage", "Allowed drop", positive("Allowed drop")).optional(),
        fraction: q(
          "fraction",
          "Allowed drop (fraction of supply)",
          (v) =>
            (v > 0 && v < 1) || 'Allowed drop as a fraction of the supply must be between 0 and 1 (e.g. 0.02 or "2 %")',
        ).optional(),
        loadMin: q("voltage", "Minimum load voltage", nonNegative("Minimum load voltage")).optional(),
      })
      .prefault({}),
    load: z
      .object({
        model: z
          .enum(loadModels, { error: `Load model: expected one of ${loadModels.join(", ")}` })
          .default("constant-current"),
      })
      .prefault({}),
    readout: z
      .discriminatedUnion("kind", [adcReadout, meterReadout], { error: 'Readout: kind must be "adc" or "meter"' })
      .prefault({ kind: "adc", bits: 12, fullScale: 2.5, sampleRateHz: 1000 }),
    resolution: z
      .object({
        countsAtMin: z
          .number()
          .positive({ error: "Counts at minimum current must be above zero" })
          .max(1e9)
          .default(10),
      })
      .prefault({}),
    accuracy: z
      .object({
        percent: z
          .union([z.number(), z.string()])
          .transform((v, ctx) => {
            const r = parsePercent(v, "Accuracy target");
            if (!r.ok) {
              ctx.addIssue({ code: "custom", message: r.message });
              return z.NEVER;
            }
            return r.value;
          })
          .check(
            z.superRefine((v: number, ctx) => {
              if (!(v > 0 && v <= 100 && Number.isFinite(v)))
                ctx.addIssue({ code: "custom", message: "Accuracy target must be above 0 % and at most 100 %" });
            }),
          )
          .default(2),
        bandMin: q("current", "Accuracy band, lowest current", positive("Accuracy band, lowest current")).optional(),
        bandMax: q("current", "Accuracy band, highest current", positive("Accuracy band, highest current")).optional(),
        crestFactor: z.number().min(0, { error: "Noise crest factor cannot be negative" }).max(10).default(3),
      })
      .prefault({}),
    temperature: z
      .object({
        min: quantity("temperature", "Lowest ambient temperature").default(0),
        max: quantity("temperature", "Highest ambient temperature").default(70),
      })
      .prefault({}),
    bandwidth: z
      .object({ min: q("frequency", "Required bandwidth", nonNegative("Required bandwidth")).default(0) })
      .prefault({}),
    shunt: z
      .object({
        series: seriesField.default("E96"),
        min: q("resistance", "Smallest shunt", positive("Smallest shunt")).default(0.001),
        max: q("resistance", "Largest shunt", positive("Largest shunt")).default(1000),
        tolerance: q(
          "fraction",
          "Shunt tolerance",
          (v) => (v >= 0 && v < 0.5) || "Shunt tolerance must be between 0 and 50 %",
        ).default(0.005),
        tempco: q("tempco", "Shunt tempco", nonNegative("Shunt tempco")).default(50e-6),
        ratings: z
          .array(q("power", "Power rating", positive("Power rating")))
          .min(1, { error: "Offer at least one power rating" })
          .default([0.1, 0.125, 0.25, 0.5, 1, 2, 3]),
        derating: z
          .number()
          .gt(0, { error: "Derating must be above 0" })
          .max(1, { error: "Derating must be at most 1" })
          .default(0.5),
        thermalResistance: q("thermalResistance", "Shunt thermal resistance", positive("Shunt thermal resistance"))
          .nullable()
          .default(null),
        ratedRise: q(
          "temperatureRise",
          "Temperature rise at full rating",
          positive("Temperature rise at full rating"),
        ).default(85),
        deratingKneeC: quantity("temperature", "Derating knee (full power up to)").default(70),
        maxTempC: quantity("temperature", "Shunt maximum temperature").default(155),
        ...shuntConstructionFields,
      })
      .prefault({}),
    inputFilter: inputFilterField,
    amplifier: z
      .object({
        gains: z
          .union([z.array(z.number().positive({ error: "Each gain must be above zero" })), gainSetSchema])
          .optional(),
        gainSet: gainSetSchema.nullable().optional(),
        offset: q("voltage", "Amplifier offset", nonNegative("Amplifier offset")).default(10e-6),
        offsetDrift: q("voltageDrift", "Offset drift", nonNegative("Offset drift")).default(0.1e-6),
        gainError: q(
          "fraction",
          "Amplifier gain error",
          (v) => (v >= 0 && v < 0.5) || "Gain error must be between 0 and 50 %",
        ).default(0.001),
        gainDrift: q("tempco", "Gain drift", nonNegative("Gain drift")).default(10e-6),
        biasCurrent: q("current", "Input bias current", nonNegative("Input bias current")).default(20e-9),
        // Left out: taken as the bias current itself, the worst a part's sheet allows when it gives none.
        offsetCurrent: z.preprocess(
          (v) => (blank(v) ? undefined : v),
          q("current", "Input offset current", nonNegative("Input offset current")).optional(),
        ),
        noiseDensity: q("noiseDensity", "Input noise density", nonNegative("Input noise density")).default(40e-9),
        gbw: q("frequency", "Gain-bandwidth", positive("Gain-bandwidth")).default(2e6),
        supply: q("voltage", "Amplifier supply", positive("Amplifier supply")).default(5),
        swingLow: q("voltage", "Lowest output (above ground)", nonNegative("Lowest output")).default(0.01),
        swingHigh: q("voltage", "Output headroom below the amplifier supply", nonNegative("Output headroom")).default(
          0.05,
        ),
        // A form's blank box means no filter, as leaving it out does.
        filterHz: z.preprocess(
          (v) => (blank(v) ? null : v),
          q("frequency", "Output filter corner", positive("Output filter corner")).nullable().default(null),
        ),
        reference: zeroReferenceField,
        cmrrDb: z.number().min(0, { error: "CMRR cannot be negative" }).max(200).default(120),
        // A form's empty choice means "by the gains": the same as leaving it out.
        topology: z.preprocess(
          (v) => (v === "" ? undefined : v),
          z.enum(topologies, { error: `Amplifier topology: expected one of ${topologies.join(", ")}` }).optional(),
        ),
        // Both ends left empty (a form's blank boxes) means the topology's usual range.
        commonMode: z.preprocess(
          (v) => (isBlankRange(v) ? undefined : v),
          z
            .object({
              min: quantity("voltage", "Lowest input common-mode voltage"),
              max: quantity("voltage", "Highest input common-mode voltage"),
            })
            .optional(),
        ),
      })
      .prefault({}),
    rangeSwitch: z
      .object({
        // Left out: sized to take a tenth of the allowed drop at full current (DEFAULTS.md).
        onResistance: q(
          "resistance",
          "Range switch on-resistance",
          nonNegative("Range switch on-resistance"),
        ).optional(),
        // How long a range change takes to act once the current leaves the range (DEFAULTS.md).
        delay: q("time", "Range switch delay", nonNegative("Range switch delay")).default(RANGE_SWITCH_DELAY_S),
      })
      .prefault({}),
    calibration: calibrationField,
    limit: z
      .number()
      .int({ error: "Limit must be a whole number" })
      .min(1, { error: "Limit must be at least 1" })
      .max(10_000, { error: "Limit must be at most 10000" })
      .default(200),
  },
  { error: "A requirement must be a JSON object" },
);

type Base = z.output<typeof baseSchema>;

/** What the API and the wizard send: numbers in SI or unit strings. */
export type RequirementInput = z.input<typeof baseSchema>;

/** Normalized: SI numbers, every default filled in, gains listed exactly as swept. */
/** Share of the allowed drop a range switch may take at full current when none is named. */
export const RANGE_SWITCH_DROP_SHARE = 0.1;

export type Requirement = Omit<Base, "drop" | "accuracy" | "amplifier" | "rangeSwitch" | "shunt"> & {
  shunt: Omit<Base["shunt"], keyof ShuntConstruction> & ShuntConstruction;
  rangeSwitch: { onResistance: number; delay: number };
  drop: { max: number; fraction?: number; loadMin?: number };
  accuracy: { percent: number; bandMin: number; bandMax: number; crestFactor: number };
  amplifier: Omit<Base["amplifier"], "gains" | "gainSet" | "topology" | "commonMode" | "reference"> & {
    reference: ZeroReference;
    gains: number[];
    gainSet: GainSet | null;
    topology: Topology;
    commonMode: { min: number; max: number };
  };
};

function dedupeSorted(gains: number[]): number[] {
  const out: number[] = [];
  for (const g of [...gains].sort((a, b) => a - b)) {
    if (out.length === 0 || Math.abs(g - (out[out.length - 1] ?? 0)) > 1e-12 * g) out.push(g);
  }
  return out;
}

/** A resistor-pair gain set makes a single-ended non-inverting stage unless the request says otherwise. */
function topologyOf(a: Base["amplifier"]): Topology {
  if (a.topology) return a.topology;
  return !Array.isArray(a.gains) && (a.gains ?? a.gainSet) ? "non-inverting" : "current-sense";
}

function gainsOf(a: Base["amplifier"]): { gains: number[]; gainSet: GainSet | null } {
  if (Array.isArray(a.gains)) return { gains: dedupeSorted(a.gains), gainSet: a.gainSet ?? null };
  const set = a.gains ?? a.gainSet ?? null;
  // A difference stage's gain is Rf/Rg; the others' 1 + Rf/Rg.
  if (set) return { gains: resistorPairGains(set, topologyOf(a) === "difference" ? 0 : 1), gainSet: set };
  return { gains: [...commonFixedGains], gainSet: null };
}

function normalize(b: Base): Requirement {
  const { max, fraction, loadMin } = b.drop;
  const fromFraction = fraction !== undefined ? fraction * b.supply.voltage : undefined;
  const dropMax =
    max !== undefined && fromFraction !== undefined
      ? Math.min(max, fromFraction)
      : (max ?? fromFraction ?? 0.02 * b.supply.voltage);
  const drop: Requirement["drop"] = { max: dropMax };
  if (fraction !== undefined) drop.fraction = fraction;
  if (loadMin !== undefined) drop.loadMin = loadMin;
  // A signed span's band is a magnitude, the same both ways (docs/model.md §3 "Signed spans").
  const top = largestMagnitude(b.current);
  const signed = isSigned(b.current);
  const bandMin = b.accuracy.bandMin ?? (signed ? 0.1 * top : Math.max(b.current.min, 0.1 * b.current.max));
  const bandMax = b.accuracy.bandMax ?? (signed ? top : b.current.max);
  const { gains: _g, gainSet: _s, topology: _t, commonMode, reference, ...amp } = b.amplifier;
  const zeroV = reference.voltage ?? defaultZeroLevelV(b.current, outputWindow(amp, b.readout.fullScale));
  const topology = topologyOf(b.amplifier);
  return {
    ...b,
    drop,
    accuracy: { percent: b.accuracy.percent, bandMin, bandMax, crestFactor: b.accuracy.crestFactor },
    shunt: normalizeConstruction({ ...b.shunt, ratings: [...b.shunt.ratings].sort((x, y) => x - y) }),
    rangeSwitch: {
      onResistance: b.rangeSwitch.onResistance ?? (RANGE_SWITCH_DROP_SHARE * dropMax) / b.current.max,
      delay: b.rangeSwitch.delay,
    },
    amplifier: {
      ...amp,
      reference: { voltage: zeroV, tolerance: reference.tolerance, tempco: reference.tempco },
      ...gainsOf(b.amplifier),
      topology,
      commonMode: commonMode ?? defaultCommonMode(topology, amp.supply),
    },
  };
}

function gainsAreSound(a: Base["amplifier"]): boolean {
  if (Array.isArray(a.gains)) return a.gains.every((g) => g > 0);
  const set = a.gains ?? a.gainSet;
  return !set || (isSeriesName(set.series) && set.min >= 1 && set.max <= 100_000);
}

function crossFieldRules(b: Base, ctx: z.RefinementCtx) {
  const issue = (path: (string | number)[], message: string) => ctx.addIssue({ code: "custom", path, message });
  const { current, supply, drop, accuracy, temperature, shunt, amplifier } = b;
  if (current.min > current.max) issue(["current", "min"], "Minimum current must not be above the maximum current");
  if (current.typical !== undefined && (current.typical < current.min || current.typical > current.max))
    issue(["current", "typical"], "Typical current must lie between the minimum and the maximum current");
  const signed = isSigned(current);
  if (!signed && current.typical !== undefined && !(current.typical > 0))
    issue(["current", "typical"], "Typical current must be above zero");
  for (const s of signedSpanIssues(
    current,
    accuracy,
    amplifier.reference,
    outputWindow(amplifier, b.readout.fullScale),
  ))
    issue(s.path, s.message);
  if (drop.max !== undefined && drop.max >= supply.voltage)
    issue(["drop", "max"], "Allowed drop must be below the supply voltage");
  if (drop.loadMin !== undefined && drop.loadMin >= supply.voltage)
    issue(["drop", "loadMin"], "Minimum load voltage must be below the supply voltage");
  const bandMin = accuracy.bandMin ?? Math.max(current.min, 0.1 * current.max);
  const bandMax = accuracy.bandMax ?? current.max;
  if (current.min <= current.max && !signed && bandMin > bandMax)
    issue(["accuracy", "bandMin"], "Accuracy band: lowest current must not be above the highest");
  if (signed && accuracy.bandMin !== undefined && accuracy.bandMax !== undefined && accuracy.bandMin > accuracy.bandMax)
    issue(["accuracy", "bandMin"], "Accuracy band: lowest current must not be above the highest");
  if (
    !signed &&
    accuracy.bandMin !== undefined &&
    (accuracy.bandMin < current.min * (1 - 1e-9) || accuracy.bandMin > current.max * (1 + 1e-9))
  )
    issue(["accuracy", "bandMin"], "Accuracy band must lie inside the current span");
  if (
    !signed &&
    accuracy.bandMax !== undefined &&
    (accuracy.bandMax < current.min * (1 - 1e-9) || accuracy.bandMax > current.max * (1 + 1e-9))
  )
    issue(["accuracy", "bandMax"], "Accuracy band must lie inside the current span");
  if (temperature.min > temperature.max)
    issue(["temperature", "min"], "Lowest ambient temperature must not be above the highest");
  if (temperature.min < -273.15) issue(["temperature", "min"], "Temperature is below absolute zero");
  if (temperature.max > 300) issue(["temperature", "max"], "Highest ambient temperature must be at most 300 °C");
  // Field-level refusals do not stop these rules from running: only check what is sound.
  for (const i of constructionIssues(shunt)) issue(i.path, i.message);
  // A copper trace's values come from its geometry (its lengths), not from the series between the bounds.
  const trace = shunt.kind === "copper-trace" ? shunt.trace : undefined;
  if (!trace && shunt.min > shunt.max) issue(["shunt", "min"], "Smallest shunt must not be above the largest");
  else if (isSeriesName(shunt.series) && shunt.min > 0 && gainsAreSound(amplifier)) {
    const n = trace
      ? traceLengths(trace.width, trace.length).length
      : seriesValues(shunt.series, shunt.min, shunt.max).length;
    if (n === 0 && !trace)
      issue(["shunt", "min"], `No ${shunt.series} value lies between the smallest and the largest shunt`);
    const g = gainsOf(amplifier).gains.length;
    if (g === 0)
      issue(
        ["amplifier", "gains"],
        "No gain to sweep: give at least one gain, or a gain range that a resistor pair can reach",
      );
    if (n * g > maxSweepPairs)
      issue(
        trace ? ["shunt", "trace", "length"] : ["shunt", "max"],
        trace
          ? `That is ${n * g} trace length and gain pairs (${n} lengths, one every ${TRACE_GRID_M * 1e3} mm); shorten the trace's longest length or give fewer gains, to at most ${maxSweepPairs}`
          : `That is ${n * g} shunt and gain pairs; narrow the shunt bounds or the gains to at most ${maxSweepPairs}`,
      );
  }
  if (Array.isArray(amplifier.gains) && amplifier.gains.length > 10_000)
    issue(["amplifier", "gains"], "At most 10000 gains");
  if (!Array.isArray(amplifier.gains) && amplifier.gains && amplifier.gains.min > amplifier.gains.max)
    issue(["amplifier", "gains", "min"], "Lowest gain must not be above the highest");
  if (amplifier.commonMode && amplifier.commonMode.min >= amplifier.commonMode.max)
    issue(["amplifier", "commonMode", "min"], "Lowest input common-mode voltage must be below the highest");
  if (shunt.deratingKneeC >= shunt.maxTempC)
    issue(["shunt", "deratingKneeC"], "Derating knee must be below the shunt's maximum temperature");
  if (amplifier.swingLow >= amplifier.supply - amplifier.swingHigh)
    issue(["amplifier", "swingLow"], "Lowest output must be below the highest output the amplifier reaches");
}

export const requirementSchema: z.ZodType<Requirement, RequirementInput> = baseSchema
  .superRefine(crossFieldRules)
  .transform(normalize);

export type FieldErrors = Record<string, string[]>;

export type ParseRequirementResult =
  { ok: true; requirement: Requirement } | { ok: false; message: string; fieldErrors: FieldErrors };

/** Zod issues as `{ "current.max": ["…"] }`, the shape the API and the form both use. */
export function issuesToFieldErrors(issues: readonly z.core.$ZodIssue[]): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of issues) {
    const path = issue.path.map(String).join(".") || "(requirement)";
    (out[path] ??= []).push(issue.message);
  }
  return out;
}

export function parseRequirement(input: unknown): ParseRequirementResult {
  const r = requirementSchema.safeParse(input);
  if (r.success) return { ok: true, requirement: r.data };
  const fieldErrors = issuesToFieldErrors(r.error.issues);
  const message = Object.entries(fieldErrors)
    .map(([path, msgs]) => `${path}: ${msgs.join("; ")}`)
    .join("\n");
  return { ok: false, message, fieldErrors };
}

/** The wizard's start values (./requirement-options), checked here against the schema's input type. */
export const defaultRequirementInput: RequirementInput = startValues;
