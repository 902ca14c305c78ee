// Which team-library parts a design's pair came from, and where each part's data stop covering
// the requirement. A design stores the figures the wizard filled from the library, not the part's
// id, so a part matches when every data-sheet figure the requirement took from it is the same.
import type { CandidateDetail, Choice, Requirement } from "@/lib/design";
import type { AdcValues, AmplifierValues, MeterValues, ShuntValues } from "@/lib/library/schema";
import { resistorSetGains } from "@/lib/library/to-requirement";
import * as f from "./format";
import { kelvinAdvice, partsList, type Part } from "./parts";

/** The team library as stored (GET /api/library's rows). */
export type LibraryParts = {
  amplifiers: (AmplifierValues & { name: string })[];
  shunts: (Omit<ShuntValues, "series"> & { name: string; series: string })[];
  /** Readouts (absent from libraries read before they held any). */
  adcs?: AdcValues[];
  meters?: MeterValues[];
};
type LibraryShunt = LibraryParts["shunts"][number];
export type LibraryPart = { name: string; gaps: string[] };
export type LibraryMatch = { amplifier: LibraryPart | null; shunt: LibraryPart | null; readout: LibraryPart | null };

const same = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b), 1e-30);

function amplifierMatches(req: Requirement, a: AmplifierValues): boolean {
  const r = req.amplifier;
  const gainsMatch =
    a.gainMode === "fixed"
      ? !r.gainSet && a.gains.every((g) => r.gains.some((x) => same(x, g)))
      : !!r.gainSet &&
        r.gainSet.min === resistorSetGains(a.gains).min &&
        r.gainSet.max === resistorSetGains(a.gains).max;
  return (
    gainsMatch &&
    same(r.offset, a.offsetV) &&
    same(r.offsetDrift, a.offsetDriftVPerK) &&
    same(r.gainError, a.gainErrorFraction) &&
    same(r.gainDrift, a.gainDriftPerK) &&
    same(r.biasCurrent, a.biasCurrentA) &&
    same(r.noiseDensity, a.noiseDensityVPerRtHz) &&
    same(r.gbw, a.gbwHz) &&
    same(r.swingLow, a.swingLowV) &&
    same(r.swingHigh, a.swingHighV) &&
    same(r.cmrrDb, a.cmrrDb)
  );
}

function amplifierGaps(req: Requirement, choice: Choice, a: AmplifierValues): string[] {
  const gaps: string[] = [];
  const s = req.amplifier.supply;
  if (s < a.supplyMinV || s > a.supplyMaxV)
    gaps.push(
      `the design runs it from ${f.volts(s)}, outside its ${f.volts(a.supplyMinV)} to ${f.volts(a.supplyMaxV)} supply range`,
    );
  if (a.gainMode === "fixed" && !a.gains.some((g) => same(g, choice.gain)))
    gaps.push(`it offers gains ${a.gains.join(", ")}, not ${f.gain(choice.gain)}`);
  if (req.supply.side === "high" && req.supply.voltage > a.supplyMaxV)
    gaps.push(
      `its data give no common-mode range: check that its inputs stand ${f.volts(req.supply.voltage)} on the high side`,
    );
  return gaps;
}

function shuntMatches(req: Requirement, s: LibraryShunt): boolean {
  return (
    req.shunt.series === s.series &&
    same(req.shunt.tolerance, s.toleranceFraction) &&
    same(req.shunt.tempco, s.tempcoPerK)
  );
}

function shuntGaps(req: Requirement, choice: Choice, m: CandidateDetail, s: LibraryShunt): string[] {
  const gaps: string[] = [];
  if (choice.shuntOhms < s.minOhms * (1 - 1e-9) || choice.shuntOhms > s.maxOhms * (1 + 1e-9))
    gaps.push(`the family spans ${f.ohms(s.minOhms)} to ${f.ohms(s.maxOhms)}, not ${f.ohms(choice.shuntOhms)}`);
  const top = Math.max(...s.ratingsW);
  const needed = m.dissipationW / req.shunt.derating;
  if (needed > top * (1 + 1e-9))
    gaps.push(
      `it is rated at most ${f.watts(top)}; this design needs ${f.watts(needed)} (${f.watts(m.dissipationW)} using at most ${f.fraction(req.shunt.derating)} of the rating)`,
    );
  if (kelvinAdvice(choice.shuntOhms) === "part" && !s.fourTerminal)
    gaps.push(`at ${f.ohms(choice.shuntOhms)} a 4-terminal part is needed and this family is 2-terminal`);
  return gaps;
}

/** An ADC matches when the readout states every figure the part gives (its rate may be lower). */
function adcMatches(req: Requirement, a: AdcValues): boolean {
  const r = req.readout;
  if (r.kind !== "adc") return false;
  const known = (v: number | undefined, w: number) => v !== undefined && same(v, w);
  return (
    r.bits === a.bits &&
    same(r.fullScale, a.fullScale) &&
    known(r.reference?.tolerance, a.reference.tolerance) &&
    known(r.reference?.tempco, a.reference.tempco) &&
    known(r.offsetLsb, a.offsetLsb) &&
    known(r.gainError, a.gainError) &&
    known(r.inlLsb, a.inlLsb)
  );
}

function meterMatches(req: Requirement, m: MeterValues): boolean {
  const r = req.readout;
  if (r.kind !== "meter") return false;
  const acc = r.accuracy;
  return (
    r.counts === m.counts &&
    same(r.fullScale, m.fullScale) &&
    acc?.percentOfReading !== undefined &&
    same(acc.percentOfReading, m.accuracy.percentOfReading) &&
    acc.digits !== undefined &&
    same(acc.digits, m.accuracy.digits)
  );
}

/** The library ADC or meter range the design's readout figures came from, with its gaps. */
export function matchLibraryReadout(req: Requirement, library: LibraryParts): LibraryPart | null {
  const r = req.readout;
  if (r.kind === "adc") {
    const adc = library.adcs?.find((a) => adcMatches(req, a));
    if (!adc) return null;
    const gaps =
      r.sampleRateHz > adc.sampleRateHz * (1 + 1e-9)
        ? [`the design samples at ${f.hertz(r.sampleRateHz)}, above its highest rate of ${f.hertz(adc.sampleRateHz)}`]
        : [];
    return { name: adc.name, gaps };
  }
  const meter = library.meters?.find((m) => meterMatches(req, m));
  return meter ? { name: meter.name, gaps: [] } : null;
}

/** The library parts the design's amplifier, shunt and readout figures came from, if any, with their gaps. */
export function matchLibraryParts(
  req: Requirement,
  choice: Choice,
  m: CandidateDetail,
  library: LibraryParts,
): LibraryMatch {
  const amp = library.amplifiers.find((a) => amplifierMatches(req, a));
  const shunt =
    library.shunts.find(
      (s) =>
        shuntMatches(req, s) &&
        choice.shuntOhms >= s.minOhms * (1 - 1e-9) &&
        choice.shuntOhms <= s.maxOhms * (1 + 1e-9),
    ) ?? library.shunts.find((s) => shuntMatches(req, s));
  return {
    amplifier: amp ? { name: amp.name, gaps: amplifierGaps(req, choice, amp) } : null,
    shunt: shunt ? { name: shunt.name, gaps: shuntGaps(req, choice, m, shunt) } : null,
    readout: matchLibraryReadout(req, library),
  };
}

/** The line a part's notes end with when its data stop short of the requirement. */
export const gapsLine = (p: LibraryPart) =>
  p.gaps.length ? ` Library data stop short: ${p.gaps.join("; ")}.` : " The library data cover the requirement.";

/** The parts list with R1, U1 and the readout's connector J1 named after their library parts, each with its coverage line. */
export function nameLibraryParts(parts: Part[], match: LibraryMatch): Part[] {
  return parts.map((p) => {
    if (p.designator === "J1" && match.readout)
      return {
        ...p,
        part: `${p.part}, to ${match.readout.name} (team library)`,
        notes: `${p.notes}${gapsLine(match.readout)}`,
      };
    const lib = p.designator === "R1" ? match.shunt : p.designator === "U1" ? match.amplifier : null;
    if (!lib) return p;
    return { ...p, part: `${lib.name} (team library): ${p.part}`, notes: `${p.notes}${gapsLine(lib)}` };
  });
}

/** The design's parts list, R1, U1 and J1 named after the team-library parts they came from when a library is given. */
export function designParts(req: Requirement, choice: Choice, m: CandidateDetail, library?: LibraryParts): Part[] {
  const listed = partsList(req, choice, m);
  return library ? nameLibraryParts(listed, matchLibraryParts(req, choice, m, library)) : listed;
}
