// Shapes shared across the engine and the API (docs/api.md lists the routes that return them).
import type { FrontEndDetail } from "./front-end";
import type { RejectReason } from "./pair";

export type Choice = { shuntOhms: number; gain: number };

/** Exactly the /api/solve candidate fields. */
export type Candidate = {
  shuntOhms: number;
  gain: number;
  transimpedanceVPerA: number;
  burdenV: number;
  /** Current through the shunt at full load in the requirement's load model, A. */
  operatingCurrentA: number;
  /** At operatingCurrentA. */
  dissipationW: number;
  ratingW: number;
  /** Ideal output at operatingCurrentA: the zero-current level + I·R·G, V. */
  outputAtMaxV: number;
  /** Highest output the error budget allows at full load (the output constraint uses it), V. */
  outputAtMaxWorstV: number;
  lsbA: number;
  /** The smallest current step the readout can tell apart through the noise (the counts constraint uses it), A. */
  resolvableStepA: number;
  /** Below this current the output sits at its floor, offset included, A. */
  deadZoneA: number;
  offsetErrorA: number;
  errorAtMinPercent: number;
  feasible: boolean;
  pareto: boolean;
  reasons: RejectReason[];
};

export type CandidateDetail = Candidate &
  FrontEndDetail & {
    loadVoltageV: number;
    selfHeatingK: number;
    bandwidthHz: number;
    /** Steps the readout can tell apart at Imin: Imin / resolvableStepA. */
    countsAtMin: number;
    /** Hot spot of the shunt at the hottest ambient and full load, °C. */
    hotSpotC: number;
    noiseA: number;
    headroomV: number;
    errorAtTypicalPercent: number | null;
    errorAtMaxPercent: number;
    rssAtMinPercent: number;
    /** Largest worst-case error inside the accuracy band, % of reading. */
    accuracyBandPercent: number;
    lowestAccurateCurrentA: number | null;
  };
