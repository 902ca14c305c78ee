// The requirement's optional parts as zod fields (the ADC's and meter's own errors, the calibration,
// the zero-current level, the input filter), kept apart from their physics so a screen that only
// needs a default or a formula does not load the schema library and the unit parser.
import "./zod-jitless";
import { z } from "zod";
import { DEFAULT_ZERO_REFERENCE } from "./bidirectional";
import { DEFAULT_FILTER_TOLERANCE } from "./input-filter";
import { blank, positive, q } from "./quantity-rules";
import { calibrations } from "./readout-error";
import { quantity } from "./units";

const ratio = (label: string, max: number) =>
  quantity("fraction", label).check(
    z.superRefine((v: number, ctx) => {
      if (!(v >= 0 && v < max))
        ctx.addIssue({ code: "custom", message: `${label} must be between 0 and ${max * 100} %` });
    }),
  );
const nonNegative = (dim: Parameters<typeof quantity>[0], label: string) =>
  quantity(dim, label).check(
    z.superRefine((v: number, ctx) => {
      if (!(v >= 0)) ctx.addIssue({ code: "custom", message: `${label} cannot be negative` });
    }),
  );
const lsb = (label: string) =>
  z
    .number({ error: `${label}: expected a number of LSB` })
    .min(0, { error: `${label} cannot be negative` })
    .max(1e6, { error: `${label} must be at most 1000000 LSB` });

/** The ADC fields of API.md v2, spread into the ADC readout's schema. */
export const adcErrorFields = {
  reference: z
    .object({
      tolerance: ratio("ADC reference tolerance", 0.2).optional(),
      tempco: nonNegative("tempco", "ADC reference tempco").optional(),
    })
    .optional(),
  offsetLsb: lsb("ADC offset").optional(),
  gainError: ratio("ADC gain error", 0.2).optional(),
  inlLsb: lsb("ADC INL").optional(),
};

/** The meter's accuracy of API.md v2, spread into the meter readout's schema. */
export const meterErrorFields = {
  accuracy: z
    .object({
      percentOfReading: ratio("Meter accuracy, % of reading", 0.5).optional(),
      digits: z
        .number({ error: "Meter accuracy, digits: expected a number of counts" })
        .min(0, { error: "Meter accuracy, digits cannot be negative" })
        .max(1e6, { error: "Meter accuracy, digits must be at most 1000000" })
        .optional(),
    })
    .optional(),
};

export const calibrationField = z
  .enum(calibrations, { error: `Calibration: expected one of ${calibrations.join(", ")}` })
  .default("none");

/** `amplifier.reference` (API.md v2). Voltage left out: placed by `defaultZeroLevelV`. */
export const zeroReferenceField = z
  .object({
    voltage: z.preprocess(
      (v) => (v === "" || v === null ? undefined : v),
      quantity("voltage", "Zero-current output level")
        .check(
          z.superRefine((v: number, ctx) => {
            if (!(v >= 0)) ctx.addIssue({ code: "custom", message: "Zero-current output level cannot be negative" });
          }),
        )
        .optional(),
    ),
    tolerance: quantity("fraction", "Zero-level tolerance")
      .check(
        z.superRefine((v: number, ctx) => {
          if (!(v >= 0 && v < 0.2))
            ctx.addIssue({ code: "custom", message: "Zero-level tolerance must be between 0 and 20 %" });
        }),
      )
      .default(DEFAULT_ZERO_REFERENCE.tolerance),
    tempco: quantity("tempco", "Zero-level tempco")
      .check(
        z.superRefine((v: number, ctx) => {
          if (!(v >= 0)) ctx.addIssue({ code: "custom", message: "Zero-level tempco cannot be negative" });
        }),
      )
      .default(DEFAULT_ZERO_REFERENCE.tempco),
  })
  .prefault({});

export const inputFilterField = z.preprocess(
  (v) =>
    blank(v) ||
    (typeof v === "object" &&
      v !== null &&
      blank((v as { resistance?: unknown }).resistance) &&
      blank((v as { capacitance?: unknown }).capacitance))
      ? null
      : v,
  z
    .object(
      {
        resistance: q("resistance", "Input filter resistor (each leg)", positive("Input filter resistor")),
        capacitance: q("capacitance", "Input filter capacitor (each leg)", positive("Input filter capacitor")),
        tolerance: z.preprocess(
          (v) => (blank(v) ? undefined : v),
          q(
            "fraction",
            "Input filter resistor tolerance",
            (v) => (v >= 0 && v < 0.2) || "Input filter resistor tolerance must be between 0 and 20 %",
          ).default(DEFAULT_FILTER_TOLERANCE),
        ),
      },
      { error: "Input filter: expected an object with resistance and capacitance (each leg)" },
    )
    .nullable()
    .default(null),
);
