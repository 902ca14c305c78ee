// The model's figures for issue 14's terms, computed once per requirement: a signed span (its
// second direction and the zero-current level), the readout's own error, and what a
// calibration leaves of each (docs/model.md §3). For a one-way span with a zero level of 0 and an
// ideal readout these are exact zeros and ones, so the sweep's arithmetic is today's.
import { isSigned, zeroLevelDriftV, zeroLevelErrorV } from "./bidirectional";
import { calibrationKeeps, readoutErrors, type ReadoutErrors } from "./readout-error";
import type { Requirement } from "./requirement";

export type ReadoutSignedFields = {
  /** Smallest current of interest: current.min, or a signed span's accuracy-band low end, A. */
  iMin: number;
  /** Highest usable output: the amplifier's swing, or the readout's full scale less its own worst errors, V. */
  outCeil: number;
  /** A signed span (current.min < 0). */
  signed: boolean;
  /** The negative direction's largest magnitude, |current.min| (0: one way), A. */
  iNeg: number;
  /** Zero-current output level, V. */
  vRef: number;
  /** Its worst deviation over the ambient range (tolerance and tempco), V at the output. */
  refErrV: number;
  /** Below this the output is stuck at its floor at zero current: swingLow − vRef, at least 0 (0 for a signed span), V. */
  deadFloorV: number;
  /** The readout's figures (step, reference, gain, offset, INL, quantisation). */
  read: ReadoutErrors;
  /**
   * Accuracy only (after calibration): the current- and gain-independent gain-type ratio
   * (amplifier, shunt, readout), the error at the output that is not the amplifier's (readout
   * quantisation, offset, INL, the zero level), and what is kept of the amplifier's 25 °C offsets
   * (Vos, bias, common mode) and of the gain-setting resistors' error (1 or 0).
   */
  accGainConst: number;
  accOutV: number;
  /** The zero level's part of accOutV: its error, or only its drift after a calibration, V. */
  accRefV: number;
  accOffKeep: number;
  accEpsKeep: number;
};

export function readoutSignedFields(req: Requirement, dTamb: number): ReadoutSignedFields {
  const a = req.amplifier;
  const s = req.shunt;
  const signed = isSigned(req.current);
  const read = readoutErrors(req.readout, dTamb);
  const keep = calibrationKeeps(req.calibration);
  const adc = req.readout.kind === "adc";
  const ref = a.reference;
  const refErrV = zeroLevelErrorV(ref, dTamb);
  const ampCeil = a.supply - a.swingHigh;
  // An ADC reaches its last code early when its reference is low, its gain high or its offset up.
  const readCeil = adc
    ? req.readout.fullScale * (1 - read.refTol - read.refDrift - read.gain) - read.offsetV
    : req.readout.fullScale;
  const accRefV = keep.offset ? refErrV : zeroLevelDriftV(ref, dTamb);
  return {
    iMin: signed ? req.accuracy.bandMin : req.current.min,
    outCeil: Math.min(readCeil, ampCeil),
    signed,
    iNeg: signed ? -req.current.min : 0,
    vRef: ref.voltage,
    refErrV,
    deadFloorV: signed ? 0 : Math.max(0, a.swingLow - ref.voltage),
    read,
    accGainConst:
      keep.gain * (a.gainError + s.tolerance + read.refTol + (adc ? read.gain : 0)) +
      s.tempco * dTamb +
      a.gainDrift * dTamb +
      read.refDrift +
      (adc ? 0 : read.gain),
    accOutV: read.quantV + read.inlV + keep.offset * read.offsetV + accRefV,
    accRefV,
    accOffKeep: keep.offset,
    accEpsKeep: keep.gain,
  };
}
