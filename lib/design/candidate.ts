// One candidate's figures (docs/model.md §3), in the API's field names.
import { errorAtWith, lowestAccurateCurrent } from "./error-budget";
import {
  type Model,
  buildModel,
  deadZoneA,
  largestRating,
  noiseRmsA,
  operatingBurden,
  outputWorstV,
  resolvableStepA,
  signalBandwidth,
} from "./model";
import { frontEndDetail } from "./front-end";
import { pairMask, reasonsOf, shuntFigures } from "./pair";
import type { Requirement } from "./requirement";
import { sweepValues } from "./sweep";
import type { Candidate, CandidateDetail, Choice } from "./types";

export { rejectReasonLabels, rejectReasons, type RejectReason } from "./pair";

/** The API fields of a pair, from the model. `pareto` is left false for the solver to set. */
export function candidateFigures(m: Model, R: number, G: number): Candidate {
  const { mask, errMinRatio, sf } = pairMask(m, R, G);
  const rg = R * G;
  // No operating point (a constant-power load that cannot be fed through R): report at Imax.
  const iOp = Number.isNaN(sf.iOp) ? m.iMax : sf.iOp;
  return {
    shuntOhms: R,
    gain: G,
    transimpedanceVPerA: rg,
    // A 2-terminal shunt's pads are in the load's path too. A signed span drops and heats most in
    // its larger direction (the charger's current may exceed the load's): both are taken there.
    burdenV: Math.max(m.iMax, m.iNeg) * (R + m.fe.padOhms),
    operatingCurrentA: iOp,
    dissipationW: Math.max(iOp, m.iNeg) ** 2 * R,
    ratingW: Number.isNaN(sf.rating) ? largestRating(m) : sf.rating,
    // The output rides on the zero-current level (0 V unless the stage is referenced, as a signed span's is).
    outputAtMaxV: m.vRef + iOp * rg,
    outputAtMaxWorstV: outputWorstV(m, R, G, sf.theta, iOp),
    lsbA: m.lsbV / rg,
    resolvableStepA: resolvableStepA(m, R, G),
    deadZoneA: deadZoneA(m, R, G),
    offsetErrorA: m.vosRef / R,
    errorAtMinPercent: 100 * errMinRatio,
    feasible: mask === 0,
    pareto: false,
    reasons: reasonsOf(mask),
  };
}

export function evaluateCandidate(req: Requirement, choice: Choice): CandidateDetail {
  return candidateDetailWith(req, buildModel(req), choice);
}

/**
 * A pair's full figures on a given model: the requirement's own, or one range's sub-span of a
 * range plan (its switch in series, so the load voltage counts it; the typical current only
 * when it falls inside the span).
 */
export function candidateDetailWith(req: Requirement, m: Model, choice: Choice): CandidateDetail {
  const { shuntOhms: R, gain: G } = choice;
  const base = candidateFigures(m, R, G);
  const sf = shuntFigures(m, R);
  const burdenOp = operatingBurden(m, R + m.switchOhms + m.fe.padOhms);
  const pct = (I: number) => errorAtWith(req, m, choice, I).worstPercent;
  const t = req.current.typical;
  const typical = t !== undefined && t >= m.iMin && t <= m.iMax ? t : undefined;
  return {
    ...base,
    loadVoltageV: Number.isNaN(burdenOp) ? 0 : m.vBus - burdenOp,
    selfHeatingK: base.dissipationW * sf.theta,
    bandwidthHz: signalBandwidth(m, G),
    countsAtMin: m.iMin / base.resolvableStepA,
    hotSpotC: m.tAmbMax + base.dissipationW * sf.theta,
    noiseA: noiseRmsA(m, R, G),
    headroomV: m.outCeil - base.outputAtMaxV,
    errorAtTypicalPercent: typical === undefined ? null : pct(typical),
    errorAtMaxPercent: pct(m.iMax),
    rssAtMinPercent: errorAtWith(req, m, choice, m.iMin).rssPercent,
    accuracyBandPercent: Math.max(pct(m.bandLo), pct(m.bandHi)),
    lowestAccurateCurrentA: lowestAccurateCurrent(req, m, choice),
    ...frontEndDetail(req, m.fe, R),
  };
}

/** Whether the pair is one the requirement's sweep examines. */
export function isInSweep(req: Requirement, choice: Choice): boolean {
  return shuntInSweep(req, choice.shuntOhms) && gainInSweep(req, choice.gain);
}

/** A shunt value the sweep examines: an E-series value, or a copper trace's geometry (sweepValues). */
export function shuntInSweep(req: Requirement, R: number): boolean {
  if (!Number.isFinite(R)) return false;
  return sweepValues(req).some((v) => Math.abs(v - R) <= 1e-9 * v);
}

export function gainInSweep(req: Requirement, G: number): boolean {
  return Number.isFinite(G) && req.amplifier.gains.some((g) => Math.abs(g - G) <= 1e-9 * g);
}
