// Error-budget sources of issue 14's terms: the readout's own error and a zero-current level.
// Each is [source, error before calibration (A), share the calibration keeps]; only the sources
// that apply to this readout and span are listed (docs/model.md §3).
import type { Model } from "./model";
import { readoutFiguresBasis } from "./readout-error";
import type { Requirement } from "./requirement";

export type ReadoutSignedSource = "readoutReference" | "readoutGain" | "readoutOffset" | "readoutInl" | "zeroLevel";

export const readoutSignedLabels: Record<ReadoutSignedSource, string> = {
  readoutReference: "ADC reference (tolerance and tempco)",
  readoutGain: "Readout gain error (ADC; a meter's % of reading)",
  readoutOffset: "ADC offset",
  readoutInl: "ADC integral nonlinearity (INL)",
  zeroLevel: "Zero-current output level (tolerance and tempco)",
};

export function readoutSignedTerms(
  req: Requirement,
  m: Model,
  rg: number,
  I: number,
): [ReadoutSignedSource, number, number][] {
  const r = m.read;
  const out: [ReadoutSignedSource, number, number][] = [];
  // A figure the request leaves out is read with its class's typical figure (readout-error.ts).
  if (req.readout.kind === "adc") {
    // Two points take out the reference's tolerance, never its drift with temperature.
    const ref = r.refTol + r.refDrift;
    out.push(["readoutReference", I * ref, ref > 0 ? (m.accEpsKeep * r.refTol + r.refDrift) / ref : 1]);
    out.push(["readoutGain", I * r.gain, m.accEpsKeep]);
    out.push(["readoutOffset", r.offsetV / rg, m.accOffKeep]);
    out.push(["readoutInl", r.inlV / rg, 1]);
  } else {
    // A meter's stated accuracy is a band over its own conditions: no calibration here removes it.
    out.push(["readoutGain", I * r.gain, 1]);
  }
  if (m.vRef > 0) {
    // A one-point calibration takes out the level's tolerance, never its drift.
    out.push(["zeroLevel", m.refErrV / rg, m.refErrV > 0 ? m.accRefV / m.refErrV : 1]);
  }
  return out;
}

/** The readout's own sources: they act on the reading, not on the amplifier's output voltage. */
export const readoutOwnSources: readonly string[] = ["readoutReference", "readoutGain", "readoutOffset", "readoutInl"];

/** The requirement's fields behind each of the readout's budget lines (a meter's digits are in its step line). */
const readoutLineFields: Record<"adc" | "meter", Partial<Record<string, readonly string[]>>> = {
  adc: {
    readoutReference: ["readout.reference.tolerance", "readout.reference.tempco"],
    readoutGain: ["readout.gainError"],
    readoutOffset: ["readout.offsetLsb"],
    readoutInl: ["readout.inlLsb"],
  },
  meter: { readoutGain: ["readout.accuracy.percentOfReading"], readout: ["readout.accuracy.digits"] },
};

/** Worked out once per readout: the budget is asked at many currents (a bisection, a curve). */
const basisCache = new WeakMap<Requirement["readout"], Partial<Record<string, string>>>();

/**
 * The figures behind each of the readout's budget lines and whether the request states them
 * ("±2 LSB, typical of …, not stated"), by source; lines that are not the readout's own error are absent.
 */
export function readoutLineBases(req: Requirement): Partial<Record<string, string>> {
  const cached = basisCache.get(req.readout);
  if (cached) return cached;
  const fields = readoutLineFields[req.readout.kind];
  const bases = Object.fromEntries(
    Object.entries(fields).map(([source, f]) => [source, readoutFiguresBasis(req.readout, f ?? [])]),
  );
  basisCache.set(req.readout, bases);
  return bases;
}
