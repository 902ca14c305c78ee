// The netlist's shunt and what sits between it and the amplifier: a 2-terminal shunt's pad and
// solder resistance, and the input RC filter with the amplifier's bias currents, as elements
// ngspice can check (issue 14 item 6).
import type { Requirement } from "./requirement";
import { spiceNumber } from "./spice-number";

/**
 * Writes RSHUNT between `sp` and `sn` (with pads, half the pad resistance at each end, the
 * sense lines leaving from the pads' outer ends) and, with a filter, a resistor and a capacitor
 * to ground per leg. With the offset included and a current-sense or instrumentation amplifier,
 * the amplifier's input bias currents (Ib ± Ios/2) are current sources drawn from the filtered
 * nodes. Returns the nodes the amplifier senses.
 */
export function frontEndElements(
  lines: string[],
  req: Requirement,
  R: number,
  includeOffset: boolean,
  mismatch: boolean,
): { ap: string; an: string } {
  const pad = req.shunt.padResistance;
  if (pad > 0) {
    lines.push(
      `* 2-terminal shunt: ${spiceNumber(pad)} ohm of pads and solder, half at each end, inside the sense points.`,
    );
    lines.push(`RPAD1 sp spi ${spiceNumber(pad / 2)}`);
    lines.push(`RSHUNT spi sni ${spiceNumber(R)}`);
    lines.push(`RPAD2 sni sn ${spiceNumber(pad / 2)}`);
  } else {
    lines.push(`RSHUNT sp sn ${spiceNumber(R)}`);
  }
  const f = req.inputFilter;
  if (!f) return { ap: "sp", an: "sn" };
  const t = mismatch ? f.tolerance : 0;
  lines.push(
    `* Input filter: ${spiceNumber(f.resistance)} ohm in each leg, ${spiceNumber(f.capacitance)} F from each leg to ground${t > 0 ? `; resistors skewed by ${spiceNumber(t)} (+ leg low, - leg high)` : ""}.`,
  );
  lines.push(`RFP sp fp ${spiceNumber(f.resistance * (1 - t))}`);
  lines.push(`CFP fp 0 ${spiceNumber(f.capacitance)}`);
  lines.push(`RFN sn fn ${spiceNumber(f.resistance * (1 + t))}`);
  lines.push(`CFN fn 0 ${spiceNumber(f.capacitance)}`);
  if (includeOffset && req.amplifier.topology !== "difference" && req.amplifier.topology !== "non-inverting") {
    const a = req.amplifier;
    const ios = a.offsetCurrent ?? a.biasCurrent;
    lines.push(
      `* Amplifier input bias currents through the filter: Ib + Ios/2 into the + input, Ib - Ios/2 into the - input.`,
    );
    lines.push(`IBP fp 0 DC ${spiceNumber(a.biasCurrent + ios / 2)}`);
    lines.push(`IBN fn 0 DC ${spiceNumber(a.biasCurrent - ios / 2)}`);
  }
  return { ap: "fp", an: "fn" };
}
