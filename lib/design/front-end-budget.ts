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

/** The front end's terms at current I through R at gain G, A; the sum is what model.ts adds to the worst case. */
export function frontEndTerms(
  fe: FrontEnd,
  R: number,
  G: number,
  I: number,
): { source: FrontEndSource; errorA: number }[] {
  const out: { source: FrontEndSource; errorA: number }[] = [];
  if (fe.filterOhms > 0) out.push({ source: "inputFilterBias", errorA: fe.filterBiasV / R });
  if (fe.filterLoading > 0 || fe.filterCmV > 0)
    out.push({ source: "inputFilterResistors", errorA: I * fe.filterLoading + filterCmErrorV(fe, G) / R });
  if (fe.padOhms > 0) out.push({ source: "shuntPads", errorA: I * padShare(fe, R) });
  if (fe.thermalEmfV > 0) out.push({ source: "thermalEmf", errorA: fe.thermalEmfV / R });
  return out;
}
