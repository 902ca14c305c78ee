// The wizard's own input layer: spellings engineers type that the engine's parser does not take,
// rewritten before parsing — a real minus sign, "C" or "degC" for Celsius, a lower-case unit letter
// ("5ua", "60 mv"). Only the unit the field expects is rewritten, so "5 C" in a current field is
// still refused as a charge.

/** The base unit a field's bare number is read in (shown beside the box), or "ratio" for shares. */
export type BaseUnit = "A" | "V" | "Ω" | "W" | "Hz" | "°C" | "V/K" | "V/√Hz" | "ratio" | "1/K" | "m" | "F" | "K";

const num = String.raw`[+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?`;
const prefixes = "pnuµμmkMG";

export function normaliseTyped(v: unknown, unit?: BaseUnit): unknown {
  if (typeof v !== "string") return v;
  // U+2212 minus, figure dash, en dash; no-break spaces.
  let t = v.replace(/[\u2212\u2012\u2013]/g, "-").replace(/[\u00a0\u202f]/g, " ");
  if (unit === "°C") {
    const m = new RegExp(String.raw`^\s*(${num})\s*(?:°\s*C|deg\s*C|C|celsius)\s*$`, "i").exec(t);
    if (m) t = `${m[1]} °C`;
  } else if (unit === "A" || unit === "V" || unit === "W") {
    const m = new RegExp(String.raw`^\s*(${num})\s*([${prefixes}]?)(${unit})\s*$`, "i").exec(t);
    if (m && m[3]) t = `${m[1]} ${m[2]}${unit}`;
  } else if (unit === "Hz") {
    const m = new RegExp(String.raw`^\s*(${num})\s*([${prefixes}]?)hz\s*$`, "i").exec(t);
    if (m) t = `${m[1]} ${m[2]}Hz`;
  }
  return t;
}

/** Whether the text is a bare number, read in the field's base unit. */
export const isBareNumber = (v: unknown) =>
  typeof v === "string" && new RegExp(String.raw`^\s*${num}\s*$`, "i").test(v.replace(/\u2212/g, "-"));
