// A copper-trace shunt: a length of printed-circuit copper between two Kelvin taps. Its
// resistance comes from its geometry and copper's resistivity, its temperature rise from the
// IPC-2221 trace-heating relation instead of a resistor's power rating.

/**
 * Resistivity of annealed copper at 20 °C, Ω·m: the International Annealed Copper Standard
 * (IACS, 100 % conductivity = 1/58 Ω·mm²/m = 1.7241 µΩ·cm), as IEC 60028 states it.
 */
export const COPPER_RESISTIVITY_20C = 1.7241e-8;
/** Temperature coefficient of resistance of annealed copper at 20 °C, 1/K (IEC 60028, same standard: 0.00393). */
export const COPPER_TEMPCO_20C = 0.00393;
/** The temperature the two figures above are stated at, °C. */
export const COPPER_REFERENCE_C = 20;

/** Resistivity of copper at t °C, Ω·m: ρ20·(1 + α20·(t − 20)), the standard's linear law. */
export function copperResistivity(tC: number): number {
  return COPPER_RESISTIVITY_20C * (1 + COPPER_TEMPCO_20C * (tC - COPPER_REFERENCE_C));
}

/**
 * Copper's tempco referred to t °C, 1/K: α20/(1 + α20·(t − 20)). The engine states tolerances
 * and tempcos at 25 °C, where copper's is 0.003854/K (≈ 3900 ppm/K).
 */
export function copperTempcoAt(tC: number): number {
  return COPPER_TEMPCO_20C / (1 + COPPER_TEMPCO_20C * (tC - COPPER_REFERENCE_C));
}

/** Where the trace runs: an outer layer sheds heat to air, an inner one only through the board. */
export const traceLayers = ["external", "internal"] as const;
export type TraceLayer = (typeof traceLayers)[number];

/** IPC-2221 (2012), §6.2 trace-heating chart fitted as I = k·ΔT^0.44·A^0.725, A in mil², I in A, ΔT in K. */
export const IPC2221_K: Record<TraceLayer, number> = { external: 0.048, internal: 0.024 };
export const IPC2221_DT_EXP = 0.44;
export const IPC2221_AREA_EXP = 0.725;
/** One mil (a thousandth of an inch) in metres: 25.4 µm exactly (the inch is 25.4 mm by definition). */
export const MIL = 25.4e-6;

export type TraceGeometry = {
  /** Width of the copper, m. */
  width: number;
  /** Length between the Kelvin taps' centre lines, m. */
  length: number;
  /** Copper thickness (foil plus plating), m. */
  thickness: number;
};

/** Resistance between the taps at t °C, Ω: ρ(t)·L/(w·t). */
export function traceResistance(g: TraceGeometry, tC = 25): number {
  return (copperResistivity(tC) * g.length) / (g.width * g.thickness);
}

/** Tap-to-tap length that gives R at 25 °C for a width and thickness, m. */
export function traceLengthFor(R: number, width: number, thickness: number): number {
  return (R * width * thickness) / copperResistivity(25);
}

/** Cross-section in square mils, IPC-2221's unit. */
export function areaMil2(width: number, thickness: number): number {
  return (width / MIL) * (thickness / MIL);
}

/** Temperature rise of a trace carrying I, K: ΔT = (I/(k·A^0.725))^(1/0.44) (IPC-2221). */
export function ipc2221Rise(currentA: number, width: number, thickness: number, layer: TraceLayer): number {
  const c = IPC2221_K[layer] * areaMil2(width, thickness) ** IPC2221_AREA_EXP;
  return (Math.abs(currentA) / c) ** (1 / IPC2221_DT_EXP);
}

/** Current that raises the trace by ΔT, A: I = k·ΔT^0.44·A^0.725 (IPC-2221). 0 for no rise allowed. */
export function ipc2221Current(riseK: number, width: number, thickness: number, layer: TraceLayer): number {
  if (!(riseK > 0)) return 0;
  return IPC2221_K[layer] * riseK ** IPC2221_DT_EXP * areaMil2(width, thickness) ** IPC2221_AREA_EXP;
}

/**
 * Tolerance of a trace's resistance when the request gives none (from memory): copper foil and
 * plating thickness ±10 % plus the etched width ±25 µm (±1 mil) on the trace's width, summed
 * worst case. A 1 mm trace comes to ±12.5 %.
 */
export const TRACE_THICKNESS_TOLERANCE = 0.1;
export const TRACE_ETCH_M = 25e-6;
export function defaultTraceTolerance(width: number): number {
  return TRACE_THICKNESS_TOLERANCE + TRACE_ETCH_M / width;
}

/**
 * Lengths the sweep offers: every step of a 0.1 mm drawing grid (common practice, no source)
 * from a length of two widths (shorter, the taps would sit in the current's spreading at the
 * ends; common practice, no source) up to the longest the board allows.
 */
export const TRACE_GRID_M = 0.1e-3;
export function traceLengths(width: number, maxLength: number): number[] {
  const first = Math.ceil((2 * width) / TRACE_GRID_M - 1e-9);
  const last = Math.floor(maxLength / TRACE_GRID_M + 1e-9);
  const out: number[] = [];
  for (let k = Math.max(1, first); k <= last; k++) out.push(k * TRACE_GRID_M);
  return out;
}

/** Resistances at 25 °C of the lengths on offer, ascending, Ω. */
export function traceValues(width: number, thickness: number, maxLength: number): number[] {
  return traceLengths(width, maxLength).map((length) => traceResistance({ width, length, thickness }));
}
