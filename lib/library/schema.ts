// The parts library's inputs: one zod schema per part kind, used by the API, the forms and CSV import.
// Quantities may be SI numbers or unit strings ("10 uV", "2 MHz"), as everywhere in the API.
import { z } from "zod";
import { isSeriesName, quantity, seriesNames, topologies, type Dimension } from "@/lib/design";
import { textField } from "@/lib/text-field";

export const gainModes = ["fixed", "resistor-set"] as const;
export type GainMode = (typeof gainModes)[number];

const nonNegative = (dim: Dimension, label: string) =>
  quantity(dim, label).check(
    z.superRefine((v: number, ctx) => {
      if (v < 0) ctx.addIssue({ code: "custom", message: `${label} cannot be negative` });
    }),
  );
const positive = (dim: Dimension, label: string) =>
  quantity(dim, label).check(
    z.superRefine((v: number, ctx) => {
      if (!(v > 0)) ctx.addIssue({ code: "custom", message: `${label} must be above zero` });
    }),
  );
const fractionBelowHalf = (label: string) =>
  quantity("fraction", label).check(
    z.superRefine((v: number, ctx) => {
      if (!(v >= 0 && v < 0.5))
        ctx.addIssue({ code: "custom", message: `${label} must be between 0 and 50 % (e.g. 0.001 or "0.1 %")` });
    }),
  );

const optionalVoltage = (label: string) =>
  z
    .preprocess((v) => (v === "" || v === undefined ? null : v), quantity("voltage", label).nullable())
    .optional()
    .transform((v) => v ?? null);

const partName = textField({ label: "Name", min: 1, minMessage: "Name is required", max: 120 });

export const amplifierObject = z.object({
  name: partName,
  gainMode: z.enum(gainModes, {
    error:
      'Gain mode: expected "fixed" (a list of gains) or "resistor-set" (a lowest and a highest gain set by a resistor pair)',
  }),
  gains: z
    .array(
      z
        .number({ error: "Each gain must be a number" })
        .positive({ error: "Each gain must be above zero" })
        .max(100_000, { error: "Each gain must be at most 100000" }),
      {
        error: "Gains: expected a list of numbers",
      },
    )
    .min(1, { error: "Give at least one gain" })
    .max(64, { error: "At most 64 gains" }),
  offsetV: nonNegative("voltage", "Input offset"),
  offsetDriftVPerK: nonNegative("voltageDrift", "Offset drift"),
  gainErrorFraction: fractionBelowHalf("Gain error"),
  gainDriftPerK: nonNegative("tempco", "Gain drift"),
  biasCurrentA: nonNegative("current", "Input bias current"),
  noiseDensityVPerRtHz: nonNegative("noiseDensity", "Input noise density"),
  gbwHz: positive("frequency", "Gain-bandwidth"),
  swingLowV: nonNegative("voltage", "Lowest output above ground"),
  swingHighV: nonNegative("voltage", "Output headroom below the supply"),
  cmrrDb: z
    .number({ error: "CMRR: expected a number of dB" })
    .min(0, { error: "CMRR cannot be negative" })
    .max(200, { error: "CMRR must be at most 200 dB" }),
  supplyMinV: positive("voltage", "Lowest supply"),
  supplyMaxV: positive("voltage", "Highest supply"),
  topology: z
    .enum(topologies, { error: `Topology: expected one of ${topologies.join(", ")}` })
    .default("current-sense"),
  // Blank: the topology's usual range (lib/design DEFAULTS.md).
  commonModeMinV: optionalVoltage("Lowest input common-mode voltage"),
  commonModeMaxV: optionalVoltage("Highest input common-mode voltage"),
});

function amplifierRules(a: z.output<typeof amplifierObject>, ctx: z.RefinementCtx) {
  if (a.supplyMinV > a.supplyMaxV)
    ctx.addIssue({
      code: "custom",
      path: ["supplyMaxV"],
      message: "Highest supply must not be below the lowest supply",
    });
  if (a.gainMode === "resistor-set") {
    if (a.gains.length !== 2)
      ctx.addIssue({
        code: "custom",
        path: ["gains"],
        message: "A resistor-set gain takes two numbers: the lowest and the highest gain",
      });
    else if (a.gains[0]! < 1 || a.gains[0]! > a.gains[1]!)
      ctx.addIssue({
        code: "custom",
        path: ["gains"],
        message: "Resistor-set gains: the lowest must be at least 1 and not above the highest",
      });
  }
  if ((a.commonModeMinV === null) !== (a.commonModeMaxV === null))
    ctx.addIssue({
      code: "custom",
      path: [a.commonModeMinV === null ? "commonModeMinV" : "commonModeMaxV"],
      message: "Give both ends of the common-mode range, or neither (the topology's usual range)",
    });
  else if (a.commonModeMinV !== null && a.commonModeMaxV !== null && a.commonModeMinV >= a.commonModeMaxV)
    ctx.addIssue({
      code: "custom",
      path: ["commonModeMaxV"],
      message: "Highest common-mode voltage must be above the lowest",
    });
  if (a.swingLowV + a.swingHighV >= a.supplyMinV)
    ctx.addIssue({
      code: "custom",
      path: ["swingLowV"],
      message: "The output swing limits leave no room at the lowest supply",
    });
}

export const amplifierInput = amplifierObject.superRefine(amplifierRules);
export const amplifierPatch = amplifierObject.partial().extend({ updatedAt: z.string().optional() });
export type AmplifierInput = z.input<typeof amplifierInput>;
export type AmplifierValues = z.output<typeof amplifierInput>;

export const shuntObject = z.object({
  name: partName,
  series: z.string({ error: "Series: expected a series name such as E96" }).refine(isSeriesName, {
    error: (iss) => `Series: unknown series "${String(iss.input)}"; use one of ${seriesNames.join(", ")}`,
  }),
  minOhms: positive("resistance", "Smallest value"),
  maxOhms: positive("resistance", "Largest value"),
  toleranceFraction: fractionBelowHalf("Tolerance"),
  tempcoPerK: nonNegative("tempco", "Tempco"),
  ratingsW: z
    .array(positive("power", "Power rating"), { error: "Power ratings: expected a list" })
    .min(1, { error: "Give at least one power rating" })
    .max(32, { error: "At most 32 power ratings" }),
  fourTerminal: z.boolean({ error: "4-terminal: expected yes or no" }),
});

function shuntRules(s: z.output<typeof shuntObject>, ctx: z.RefinementCtx) {
  if (s.minOhms > s.maxOhms)
    ctx.addIssue({ code: "custom", path: ["maxOhms"], message: "Largest value must not be below the smallest value" });
}

export const shuntInput = shuntObject.superRefine(shuntRules);
export const shuntPatch = shuntObject.partial().extend({ updatedAt: z.string().optional() });
export type ShuntInput = z.input<typeof shuntInput>;
export type ShuntValues = z.output<typeof shuntInput>;

/** Re-checks a part after a PATCH merged its fields into the stored ones. */
export const checkAmplifier = (merged: unknown) => amplifierInput.safeParse(merged);
export const checkShunt = (merged: unknown) => shuntInput.safeParse(merged);

// Readouts (issue 14): an ADC or a meter range, under the requirement's readout field names (API.md v2)
// so a part maps onto `readout` one to one. Every error figure is required: a library part states
// its data sheet, where a request that leaves a figure out is read as an ideal readout.
const wholeNumber = (label: string, min: number, max: number) =>
  z
    .number({ error: `${label}: expected a whole number` })
    .int({ error: `${label} must be a whole number` })
    .min(min, { error: `${label} must be at least ${min}` })
    .max(max, { error: `${label} must be at most ${max}` });
const lsb = (label: string) =>
  z
    .number({ error: `${label}: expected a number of LSB` })
    .min(0, { error: `${label} cannot be negative` })
    .max(1e6, { error: `${label} must be at most 1000000 LSB` });
const ratioBelow = (label: string, max: number) =>
  quantity("fraction", label).check(
    z.superRefine((v: number, ctx) => {
      if (!(v >= 0 && v < max))
        ctx.addIssue({ code: "custom", message: `${label} must be between 0 and ${max * 100} % (e.g. "0.1 %")` });
    }),
  );
const group = (label: string) => ({
  error: (iss: { input?: unknown }) =>
    iss.input === undefined ? `${label} is required` : `${label}: expected an object`,
});

export const adcObject = z.object({
  name: partName,
  // The engine's own limits on a readout (lib/design/requirement.ts), so every part fits a design.
  bits: wholeNumber("ADC resolution (bits)", 4, 32),
  fullScale: positive("voltage", "ADC full scale"),
  sampleRateHz: positive("frequency", "Highest sample rate"),
  reference: z.object(
    {
      tolerance: ratioBelow("Reference tolerance", 0.2),
      tempco: nonNegative("tempco", "Reference tempco"),
    },
    group("Reference"),
  ),
  offsetLsb: lsb("Offset error"),
  gainError: ratioBelow("Gain error", 0.2),
  inlLsb: lsb("Integral nonlinearity (INL)"),
});
export const adcInput = adcObject;
export const adcPatch = adcObject
  .extend({ reference: adcObject.shape.reference.partial().optional() })
  .partial()
  .extend({ updatedAt: z.string().optional() });
export type AdcInput = z.input<typeof adcInput>;
export type AdcValues = z.output<typeof adcInput>;

export const meterObject = z.object({
  name: partName,
  fullScale: positive("voltage", "Range full scale"),
  counts: wholeNumber("Counts", 10, 10_000_000),
  accuracy: z.object(
    {
      percentOfReading: ratioBelow("Accuracy, % of reading", 0.5),
      digits: z
        .number({ error: "Accuracy, digits: expected a number of counts" })
        .min(0, { error: "Accuracy, digits cannot be negative" })
        .max(1e6, { error: "Accuracy, digits must be at most 1000000" }),
    },
    group("Accuracy"),
  ),
});
export const meterInput = meterObject;
export const meterPatch = meterObject
  .extend({ accuracy: meterObject.shape.accuracy.partial().optional() })
  .partial()
  .extend({ updatedAt: z.string().optional() });
export type MeterInput = z.input<typeof meterInput>;
export type MeterValues = z.output<typeof meterInput>;

export type PartKind = "amplifiers" | "shunts" | "adcs" | "meters";
export const partKinds = ["amplifiers", "shunts", "adcs", "meters"] as const;

/** A whole file's parts of one kind, each row checked against its kind's schema. */
export type ImportedParts =
  | { kind: "amplifiers"; rows: AmplifierValues[] }
  | { kind: "shunts"; rows: ShuntValues[] }
  | { kind: "adcs"; rows: AdcValues[] }
  | { kind: "meters"; rows: MeterValues[] };
