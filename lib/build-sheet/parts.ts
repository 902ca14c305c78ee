// The parts list of a design: what the sheet, the CSV and the design page all show. Values come
// from the saved requirement and choice; figures from the engine.
import { evaluateCandidate, resistorPairFor, type CandidateDetail, type Choice, type Requirement } from "@/lib/design";
import * as f from "./format";
import { zeroLevelParts } from "./readout-zero-text";

export type Part = {
  designator: string;
  part: string;
  value: string;
  tolerance: string;
  tempco: string;
  rating: string;
  notes: string;
  /** The value in SI base units, for scripts (null where a part has no single value). */
  valueSI: number | null;
  unit: string | null;
};

/** Below this a shunt needs a 4-terminal part (common practice, no source). */
export const KELVIN_PART_BELOW_OHMS = 0.01;
/** Below this a 4-pad Kelvin footprint is worth it even for a 2-terminal part (common practice, no source). */
export const KELVIN_FOOTPRINT_BELOW_OHMS = 0.1;

export type KelvinAdvice = "part" | "footprint" | "pads";

export function kelvinAdvice(shuntOhms: number): KelvinAdvice {
  if (shuntOhms < KELVIN_PART_BELOW_OHMS) return "part";
  if (shuntOhms < KELVIN_FOOTPRINT_BELOW_OHMS) return "footprint";
  return "pads";
}

const kelvinText: Record<KelvinAdvice, string> = {
  part: "4-terminal (Kelvin) shunt required: at this value the solder joints and copper would be a large part of the resistance; sense from its sense terminals only",
  footprint:
    "Use a 4-pad Kelvin footprint (or a 4-terminal part): sense traces leave from the inner edges of the pads, current from the outer",
  pads: "2-terminal part is fine; take the sense traces from the inner edges of the pads, not from the current path",
};

export const kelvinAdviceText = (shuntOhms: number) => kelvinText[kelvinAdvice(shuntOhms)];

/** Gain-setting resistors for a resistor-set gain (G = 1 + Rf/Rg), or null for a fixed-gain part. */
export function gainResistors(req: Requirement, choice: Choice): { rfOhms: number; rgOhms: number } | null {
  const set = req.amplifier.gainSet;
  if (!set) return null;
  return resistorPairFor(choice.gain, set.series, req.amplifier.topology === "difference" ? 0 : 1);
}

export function partsList(
  req: Requirement,
  choice: Choice,
  metrics: CandidateDetail = evaluateCandidate(req, choice),
): Part[] {
  const a = req.amplifier;
  const s = req.shunt;
  const high = req.supply.side === "high";
  const usedOfRating = metrics.ratingW > 0 ? metrics.dissipationW / metrics.ratingW : NaN;
  const pair = gainResistors(req, choice);
  const parts: Part[] = [
    {
      designator: "R1",
      part: `Shunt resistor, ${s.series} value${kelvinAdvice(choice.shuntOhms) === "part" ? ", 4-terminal" : ""}`,
      value: f.ohms(choice.shuntOhms),
      valueSI: choice.shuntOhms,
      unit: "ohm",
      tolerance: `±${f.fraction(s.tolerance)}`,
      tempco: `${f.ppmPerK(s.tempco)} or better`,
      rating: f.watts(metrics.ratingW),
      notes:
        `Dissipates ${f.watts(metrics.dissipationW)} at the maximum current, ${f.fraction(usedOfRating)} of its rating ` +
        `(derating ${f.fraction(s.derating)}: use at most that share of the rating); self-heating about ${f.kelvin(metrics.selfHeatingK)}. ` +
        kelvinAdviceText(choice.shuntOhms) +
        ".",
    },
    {
      designator: "U1",
      part: pair
        ? "Precision amplifier, non-inverting stage (zero-drift op-amp or instrumentation amplifier)"
        : "Current-sense amplifier, fixed gain",
      value: `Gain ${f.gain(choice.gain)}`,
      valueSI: choice.gain,
      unit: "V/V",
      tolerance: `gain error at most ${f.fraction(a.gainError)}`,
      tempco: `gain drift at most ${f.ppmPerK(a.gainDrift)}`,
      rating: `supply ${f.volts(a.supply)}`,
      notes:
        `Offset at most ${f.volts(a.offset)} (drift at most ${f.volts(a.offsetDrift)}/K); bias current at most ${f.amps(a.biasCurrent)}; ` +
        `noise at most ${f.noiseDensity(a.noiseDensity)}; gain-bandwidth at least ${f.hertz(a.gbw)} (bandwidth ${f.hertz(metrics.bandwidthHz)} at this gain); ` +
        `output swings to within ${f.volts(a.swingLow)} of ground and ${f.volts(a.swingHigh)} of its supply; CMRR at least ${f.decibels(a.cmrrDb)}; ` +
        (high
          ? `input common-mode range must include ${f.volts(req.supply.voltage)} (high side: both inputs sit at the supply).`
          : "input common-mode range must include 0 V (low side: both inputs sit at ground)."),
    },
  ];
  if (pair) {
    const note =
      "Sets the gain with R3 (G = 1 + R2/R3); 0.1 % and 25 ppm/K or better, same type for both so their drift tracks (common practice, no source).";
    parts.push(
      {
        designator: "R2",
        part: `Feedback resistor, ${req.amplifier.gainSet!.series} value`,
        value: f.ohms(pair.rfOhms),
        valueSI: pair.rfOhms,
        unit: "ohm",
        tolerance: "±0.1 %",
        tempco: "25 ppm/K or better",
        rating: f.watts(0.063),
        notes: note,
      },
      {
        designator: "R3",
        part: `Gain resistor, ${req.amplifier.gainSet!.series} value`,
        value: f.ohms(pair.rgOhms),
        valueSI: pair.rgOhms,
        unit: "ohm",
        tolerance: "±0.1 %",
        tempco: "25 ppm/K or better",
        rating: f.watts(0.063),
        notes: "Pairs with R2; place both next to U1.",
      },
    );
  }
  parts.push(...zeroLevelParts(req));
  parts.push(
    {
      designator: "C1",
      part: "Ceramic capacitor, X7R",
      value: f.farads(100e-9),
      valueSI: 100e-9,
      unit: "F",
      tolerance: "±10 %",
      tempco: "X7R",
      rating: `${f.volts(Math.max(10, 2 * a.supply))} or more`,
      notes: "Supply decoupling right at U1's supply pin (common practice, no source).",
    },
    {
      designator: "J1",
      part: "2-way connector: OUT and GND",
      value: "—",
      valueSI: null,
      unit: null,
      tolerance: "—",
      tempco: "—",
      rating: "—",
      notes: `Output to the readout (${readoutText(req)}); take GND from U1's ground, not from the shunt's current path.`,
    },
  );
  return parts;
}

export function readoutText(req: Requirement): string {
  const r = req.readout;
  return r.kind === "adc"
    ? `ADC, ${r.bits} bits, ${f.volts(r.fullScale)} full scale`
    : `meter range ${f.volts(r.fullScale)} full scale, ${r.counts} counts`;
}
