// Numbers to text with SI prefixes (4.7 mΩ, 38 mV): the engine's one way of writing a figure,
// on screen, on the build sheet and in the parts CSV. No mathjs here, so a client component that
// only draws a table imports this module and not the parser (./units).
const prefixes: Record<number, string> = {
  [-24]: "y",
  [-21]: "z",
  [-18]: "a",
  [-15]: "f",
  [-12]: "p",
  [-9]: "n",
  [-6]: "µ",
  [-3]: "m",
  0: "",
  3: "k",
  6: "M",
  9: "G",
  12: "T",
  15: "P",
};

/** formatSI(0.0047, "Ω") → "4.7 mΩ"; trailing zeros dropped, `sig` significant figures at most. */
export function formatSI(value: number, unitName: string, sig = 3): string {
  const sep = unitName ? " " : "";
  if (!Number.isFinite(value)) return `${value > 0 ? "∞" : value < 0 ? "−∞" : "—"}${sep}${unitName}`;
  if (value === 0) return `0${sep}${unitName}`;
  let exp = Math.floor(Math.log10(Math.abs(value)) / 3) * 3;
  exp = Math.max(-24, Math.min(15, exp));
  let mantissa = Number((value / 10 ** exp).toPrecision(sig));
  if (Math.abs(mantissa) >= 1000 && exp < 15) {
    exp += 3;
    mantissa = Number((value / 10 ** exp).toPrecision(sig));
  }
  return `${String(mantissa)}${sep}${prefixes[exp] ?? ""}${unitName}`;
}

/** Percent with sensible figures: formatPercent(0.0123) → "1.23 %" from a ratio. */
export function formatPercent(ratio: number, sig = 3): string {
  if (!Number.isFinite(ratio)) return "—";
  return `${String(Number((ratio * 100).toPrecision(sig)))} %`;
}
