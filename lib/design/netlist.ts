// An ngspice-compatible netlist of one design at Imax: supply, shunt, load and amplifier.
import { buildModel, operatingBurden } from "./model";
import { DIFFERENCE_RG_OHMS } from "./input-filter";
import { frontEndElements } from "./netlist-front-end";
import { spiceNumber } from "./spice-number";
import type { Requirement } from "./requirement";
import type { Choice } from "./types";

export { spiceNumber } from "./spice-number";

/** Gain-setting resistors of a difference stage: Rg from each input, Rf to the output and to ground. */
export { DIFFERENCE_RG_OHMS } from "./input-filter";
/** Open-loop gain of the op-amp in a difference stage's netlist (an ideal-enough op-amp). */
export const OPAMP_OPEN_LOOP_GAIN = 1e7;

export type NetlistOptions = {
  includeOffset?: boolean;
  /**
   * Difference stage only: skew its four resistors by ± the gain-set tolerance in the pattern
   * that spoils common-mode rejection most (Rg1·(1+t), Rf1·(1−t), Rg2·(1−t), Rf2·(1+t)), and an
   * input filter's resistors by ± their tolerance in the same sense (the − leg high, the + leg low).
   */
  worstMismatch?: boolean;
  /**
   * The current through the shunt, A, with the load drawn as a current source at it: a signed
   * span's negative direction (a charger) or zero. Left out: the load model at Imax.
   */
  currentA?: number;
};

export function buildNetlist(req: Requirement, choice: Choice, opts: NetlistOptions = {}): string {
  const includeOffset = opts.includeOffset ?? true;
  const { shuntOhms: R, gain: G } = choice;
  const vBus = req.supply.voltage;
  const iMax = opts.currentA ?? req.current.max;
  const high = req.supply.side === "high";
  const model = opts.currentA === undefined ? req.load.model : "constant-current";
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
  // The shunt, a 2-terminal shunt's pads, and the input filter: the amplifier senses `ap`, `an`.
  const { ap, an } = frontEndElements(lines, req, R, includeOffset, opts.worstMismatch ?? false);
  if (!high) lines.push("VRET sn 0 DC 0");
  if (opts.currentA !== undefined) {
    lines.push(
      `* The load as a current source at ${spiceNumber(iMax)} A (negative: the current flows back, as a charger drives it).`,
    );
    lines.push(`ILOAD ${la} ${lb} DC ${spiceNumber(iMax)}`);
  } else {
    const burden = model === "constant-power" ? operatingBurden(buildModel(req), R) : NaN;
    loadLines(lines, req, la, lb, iMax, burden);
  }
  amplifierLines(lines, req, G, includeOffset, opts.worstMismatch ?? false, { ap, an });
  return lines.join("\n") + "\n";
}

/**
 * The amplifier across the shunt (its inputs `ap`, `an`: the shunt's ends, or an input filter's
 * outputs), standing on the zero-current level, its output `out` loaded by RREAD, then `.op` and
 * `.end`: the close of every netlist the engine writes.
 */
export function amplifierLines(
  lines: string[],
  req: Requirement,
  G: number,
  includeOffset: boolean,
  worstMismatch: boolean,
  { ap, an }: { ap: string; an: string } = { ap: "sp", an: "sn" },
) {
  const ref = zeroLevelNode(lines, req);
  if (req.amplifier.topology === "difference") {
    const t = worstMismatch ? (req.amplifier.gainSet?.tolerance ?? 0) : 0;
    differenceStage(lines, req, G, includeOffset, t, { ap, an, ref });
  } else {
    lines.push("* Amplifier: an ideal voltage-controlled voltage source across the shunt,");
    if (includeOffset) {
      lines.push(
        `* with its input offset ${spiceNumber(req.amplifier.offset)} V as a source in series with the + input.`,
      );
      lines.push(`VOS spo ${ap} DC ${spiceNumber(req.amplifier.offset)}`);
      lines.push(`EAMP out ${ref} spo ${an} ${spiceNumber(G)}`);
    } else {
      lines.push("* offset left out.");
      lines.push(`EAMP out ${ref} ${ap} ${an} ${spiceNumber(G)}`);
    }
  }
  // A load on the output keeps `out` from floating in simulators that check it.
  lines.push("RREAD out 0 1e6");
  lines.push(".op");
  lines.push(".end");
}

/**
 * The zero-current output level as a source (node `ref`) the amplifier's output stands on, at its
 * nominal voltage; returns the node the output is referred to ("0" when there is none).
 */
function zeroLevelNode(lines: string[], req: Requirement): string {
  const v = req.amplifier.reference.voltage;
  if (!(v > 0)) return "0";
  lines.push(`* Zero-current output level (the amplifier's reference input): ${spiceNumber(v)} V.`);
  lines.push(`VREF ref 0 DC ${spiceNumber(v)}`);
  return "ref";
}

/** Nodes a stage connects to: the inputs after any filter, and the zero level its output stands on. */
type StageNodes = { ap: string; an: string; ref: string };

/** A difference amplifier, G = Rf/Rg: an op-amp (a high-gain source) and its four resistors. */
function differenceStage(
  lines: string[],
  req: Requirement,
  G: number,
  includeOffset: boolean,
  t: number,
  { ap, an, ref }: StageNodes,
) {
  const rg = DIFFERENCE_RG_OHMS;
  const rf = G * rg;
  lines.push(
    `* Amplifier: difference stage, G = Rf/Rg = ${spiceNumber(rf)}/${spiceNumber(rg)}, an op-amp with four resistors.`,
  );
  if (t > 0)
    lines.push(`* Resistors skewed by ${spiceNumber(t)} in the pattern that spoils common-mode rejection most.`);
  lines.push(`RG1 ${an} inn ${spiceNumber(rg * (1 + t))}`);
  lines.push(`RF1 inn out ${spiceNumber(rf * (1 - t))}`);
  lines.push(`RG2 ${ap} inp ${spiceNumber(rg * (1 - t))}`);
  lines.push(`RF2 inp ${ref} ${spiceNumber(rf * (1 + t))}`);
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
