// The RC filter at the amplifier's inputs (API.md v2 `inputFilter`): a resistor in series with
// each input leg and a capacitor from each leg to ground. It band-limits the signal and the
// noise, and costs accuracy: the amplifier's bias currents flow through its resistors, and in a
// difference stage those resistors add to the stage's input resistors.
import { seriesValues } from "./eseries";

/** Tolerance of the filter resistors when the request gives none (from memory: ordinary 1 % thick-film chips). */
export const DEFAULT_FILTER_TOLERANCE = 0.01;

export type InputFilter = { resistance: number; capacitance: number; tolerance: number };

/**
 * −3 dB corner of the filter, Hz: each leg is R in series, C to ground, so a differential
 * signal sees the same single pole as each leg, f = 1/(2π·R·C) (first-order RC low-pass).
 */
export function filterCornerHz(f: InputFilter): number {
  return 1 / (2 * Math.PI * f.resistance * f.capacitance);
}

/**
 * Offset the bias currents make across the filter resistors, V, worst case. Input currents
 * Ib ± Ios/2 through legs R₊ and R₋, each within R(1 ± t): the difference of the two legs'
 * drops is Ib·(R₊ − R₋) + (Ios/2)·(R₊ + R₋), at most Ib·2·t·R + Ios·R·(1 + t) (Ohm's law on
 * each leg, the worst signs and resistor ends together).
 */
export function filterBiasErrorV(f: InputFilter, biasA: number, offsetCurrentA: number): number {
  return biasA * 2 * f.tolerance * f.resistance + offsetCurrentA * f.resistance * (1 + f.tolerance);
}

/**
 * Gain-setting input resistor of a difference stage, Ω: the stage is drawn (netlist, parts
 * list) with Rg = 10 kΩ and Rf = G·Rg (a usual value for a precision stage; common practice, no source).
 */
export const DIFFERENCE_RG_OHMS = 10_000;

/**
 * Gain a difference stage loses to the filter: its resistors add to Rg, so G becomes
 * Rf/(Rg + Rfilt), low by Rfilt/(Rg + Rfilt) (standard op-amp circuit analysis).
 */
export function differenceLoading(f: InputFilter): number {
  return f.resistance / (DIFFERENCE_RG_OHMS + f.resistance);
}

/**
 * Common-mode error a difference stage's filter resistors add, referred to the input, V, before
 * the 1/(1 + G) the stage's own resistors share: each leg's input resistor becomes Rg + Rfilt,
 * and a mismatch t_f on Rfilt is a share Rfilt·t_f/(Rg + Rfilt) of it. The difference stage's
 * CMRR = (1 + G)/(Σ|εᵢ|) (standard op-amp circuit analysis, as model.ts uses for 4·t) gives
 * Vcm·2·t_f·Rfilt/((Rg + Rfilt)·(1 + G)).
 */
export function differenceFilterCmV(f: InputFilter, vCm: number): number {
  return (vCm * 2 * f.tolerance * f.resistance) / (DIFFERENCE_RG_OHMS + f.resistance);
}

/** Smallest and largest filter resistor the wizard suggests, Ω (common practice, no source). */
export const SUGGESTED_R_MIN = 10;
export const SUGGESTED_R_MAX = 1000;

export type FilterSuggestion = InputFilter & { cornerHz: number; why: string };

/**
 * A starting filter for a readout: the corner at a tenth of the ADC's sample rate (a meter: its
 * own bandwidth), and never below twice the required bandwidth; R the largest E6 value whose
 * bias-current error Ios·R stays at a tenth of the amplifier's offset (so the filter adds about
 * a tenth to the offset term), kept within 10 Ω…1 kΩ; C the E6 value at or above 1/(2π·R·f)
 * so the corner lands at or below the aim (all common practice, no source).
 */
export function suggestInputFilter(opts: {
  readoutHz: number;
  bandwidthMinHz: number;
  offsetV: number;
  offsetCurrentA: number;
}): FilterSuggestion {
  const aim = Math.max(opts.readoutHz, 2 * opts.bandwidthMinHz);
  const rCap = opts.offsetCurrentA > 0 ? (0.1 * opts.offsetV) / opts.offsetCurrentA : SUGGESTED_R_MAX;
  const rs = seriesValues("E6", SUGGESTED_R_MIN, SUGGESTED_R_MAX);
  const resistance = [...rs].reverse().find((r) => r <= rCap * (1 + 1e-9)) ?? SUGGESTED_R_MIN;
  const cNeed = 1 / (2 * Math.PI * resistance * aim);
  const cs = seriesValues("E6", cNeed / 10, cNeed * 10);
  const capacitance = cs.find((c) => c >= cNeed * (1 - 1e-9)) ?? cNeed;
  const f = { resistance, capacitance, tolerance: DEFAULT_FILTER_TOLERANCE };
  return {
    ...f,
    cornerHz: filterCornerHz(f),
    why: "corner at or below a tenth of the sample rate; R small enough that bias current through it adds about a tenth to the offset",
  };
}
