// Figures that go to the browser only to be drawn or printed, cut to the digits a screen can show.
// A double prints with up to 17 significant digits ("0.6000000000000001"); a chart 600 px wide
// resolves about three, and figures print with three (formatSI). The design page sent 18 KB of
// curves and budgets that way and the compare page 14 KB.

/** Significant digits kept: a hundred times finer than a screen's 600 px or formatSI's three digits. */
export const DISPLAY_DIGITS = 5;

/**
 * `value` with every finite number in it rounded to `digits` significant digits; strings, booleans,
 * null, zero and non-finite numbers as they are. Plain data only (arrays and plain objects).
 */
export function toDisplayDigits<T>(value: T, digits = DISPLAY_DIGITS): T {
  if (typeof value === "number")
    return (Number.isFinite(value) && value !== 0 ? Number(value.toPrecision(digits)) : value) as T;
  if (Array.isArray(value)) return value.map((v) => toDisplayDigits(v, digits)) as T;
  if (value !== null && typeof value === "object")
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, toDisplayDigits(v, digits)])) as T;
  return value;
}
