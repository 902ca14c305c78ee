// Shapes shared across the engine and the API (docs/api.md lists the routes that return them).
import type { RejectReason } from "./pair";

export type Choice = { shuntOhms: number; gain: number };

/** Exactly the /api/solve candidate fields. */
export type Candidate = {
  shuntOhms: number;
  gain: number;
  transimpedanceVPerA: number;
  burdenV: number;
  dissipationW: number;
  ratingW: number;
  outputAtMaxV: number;
  lsbA: number;
  offsetErrorA: number;
  errorAtMinPercent: number;
  feasible: boolean;
  pareto: boolean;
  reasons: RejectReason[];
};

export type CandidateDetail = Candidate & {
  loadVoltageV: number;
  selfHeatingK: number;
  bandwidthHz: number;
  deadZoneA: number;
  countsAtMin: number;
  noiseA: number;
  headroomV: number;
  errorAtTypicalPercent: number | null;
  errorAtMaxPercent: number;
  rssAtMinPercent: number;
  /** Largest worst-case error inside the accuracy band, % of reading. */
  accuracyBandPercent: number;
  lowestAccurateCurrentA: number | null;
};
