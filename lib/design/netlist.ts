// An ngspice-compatible netlist of one design at Imax: supply, shunt, load and amplifier.
import { buildModel, operatingBurden } from "./model";
import type { Requirement } from "./requirement";
import type { Choice } from "./types";

/**
 * SPICE reads "m" and "M" both as milli, so values go out in plain exponent notation
 * ("4.7e-3"), never with scale suffixes.
 */
export function spiceNumber(x: number): string {
  if (!Number.isFinite(x)) throw new RangeError(`cannot write ${x} into a netlist`);
  if (x === 0) return "0";
  const [mant = "0", exp = "0"] = x.toExponential(9).split("e");
  const m = mant.replace(/\.?0+$/, "");
  const e = Number(exp);
  return e === 0 ? m : `${m}e${e}`;
}

/** Gain-setting resistors of a difference stage: Rg from each input, Rf to the output and to ground. */
export const DIFFERENCE_RG_OHMS = 10_000;
/** Open-loop gain of the op-amp in a difference stage's netlist (an ideal-enough op-amp). */
export const OPAMP_OPEN_LOOP_GAIN = 1e7;

export type NetlistOptions = {
  includeOffset?: boolean;
  /**
   * Difference stage only: skew its four resistors by ± the gain-set tolerance in the pattern
   * that spoils common-mode rejection most (Rg1·(1+t), Rf1·(1−t), Rg2·(1−t), Rf2·(1+t)).
   */
  worstMismatch?: boolean;
};

export function buildNetlist(req: Requirement, choice: Choice, opts: NetlistOptions = {}): string {
  const includeOffset = opts.includeOffset ?? true;
  const { shuntOhms: R, gain: G } = choice;
  const vBus = req.supply.voltage;
  const iMax = req.current.max;
  const high = req.supply.side === "high";
  const model = req.load.model;
  // The load sits between `la` and `lb`: bus → load → sp on the low side, sn → load → 0 on the high side.
  const [la, lb] = high ? ["sn", "0"] : ["bus", "sp"];
  const lines: string[] = [];
  lines.push(`* Sensewright current-sense front end: ${high ? "high" : "low"}-side shunt, ${model} load at Imax`);
  lines.push(`* shunt ${spiceNumber(R)} ohm, gain ${spiceNumber(G)}; all values in SI base units`);
  lines.push(
    "* Nodes: bus = supply +, sp = shunt end the current enters, sn = the other end, out = amplifier output, 0 = ground.",
  );
  if (high) {
    lines.push("* High side: bus -> VFEED (0 V, reads the current) -> sp -> RSHUNT -> sn -> load -> 0.");
  } else {
    lines.push("* Low side: bus -> load -> sp -> RSHUNT -> sn -> VRET (0 V, reads the current) -> 0.");
  }
  lines.push(`VBUS bus 0 DC ${spiceNumber(vBus)}`);
  if (high) lines.push("VFEED bus sp DC 0");
  lines.push(`RSHUNT sp sn ${spiceNumber(R)}`);
  if (!high) lines.push("VRET sn 0 DC 0");
  const burden = model === "constant-power" ? operatingBurden(buildModel(req), R) : NaN;
  loadLines(lines, req, la, lb, iMax, burden);
  amplifierLines(lines, req, G, includeOffset, opts.worstMismatch ?? false);
  return lines.join("\n") + "\n";
}

/**
 * The amplifier across the shunt between `sp` and `sn`, its output `out` loaded by RREAD, then
 * `.op` and `.end`: the close of every netlist the engine writes.
 */
export function amplifierLines(
  lines: string[],
  req: Requirement,
  G: number,
  includeOffset: boolean,
  worstMismatch: boolean,
) {
  if (req.amplifier.topology === "difference") {
    differenceStage(lines, req, G, includeOffset, worstMismatch ? (req.amplifier.gainSet?.tolerance ?? 0) : 0);
  } else {
    lines.push("* Amplifier: an ideal voltage-controlled voltage source across the shunt,");
    if (includeOffset) {
      lines.push(
        `* with its input offset ${spiceNumber(req.amplifier.offset)} V as a source in series with the + input.`,
      );
      lines.push(`VOS spo sp DC ${spiceNumber(req.amplifier.offset)}`);
      lines.push(`EAMP out 0 spo sn ${spiceNumber(G)}`);
    } else {
      lines.push("* offset left out.");
      lines.push(`EAMP out 0 sp sn ${spiceNumber(G)}`);
    }
  }
  // A load on the output keeps `out` from floating in simulators that check it.
  lines.push("RREAD out 0 1e6");
  lines.push(".op");
  lines.push(".end");
}

/** A difference amplifier, G = Rf/Rg: an op-amp (a high-gain source) and its four resistors. */
function differenceStage(lines: string[], req: Requirement, G: number, includeOffset: boolean, t: number) {
  const rg = DIFFERENCE_RG_OHMS;
  const rf = G * rg;
  lines.push(
    `* Amplifier: difference stage, G = Rf/Rg = ${spiceNumber(rf)}/${spiceNumber(rg)}, an op-amp with four resistors.`,
  );
  if (t > 0)
    lines.push(`* Resistors skewed by ${spiceNumber(t)} in the pattern that spoils common-mode rejection most.`);
  lines.push(`RG1 sn inn ${spiceNumber(rg * (1 + t))}`);
  lines.push(`RF1 inn out ${spiceNumber(rf * (1 - t))}`);
  lines.push(`RG2 sp inp ${spiceNumber(rg * (1 - t))}`);
  lines.push(`RF2 inp 0 ${spiceNumber(rf * (1 + t))}`);
  if (includeOffset) {
    lines.push(`* Input offset ${spiceNumber(req.amplifier.offset)} V in series with the op-amp's + input.`);
    lines.push(`VOS inpo inp DC ${spiceNumber(req.amplifier.offset)}`);
    lines.push(`EOA out 0 inpo inn ${spiceNumber(OPAMP_OPEN_LOOP_GAIN)}`);
  } else {
    lines.push(`EOA out 0 inp inn ${spiceNumber(OPAMP_OPEN_LOOP_GAIN)}`);
  }
}

/**
 * The load between `la` and `lb`, described by drawing `iTopA` at the full supply in the
 * requirement's load model. `burdenV`: the engine's drop at that operating point, which steers a
 * constant-power load's operating point to the physical (high-voltage) solution.
 */
export function loadLines(lines: string[], req: Requirement, la: string, lb: string, iTopA: number, burdenV: number) {
  const vBus = req.supply.voltage;
  const high = req.supply.side === "high";
  const model = req.load.model;
  if (model === "constant-current") {
    lines.push(`* Constant-current load: draws ${spiceNumber(iTopA)} A whatever its voltage.`);
    lines.push(`ILOAD ${la} ${lb} DC ${spiceNumber(iTopA)}`);
  } else if (model === "resistive") {
    lines.push(`* Resistive load: the resistance that draws ${spiceNumber(iTopA)} A at the full supply.`);
    lines.push(`RLOAD ${la} ${lb} ${spiceNumber(vBus / iTopA)}`);
  } else {
    const p = vBus * iTopA;
    lines.push(
      `* Constant-power load: draws ${spiceNumber(iTopA)} A at the full supply, P = ${spiceNumber(p)} W, more current as its voltage falls.`,
    );
    lines.push(`BLOAD ${la} ${lb} I=${spiceNumber(p)}/max(V(${la},${lb}),${spiceNumber(vBus / 1000)})`);
    if (Number.isFinite(burdenV)) {
      lines.push(
        high ? `.nodeset V(${la})=${spiceNumber(vBus - burdenV)}` : `.nodeset V(${lb})=${spiceNumber(burdenV)}`,
      );
    }
  }
}
