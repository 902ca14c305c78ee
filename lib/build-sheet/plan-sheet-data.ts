// Everything a range plan's build sheet says, as text rows: the engine (evaluatePlan, planCautions)
// computes, this file only words and formats. Shared by the PDF, the parts CSV and the tests.
import {
  decadeScale,
  evaluatePlan,
  planCautions,
  resistorCode,
  type PlanChoice,
  type PlanRangeMetrics,
  type Requirement,
} from "@/lib/design";
import * as f from "./format";
import { planDesignators, planPartsList } from "./plan-parts";
import type { Part } from "./parts";
import { requirementRows, type BenchRow, type Row } from "./sheet-data";

export type PlanRangeSheet = {
  title: string;
  performance: Row[];
  bench: BenchRow[];
};

export type PlanSheetData = {
  requirement: Row[];
  parts: Part[];
  /** The switching rule, the switch delay, settling and the protection, one paragraph each. */
  switching: string[];
  ranges: PlanRangeSheet[];
  benchHowTo: string[];
  layout: string[];
  cautions: string[];
  metrics: PlanRangeMetrics[];
};

/** A plan the engine refuses has no sheet: the caller saved it through the same check, so this is a bug. */
export class UnsoundPlanError extends Error {}

export function planRequirementRows(req: Requirement): Row[] {
  return [
    ...requirementRows(req),
    { label: "Range switch on-resistance", value: `at most ${f.ohms(req.rangeSwitch.onResistance)}` },
    { label: "Range switch delay", value: formatSeconds(req.rangeSwitch.delay) },
  ];
}

const formatSeconds = (s: number) => (s === 0 ? "0 s (acts at once)" : f.seconds(s));

export function planRangeRows(req: Requirement, r: PlanRangeMetrics, k: number, n: number): Row[] {
  const top = k === n - 1;
  const rows: Row[] = [
    { label: "Span", value: `${f.amps(r.minA)} to ${f.amps(r.maxA)}` },
    { label: "Shunt", value: `${f.ohms(r.shuntOhms)} (${resistorCode(r.shuntOhms)}), ${f.watts(r.ratingW)} part` },
    { label: "Gain", value: f.gain(r.gain) },
    {
      label: "Scale factor",
      value: `${f.transimpedance(r.transimpedanceVPerA)}: ${decadeScale(r.transimpedanceVPerA)}`,
    },
    { label: "Drop across the shunt at the top", value: f.volts(r.burdenAtTopV) },
    {
      label: "Drop with the switch at the top",
      value: `${f.volts(r.worstBurdenV)} (allowed ${f.volts(req.drop.max)})`,
    },
    { label: "Output at the top", value: f.volts(r.outputAtMaxV) },
    { label: "Readout step (LSB) in current", value: f.amps(r.lsbA) },
    { label: "Resolvable steps at the bottom", value: String(Number(r.countsAtBottom.toPrecision(3))) },
    { label: "Error at the bottom (worst case)", value: `${f.percent(r.errorAtMinPercent)} of reading` },
    { label: "Error at the top (worst case)", value: `${f.percent(r.errorAtMaxPercent)} of reading` },
    { label: "Bandwidth (−3 dB)", value: f.hertz(r.bandwidthHz) },
    { label: "Settling after a switch", value: f.seconds(r.settlingS) },
  ];
  if (!top)
    rows.push({
      label: "Most current before the protection acts",
      value: `${f.amps(r.faultCurrentA)} (${f.watts(r.faultDissipationW)} in the shunt)`,
    });
  return rows;
}

function benchRowsOf(r: PlanRangeMetrics): BenchRow[] {
  return r.benchCheck.map((b) => ({
    ...b,
    current: f.amps(b.currentA),
    expected: f.volts(b.expectedV),
    band: `${f.volts(b.minV)} to ${f.volts(b.maxV)}`,
  }));
}

function switchingText(req: Requirement, ev: Extract<ReturnType<typeof evaluatePlan>, { ok: true }>): string[] {
  const slowest = Math.max(...ev.ranges.map((r) => r.settlingS));
  return [
    ev.switchRule,
    `The switch acts within ${formatSeconds(req.rangeSwitch.delay)} of the current leaving a range (the requirement's switch delay); until then the range in use reads above its top and its output may clip. Switch make-before-break, so the load never sees an open circuit.`,
    `After a switch the amplifier of the new range needs about ${f.seconds(slowest)} to settle within half a readout step: discard readings taken in that time.`,
    `Protection: ${ev.protection}`,
  ];
}

function planBenchHowTo(req: Requirement, n: number): string[] {
  const d = planDesignators(n);
  return [
    "Power the amplifiers and the comparator from their own supply and feed the shunts from a test source, not the real load.",
    `Check the protection first: select range 1 (only ${d.switch(0)} on), raise the test current slowly past range 1's top, and check that ${d.protection} closes ${d.switch(n - 1)} before the drop passes ${f.volts(req.drop.max)}.`,
    "Then, for each range, turn on only that range's switch, apply each test current with a calibrated source and a reference meter in series, and read that range's output (OUTk) between OUTk and GND on J1.",
    "At each switch point, read the current on both ranges, the one below and the one above: both readings must fall inside their bands, so the reading does not jump when the range changes.",
    "Each reading should fall inside its band (the worst-case error budget at that current). A reading outside it points at that range's shunt, its sense connections, its switch or its amplifier gain.",
  ];
}

function planLayout(req: Requirement, ranges: PlanRangeMetrics[]): string[] {
  const n = ranges.length;
  const d = planDesignators(n);
  return [
    "Kelvin connections on every shunt: each amplifier's sense pair leaves its own shunt's inner terminals, never the shared current node.",
    `Put each range switch on the far side of its shunt from the shared node sp, so the switch's on-resistance stays out of the sense pair (it counts in the drop, not in the reading).`,
    `The top range's path (${d.shunt(n - 1)} and ${d.switch(n - 1)}) carries ${f.amps(req.current.max)}: wide copper, and room for its heat.`,
    `Keep ${d.protection} and its sense lines short and close to ${d.switch(n - 1)}'s gate: its speed is what protects the lower shunts.`,
    req.supply.side === "high"
      ? "High side: every sense line and switch sits at the supply voltage; keep clearance to low-voltage circuitry as the working voltage requires."
      : "Low side: the shunts lift the load's return above the system ground by the drop; keep other grounds from joining between the shunts and the load.",
  ];
}

/** The sheet data of a saved plan, from the engine's re-derivation of it. */
export function planSheetData(req: Requirement, plan: PlanChoice): PlanSheetData {
  const ev = evaluatePlan(req, plan);
  if (!ev.ok) throw new UnsoundPlanError(ev.message);
  const n = ev.ranges.length;
  return {
    requirement: planRequirementRows(req),
    parts: planPartsList(req, ev.ranges),
    switching: switchingText(req, ev),
    ranges: ev.ranges.map((r, k) => ({
      title: `Range ${k + 1}: ${f.amps(r.minA)} to ${f.amps(r.maxA)}`,
      performance: planRangeRows(req, r, k, n),
      bench: benchRowsOf(r),
    })),
    benchHowTo: planBenchHowTo(req, n),
    layout: planLayout(req, ev.ranges),
    cautions: planCautions(req, ev).map((c) => `${c.title}: ${c.text}`),
    metrics: ev.ranges,
  };
}
