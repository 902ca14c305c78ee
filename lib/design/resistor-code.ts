// A resistance as the letter-and-digit code of IEC 60062 (the "RKM" code printed on parts and
// drawings): the multiplier's letter stands where the decimal point would be, so a smudged or
// lost dot cannot turn 4.7 Ω into 47 Ω. R010 is 10 mΩ, 4R7 is 4.7 Ω, 4K7 is 4.7 kΩ.
const letters: [exponent: number, letter: string][] = [
  [12, "T"],
  [9, "G"],
  [6, "M"],
  [3, "K"],
  [0, "R"],
];

/**
 * IEC 60062 code of a resistance (Ω > 0), with as many significant digits as the value needs
 * (at least two, at most `maxDigits`: three covers E96 and E192 values).
 */
export function resistorCode(ohms: number, maxDigits = 3): string {
  if (!(ohms > 0) || !Number.isFinite(ohms)) throw new RangeError(`no resistor code for ${ohms} Ω`);
  const [exp, letter] = letters.find(([e]) => ohms >= 10 ** e) ?? [0, "R"];
  const scaled = ohms / 10 ** exp;
  // Significant digits, trailing zeros dropped but never fewer than two (10 mΩ is R010, not R01).
  let digits = Number(scaled.toPrecision(maxDigits)).toPrecision(maxDigits);
  while (digits.includes(".") && digits.endsWith("0") && significant(digits) > 2) digits = digits.slice(0, -1);
  digits = digits.replace(/\.$/, "");
  const [whole = "", frac = ""] = digits.split(".");
  return `${whole === "0" ? "" : whole}${letter}${frac}`;
}

function significant(text: string): number {
  return text.replace(".", "").replace(/^0+/, "").length;
}
