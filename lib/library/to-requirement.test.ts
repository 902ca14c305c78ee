import { describe, expect, it } from "vitest";
import { demoAmplifiers, demoShunts } from "@/db/seed/library";
import { parseQuantity, parseRequirement } from "@/lib/design";
import { amplifierInput, shuntInput } from "./schema";
import { amplifierRequirement, shuntRequirement } from "./to-requirement";

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
