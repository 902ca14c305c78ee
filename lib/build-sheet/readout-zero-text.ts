// Build-sheet words for issue 14's parts: the readout's own error, the calibration the design
// counts on, and a bidirectional design's zero-current reference (the engine has the figures).
import { calibrationRemoves, readoutFigures, readoutFiguresBasis } from "@/lib/design/readout-error";
import type { Requirement } from "@/lib/design";
import type { Part } from "./part";
import * as f from "./format";

/**
 * The readout's own error as the design counts it: each figure, and for those the request leaves
 * out, that they are typical of a class of part, not stated (readout-error.ts).
 */
export function readoutErrorText(req: Requirement): string {
  const fields = readoutFigures(req.readout).map((x) => x.field);
  return readoutFiguresBasis(req.readout, fields);
}

/** The calibration row of the requirement table. */
export function calibrationText(req: Requirement): string {
  const name = {
    none: "None",
    "one-point": "One point, at zero current",
    "two-point": "Two points, zero and near full scale",
  }[req.calibration];
  // Without a calibration there is nothing to say beyond "none": keep the front page short.
  if (req.calibration === "none") return "None: every error term is counted";
  return `${name}. Takes out: ${calibrationRemoves(req.calibration)}`;
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
