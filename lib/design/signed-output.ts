// Both ends of a signed span's output against the output window (issue 14, item 1): the
// +Imax end with every error that raises it against the ceiling, the −|Imin| end with every error
// that lowers it against the floor. The same model figures the `output` constraint tests
// (docs/model.md §3 "Signed spans"), so the sheet and compare show what the sweep judged.
import { buildModel, outputFloorWorstV, outputWorstV } from "./model";
import { shuntFigures } from "./pair";
import type { Requirement } from "./requirement";
import type { Choice } from "./types";

export type SignedOutputEnds = {
  /** Zero-current output level, V. */
  zeroV: number;
  /** Lowest output the amplifier reaches (its swing above ground), V. */
  floorV: number;
  /** Highest usable output: the amplifier's swing or the readout's full scale less its own errors, V. */
  ceilV: number;
  /** The positive end: the operating current at full load (the load model's), A. */
  highCurrentA: number;
  /** Its nominal output, zero level + I·R·G, V. */
  highNominalV: number;
  /** Its highest output with every error that raises it, V. */
  highWorstV: number;
  /** The negative end, current.min (below zero), A. */
  lowCurrentA: number;
  lowNominalV: number;
  /** Its lowest output with every error that lowers it, V. */
  lowWorstV: number;
  /** Room left at each end (negative: the output clips there), V. */
  highMarginV: number;
  lowMarginV: number;
  /** The drop at the negative end, |Imin|·R (a 2-terminal shunt's pads included), V. */
  lowBurdenV: number;
  /** The shunt's dissipation at the negative end, Imin²·R (Joule), W. */
  lowDissipationW: number;
};

/** Both ends of a signed span's output at a pair, worst case; null for a one-way span. */
export function signedOutputEnds(req: Requirement, choice: Choice): SignedOutputEnds | null {
  const m = buildModel(req);
  if (!m.signed) return null;
  const { shuntOhms: R, gain: G } = choice;
  const sf = shuntFigures(m, R);
  const iOp = Number.isNaN(sf.iOp) ? m.iMax : sf.iOp;
  const highWorstV = outputWorstV(m, R, G, sf.theta, iOp);
  const lowWorstV = outputFloorWorstV(m, R, G, sf.theta);
  return {
    zeroV: m.vRef,
    floorV: m.swingLow,
    ceilV: m.outCeil,
    highCurrentA: iOp,
    highNominalV: m.vRef + iOp * R * G,
    highWorstV,
    lowCurrentA: -m.iNeg,
    lowNominalV: m.vRef - m.iNeg * R * G,
    lowWorstV,
    highMarginV: m.outCeil - highWorstV,
    lowMarginV: lowWorstV - m.swingLow,
    lowBurdenV: m.iNeg * (R + m.fe.padOhms),
    lowDissipationW: m.iNeg * m.iNeg * R,
  };
}
