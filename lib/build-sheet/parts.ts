// The parts list of a design: what the sheet, the CSV and the design page all show. Values come
// from the saved requirement and choice; figures from the engine.
import { evaluateCandidate, resistorPairFor, type CandidateDetail, type Choice, type Requirement } from "@/lib/design";
import * as f from "./format";
import type { Part } from "./part";
import { filterParts, padNote, traceShuntPart } from "./front-end-parts";
import { resistorCode } from "@/lib/design/resistor-code";
import { zeroLevelParts } from "./readout-zero-text";

export type { Part } from "./part";

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

/** What every shunt's part row says of its tolerance, tempco and rating. */
export function shuntPartCommon(req: Requirement, ohms: number, ratingW: number) {
  return {
    valueSI: ohms,
    unit: "ohm",
    code: resistorCode(ohms),
    tolerance: `±${f.fraction(req.shunt.tolerance)}`,
    tempco: `${f.ppmPerK(req.shunt.tempco)} or better`,
    rating: f.watts(ratingW),
  };
}

export function partsList(
  req: Requirement,
  choice: Choice,
  metrics: CandidateDetail = evaluateCandidate(req, choice),
): Part[] {
  const a = req.amplifier;
  const s = req.shunt;
  const usedOfRating = metrics.ratingW > 0 ? metrics.dissipationW / metrics.ratingW : NaN;
  const pair = gainResistors(req, choice);
  const parts: Part[] = [
    traceShuntPart(req, choice, metrics) ?? {
      ...shuntPartCommon(req, choice.shuntOhms, metrics.ratingW),
      designator: "R1",
      part: `Shunt resistor, ${s.series} value${kelvinAdvice(choice.shuntOhms) === "part" ? ", 4-terminal" : ""}`,
      value: f.ohms(choice.shuntOhms),
      notes:
        `Dissipates ${f.watts(metrics.dissipationW)} at the maximum current, ${f.fraction(usedOfRating)} of its rating ` +
        `(derating ${f.fraction(s.derating)}: use at most that share of the rating); self-heating about ${f.kelvin(metrics.selfHeatingK)}. ` +
        (padNote(req) ?? kelvinAdviceText(choice.shuntOhms)) +
        ".",
    },
    amplifierPart(req, { designator: "U1", gain: choice.gain, bandwidthHz: metrics.bandwidthHz }),
  ];
  if (pair) parts.push(...gainPairParts(req, pair, { rf: "R2", rg: "R3", amplifier: "U1", rf2: "R4", rg2: "R5" }));
  const nextR = parts.filter((p) => p.designator.startsWith("R")).length + 1;
  parts.push(...filterParts(req, nextR, 2));
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
      code: null,
      rating: `${f.volts(Math.max(10, 2 * a.supply))} or more`,
      notes: "Supply decoupling right at U1's supply pin (common practice, no source).",
    },
    {
      designator: "J1",
      part: "2-way connector: OUT and GND",
      value: "—",
      valueSI: null,
      unit: null,
      code: null,
      tolerance: "—",
      tempco: "—",
      rating: "—",
      notes: `Output to the readout (${readoutText(req)}); take GND from U1's ground, not from the shunt's current path.`,
    },
  );
  return parts;
}

/**
 * An amplifier's part row: its gain, and the figures the requirement asks of it. `lead` opens the
 * notes (what it is wired to); `forWhat` names what it serves in the part's name (", range 2").
 */
export function amplifierPart(
  req: Requirement,
  o: { designator: string; gain: number; bandwidthHz: number; forWhat?: string; lead?: string },
): Part {
  const a = req.amplifier;
  const forWhat = o.forWhat ?? "";
  return {
    designator: o.designator,
    part:
      a.topology === "difference"
        ? `Precision op-amp${forWhat}, difference stage (zero-drift)`
        : a.gainSet
          ? `Precision amplifier${forWhat}, non-inverting stage (zero-drift op-amp or instrumentation amplifier)`
          : `Current-sense amplifier${forWhat}, fixed gain`,
    value: `Gain ${f.gain(o.gain)}`,
    valueSI: o.gain,
    unit: "V/V",
    code: null,
    tolerance: `gain error at most ${f.fraction(a.gainError)}`,
    tempco: `gain drift at most ${f.ppmPerK(a.gainDrift)}`,
    rating: `supply ${f.volts(a.supply)}`,
    notes:
      (o.lead ?? "") +
      `Offset at most ${f.volts(a.offset)} (drift at most ${f.volts(a.offsetDrift)}/K); bias current at most ${f.amps(a.biasCurrent)}; ` +
      `noise at most ${f.noiseDensity(a.noiseDensity)}; gain-bandwidth at least ${f.hertz(a.gbw)} (bandwidth ${f.hertz(o.bandwidthHz)} at this gain); ` +
      `output swings to within ${f.volts(a.swingLow)} of ground and ${f.volts(a.swingHigh)} of its supply; CMRR at least ${f.decibels(a.cmrrDb)}; ` +
      (req.supply.side === "high"
        ? `input common-mode range must include ${f.volts(req.supply.voltage)} (high side: both inputs sit at the supply).`
        : "input common-mode range must include 0 V (low side: both inputs sit at ground)."),
  };
}

/**
 * The resistors that set a stage's gain: G = 1 + Rf/Rg for a non-inverting stage; for a difference
 * stage G = Rf/Rg with a matched second pair (designators `rf2`, `rg2`) on the + input.
 */
export function gainPairParts(
  req: Requirement,
  pair: { rfOhms: number; rgOhms: number },
  d: { rf: string; rg: string; amplifier: string; rf2?: string; rg2?: string },
): Part[] {
  const set = req.amplifier.gainSet;
  const diff = req.amplifier.topology === "difference";
  const common = {
    unit: "ohm",
    tolerance: `±${f.fraction(set?.tolerance ?? 0.001)}`,
    tempco: "25 ppm/K or better",
    rating: f.watts(0.063),
  };
  const note = diff
    ? `Difference stage, G = ${d.rf}/${d.rg}: ${d.rg} from the − sense line to ${d.amplifier}'s − input, ${d.rf} from there to the output; the matched pair on the + input to the zero level. Same type for all four so they track (common practice, no source).`
    : `Sets the gain with ${d.rg} (G = 1 + ${d.rf}/${d.rg}); same type for both so their drift tracks (common practice, no source).`;
  const rf: Part = {
    ...common,
    designator: d.rf,
    part: `Feedback resistor, ${set?.series ?? ""} value`,
    value: f.ohms(pair.rfOhms),
    valueSI: pair.rfOhms,
    code: resistorCode(pair.rfOhms),
    notes: note,
  };
  const rg: Part = {
    ...common,
    designator: d.rg,
    part: `Gain resistor, ${set?.series ?? ""} value`,
    value: f.ohms(pair.rgOhms),
    valueSI: pair.rgOhms,
    code: resistorCode(pair.rgOhms),
    notes: `Pairs with ${d.rf}; place both next to ${d.amplifier}.`,
  };
  if (!diff) return [rf, rg];
  const rf2 = d.rf2 ?? `${d.rf}b`;
  const rg2 = d.rg2 ?? `${d.rg}b`;
  return [
    rf,
    rg,
    { ...rf, designator: rf2, notes: `Matches ${d.rf}: from ${d.amplifier}'s + input to the zero level (ground).` },
    { ...rg, designator: rg2, notes: `Matches ${d.rg}: from the + sense line to ${d.amplifier}'s + input.` },
  ];
}

/** The readout in a few words (its own error has a row of its own): kind, resolution and full scale. */
export function readoutText(req: Requirement): string {
  const r = req.readout;
  return r.kind === "adc"
    ? `ADC, ${r.bits} bits, ${f.volts(r.fullScale)} full scale`
    : `meter range ${f.volts(r.fullScale)} full scale, ${r.counts} counts`;
}
