// The wizard's input layer hands the engine's parser spellings it reads; the parser then gives
// the SI value (lib/design/units.ts). Conversions checked: °C and mV/µA by definition of the SI
// prefixes (SI Brochure, 9th edition, table 7).
import { describe, expect, it } from "vitest";
import { parseQuantity } from "@/lib/design/units";
import { isBareNumber, normaliseTyped } from "./typed-quantity";

const parsed = (text: string, unit: Parameters<typeof normaliseTyped>[1], dim: Parameters<typeof parseQuantity>[1]) =>
  parseQuantity(normaliseTyped(text, unit) as string, dim);

describe("normaliseTyped", () => {
  it("reads a real minus sign and Celsius spelled several ways", () => {
    for (const t of ["−20 °C", "-20 C", "-20C", "−20 degC", "-20 deg C"]) {
      expect(parsed(t, "°C", "temperature"), t).toEqual({ ok: true, value: -20 });
    }
    expect(parsed("20degC", "°C", "temperature")).toEqual({ ok: true, value: 20 });
  });
  it("reads a lower-case unit letter with its prefix", () => {
    expect(parsed("5ua", "A", "current")).toEqual({ ok: true, value: 5e-6 });
    expect(parsed("60 mv", "V", "voltage")).toEqual({ ok: true, value: 0.06 });
    expect(parsed("10 khz", "Hz", "frequency")).toEqual({ ok: true, value: 1e4 });
  });
  it("leaves other units alone, so a wrong dimension is still refused", () => {
    expect(normaliseTyped("5 C", "A")).toBe("5 C");
    expect(parsed("5 C", "A", "current").ok).toBe(false);
    expect(normaliseTyped("3 ohm", "V")).toBe("3 ohm");
  });
  it("tells a bare number from a quantity", () => {
    expect(isBareNumber("3.3")).toBe(true);
    expect(isBareNumber("−20")).toBe(true);
    expect(isBareNumber("3.3 V")).toBe(false);
  });
});
