// ngspice-compatible netlists of a range plan: one deck per range, each an `.op` at that range's
// top current with its own switch closed, the other ranges' switches open and the protection in
// place (docs/model.md, "Netlist"; DEFAULTS.md, "Range plans").
import { buildModel, operatingBurden, operatingCurrent } from "./model";
import { amplifierLines, loadLines, spiceNumber } from "./netlist";
import type { PlanChoice } from "./plan-choice";
import { subModel } from "./range-plan";
import type { Requirement } from "./requirement";

/**
 * An open switch as a resistance: 1 GΩ, far above any shunt, so a path left open carries
 * picoamps at the plan's drops. A real switch's off-state leakage is on its data sheet.
 */
export const OPEN_SWITCH_OHMS = 1e9;

export type RangeDeck = {
  /** 0-based, ascending ranges as the plan lists them. */
  range: number;
  netlist: string;
  /** The engine's figures the deck should reproduce. */
  expected: { currentA: number; shuntDropV: number; pathDropV: number; outputV: number };
};

/** The engine's operating point of range k at its own top current: current, shunt drop, path drop. */
export function rangeOperatingPoint(req: Requirement, plan: PlanChoice, k: number) {
  const r = plan.ranges[k]!;
  const sub = subModel(req, buildModel(req), r.minA, r.maxA);
  const path = r.shuntOhms + req.rangeSwitch.onResistance;
  const currentA = operatingCurrent(sub, path);
  return { currentA, shuntDropV: currentA * r.shuntOhms, pathDropV: operatingBurden(sub, path) };
}

/**
 * Range k's deck. Nodes: bus (supply +), sp (where the current enters every shunt), sn (the far
 * end of the shunt in use; the others end at sn1, sn2, …), out (the amplifier of the range in use).
 * Low side: bus → load → sp → shunts → switches → ret → VRET (0 V) → 0. High side: bus → VFEED
 * (0 V) → sp → shunts → switches → ld → load → 0. The protection is a switch (SPROT) beside the
 * top range's that closes when the drop of the path in use reaches the allowed drop.
 */
export function rangeDeck(
  req: Requirement,
  plan: PlanChoice,
  k: number,
  opts: { includeOffset?: boolean } = {},
): RangeDeck {
  const includeOffset = opts.includeOffset ?? true;
  const high = req.supply.side === "high";
  const ron = req.rangeSwitch.onResistance;
  const n = plan.ranges.length;
  const active = plan.ranges[k]!;
  const op = rangeOperatingPoint(req, plan, k);
  const join = high ? "ld" : "ret";
  const end = (j: number) => (j === k ? "sn" : `sn${j + 1}`);
  const lines: string[] = [];
  lines.push(
    `* Sensewright range plan, range ${k + 1} of ${n} in use: ${high ? "high" : "low"}-side, ${req.load.model} load at this range's top current`,
  );
  lines.push(
    `* shunt ${spiceNumber(active.shuntOhms)} ohm, gain ${spiceNumber(active.gain)}, switch on-resistance ${spiceNumber(ron)} ohm; all values in SI base units`,
  );
  lines.push(
    `* Nodes: bus = supply +, sp = where the current enters every shunt, sn = far end of the shunt in use (others sn1, sn2, ...), ${join} = where the switches join, out = amplifier output, 0 = ground.`,
  );
  lines.push(`VBUS bus 0 DC ${spiceNumber(req.supply.voltage)}`);
  if (high) lines.push("VFEED bus sp DC 0");
  for (let j = 0; j < n; j++) {
    const r = plan.ranges[j]!;
    lines.push(`RSHUNT${j + 1} sp ${end(j)} ${spiceNumber(r.shuntOhms)}`);
    lines.push(
      j === k
        ? `RSW${j + 1} ${end(j)} ${join} ${spiceNumber(ron)} ; range ${j + 1} switch closed (on-resistance)`
        : `RSW${j + 1} ${end(j)} ${join} ${spiceNumber(OPEN_SWITCH_OHMS)} ; range ${j + 1} switch open`,
    );
  }
  // The protection: closes the top range's path when the drop of the path in use reaches the
  // allowed drop. At a range's own top the drop is below that, so it stays open here.
  const topEnd = end(n - 1);
  lines.push(
    `* Protection: a comparator-driven switch beside the top range's switch; closes at a path drop of ${spiceNumber(req.drop.max)} V.`,
  );
  lines.push(`SPROT ${topEnd} ${join} sp ${join} SWPROT`);
  lines.push(
    `.model SWPROT SW(VT=${spiceNumber(req.drop.max)} VH=0 RON=${spiceNumber(ron)} ROFF=${spiceNumber(OPEN_SWITCH_OHMS)})`,
  );
  if (!high) lines.push(`VRET ${join} 0 DC 0`);
  const [la, lb] = high ? [join, "0"] : ["bus", "sp"];
  loadLines(lines, req, la, lb, active.maxA, op.pathDropV);
  amplifierLines(lines, req, active.gain, includeOffset, false);
  return {
    range: k,
    netlist: lines.join("\n") + "\n",
    expected: {
      ...op,
      outputV: active.gain * (op.shuntDropV + (includeOffset ? req.amplifier.offset : 0)),
    },
  };
}

/** Every range's deck, for the design's netlist download: each runs on its own in ngspice. */
export function planNetlist(req: Requirement, plan: PlanChoice, opts: { includeOffset?: boolean } = {}): string {
  const decks = plan.ranges.map((_, k) => rangeDeck(req, plan, k, opts).netlist);
  const head = [
    `* Sensewright range plan: ${plan.ranges.length} ranges, one deck per range below, each ending in .end.`,
    "* A simulator reads one deck per file: save each deck as its own file (or download one with ?range=N).",
    "",
  ].join("\n");
  return head + decks.join("\n");
}
