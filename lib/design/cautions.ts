// Safety cautions for one design: one list, shown on the candidate study and printed on the build
// sheet. They inform; local codes and licensed practice decide (docs/model.md §5).
import { REFERENCE_C } from "./model";
import type { Requirement } from "./requirement";
import type { CandidateDetail } from "./types";
import type { PlannedRange } from "./range-plan";
import { formatSI } from "./format";

export type CautionKey =
  | "hot"
  | "hazardous"
  | "common-mode"
  | "mains"
  | "fuse"
  | "inductive"
  | "codes"
  | "range-switch"
  | "range-protection"
  | "switch-heat";

/** bad: a hazard this design has; warn: a hazard it may have; note: what every build needs. */
export type Caution = { key: CautionKey; severity: "bad" | "warn" | "note"; title: string; text: string };

/**
 * Touch-temperature limits for a bare metal or ceramic surface (a shunt's body and pads). They
 * follow the burn thresholds of ISO 13732-1 (contact with hot surfaces), which the IEC equipment
 * safety standards (IEC 61010-1 for measurement equipment, IEC 62368-1 for ICT equipment) draw on
 * for the limits of touchable surfaces: about 65 °C burns on a one-second touch, and about 51 °C
 * if held for a minute. Values from memory: check the edition in force.
 */
export const BURNS_ON_BRIEF_TOUCH_C = 65;
export const BURNS_IF_HELD_C = 51;

/**
 * The DC voltage above which a circuit counts as hazardous to touch: 60 V, the dry-condition
 * limit the IEC equipment standards use for accessible DC circuits (IEC 61010-1, IEC 62368-1's
 * ES1 limit). From memory.
 */
export const HAZARDOUS_DC_V = 60;

/**
 * High-side common-mode voltage above which the amplifier's rating needs a second look: many
 * current-sense amplifiers stop near 26–36 V (common practice, no source).
 */
export const AMPLIFIER_CM_CHECK_V = 30;

/**
 * The shunt's surface temperature at full current where people handle the board: the bench,
 * at the reference 25 °C. Heat from the product's own ambient is its enclosure's concern; this
 * is the heat the chosen shunt adds.
 */
export function shuntTouchTemperatureC(m: Pick<CandidateDetail, "selfHeatingK">): number {
  return REFERENCE_C + m.selfHeatingK;
}

/** `shunt` names the part in the hot-shunt caution (a range plan names the range's shunt). */
export function designCautions(req: Requirement, m: CandidateDetail, shunt = "R1"): Caution[] {
  const out: Caution[] = [];
  const touchC = shuntTouchTemperatureC(m);
  const hottestC = req.temperature.max + m.selfHeatingK;
  if (touchC >= BURNS_IF_HELD_C) {
    const brief = touchC >= BURNS_ON_BRIEF_TOUCH_C;
    out.push({
      key: "hot",
      severity: brief ? "bad" : "warn",
      title: "Hot shunt",
      text:
        `At full current ${shunt} dissipates ${formatSI(m.dissipationW, "W")} (rated ${formatSI(m.ratingW, "W")}) and runs about ` +
        `${formatSI(m.selfHeatingK, "K")} above its surroundings: about ${formatSI(touchC, "°C")} on a 25 °C bench, ` +
        `up to about ${formatSI(hottestC, "°C")} at the highest ambient. ` +
        (brief
          ? "That burns on a brief touch: do not touch it while, or just after, it carries current. "
          : "That burns if held: do not hold it while it carries current. ") +
        "Give it copper area and keep the amplifier and other heat-sensitive parts away from it.",
    });
  }
  const v = req.supply.voltage;
  if (v >= HAZARDOUS_DC_V) {
    out.push({
      key: "hazardous",
      severity: "bad",
      title: "Hazardous voltage",
      text:
        `${formatSI(v, "V")} can kill. ` +
        (req.supply.side === "high"
          ? `On the high side the sense lines sit at ${formatSI(v, "V")}: use an isolated amplifier or one rated for that common-mode voltage, an isolated readout, and bench instruments rated for the circuit's measurement category. `
          : "Use bench instruments rated for the circuit's measurement category. ") +
        "Isolation, creepage and clearance, enclosure and fusing are as local codes require; have the design made and checked by someone licensed to do so. These figures do not replace that.",
    });
  } else if (req.supply.side === "high" && v > AMPLIFIER_CM_CHECK_V) {
    out.push({
      key: "common-mode",
      severity: "warn",
      title: "High common-mode voltage",
      text: `The sense lines sit ${formatSI(v, "V")} above ground: the amplifier must be rated for that common-mode voltage, with margin for transients on the supply.`,
    });
  }
  if (v < HAZARDOUS_DC_V) {
    out.push({
      key: "mains",
      severity: "note",
      title: "Not for mains",
      text: "If this front end is ever used on mains-connected or high-voltage circuits, it needs an isolated amplifier, an isolated readout and instruments rated for the circuit's measurement category; this design does not provide them.",
    });
  }
  out.push(
    {
      key: "fuse",
      severity: "note",
      title: "Fuse the measured path",
      text: `Up to ${formatSI(req.current.max, "A")} flows through the shunt: put a fuse or current limit rated for the circuit ahead of it, so a fault cannot turn the shunt or its traces into the fuse.`,
    },
    {
      key: "inductive",
      severity: "note",
      title: "Never open a live inductive circuit",
      text: "Motors, coils and long supply leads keep the current flowing: the voltage spike can arc or destroy the amplifier. Switch off before connecting or disconnecting the shunt.",
    },
    {
      key: "codes",
      severity: "note",
      title: "Local codes decide",
      text: "Follow local electrical codes and your organisation's safety rules; work on mains or hazardous voltages belongs to suitably qualified, licensed people.",
    },
  );
  return out;
}

/**
 * A range plan's switch, beyond the failure the plan cautions name: what the protection does for
 * each lower range (the current it lets through before the top range's switch closes, Ohm's law
 * at the allowed drop) and how to prove it on the bench, and the top switch's own heat (I²·Ron).
 * Designators as on the plan's build sheet: shunts R1…Rn, switches Q1…Qn, the comparator U(n+1).
 */
export function switchCautions(req: Requirement, ranges: PlannedRange[]): Caution[] {
  const n = ranges.length;
  const iFull = req.current.max;
  const ron = req.rangeSwitch.onResistance;
  const lower = ranges
    .slice(0, -1)
    .map(
      (r, k) =>
        `R${k + 1} (range ${k + 1}, ${formatSI(r.shuntOhms, "Ω")}) carries at most ${formatSI(r.faultCurrentA, "A")} (${formatSI(r.faultCurrentA * r.faultCurrentA * r.shuntOhms, "W")} in its ${formatSI(r.ratingW, "W")} part)`,
    );
  return [
    {
      key: "range-protection",
      severity: "warn",
      title: "What keeps a low range alive at full current",
      text:
        `U${n + 1}, a latching comparator, closes Q${n} (the top range's switch) in hardware when the drop across the path in use reaches ${formatSI(req.drop.max, "V")}; until then ${lower.join("; ")}. ` +
        `It must act faster than the load's current can rise past range 1's top (${formatSI(ranges[0]!.maxA, "A")}). ` +
        `Prove it on the bench before connecting a battery or a supply that can deliver ${formatSI(iFull, "A")}: select range 1, raise the current slowly past its top, and check that the drop stops at about ${formatSI(req.drop.max, "V")}. Never leave out Q${n} or U${n + 1} to save parts.`,
    },
    {
      key: "switch-heat",
      severity: "note",
      title: "The top range's switch carries the full current",
      text: `Q${n} carries ${formatSI(iFull, "A")} continuously: ${formatSI(iFull * iFull * ron, "W")} at its ${formatSI(ron, "Ω")} on-resistance, more when hot (a MOSFET's on-resistance rises with temperature). Choose one rated for the full current at the highest ambient, with copper area to spread its heat.`,
    },
  ];
}
