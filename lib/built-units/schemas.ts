// One zod schema per built-unit input, shared by the form and the routes. Readings are quantities
// ("164.2 mV", "0.1642 V" or a number in volts), read by the engine's quantity parser.
import { z } from "zod";
import { quantity } from "@/lib/design";

/** A printable serial: letters, digits and the usual separators; no control characters. */
export const serialSchema = z
  .string({ error: "Serial: expected text" })
  .trim()
  .min(1, { error: "Give the unit a serial" })
  .max(64, { error: "Serial: at most 64 characters" })
  .refine((s) => !/[\u0000-\u001f\u007f]/.test(s), { error: "Serial: no tabs, line breaks or control characters" });

export const builtOnSchema = z.iso.date({ error: "Date built: expected a date as YYYY-MM-DD" });

const positiveCurrent = quantity("current", "Test current").refine((v) => v > 0, {
  error: "Test current must be above zero",
});

export const readingSchema = z.object(
  {
    currentA: positiveCurrent,
    outputV: quantity("voltage", "Output reading"),
  },
  { error: "Each reading is an object with currentA and outputV" },
);

const readingsSchema = z
  .array(readingSchema, { error: "readings: expected a list of {currentA, outputV}" })
  .min(1, { error: "readings: give the reading at every test point" })
  .max(60, { error: "readings: at most 60" });

export const recordUnitSchema = z.object({
  serial: serialSchema,
  revision: z
    .number({ error: "revision: expected a revision number" })
    .int({ error: "revision must be a whole number" })
    .min(1, { error: "revision must be at least 1" })
    .optional(),
  builtOn: builtOnSchema.optional(),
  readings: readingsSchema,
});
export type RecordUnitBody = z.infer<typeof recordUnitSchema>;

export const editUnitSchema = z.object({
  serial: serialSchema.optional(),
  builtOn: builtOnSchema.optional(),
  readings: readingsSchema.optional(),
});
export type EditUnitBody = z.infer<typeof editUnitSchema>;

export { todayIso } from "./today";
