// The front end's construction in the model's plain numbers: input filter, shunt terminals,
// copper trace and thermal EMF (issue 14 items 3–5). model.ts holds one of these per
// requirement; the sweep, the budget and the Monte Carlo read the same figures.
import {
  copperTempcoAt,
  ipc2221Current,
  ipc2221Rise,
  TRACE_GRID_M,
  traceLengthFor,
  type TraceLayer,
} from "./copper-trace";
import {
  differenceFilterCmV,
  differenceLoading,
  filterBiasErrorV,
  filterCornerHz,
  suggestInputFilter,
  type FilterSuggestion,
} from "./input-filter";
import type { Requirement } from "./requirement";

export type FrontEnd = {
  /** Series resistance of each filter leg, Ω (0: no filter). */
  filterOhms: number;
  /** The filter's corner, Hz (Infinity: no filter). */
  filterCornerHz: number;
  /** Worst-case offset of the bias currents in the filter resistors, V. */
  filterBiasV: number;
  /** Difference stage: gain lost to the filter resistors in series with Rg, ratio (0 otherwise). */
  filterLoading: number;
  /** Difference stage: the filter resistors' common-mode error at the operating common mode, V, before ÷(1 + G). */
  filterCmV: number;
  /** Thermal EMF of the shunt's joints: thermalEmf × gradient, V. */
  thermalEmfV: number;
  /** Pad and solder resistance in series with the sensed value, Ω (0: Kelvin). */
  padOhms: number;
  /** The same at the worst ambient, with copper's tempco: padOhms·(1 + α_Cu·ΔT), Ω. */
  padOhmsWorst: number;
  /** A copper-trace shunt's cross-section, for its IPC-2221 heating (null: a resistor). */
  trace: { width: number; thickness: number; layer: TraceLayer } | null;
};

/** Thermal EMF of the shunt's joints: their coefficient times the gradient across the shunt, V. */
export function jointThermalEmfV(shunt: Pick<Requirement["shunt"], "thermalEmf" | "gradient">): number {
  return shunt.thermalEmf * shunt.gradient;
}

/** The input filter's, pads' and joints' figures for a requirement; `dTamb` the ambient excursion from 25 °C, K. */
export function buildFrontEnd(req: Requirement, dTamb: number, vCm: number, difference: boolean): FrontEnd {
  const f = req.inputFilter;
  const a = req.amplifier;
  const s = req.shunt;
  const ios = a.offsetCurrent ?? a.biasCurrent;
  return {
    filterOhms: f ? f.resistance : 0,
    filterCornerHz: f ? filterCornerHz(f) : Infinity,
    filterBiasV: f ? filterBiasErrorV(f, a.biasCurrent, ios) : 0,
    filterLoading: f && difference ? differenceLoading(f) : 0,
    filterCmV: f && difference ? differenceFilterCmV(f, vCm) : 0,
    thermalEmfV: jointThermalEmfV(s),
    padOhms: s.padResistance,
    padOhmsWorst: s.padResistance * (1 + copperTempcoAt(25) * dTamb),
    trace: s.trace ? { width: s.trace.width, thickness: s.trace.thickness, layer: s.trace.layer } : null,
  };
}

/** Offset at the amplifier input that does not depend on the pair: filter bias currents and thermal EMF, V. */
export function frontEndOffsetV(fe: FrontEnd): number {
  return fe.filterBiasV + fe.thermalEmfV;
}

/** Difference stage: the filter resistors' common-mode error at gain G, referred to the input, V. */
export function filterCmErrorV(fe: FrontEnd, G: number): number {
  return fe.filterCmV / (1 + G);
}

/** Gain-type error of the pads on a shunt of R ohms, ratio (0.5 mΩ on 1 mΩ is 0.5, i.e. +50 %). */
export function padShare(fe: FrontEnd, R: number): number {
  return fe.padOhmsWorst / R;
}

export type TraceHeat = { ratingW: number; theta: number };

/**
 * A copper trace's heating at current I through R (IPC-2221 instead of a power rating): its
 * "rating" is the power at the current that takes it from the hottest ambient to the shunt's
 * maximum temperature (NaN: none), and θ = ΔT(I)/(I²·R) so that P·θ is the IPC-2221 rise.
 * The error model's self-heating term α·I²·R·θ then scales the full-load rise by (I/Iload)²,
 * above IPC-2221's (I/Iload)^2.27 below full load: conservative.
 */
export function traceHeat(
  trace: NonNullable<FrontEnd["trace"]>,
  R: number,
  currentA: number,
  tAmbMax: number,
  maxTempC: number,
): TraceHeat {
  const iAllowed = ipc2221Current(maxTempC - tAmbMax, trace.width, trace.thickness, trace.layer);
  const power = currentA * currentA * R;
  const rise = ipc2221Rise(currentA, trace.width, trace.thickness, trace.layer);
  return { ratingW: iAllowed > 0 ? iAllowed * iAllowed * R : NaN, theta: power > 0 ? rise / power : 0 };
}

/** The filter the wizard offers for this requirement's readout (input-filter.ts says how). */
export function suggestedFilterFor(req: Requirement): FilterSuggestion {
  const r = req.readout;
  return suggestInputFilter({
    readoutHz: r.kind === "adc" ? r.sampleRateHz / 10 : r.bandwidthHz,
    bandwidthMinHz: req.bandwidth.min,
    offsetV: req.amplifier.offset,
    offsetCurrentA: req.amplifier.offsetCurrent ?? req.amplifier.biasCurrent,
  });
}

export type FrontEndDraw = {
  /** Offset at the amplifier input: filter bias currents, the filter's common mode, thermal EMF, V. */
  offsetV: number;
  /** Factor on the stage's gain: a difference stage's filter loading. */
  gainFactor: number;
  /** Pad and solder resistance of this unit at its ambient, Ω. */
  padOhms: number;
};

/**
 * One built unit's front end for the Monte Carlo. Distributions: filter resistors each uniform
 * within ±tolerance; bias current (shared with the budget's) uniform in ±Ib; offset current
 * uniform in ±Ios; the difference stage's filter common-mode error uniform within its bound;
 * thermal EMF uniform in ±thermalEmf·gradient (the gradient's sign depends on the layout);
 * pads uniform between half and all of the stated value (it is taken as the upper estimate),
 * times copper's tempco at the unit's ambient. Every draw stays inside the worst case.
 */
export function drawFrontEnd(
  req: Requirement,
  fe: FrontEnd,
  G: number,
  rnd: () => number,
  biasA: number,
  dT: number,
): FrontEndDraw {
  // A term the design lacks draws nothing, so designs without these parts keep their random streams.
  const u = (half: number) => (half === 0 ? 0 : (2 * rnd() - 1) * half);
  const f = req.inputFilter;
  let offsetV = u(fe.thermalEmfV) + u(filterCmErrorV(fe, G));
  if (f) {
    const ios = u(req.amplifier.offsetCurrent ?? req.amplifier.biasCurrent);
    const rp = f.resistance * (1 + u(f.tolerance));
    const rn = f.resistance * (1 + u(f.tolerance));
    offsetV += (biasA + ios / 2) * rp - (biasA - ios / 2) * rn;
  }
  const padOhms = fe.padOhms === 0 ? 0 : fe.padOhms * (0.5 + 0.5 * rnd()) * (1 + copperTempcoAt(25) * dT);
  return { offsetV, gainFactor: 1 - fe.filterLoading, padOhms };
}

/** A copper trace's tap-to-tap length for the chosen value, on the sweep's drawing grid, m. */
export function traceLengthOf(req: Requirement, R: number): number | null {
  const t = req.shunt.trace;
  if (!t) return null;
  return Math.round(traceLengthFor(R, t.width, t.thickness) / TRACE_GRID_M) * TRACE_GRID_M;
}

/** The construction figures a candidate reports (API: SI, unit in the name). */
export type FrontEndDetail = {
  /** The input filter's corner, Hz (null: no filter). */
  inputFilterCornerHz: number | null;
  /** A copper trace's length between its Kelvin taps, m (null: a resistor). */
  traceLengthM: number | null;
  /** Thermal EMF of the shunt's joints at the stated gradient, V. */
  thermalEmfV: number;
};

export function frontEndDetail(req: Requirement, fe: FrontEnd, R: number): FrontEndDetail {
  return {
    inputFilterCornerHz: Number.isFinite(fe.filterCornerHz) ? fe.filterCornerHz : null,
    traceLengthM: traceLengthOf(req, R),
    thermalEmfV: fe.thermalEmfV,
  };
}
