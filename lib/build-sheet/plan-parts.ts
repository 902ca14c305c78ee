// The parts list of a range plan: a shunt, a switch and an amplifier per range, the gain parts,
// the protection that keeps a low range alive at full current, decoupling and connectors. Values
// come from the saved requirement and plan; figures from the engine (evaluatePlan).
import { rangeSwitchW, type PlanRangeMetrics, type Requirement } from "@/lib/design";
import * as f from "./format";
import {
  amplifierPart,
  gainPairParts,
  gainResistors,
  kelvinAdvice,
  kelvinAdviceText,
  readoutText,
  shuntPartCommon,
  type Part,
} from "./parts";

/**
 * An open range switch can see the whole supply (every path open at power-up, a load fault), so it
 * is rated for at least the supply with margin: twice it (common practice, no source).
 */
export const SWITCH_VOLTAGE_MARGIN = 2;

/** Designators: shunts R1…Rn, switches Q1…Qn, amplifiers U1…Un, the protection's comparator U(n+1). */
export function planDesignators(n: number) {
  return {
    shunt: (k: number) => `R${k + 1}`,
    switch: (k: number) => `Q${k + 1}`,
    amplifier: (k: number) => `U${k + 1}`,
    protection: `U${n + 1}`,
  };
}

export function planPartsList(req: Requirement, ranges: PlanRangeMetrics[]): Part[] {
  const n = ranges.length;
  const d = planDesignators(n);
  const s = req.shunt;
  const a = req.amplifier;
  const high = req.supply.side === "high";
  const ron = req.rangeSwitch.onResistance;
  const vSwitch = SWITCH_VOLTAGE_MARGIN * req.supply.voltage;
  const parts: Part[] = [];
  ranges.forEach((r, k) => {
    const top = k === n - 1;
    parts.push({
      designator: d.shunt(k),
      part: `Shunt resistor, range ${k + 1}, ${s.series} value${kelvinAdvice(r.shuntOhms) === "part" ? ", 4-terminal" : ""}`,
      ...shuntPartCommon(req, r.shuntOhms, r.ratingW),
      value: f.ohms(r.shuntOhms),
      notes:
        `Range ${k + 1}, ${f.amps(r.minA)} to ${f.amps(r.maxA)}. ` +
        (top
          ? `Dissipates ${f.watts(r.dissipationW)} at the maximum current. `
          : `Rated for ${f.amps(r.faultCurrentA)} (${f.watts(r.faultDissipationW)}), the most it carries before the protection closes ${d.switch(n - 1)}. `) +
        `${kelvinAdviceText(r.shuntOhms)}.`,
    });
  });
  ranges.forEach((r, k) => {
    const top = k === n - 1;
    const current = top ? req.current.max : r.faultCurrentA;
    parts.push({
      designator: d.switch(k),
      part: high
        ? `Range switch, range ${k + 1}: P-channel MOSFET (or a high-side switch with its own gate driver)`
        : `Range switch, range ${k + 1}: N-channel logic-level MOSFET`,
      value: `on-resistance at most ${f.ohms(ron)}`,
      valueSI: ron,
      unit: "ohm",
      code: null,
      tolerance: "at the gate drive used, at the highest ambient",
      tempco: "—",
      rating: `${f.volts(vSwitch)}, ${f.amps(current)}`,
      notes:
        `Blocks at least ${f.volts(vSwitch)} (twice the supply) and carries ${f.amps(current)} ` +
        (top
          ? `continuously (${f.watts(rangeSwitchW(req, current))} at ${f.ohms(ron)}); the protection closes it at full current.`
          : `until the protection acts (the range's own top is ${f.amps(r.maxA)}).`) +
        ` Its on-resistance is in the plan's drop: a higher one takes the range past the allowed ${f.volts(req.drop.max)}.`,
    });
  });
  ranges.forEach((r, k) =>
    parts.push(
      amplifierPart(req, {
        designator: d.amplifier(k),
        gain: r.gain,
        bandwidthHz: r.bandwidthHz,
        forWhat: ` for range ${k + 1}`,
        lead: `Across ${d.shunt(k)}'s sense terminals; output OUT${k + 1} on J1 (${f.transimpedance(r.transimpedanceVPerA)}). `,
      }),
    ),
  );
  let nextR = n + 1;
  ranges.forEach((r, k) => {
    const pair = gainResistors(req, r);
    if (!pair) return;
    const diff = req.amplifier.topology === "difference";
    const names = { rf: `R${nextR++}`, rg: `R${nextR++}`, amplifier: d.amplifier(k) };
    parts.push(...gainPairParts(req, pair, diff ? { ...names, rf2: `R${nextR++}`, rg2: `R${nextR++}` } : names));
  });
  parts.push(
    {
      designator: d.protection,
      part: "Protection: comparator with latch, driving the top range's switch",
      value: `trips at ${f.volts(req.drop.max)}`,
      valueSI: req.drop.max,
      unit: "V",
      code: null,
      // Above every lower range's own worst drop (or it trips in normal use), not above the allowed drop.
      tolerance: `trips between ${f.volts(Math.max(...ranges.slice(0, -1).map((r) => r.worstBurdenV)))} and ${f.volts(req.drop.max)}`,
      tempco: "—",
      rating: `supply ${f.volts(a.supply)}`,
      notes:
        `Watches the drop across the path in use (shunt and switch) and closes ${d.switch(n - 1)} in hardware when it reaches ${f.volts(req.drop.max)}, holding it until the switching logic takes over. ` +
        `It must act faster than the load's current can rise past range 1's top (${f.amps(ranges[0]!.maxA)}). This is what keeps ${ranges
          .slice(0, -1)
          .map((_, k) => d.shunt(k))
          .join(" and ")} alive at the full ${f.amps(req.current.max)}.`,
    },
    {
      designator: "C1",
      part: "Ceramic capacitor, X7R (one per amplifier and comparator)",
      value: f.farads(100e-9),
      valueSI: 100e-9,
      unit: "F",
      code: null,
      tolerance: "±10 %",
      tempco: "X7R",
      rating: `${f.volts(Math.max(10, 2 * a.supply))} or more`,
      notes: `Supply decoupling right at each of U1 to ${d.protection}'s supply pins: ${n + 1} in all (common practice, no source).`,
    },
    {
      designator: "J1",
      part: `${n + 1 + n}-way connector: OUT1 to OUT${n}, GND, and the gate drives G1 to G${n}`,
      value: "—",
      valueSI: null,
      unit: null,
      code: null,
      tolerance: "—",
      tempco: "—",
      rating: "—",
      notes: `OUTk goes to the readout (${readoutText(req)}) while range k is in use; Gk drives Qk from the switching logic. Take GND from the amplifiers' ground, not from the current path.`,
    },
  );
  return parts;
}
