// Everything the build sheet says, as text rows: the engine computes, this file only words and
// formats. Shared by the PDF, the design page's panel and the tests (which compare against it).
import {
  benchCheck,
  designCautions,
  decadeScale,
  errorAt,
  errorCurve,
  curveByMagnitude,
  evaluateCandidate,
  type BenchCheckRow,
  type CandidateDetail,
  type Choice,
  type ErrorCurvePoint,
  type Requirement,
} from "@/lib/design";
import type { PairDesignView as DesignView } from "@/lib/design-view";
import { oneLine } from "@/lib/text-field";
import { isSigned, signedOutputV } from "@/lib/design/bidirectional";
import { signedOutputEnds } from "@/lib/design/signed-output";
import * as f from "./format";
import { designParts, type LibraryParts } from "./library-parts";
import { constructionRows, traceLayoutNotes } from "./front-end-parts";
import { kelvinAdvice, readoutText, type Part } from "./parts";
import { calibrationText, readoutErrorText } from "./readout-zero-text";
import { savedPairVerdict } from "@/lib/design/saved-verdict";

export type Row = { label: string; value: string };
export type BenchRow = BenchCheckRow & { current: string; expected: string; band: string };
export type BudgetRow = { label: string; atMin: string; atMinPercent: string; atMax: string; atMaxPercent: string };

export type SheetData = {
  requirement: Row[];
  parts: Part[];
  performance: Row[];
  budget: BudgetRow[];
  budgetTotals: { atMinPercent: string; atMaxPercent: string; rssMinPercent: string; rssMaxPercent: string };
  curve: ErrorCurvePoint[];
  bench: BenchRow[];
  benchHowTo: string[];
  layout: string[];
  cautions: string[];
  metrics: CandidateDetail;
  /** Set when the saved pair fails under today's model: printed first on the front page. */
  modelFails: string | null;
};

/**
 * The view with every name on one line (design, project, author, approver): a name holding a line
 * break could otherwise print a line of its own on the sheet, such as a fake "APPROVED by …".
 */
export function namesOnOneLine<V extends Pick<DesignView, "name" | "project" | "authorName" | "approval">>(view: V): V {
  return {
    ...view,
    name: oneLine(view.name),
    project: view.project === null ? null : oneLine(view.project),
    authorName: oneLine(view.authorName),
    approval: view.approval ? { ...view.approval, byName: oneLine(view.approval.byName) } : view.approval,
  };
}

/** A longer gain list is summarised, so the requirement table stays one table. */
const MAX_LISTED_GAINS = 12;

export function requirementRows(req: Requirement): Row[] {
  const c = req.current;
  const rows: Row[] = [{ label: "Current span", value: `${f.amps(c.min)} to ${f.amps(c.max)}` }];
  if (c.typical !== undefined) rows.push({ label: "Typical current", value: f.amps(c.typical) });
  rows.push(
    {
      label: "Supply",
      value: `${f.volts(req.supply.voltage)}, ${req.supply.side === "high" ? "high-side" : "low-side"} shunt`,
    },
    { label: "Allowed drop at maximum current", value: f.volts(req.drop.max) },
  );
  if (req.drop.loadMin !== undefined) rows.push({ label: "Minimum load voltage", value: f.volts(req.drop.loadMin) });
  rows.push(
    { label: "Load", value: req.load.model.replace("-", " ") },
    { label: "Readout", value: readoutText(req) },
    { label: "Readout's own error", value: readoutErrorText(req) },
    { label: "Calibration", value: calibrationText(req) },
    { label: "Counts at minimum current", value: `at least ${formatCount(req.resolution.countsAtMin)}` },
    {
      label: "Accuracy target",
      value: `${f.percent(req.accuracy.percent)} of reading from ${f.amps(req.accuracy.bandMin)} to ${f.amps(req.accuracy.bandMax)}`,
    },
    { label: "Ambient temperature", value: `${f.celsius(req.temperature.min)} to ${f.celsius(req.temperature.max)}` },
  );
  if (req.bandwidth.min > 0) rows.push({ label: "Bandwidth", value: `at least ${f.hertz(req.bandwidth.min)}` });
  rows.push({
    label: "Shunt options",
    value: `${req.shunt.series}, ${f.ohms(req.shunt.min)} to ${f.ohms(req.shunt.max)}, ±${f.fraction(req.shunt.tolerance)}, ${f.ppmPerK(req.shunt.tempco)}, derating ${f.fraction(req.shunt.derating)}`,
  });
  const a = req.amplifier;
  const gains = a.gainSet
    ? `set by a resistor pair (${a.gainSet.series}), ${f.gain(a.gainSet.min)} to ${f.gain(a.gainSet.max)}`
    : a.gains.length <= MAX_LISTED_GAINS
      ? a.gains.map((g) => f.gain(g)).join(", ")
      : `${a.gains.length} gains from ${f.gain(a.gains[0]!)} to ${f.gain(a.gains[a.gains.length - 1]!)}`;
  rows.push({ label: "Amplifier gains offered", value: gains });
  rows.push(...constructionRows(req));
  return rows;
}

function formatCount(n: number): string {
  return Number.isInteger(n) ? String(n) : String(Number(n.toPrecision(3)));
}

export function performanceRows(req: Requirement, m: CandidateDetail): Row[] {
  const rows: Row[] = [
    {
      label: "Drop at maximum current",
      value: `${f.volts(m.burdenV)} (${f.fraction(m.burdenV / req.supply.voltage)} of the supply)`,
    },
    { label: "Load voltage at maximum current", value: f.volts(m.loadVoltageV) },
    ...(req.load.model === "constant-current"
      ? []
      : [
          {
            label: `Current through the shunt at full load (${req.load.model} load)`,
            value: f.amps(m.operatingCurrentA),
          },
        ]),
    {
      label: "Scale factor",
      value: `${f.transimpedance(m.transimpedanceVPerA)}: ${decadeScale(m.transimpedanceVPerA)}`,
    },
    ...outputRows(req, m),
    ...worstOutputRows(req, m),
    { label: "Readout step (LSB) in current", value: f.amps(m.lsbA) },
    {
      label: "Smallest step it can tell apart",
      value: `${f.amps(m.resolvableStepA)} (${m.resolvableStepA > m.lsbA * (1 + 1e-9) ? "the RMS noise, above one step" : "one readout step"})`,
    },
    { label: "Counts at minimum current", value: formatCount(m.countsAtMin) },
    {
      label: "Error at minimum current (worst case)",
      value: `${f.percent(m.errorAtMinPercent)} of reading (RSS ${f.percent(m.rssAtMinPercent)})`,
    },
  ];
  if (m.errorAtTypicalPercent !== null && req.current.typical !== undefined) {
    rows.push({
      label: `Error at the typical current (${f.amps(req.current.typical)})`,
      value: `${f.percent(m.errorAtTypicalPercent)} of reading`,
    });
  }
  rows.push(
    { label: "Error at maximum current (worst case)", value: `${f.percent(m.errorAtMaxPercent)} of reading` },
    {
      label: `Lowest current within ${f.percent(req.accuracy.percent)}`,
      value: m.lowestAccurateCurrentA === null ? "none in the span" : f.amps(m.lowestAccurateCurrentA),
    },
    { label: "Bandwidth (−3 dB)", value: f.hertz(m.bandwidthHz) },
    {
      label: "Dissipation at full load",
      value: req.shunt.trace
        ? `${f.watts(m.dissipationW)} in the trace (it may take ${f.watts(m.ratingW)} before it passes ${f.celsius(req.shunt.maxTempC)})`
        : `${f.watts(m.dissipationW)} in a ${f.watts(m.ratingW)} part`,
    },
    {
      label: "Self-heating at full load",
      value: `${f.kelvin(m.selfHeatingK)} (shunt up to about ${f.celsius(req.temperature.max + m.selfHeatingK)})`,
    },
  );
  if (m.deadZoneA > 0)
    rows.push(
      isSigned(req.current)
        ? // A signed span has no floor at zero: its dead zone is where the offsets can flip the sign.
          { label: "Sign uncertain within", value: `±${f.amps(m.deadZoneA)} of zero (zero level's error and offsets)` }
        : {
            label: "Reads as zero below",
            value: `${f.amps(m.deadZoneA)} (output floor ${f.volts(req.amplifier.swingLow)})`,
          },
    );
  return rows;
}

/** The output at the span's ends: a signed span's sits on its zero level, both ways. */
function outputRows(req: Requirement, m: CandidateDetail): Row[] {
  if (!isSigned(req.current))
    return [
      { label: "Output at maximum current", value: `${f.volts(m.outputAtMaxV)} (headroom ${f.volts(m.headroomV)})` },
    ];
  const zeroV = req.amplifier.reference.voltage;
  const at = (I: number) => f.volts(signedOutputV(zeroV, m.transimpedanceVPerA, I));
  return [
    { label: "Output at zero current", value: `${f.volts(zeroV)} (the zero level)` },
    { label: "Output at maximum current", value: `${at(req.current.max)} at ${f.amps(req.current.max)}` },
    { label: "Output at the largest negative current", value: `${at(req.current.min)} at ${f.amps(req.current.min)}` },
  ];
}

/**
 * The worst-case output at full load. A signed span has two ends, each against its side of the
 * window: +Imax with every error that raises it against the ceiling, −|Imin| with every error that
 * lowers it against the floor (the engine's signedOutputEnds, the figures the sweep judged).
 */
function worstOutputRows(req: Requirement, m: CandidateDetail): Row[] {
  const ends = signedOutputEnds(req, { shuntOhms: m.shuntOhms, gain: m.gain });
  if (!ends)
    return [
      {
        label: "Output at full load, worst case",
        value: `${f.volts(m.outputAtMaxWorstV)} with every error that raises it`,
      },
    ];
  const room = (v: number) => (v >= 0 ? `${f.volts(v)} to spare` : `clips: ${f.volts(-v)} short`);
  return [
    {
      label: `Output at full load (${f.amps(ends.highCurrentA)}), worst case`,
      value: `${f.volts(ends.highWorstV)} with every error that raises it; ceiling ${f.volts(ends.ceilV)} (${room(ends.highMarginV)})`,
    },
    {
      label: `Output at full reverse load (${f.amps(ends.lowCurrentA)}), worst case`,
      value: `${f.volts(ends.lowWorstV)} with every error that lowers it; floor ${f.volts(ends.floorV)} (${room(ends.lowMarginV)})`,
    },
  ];
}

export function budgetRows(req: Requirement, choice: Choice): { rows: BudgetRow[]; totals: SheetData["budgetTotals"] } {
  const lo = errorAt(req, choice, req.current.min);
  const hi = errorAt(req, choice, req.current.max);
  const rows = lo.terms.map((t, i) => {
    const h = hi.terms[i]!;
    return {
      // The readout's own lines say whether their figures are stated or typical of a class of part.
      label: t.basis ? `${t.label} (${t.basis})` : t.label,
      atMin: f.amps(t.errorA),
      // By magnitude: a signed span's lower end is its largest negative current.
      atMinPercent: f.percent((100 * t.errorA) / Math.abs(req.current.min)),
      atMax: f.amps(h.errorA),
      atMaxPercent: f.percent((100 * h.errorA) / req.current.max),
    };
  });
  return {
    rows,
    totals: {
      atMinPercent: f.percent(lo.worstPercent),
      atMaxPercent: f.percent(hi.worstPercent),
      rssMinPercent: f.percent(lo.rssPercent),
      rssMaxPercent: f.percent(hi.rssPercent),
    },
  };
}

export function benchRows(req: Requirement, choice: Choice): BenchRow[] {
  return benchCheck(req, choice).map((r) => ({
    ...r,
    current: f.amps(r.currentA),
    expected: f.volts(r.expectedV),
    band: `${f.volts(r.minV)} to ${f.volts(r.maxV)}`,
  }));
}

export function benchHowTo(req: Requirement): string[] {
  const high = req.supply.side === "high";
  return [
    "Power U1 from its own supply and leave the circuit under test disconnected: feed the shunt from a test source instead of the real load.",
    "Apply each test current with a calibrated current source, or with a known resistor from a stable supply (current = supply voltage / resistance), and measure the current with a reference meter in series.",
    `Read the output between OUT and GND on J1 with a reference voltmeter${high ? "; on the high side, bring the shunt up to the working supply voltage so the amplifier sees its real common-mode voltage" : ""}.`,
    "Each reading should fall inside its band; the band is the worst-case error budget at that current. A reading outside it points at the shunt value, its sense connections or the amplifier gain.",
    "Start at the lowest current and work up; at full scale, let the shunt settle thermally for a minute before reading.",
  ];
}

export function layoutNotes(req: Requirement, choice: Choice): string[] {
  const k = kelvinAdvice(choice.shuntOhms);
  const trace = traceLayoutNotes(req, choice);
  return [
    ...trace,
    trace.length > 0
      ? "R1 is drawn in copper: the taps above are its Kelvin connections."
      : k === "part"
        ? `Kelvin connections: R1 is a 4-terminal part; route the sense traces from its sense terminals only. At ${f.ohms(choice.shuntOhms)}, a few milliohms of copper or solder in the sense path would be a large error.`
        : "Kelvin connections: take the sense traces from the inner edges of R1's pads, never from the wide current traces; the current enters and leaves by the outer edges.",
    "Run the two sense traces as a short, tightly paired (or twisted) pair straight to U1's inputs, away from switching nodes and the load's current loop.",
    "Place U1 close to R1 so the sense pair stays short; keep the gain-setting parts (if any) and C1 right at U1.",
    "Keep copper and solder-joint resistance out of the measurement: no vias or connectors between R1's sense points and U1, and the current path's copper wide enough for the maximum current.",
    `Heat: R1 dissipates ${f.watts(evaluateCandidate(req, choice).dissipationW)} at full scale; give ${trace.length > 0 ? "the trace" : "its pads"} copper area to spread the heat, and keep U1 and any other precision parts away from it.`,
    req.supply.side === "high"
      ? "High side: both sense lines carry the supply voltage; keep clearance to low-voltage circuitry as the working voltage requires."
      : "Low side: R1 lifts the load's return above the system ground by the drop; keep other grounds from joining between R1 and the load.",
  ];
}

/** The engine's cautions for this design, one line each (the same list the candidate study shows). */
export function cautions(req: Requirement, m: CandidateDetail): string[] {
  return designCautions(req, m).map((c) => `${c.title}: ${c.text}`);
}

/** `library`: the team's parts, to name the ones the pair came from. */
export function sheetData(view: Pick<DesignView, "requirement" | "choice">, library?: LibraryParts): SheetData {
  const { requirement: req, choice } = view;
  const m = evaluateCandidate(req, choice);
  const budget = budgetRows(req, choice);
  return {
    requirement: requirementRows(req),
    parts: designParts(req, choice, m, library),
    performance: performanceRows(req, m),
    budget: budget.rows,
    budgetTotals: budget.totals,
    curve: curveByMagnitude(errorCurve(req, choice, 60)),
    bench: benchRows(req, choice),
    benchHowTo: benchHowTo(req),
    layout: layoutNotes(req, choice),
    cautions: cautions(req, m),
    metrics: m,
    modelFails: (() => {
      const v = savedPairVerdict(req, choice);
      return v.fails ? v.statement : null;
    })(),
  };
}
