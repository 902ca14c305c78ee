// The build sheet's share of issue 14: a copper-trace shunt's geometry and Kelvin taps, a
// 2-terminal shunt's pads, the input filter's parts, and the rows that state them.
import { copperTempcoAt, ipc2221Rise } from "@/lib/design/copper-trace";
import { jointThermalEmfV, traceLengthOf } from "@/lib/design/front-end";
import { filterCornerHz } from "@/lib/design/input-filter";
import type { Requirement } from "@/lib/design/requirement";
import type { CandidateDetail, Choice } from "@/lib/design/types";
import * as f from "./format";
import type { Part } from "./part";
import { resistorCode } from "@/lib/design/resistor-code";

const mm = (m: number) => f.formatLength(m);

/** The trace's dimensions and where its taps go, in words a board designer draws from. */
export function traceGeometryText(req: Requirement, choice: Choice): string | null {
  const t = req.shunt.trace;
  const L = traceLengthOf(req, choice.shuntOhms);
  if (!t || L === null) return null;
  return (
    `copper trace ${mm(t.width)} wide, ${mm(L)} between the Kelvin taps' centre lines, ${f.formatLength(t.thickness)} copper ` +
    `on an ${t.layer} layer`
  );
}

/** R1 as a copper trace: no part to buy, a drawing to follow. */
export function traceShuntPart(req: Requirement, choice: Choice, m: CandidateDetail): Part | null {
  const t = req.shunt.trace;
  const L = traceLengthOf(req, choice.shuntOhms);
  if (!t || L === null) return null;
  const rise = ipc2221Rise(m.operatingCurrentA, t.width, t.thickness, t.layer);
  return {
    designator: "R1",
    part: "Copper-trace shunt (board copper, Kelvin-tapped)",
    value: f.ohms(choice.shuntOhms),
    valueSI: choice.shuntOhms,
    unit: "ohm",
    code: null,
    tolerance: `±${f.fraction(t.tolerance)} (etch and copper thickness)`,
    tempco: `${f.ppmPerK(copperTempcoAt(25))} (copper)`,
    rating: `rises ${f.kelvin(rise)} at ${f.amps(m.operatingCurrentA)} (IPC-2221)`,
    notes:
      `Draw as a ${traceGeometryText(req, choice)}. Resistance at 25 °C from copper's resistivity (IACS, 1.7241e-8 Ω·m at 20 °C). ` +
      `Reaches about ${f.celsius(req.temperature.max + rise)} at the hottest ambient; keep it below the board's rating and clear of parts that mind heat. ` +
      "Ask the board maker for the copper thickness tolerance; calibrate each unit if the accuracy needs better than the trace's tolerance.",
  };
}

/** Where the taps go on a copper trace, and why. */
export function traceLayoutNotes(req: Requirement, choice: Choice): string[] {
  const t = req.shunt.trace;
  const L = traceLengthOf(req, choice.shuntOhms);
  if (!t || L === null) return [];
  return [
    `Copper-trace shunt R1: a straight run ${mm(t.width)} wide; the sensed length is ${mm(L)} between the centre lines of the two Kelvin taps. ` +
      `Tap A at 0 mm and tap B at ${mm(L)} along the trace; the current enters and leaves at least ${mm(t.width)} (one width) beyond each tap so it flows evenly under them.`,
    `Kelvin taps: two thin sense traces (no wider than ${mm(Math.min(t.width / 4, 0.25e-3))}) leaving the same edge of the trace at the tap positions, carrying no load current, run as a tight pair to U1. No vias, solder mask openings or parts on the sensed length.`,
  ];
}

/** A 2-terminal shunt: what its pads do to the reading. */
export function padNote(req: Requirement): string | null {
  if (req.shunt.terminals !== 2) return null;
  return (
    `2-terminal part: the sense lines see its pads and solder as well (about ${f.ohms(req.shunt.padResistance)}, counted in the error budget as a gain error with copper's tempco); ` +
    "make the solder fillets even and the pads as short as the footprint allows."
  );
}

/** The input filter's resistors and capacitors, numbered from `firstR` and `firstC`. */
export function filterParts(req: Requirement, firstR: number, firstC: number): Part[] {
  const flt = req.inputFilter;
  if (!flt) return [];
  const corner = filterCornerHz(flt);
  const resistor = (n: number, leg: string): Part => ({
    designator: `R${n}`,
    part: `Input filter resistor, ${leg} leg`,
    value: f.ohms(flt.resistance),
    valueSI: flt.resistance,
    unit: "ohm",
    code: resistorCode(flt.resistance),
    tolerance: `±${f.fraction(flt.tolerance)}`,
    tempco: "100 ppm/K or better",
    rating: f.watts(0.063),
    notes: `In series with U1's ${leg} input, between the sense line and the input pin; the two legs' mismatch and U1's bias currents through them are in the error budget.`,
  });
  const capacitor = (n: number, leg: string): Part => ({
    designator: `C${n}`,
    part: "Ceramic capacitor, C0G/NP0 (or film)",
    value: f.farads(flt.capacitance),
    valueSI: flt.capacitance,
    unit: "F",
    code: null,
    tolerance: "±5 % or better",
    tempco: "C0G",
    rating: `${f.volts(Math.max(10, 2 * (req.supply.side === "high" ? req.supply.voltage : req.amplifier.supply)))} or more`,
    notes: `From U1's ${leg} input to ground, right at the pin: with the resistor a ${f.hertz(corner)} corner (1/(2π·R·C)). A stable dielectric keeps the two legs' corners matched.`,
  });
  return [resistor(firstR, "+"), resistor(firstR + 1, "−"), capacitor(firstC, "+"), capacitor(firstC + 1, "−")];
}

/** Requirement rows for the construction: shunt kind, terminals, filter, thermal EMF. */
export function constructionRows(req: Requirement): { label: string; value: string }[] {
  const s = req.shunt;
  const rows: { label: string; value: string }[] = [];
  if (s.trace)
    rows.push({
      label: "Shunt construction",
      value: `copper trace, ${mm(s.trace.width)} wide, ${f.formatLength(s.trace.thickness)} copper, ${s.trace.layer} layer, at most ${mm(s.trace.length)} long`,
    });
  else
    rows.push({
      label: "Shunt terminals",
      value: s.terminals === 4 ? "4 (Kelvin)" : `2, with ${f.ohms(s.padResistance)} of pads and solder`,
    });
  if (req.inputFilter)
    rows.push({
      label: "Input filter (each leg)",
      value: `${f.ohms(req.inputFilter.resistance)} and ${f.farads(req.inputFilter.capacitance)}, corner ${f.hertz(filterCornerHz(req.inputFilter))}`,
    });
  if (s.gradient > 0)
    rows.push({
      label: "Thermal EMF at the shunt's joints",
      value: `${f.volts(s.thermalEmf)}/K over ${f.kelvin(s.gradient)}: ${f.volts(jointThermalEmfV(s))}`,
    });
  return rows;
}
