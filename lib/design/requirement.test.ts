import { describe, expect, it } from "vitest";
import { defaultRequirementInput, parseRequirement, requirementSchema } from "./requirement";
import { commonFixedGains } from "./gains";
import { demoLoggerInput } from "./test-helpers";

const base = {
  current: { min: "3 uA", max: "180 mA" },
  supply: { voltage: "3.0 V" },
  drop: { max: "60 mV" },
  readout: { kind: "adc", bits: 12, fullScale: "2.5 V" },
};

function errorsOf(input: unknown): Record<string, string[]> {
  const r = parseRequirement(input);
  if (r.ok) throw new Error("expected the requirement to be refused");
  expect(r.message.length).toBeGreaterThan(0);
  return r.fieldErrors;
}

describe("parseRequirement: refusals land on the dotted field path", () => {
  it("wrong dimension → current.max", () => {
    const e = errorsOf({ ...base, current: { min: "3 uA", max: "5 V" } });
    expect(e["current.max"]).toEqual(["Maximum current: 5 V is a voltage, not a current"]);
  });
  it("minimum above maximum → current.min", () => {
    const e = errorsOf({ ...base, current: { min: "2 A", max: "1 A" } });
    expect(Object.keys(e)).toEqual(["current.min"]);
    expect(e["current.min"]?.[0]).toMatch(/above the maximum/);
  });
  it("negative values are refused on their own path", () => {
    expect(errorsOf({ ...base, supply: { voltage: -3 } })["supply.voltage"]).toBeDefined();
    expect(errorsOf({ ...base, amplifier: { offset: "-10 uV" } })["amplifier.offset"]).toBeDefined();
    expect(errorsOf({ ...base, shunt: { tolerance: -0.01 } })["shunt.tolerance"]).toBeDefined();
  });
  it("non-finite values are refused", () => {
    expect(errorsOf({ ...base, current: { min: "3 uA", max: Infinity } })["current.max"]).toBeDefined();
    expect(errorsOf({ ...base, current: { min: NaN, max: "1 A" } })["current.min"]).toBeDefined();
    // A size no shunt has (the fuzzer's −1e308 A once reached the netlist writer).
    expect(errorsOf({ ...base, current: { min: -1e308, max: "1 A" } })["current.min"]).toEqual([
      "Minimum current must be within ±100 kA",
    ]);
    expect(errorsOf({ ...base, current: { min: "3 uA", max: "1 MA" } })["current.max"]).toEqual([
      "Maximum current must be within ±100 kA",
    ]);
    expect(errorsOf({ ...base, drop: { max: "Infinity V" } })["drop.max"]).toBeDefined();
  });
  it("bits must be a whole number from 4 to 32", () => {
    expect(errorsOf({ ...base, readout: { kind: "adc", bits: 64, fullScale: 2.5 } })["readout.bits"]).toBeDefined();
    expect(errorsOf({ ...base, readout: { kind: "adc", bits: 3, fullScale: 2.5 } })["readout.bits"]).toBeDefined();
    expect(errorsOf({ ...base, readout: { kind: "adc", bits: 12.5, fullScale: 2.5 } })["readout.bits"]).toBeDefined();
  });
  it("unknown series → shunt.series", () => {
    const e = errorsOf({ ...base, shunt: { series: "E13" } });
    expect(e["shunt.series"]?.[0]).toMatch(/unknown series "E13"/);
  });
  it("a drop not below the supply, and an empty shunt range, are refused", () => {
    expect(errorsOf({ ...base, drop: { max: "5 V" } })["drop.max"]).toBeDefined();
    expect(errorsOf({ ...base, shunt: { series: "E6", min: "1.6 ohm", max: "2.1 ohm" } })["shunt.min"]).toBeDefined();
    expect(errorsOf({ ...base, shunt: { min: "2 ohm", max: "1 ohm" } })["shunt.min"]).toBeDefined();
  });
  it("missing fields say they are required, on their own path", () => {
    const e = errorsOf({ current: { min: "1 mA" }, readout: { kind: "adc", bits: 12 } });
    expect(e["current.max"]).toEqual(["Maximum current is required"]);
    expect(e["supply"]).toEqual(["Supply (voltage) is required"]);
    expect(e["readout.fullScale"]).toEqual(["ADC full scale is required"]);
    expect(errorsOf(null)["(requirement)"]).toBeDefined();
  });
  it("a grid too large to sweep is refused on shunt.max", () => {
    const e = errorsOf({
      ...base,
      shunt: { series: "E192", min: "1 uohm", max: "1 Gohm" },
      amplifier: { gains: { series: "E24", min: 1.1, max: 10000 } },
    });
    expect(e["shunt.max"]?.[0]).toMatch(/narrow/);
  });
});

describe("parseRequirement: defaults and normalisation", () => {
  it("fills the documented defaults (DEFAULTS.md) in SI", () => {
    const r = parseRequirement(base);
    if (!r.ok) throw new Error(r.message);
    const q = r.requirement;
    expect(q.current).toEqual({ min: 3e-6, max: 0.18 });
    expect(q.supply).toEqual({ voltage: 3, side: "low" });
    expect(q.load.model).toBe("constant-current");
    expect(q.resolution.countsAtMin).toBe(10);
    expect(q.accuracy).toEqual({ percent: 2, bandMin: 0.018, bandMax: 0.18, crestFactor: 3 });
    expect(q.shunt.series).toBe("E96");
    expect(q.shunt.ratings[0]).toBe(0.1);
    expect(q.amplifier.gains).toEqual([...commonFixedGains]);
    expect(q.limit).toBe(200);
  });
  it("turns a drop given as a fraction of the supply into volts, the tighter of two winning", () => {
    const r = parseRequirement({ ...base, drop: { fraction: "2 %" } });
    if (!r.ok) throw new Error(r.message);
    expect(r.requirement.drop.max).toBeCloseTo(0.06, 12);
    const r2 = parseRequirement({ ...base, drop: { fraction: 0.02, max: "30 mV", loadMin: "2.9 V" } });
    if (!r2.ok) throw new Error(r2.message);
    expect(r2.requirement.drop).toEqual({ max: 0.03, fraction: 0.02, loadMin: 2.9 });
  });
  it("lists the resistor-pair gains exactly as swept, deduplicated and in bounds", () => {
    const r = parseRequirement({ ...base, amplifier: { gains: { series: "E6", min: 2, max: 11 } } });
    if (!r.ok) throw new Error(r.message);
    const g = r.requirement.amplifier.gains;
    expect(new Set(g).size).toBe(g.length);
    expect(Math.min(...g)).toBeGreaterThanOrEqual(2);
    expect(Math.max(...g)).toBeLessThanOrEqual(11);
    expect(g).toContain(11); // 1 + 10k/1k
    expect(g).toContain(5.7); // 1 + 4.7k/1k
    expect(r.requirement.amplifier.gainSet).toEqual({ series: "E6", min: 2, max: 11, tolerance: 0.001 });
  });
  it("sorts and deduplicates a gain list", () => {
    const r = parseRequirement({ ...base, amplifier: { gains: [100, 20, 100, 50] } });
    if (!r.ok) throw new Error(r.message);
    expect(r.requirement.amplifier.gains).toEqual([20, 50, 100]);
  });
  it("re-parses its own output to the same requirement", () => {
    const r = parseRequirement({
      ...base,
      amplifier: { gains: { series: "E12", min: 2, max: 100 } },
      drop: { fraction: 0.02 },
    });
    if (!r.ok) throw new Error(r.message);
    const again = parseRequirement(JSON.parse(JSON.stringify(r.requirement)));
    if (!again.ok) throw new Error(again.message);
    expect(again.requirement).toEqual(r.requirement);
  });
  it("the demo start values parse, and are the demo logger the engine's tests use", () => {
    expect(requirementSchema.safeParse(defaultRequirementInput).success).toBe(true);
    expect(defaultRequirementInput).toEqual(demoLoggerInput);
  });
});
