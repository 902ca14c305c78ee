import { describe, expect, it } from "vitest";
import { formatPercent, formatSI } from "./format";
import { parseQuantity, roundSig } from "./units";

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
