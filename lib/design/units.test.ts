import { describe, expect, it } from "vitest";
import { parseRequirement } from "./requirement";
import { formatPercent, formatSI } from "./format";
import { MAX_QUANTITY_CHARS, parsePercent, parseQuantity, roundSig } from "./units";

const value = (input: number | string, dim: Parameters<typeof parseQuantity>[1]) => {
  const r = parseQuantity(input, dim);
  if (!r.ok) throw new Error(r.message);
  return r.value;
};

describe("parseQuantity", () => {
  it.each([
    ["150 mA", "current", 0.15],
    ["3.3V", "voltage", 3.3],
    ["2.5 uA", "current", 2.5e-6],
    ["2.5 µA", "current", 2.5e-6],
    ["2.5 μA", "current", 2.5e-6], // Greek mu as well as the micro sign
    ["50 uA", "current", 50e-6], // mathjs alone gives 4.9999…e-5
    ["4.7 mohm", "resistance", 4.7e-3],
    ["4.7 mΩ", "resistance", 4.7e-3],
    ["1 MΩ", "resistance", 1e6],
    ["10 kohm", "resistance", 1e4],
    ["2 ohm", "resistance", 2],
    ["60 mV", "voltage", 0.06],
    ["0.15", "current", 0.15],
    ["1e-3", "current", 1e-3],
    ["1 %", "fraction", 0.01],
    ["0.1%", "fraction", 0.001],
    ["50 ppm/K", "tempco", 50e-6],
    ["50 ppm/°C", "tempco", 50e-6],
    ["0.1 uV/K", "voltageDrift", 1e-7],
    ["0.1 µV/°C", "voltageDrift", 1e-7],
    ["40 nV/√Hz", "noiseDensity", 40e-9],
    ["40 nV/rtHz", "noiseDensity", 40e-9],
    ["2 MHz", "frequency", 2e6],
    ["85 °C", "temperature", 85],
    ["300 K", "temperature", 26.85],
    ["80 K/W", "thermalResistance", 80],
    ["250 mW", "power", 0.25],
  ] as const)("%s as %s → %d", (input, dim, expected) => {
    expect(value(input, dim)).toBe(expected);
  });

  it("passes SI numbers through", () => {
    expect(value(0.15, "current")).toBe(0.15);
  });

  it("refuses the wrong dimension, naming the field, the value and both kinds", () => {
    const r = parseQuantity("5 V", "current", "Maximum current");
    expect(r).toEqual({ ok: false, message: "Maximum current: 5 V is a voltage, not a current" });
    const r2 = parseQuantity("3 mA", "resistance", "Smallest shunt");
    expect(r2.ok).toBe(false);
    if (!r2.ok) expect(r2.message).toBe("Smallest shunt: 3 mA is a current, not a resistance");
    expect(parseQuantity("1 %", "current").ok).toBe(false);
  });

  it("refuses non-finite numbers and unreadable text", () => {
    expect(parseQuantity(Infinity, "current").ok).toBe(false);
    expect(parseQuantity(NaN, "current").ok).toBe(false);
    expect(parseQuantity("Infinity", "current").ok).toBe(false);
    expect(parseQuantity("lots", "current").ok).toBe(false);
    expect(parseQuantity("", "current").ok).toBe(false);
  });
});

/** The fastest of `runs` timings of `fn` repeated `reps` times (the minimum is the least noisy). */
function fastest(fn: () => unknown, reps = 20, runs = 5): number {
  let best = Infinity;
  for (let r = 0; r < runs; r++) {
    const start = performance.now();
    for (let k = 0; k < reps; k++) fn();
    best = Math.min(best, performance.now() - start);
  }
  return best;
}

describe("parseQuantity on hostile text (issue 10, item 1)", () => {
  it(`refuses text over ${MAX_QUANTITY_CHARS} characters before reading it`, () => {
    const r = parseQuantity("1".repeat(100_000) + "x", "current", "Maximum current");
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/^Maximum current: at most 64 characters \(this is 100001\)/);
    // 64 characters of an honest number still read.
    expect(value(`0.${"1".repeat(62)}`, "current")).toBeCloseTo(0.111111111111, 12);
  });

  it("40,000 digits and an x cost about what a short refusal does (a ratio, not a time)", () => {
    const long = "1".repeat(40_000) + "x";
    const short = "1x";
    for (const dim of ["current", "fraction", "noiseDensity"] as const) {
      const ratio =
        fastest(() => parseQuantity(long, dim)) /
        Math.max(
          fastest(() => parseQuantity(short, dim)),
          1e-3,
        );
      // Linear or better: a quadratic regex made this ratio tens of thousands.
      expect(ratio, dim).toBeLessThan(20);
    }
  });

  it('refuses "1e999" and other text that reads as infinity (item 9)', () => {
    for (const text of ["1e999", "-1e999", "1e999 %", "1e999 mA", "1e400 ppm/K"]) {
      const dim = text.includes("ppm") ? "tempco" : text.includes("%") ? "fraction" : "current";
      const r = parseQuantity(text, dim, "Field");
      expect(r.ok, text).toBe(false);
      if (!r.ok) expect(r.message, text).toMatch(/^Field: .*not a finite/);
    }
  });
});

describe("parsing slips (issue 11, item 9)", () => {
  // A kelvin and a degree Celsius are the same size, so a rise of 85 K is a rise of 85 °C
  // (SI Brochure, 9th ed., on the degree Celsius: a temperature difference may be expressed in
  // either unit; section from memory).
  it.each([
    ["85 K", 85],
    ["85 degC", 85],
    ["85 °C", 85],
    [85, 85],
    ["40", 40],
  ] as const)("a temperature rise %s is %d K", (input, expected) => {
    expect(value(input, "temperatureRise")).toBe(expected);
  });

  it("a rise in °F is refused with a message rather than read with its offset", () => {
    const r = parseQuantity("150 degF", "temperatureRise", "Temperature rise at full rating");
    expect(r.ok).toBe(false);
  });

  it("an absolute temperature still reads 300 K as 26.85 °C", () => {
    expect(value("300 K", "temperature")).toBe(26.85);
  });

  it("percent and fraction fields read a signed value the same way; a bare one by the field's name", () => {
    const percent = (v: number | string) => {
      const r = parsePercent(v);
      if (!r.ok) throw new Error(r.message);
      return r.value;
    };
    // "2 %" is 2 % in both (accuracy.percent holds percent, drop.fraction a ratio).
    expect(percent("2 %")).toBe(2);
    expect(value("2 %", "fraction")).toBe(0.02);
    expect(percent("20000 ppm")).toBe(2);
    // Bare: the unit is the one in the field's name (API.md's rule for every field).
    expect(percent(2)).toBe(2);
    expect(percent("0.5")).toBe(0.5);
    expect(value(0.02, "fraction")).toBe(0.02);
    expect(parsePercent("2 mA").ok).toBe(false);
  });

  it('the requirement reads ratedRise 85 K as a rise and accuracy "2 %" as 2', () => {
    const base = { current: { min: "2 mA", max: "180 mA" }, supply: { voltage: "3 V" } };
    const r = parseRequirement({ ...base, shunt: { ratedRise: "85 K" }, accuracy: { percent: "2 %" } });
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.requirement.shunt.ratedRise).toBe(85);
      expect(r.requirement.accuracy.percent).toBe(2);
    }
    const fraction = parseRequirement({ ...base, drop: { fraction: "2 %" }, accuracy: { percent: 2 } });
    expect(fraction.ok).toBe(true);
    if (fraction.ok) {
      expect(fraction.requirement.drop.fraction).toBe(0.02);
      expect(fraction.requirement.accuracy.percent).toBe(2);
    }
  });
});

describe("formatSI", () => {
  it.each([
    [0.0047, "Ω", "4.7 mΩ"],
    [0.038, "V", "38 mV"],
    [1.2e-6, "A", "1.2 µA"],
    [0.18, "A", "180 mA"],
    [2500, "Ω", "2.5 kΩ"],
    [1, "A", "1 A"],
    [0, "V", "0 V"],
    [-0.0033, "V", "-3.3 mV"],
    [0.0009996, "A", "1 mA"], // rounds up into the next prefix
    [4.07e-9, "V/√Hz", "4.07 nV/√Hz"],
  ])("%d %s → %s", (v, u, s) => {
    expect(formatSI(v, u)).toBe(s);
  });
  it("keeps the significant figures asked for", () => {
    expect(formatSI(0.123456, "A", 5)).toBe("123.46 mA");
    expect(formatPercent(0.012345)).toBe("1.23 %");
  });
  it("roundSig trims binary noise", () => {
    expect(roundSig(4.9999999999999996e-5)).toBe(5e-5);
  });
});
