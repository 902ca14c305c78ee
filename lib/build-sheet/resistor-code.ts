// Resistor values in IEC 60062's letter-and-digit code (the "RKM" code): the letter stands in
// for the decimal point and gives the multiplier (R ×1, K ×10³, M ×10⁶, G ×10⁹, T ×10¹²),
// so "4K7" is 4.7 kΩ and "R47" is 0.47 Ω. Values below 1 Ω keep the leading R ("R0047" for
// 4.7 mΩ), which no reader can take for another value.

const letters: [number, string][] = [
  [1e12, "T"],
  [1e9, "G"],
  [1e6, "M"],
  [1e3, "K"],
  [1, "R"],
];

/** The code for a resistance in ohms, to three significant digits (enough for E192). */
export function iecResistorCode(ohms: number): string {
  if (!(ohms > 0) || !Number.isFinite(ohms)) throw new RangeError(`no resistor code for ${ohms} Ω`);
  const sig = Number(ohms.toPrecision(3));
  const [mult, letter] = letters.find(([m]) => sig >= m) ?? [1, "R"];
  // Digits of the scaled value without float noise: 4.7e-3 → "0.0047".
  const scaled = Number((sig / mult).toPrecision(3)).toString();
  const [whole = "0", frac = ""] = scaled.split(".");
  if (whole === "0") return `${letter}${frac}`;
  // At least two digits, so "1K0" cannot be misread as a bare "1K" that lost a digit.
  return `${whole}${letter}${frac === "" && whole.length === 1 ? "0" : frac}`;
}
