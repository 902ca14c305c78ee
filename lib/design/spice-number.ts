// Numbers as a SPICE netlist reads them.

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
