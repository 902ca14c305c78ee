import { describe, expect, it } from "vitest";
import { demoAdcs, demoAmplifiers, demoMeters, demoShunts } from "@/db/seed/library";
import { errorAt, parseQuantity, parseRequirement } from "@/lib/design";
import { adcInput, amplifierInput, meterInput, shuntInput } from "./schema";
import { adcRequirement, amplifierRequirement, meterRequirement, shuntRequirement } from "./to-requirement";

const base = {
  current: { min: "1 mA", max: "100 mA" },
  supply: { voltage: "3.3 V", side: "low" as const },
  drop: { max: "100 mV" },
  readout: { kind: "adc" as const, bits: 12, fullScale: "2.5 V" },
};

describe("library parts as requirement groups", () => {
  it("every demo amplifier and shunt family makes a requirement the engine accepts", () => {
    for (const a of demoAmplifiers) {
      for (const s of demoShunts) {
        const amp = amplifierInput.parse(a);
        const r = parseRequirement({
          ...base,
          amplifier: amplifierRequirement(amp, 5),
          shunt: shuntRequirement(shuntInput.parse(s)),
        });
        expect(r.ok, r.ok ? "" : `${a.name} + ${s.name}: ${r.message}`).toBe(true);
        if (!r.ok) continue;
        expect(r.requirement.amplifier.offset).toBe(amp.offsetV);
        expect(r.requirement.amplifier.supply).toBe(5);
        if (amp.gainMode === "fixed") expect(r.requirement.amplifier.gains).toEqual(amp.gains);
        else expect(Math.min(...r.requirement.amplifier.gains)).toBeGreaterThanOrEqual(amp.gains[0]!);
      }
    }
  });

  it("carries the part's topology and common-mode range; blank means the topology's usual range", () => {
    const hv = amplifierInput.parse(demoAmplifiers.find((a) => a.commonModeMaxV !== undefined)!);
    const r = parseRequirement({ ...base, amplifier: amplifierRequirement(hv, 5) });
    if (!r.ok) throw new Error(r.message);
    expect(r.requirement.amplifier.commonMode).toEqual({ min: -0.3, max: 36 });
    const rs = amplifierInput.parse(demoAmplifiers.find((a) => a.gainMode === "resistor-set")!);
    const r2 = parseRequirement({ ...base, amplifier: amplifierRequirement(rs, 5) });
    if (!r2.ok) throw new Error(r2.message);
    expect(r2.requirement.amplifier.topology).toBe("non-inverting");
    expect(r2.requirement.amplifier.commonMode).toEqual({ min: -0.1, max: 5.1 });
    expect(amplifierInput.safeParse({ ...demoAmplifiers[0], commonModeMinV: "0 V" }).success).toBe(false);
  });

  it("clamps the amplifier supply into the part's range", () => {
    const amp = amplifierInput.parse(demoAmplifiers[0]!);
    expect(amplifierRequirement(amp, 12).supply).toBe(amp.supplyMaxV);
    expect(amplifierRequirement(amp, 1).supply).toBe(amp.supplyMinV);
  });

  it("shows noise density as V/√Hz text that reads back", () => {
    expect(parseQuantity("40 nV/√Hz", "noiseDensity")).toEqual({ ok: true, value: 4e-8 });
  });
});

const termOf = (terms: { source: string; errorA: number }[], source: string) =>
  terms.find((t) => t.source === source)?.errorA ?? NaN;

describe("library readouts as the requirement's readout", () => {
  it("an ADC's every figure lands under the same v2 name, so its own error is in the budget", () => {
    const adc = adcInput.parse(demoAdcs.find((a) => a.name.startsWith("SW-ADC12"))!);
    const r = parseRequirement({
      ...base,
      current: { min: "10 mA", max: "1 A" },
      supply: { voltage: "12 V", side: "low" },
      temperature: { min: "0 °C", max: "70 °C" },
      readout: adcRequirement(adc),
      amplifier: { gains: [20] },
    });
    if (!r.ok) throw new Error(r.message);
    expect(r.requirement.readout).toMatchObject({
      kind: "adc",
      bits: 12,
      fullScale: 2.5,
      sampleRateHz: 10_000,
      reference: { tolerance: 0.001, tempco: 20e-6 },
      offsetLsb: 2,
      gainError: 0.0005,
      inlLsb: 1,
    });
    // Reference: ±0.1 % + 20 ppm/K × 45 K (70 °C against 25 °C) = 0.1 % + 0.09 % = 0.19 % of reading
    // (tolerance plus tempco × excursion; common practice, no source).
    const t = errorAt(r.requirement, { shuntOhms: 0.05, gain: 20 }, 0.5).terms;
    expect(termOf(t, "readoutReference") / 0.5).toBeCloseTo(0.0019, 12);
    // Offset: 2 LSB of 2.5 V / 4096 at the output, over 0.05 Ω × 20 = 1 V/A: 1.2207 mA.
    expect(termOf(t, "readoutOffset")).toBeCloseTo((2 * 2.5) / 4096, 12);
  });

  it("a meter range's ±(% of reading + digits): issue 14's 200 mV, 2000-count example is ±1.5 % at 20 mV", () => {
    const meter = meterInput.parse(demoMeters[0]!);
    expect(meter).toMatchObject({ fullScale: 0.2, counts: 2000, accuracy: { percentOfReading: 0.005, digits: 2 } });
    const r = parseRequirement({
      current: { min: "2 uA", max: "180 uA" },
      supply: { voltage: "3.3 V" },
      drop: { max: "20 mV" },
      readout: meterRequirement(meter),
      amplifier: { gains: [10] },
    });
    if (!r.ok) throw new Error(r.message);
    // 20 µA × 100 Ω × 10 = 20 mV; 0.5 % + 2 × 0.1 mV / 20 mV = 1.5 % (the issue's hand figure).
    const t = errorAt(r.requirement, { shuntOhms: 100, gain: 10 }, 20e-6).terms;
    expect((termOf(t, "readoutGain") + termOf(t, "readout")) / 20e-6).toBeCloseTo(0.015, 12);
  });

  it("refuses a part with a missing or out-of-range figure, naming the field", () => {
    const bad = adcInput.safeParse({ ...demoAdcs[0], reference: { tolerance: "30 %", tempco: "20 ppm/K" } });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0]?.path).toEqual(["reference", "tolerance"]);
    expect(bad.error?.issues[0]?.message).toBe('Reference tolerance must be between 0 and 20 % (e.g. "0.1 %")');
    const missing = meterInput.safeParse({ name: "x", fullScale: "2 V", counts: 20000 });
    expect(missing.error?.issues[0]).toMatchObject({ path: ["accuracy"], message: "Accuracy is required" });
    const bits = adcInput.safeParse({ ...demoAdcs[0], bits: 40 });
    expect(bits.error?.issues[0]?.message).toBe("ADC resolution (bits) must be at most 32");
  });
});
