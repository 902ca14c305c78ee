// Quantity fields with a sign rule, shared by every part of the requirement schema.
import { z } from "zod";
import { quantity } from "./units";

export const positive = (label: string) => (v: number) => v > 0 || `${label} must be above zero`;
export const nonNegative = (label: string) => (v: number) => v >= 0 || `${label} cannot be negative`;

/** A quantity field with a sign rule; the rule's message lands on the field's own path. */
export function q(dim: Parameters<typeof quantity>[0], label: string, rule: (v: number) => true | string) {
  return quantity(dim, label).check(
    z.superRefine((v: number, ctx) => {
      const r = rule(v);
      if (r !== true) ctx.addIssue({ code: "custom", message: r });
    }),
  );
}

/** A form's blank box: left out, null, or only spaces. */
export const blank = (v: unknown) => v === undefined || v === null || (typeof v === "string" && v.trim() === "");
