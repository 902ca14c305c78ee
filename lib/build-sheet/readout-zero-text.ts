// Build-sheet words for issue 14's parts: the readout's own error, the calibration the design
// counts on, and a bidirectional design's zero-current reference (the engine has the figures).
import { assumedBasis, calibrationLabels, formatReadoutFigure, readoutFigures } from "@/lib/design/readout-error";
import type { Requirement } from "@/lib/design";
import type { Part } from "./part";
import * as f from "./format";

/**
 * The readout's own error as the design counts it, short enough for the front page: the stated
 * figures, then those the request leaves out as typical of a class of part, not stated.
 */
export function readoutErrorText(req: Requirement): string {
  const figures = readoutFigures(req.readout);
  const words = (stated: boolean) =>
    figures
      .filter((x) => x.stated === stated)
      .map((x) => `${x.name} ${formatReadoutFigure(x)}`)
      .join(", ");
  const stated = words(true);
  const assumed = words(false);
  if (!assumed) return `${stated} (stated)`;
  const typical = `${assumed} (${assumedBasis(req.readout.kind)})`;
  return stated ? `${stated} (stated); ${typical}` : typical;
}

/** The calibration row of the requirement table: what it takes out in a few words (the budget shows what remains). */
export function calibrationText(req: Requirement): string {
  // Without a calibration there is nothing to say beyond "none": keep the front page short.
  if (req.calibration === "none") return "None: every error term is counted";
  return calibrationLabels[req.calibration];
}

/** The zero-current reference feeding the amplifier's reference input, when the design has one. */
export function zeroLevelParts(req: Requirement): Part[] {
  const ref = req.amplifier.reference;
  if (!(ref.voltage > 0)) return [];
  return [
    {
      designator: "U2",
      part: "Zero-current reference for U1's reference input (a voltage reference, or a divider from one, buffered)",
      value: f.volts(ref.voltage),
      valueSI: ref.voltage,
      unit: "V",
      code: null,
      tolerance: `±${f.fraction(ref.tolerance)}`,
      tempco: `${f.ppmPerK(ref.tempco)} or better`,
      rating: "—",
      notes:
        `The output sits here at zero current and swings both ways (${f.amps(req.current.min)} to ${f.amps(req.current.max)}). ` +
        "Drive the reference input from a low impedance: a resistor in series with it upsets the amplifier's gain and common-mode rejection (common practice, no source).",
    },
  ];
}
