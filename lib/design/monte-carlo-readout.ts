// Monte Carlo draws of issue 14's sources, each with its stated distribution (docs/model.md §3):
// the zero-current level and the readout's own error, drawn once per built unit.
import type { Model } from "./model";
import { withTypicalReadoutErrors } from "./readout-error";
import type { Requirement } from "./requirement";

/** A draw uniform on ±half. */
type Uniform = (half: number) => number;

/**
 * The unit's zero-current level at ambient excursion t (K from 25 °C), V: tolerance uniform, tempco
 * uniform. A level of 0 (a one-way span) draws nothing, so one-way units draw as before.
 */
export function drawZeroLevelV(req: Requirement, u: Uniform): (t: number) => number {
  const ref = req.amplifier.reference;
  if (!(ref.voltage > 0)) return () => 0;
  const tol = u(ref.tolerance);
  const tc = u(ref.tempco);
  return (t) => ref.voltage * (1 + tol + tc * t);
}

/**
 * The readout converting the amplifier's output vOut at ambient excursion t, V of reading. ADC:
 * reference tolerance and tempco, gain error, offset and INL each uniform within ± its figure, the
 * INL taken as a fixed share of ±INL for the unit (its shape along the codes is not modelled), then
 * rounded to a code and clipped to the codes there are. Meter: its % of reading uniform, and its
 * digits uniform within ±(digits − ½) counts beyond the rounding the reading itself does. A figure
 * the request leaves out is drawn from its class's typical figure, as the budget counts it.
 */
export function drawReadout(req: Requirement, m: Model, u: Uniform): (vOut: number, t: number) => number {
  const r = withTypicalReadoutErrors(req.readout);
  const step = m.read.stepV;
  if (r.kind === "adc") {
    const refTol = u(r.reference?.tolerance ?? 0);
    const refTc = u(r.reference?.tempco ?? 0);
    const gain = u(r.gainError ?? 0);
    const offset = u(r.offsetLsb ?? 0) * step;
    const inl = u(r.inlLsb ?? 0) * step;
    const top = 2 ** r.bits - 1;
    return (vOut, t) => {
      const v = (vOut * (1 + gain)) / (1 + refTol + refTc * t) + offset + inl;
      return Math.min(top, Math.max(0, Math.round(v / step))) * step;
    };
  }
  const pct = u(r.accuracy?.percentOfReading ?? 0);
  const digits = u(Math.max(0, (r.accuracy?.digits ?? 0.5) - 0.5)) * step;
  return (vOut) => Math.round((vOut * (1 + pct) + digits) / step) * step;
}
