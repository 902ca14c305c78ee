// The error-budget sources the front end's construction adds (issue 14 items 3–5). Each is
// listed only where the design has it: a filter, a 2-terminal shunt, a thermal EMF.
import { filterCmErrorV, padShare, type FrontEnd } from "./front-end";

export const frontEndSources = ["inputFilterBias", "inputFilterResistors", "shuntPads", "thermalEmf"] as const;
export type FrontEndSource = (typeof frontEndSources)[number];

export const frontEndSourceLabels: Record<FrontEndSource, string> = {
  inputFilterBias: "Input filter: bias and offset current through its resistors",
  inputFilterResistors: "Input filter resistors in the difference stage (gain and CMRR)",
  shuntPads: "Pads and solder of a 2-terminal shunt (with copper's tempco)",
  thermalEmf: "Thermal EMF at the shunt's joints",
};

/**
 * A front-end term at current I: `errorA` before calibration, and `keptA` what a calibration
 * keeping `gainKeep` of the gain-type and `offKeep` of the offset-type errors leaves of it.
 */
export type FrontEndTerm = {
  source: FrontEndSource;
  errorA: number;
  keptA: (gainKeep: number, offKeep: number) => number;
};

/**
 * The front end's terms at current I through R at gain G, A; the kept sums are what model.ts adds
 * to the worst case. A calibration takes out the 25 °C values of the filter's bias error, its
 * loading and common-mode error and the pads; the pads' drift and the joints' thermal EMF (which
 * follows the load's heat) remain.
 */
export function frontEndTerms(fe: FrontEnd, R: number, G: number, I: number): FrontEndTerm[] {
  const out: FrontEndTerm[] = [];
  if (fe.filterOhms > 0) {
    const e = fe.filterBiasV / R;
    out.push({ source: "inputFilterBias", errorA: e, keptA: (_g, off) => off * e });
  }
  if (fe.filterLoading > 0 || fe.filterCmV > 0) {
    const load = I * fe.filterLoading;
    const cm = filterCmErrorV(fe, G) / R;
    out.push({ source: "inputFilterResistors", errorA: load + cm, keptA: (g, off) => g * load + off * cm });
  }
  if (fe.padOhms > 0) {
    const at25 = (I * fe.padOhms) / R;
    const drift = I * padShare(fe, R) - at25;
    out.push({ source: "shuntPads", errorA: at25 + drift, keptA: (g) => g * at25 + drift });
  }
  if (fe.thermalEmfV > 0) {
    const e = fe.thermalEmfV / R;
    out.push({ source: "thermalEmf", errorA: e, keptA: () => e });
  }
  return out;
}
