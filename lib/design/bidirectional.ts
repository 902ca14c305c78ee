// Bidirectional spans (issue 14, item 1): a span whose current.min is below zero is read around
// a zero-current output level, amplifier.reference, whose own error is an offset source.
// docs/model.md §3 "Signed spans" states the meaning of each constraint for such a span.

/**
 * The zero-current level's error when the request gives none (from memory): a level divided
 * down from a precision reference with 0.1 % resistors and buffered, ±0.2 % and 25 ppm/K.
 */
export const DEFAULT_ZERO_REFERENCE = { tolerance: 0.002, tempco: 25e-6 } as const;

export type ZeroReference = { voltage: number; tolerance: number; tempco: number };

/** A span is signed when its lowest current is below zero (API.md v2). */
export function isSigned(current: { min: number }): boolean {
  return current.min < 0;
}

/** The output window: the amplifier's floor and the lower of its ceiling and the readout's full scale, V. */
export function outputWindow(a: { supply: number; swingLow: number; swingHigh: number }, fullScaleV: number) {
  return { floorV: a.swingLow, ceilV: Math.min(fullScaleV, a.supply - a.swingHigh) };
}

/**
 * Where the zero-current level goes when the request leaves it out, V: a signed span's window
 * split in proportion to the two directions' largest currents, floor + (ceiling − floor)·|Imin|/
 * (|Imin| + Imax), so both reach their end of the window at the same gain; 0 for a one-way span.
 */
export function defaultZeroLevelV(current: { min: number; max: number }, window: { floorV: number; ceilV: number }) {
  if (!isSigned(current)) return 0;
  const neg = -current.min;
  return window.floorV + ((window.ceilV - window.floorV) * neg) / (neg + current.max);
}

/** Worst deviation of the zero-current level from its nominal over the ambient range, V. */
export function zeroLevelErrorV(ref: ZeroReference, dTamb: number): number {
  return ref.voltage * (ref.tolerance + ref.tempco * dTamb);
}

/** The part of it a one-point calibration at 25 °C cannot take out (the drift), V. */
export function zeroLevelDriftV(ref: ZeroReference, dTamb: number): number {
  return ref.voltage * ref.tempco * dTamb;
}

/** The largest current magnitude either way, A. */
export function largestMagnitude(current: { min: number; max: number }): number {
  return Math.max(Math.abs(current.min), Math.abs(current.max));
}

/**
 * Currents for a chart over a signed span: log-spaced magnitudes each way from `lowA` to that
 * direction's end, negative ones first (ascending overall). Zero itself has no "% of reading".
 */
export function signedSpanCurrents(minA: number, maxA: number, lowA: number, perSide: number): number[] {
  const side = (end: number) => {
    if (!(end > lowA)) return [end];
    const n = Math.max(2, perSide);
    const r = end / lowA;
    return Array.from({ length: n }, (_, k) => (k === n - 1 ? end : lowA * r ** (k / (n - 1))));
  };
  const neg = minA < 0 ? side(-minA).map((x) => -x) : [];
  return [...neg.reverse(), ...side(maxA)];
}

/** Cross-field rules of a signed span, each on its field's path. */
export function signedSpanIssues(
  current: { min: number; max: number; typical?: number },
  accuracy: { bandMin?: number; bandMax?: number },
  ref: { voltage?: number },
  window: { floorV: number; ceilV: number },
): { path: string[]; message: string }[] {
  const out: { path: string[]; message: string }[] = [];
  if (!isSigned(current)) {
    if (ref.voltage !== undefined && ref.voltage >= window.ceilV)
      out.push({
        path: ["amplifier", "reference", "voltage"],
        message: "Zero-current output level must be below the top of the output window",
      });
    return out;
  }
  if (!(current.max > 0))
    out.push({
      path: ["current", "max"],
      message:
        "Maximum current must be above zero in a bidirectional span (a span that only runs one way is given positive)",
    });
  if (current.typical !== undefined && current.typical === 0)
    out.push({ path: ["current", "typical"], message: "Typical current cannot be zero (no % of reading there)" });
  const top = largestMagnitude(current);
  for (const k of ["bandMin", "bandMax"] as const) {
    const v = accuracy[k];
    if (v !== undefined && !(v > 0 && v <= top * (1 + 1e-9)))
      out.push({
        path: ["accuracy", k],
        message:
          "In a bidirectional span the accuracy band is a magnitude: above zero and at most the larger end of the span",
      });
  }
  if (ref.voltage !== undefined && !(ref.voltage > window.floorV && ref.voltage < window.ceilV))
    out.push({
      path: ["amplifier", "reference", "voltage"],
      message:
        "Zero-current output level must lie inside the output window (above the amplifier's lowest output, below the full scale)",
    });
  return out;
}

/** Nominal output of a referenced stage at signed current I, V: zero level + I·R·G (the stage's transfer). */
export function signedOutputV(zeroV: number, transimpedanceVPerA: number, currentA: number): number {
  return zeroV + currentA * transimpedanceVPerA;
}
