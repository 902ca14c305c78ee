// Two-terminal pads, thermal EMF and copper-trace shunts through the whole engine: requirement,
// sweep, candidate figures and budget, each against a hand calculation.
import { describe, expect, it } from "vitest";
import { evaluateCandidate, isInSweep } from "./candidate";
import { copperTempcoAt, ipc2221Rise, traceResistance } from "./copper-trace";
import { errorAt } from "./error-budget";
import { parseRequirement, type RequirementInput } from "./requirement";
import { solve } from "./solve";
import { sweepValues } from "./sweep";
import { req } from "./test-helpers";

const at25 = { min: "25 degC", max: "25 degC" };
const base = {
  current: { min: "1 A", max: "20 A" },
  supply: { voltage: "12 V" },
  drop: { max: "100 mV" },
  readout: { kind: "adc", bits: 16, fullScale: "2.5 V" },
} as const;

const term = (r: ReturnType<typeof req>, choice: { shuntOhms: number; gain: number }, I: number, source: string) =>
  errorAt(r, choice, I).terms.find((t) => t.source === source)?.errorA;

describe("two-terminal shunts: the pads add to the measured value", () => {
  it("0.5 mΩ of pads on 1 mΩ reads +50 % (at 25 °C, where copper's tempco adds nothing)", () => {
    const r = req({ ...base, temperature: at25, shunt: { terminals: 2, padResistance: "0.5 mohm" } });
    expect(term(r, { shuntOhms: 0.001, gain: 50 }, 10, "shuntPads")).toBeCloseTo(5, 12); // 50 % of 10 A
  });
  it("over 0–70 °C the pads' copper adds α·ΔT: 0.5·(1 + 0.003854·45) = 58.67 %", () => {
    const r = req({ ...base, shunt: { terminals: 2, padResistance: "0.5 mohm" } });
    const share = (term(r, { shuntOhms: 0.001, gain: 50 }, 10, "shuntPads") ?? NaN) / 10;
    expect(share).toBeCloseTo(0.5 * (1 + copperTempcoAt(25) * 45), 12);
    expect(share).toBeCloseTo(0.5867, 4);
  });
  it("the pads are in the load's path (drop) and default to 0.5 mΩ (from memory)", () => {
    const r = req({ ...base, shunt: { terminals: 2 } });
    expect(r.shunt.padResistance).toBe(0.5e-3);
    expect(evaluateCandidate(r, { shuntOhms: 0.002, gain: 50 }).burdenV).toBeCloseTo(20 * 0.0025, 12);
  });
  it("Kelvin (4 terminals, the default) changes nothing", () => {
    const kelvin = req(base);
    expect(kelvin.shunt.terminals).toBe(4);
    expect(kelvin.shunt.padResistance).toBe(0);
    const named = req({ ...base, shunt: { terminals: 4, padResistance: "0.5 mohm" } });
    const c = { shuntOhms: 0.002, gain: 50 };
    expect(evaluateCandidate(named, c)).toEqual(evaluateCandidate(kelvin, c));
  });
  it('a form\'s "2" reads as 2; anything else is refused on shunt.terminals', () => {
    expect(req({ ...base, shunt: { terminals: "2" as unknown as 2 } }).shunt.terminals).toBe(2);
    const bad = parseRequirement({ ...base, shunt: { terminals: 3 as unknown as 2 } });
    expect(!bad.ok && bad.fieldErrors["shunt.terminals"]?.[0]).toMatch(/4 \(Kelvin\) or 2/);
  });
});

describe("thermal EMF at the shunt's joints", () => {
  it("1 µV/K × 2 K on 1 mΩ is a 2 mA offset", () => {
    const r = req({ ...base, shunt: { thermalEmf: "1 uV/K", gradient: "2 K" } });
    expect(term(r, { shuntOhms: 0.001, gain: 50 }, 10, "thermalEmf")).toBeCloseTo(2e-3, 12);
  });
  it("defaults: 1 µV/K for a resistor, 0 for a copper trace, gradient 0 K: existing verdicts stay as they were", () => {
    const r = req(base);
    expect(r.shunt.thermalEmf).toBe(1e-6);
    expect(r.shunt.gradient).toBe(0);
    expect(errorAt(r, { shuntOhms: 0.001, gain: 50 }, 10).terms.map((t) => t.source)).not.toContain("thermalEmf");
  });
});

const battery: RequirementInput = {
  current: { min: "0.5 A", max: "30 A" },
  supply: { voltage: "48 V" },
  drop: { max: "50 mV" },
  readout: { kind: "adc", bits: 16, fullScale: "2.5 V" },
  accuracy: { percent: "30 %" },
  temperature: { min: "0 degC", max: "40 degC" },
  shunt: { kind: "copper-trace", trace: { width: "10 mm", length: "40 mm", thickness: "70 um" } },
  amplifier: { gains: [20, 50, 100, 200] },
};
const batteryShunt = { kind: "copper-trace", trace: { width: "10 mm", length: "40 mm", thickness: "70 um" } } as const;

describe("copper-trace shunts through the sweep", () => {
  const r = req(battery);
  it("takes the copper's tolerance and tempco: 10 % + 25 µm/10 mm = 10.25 %, 0.003854/K", () => {
    expect(r.shunt.kind).toBe("copper-trace");
    expect(r.shunt.tolerance).toBeCloseTo(0.1025, 12);
    expect(r.shunt.tempco).toBeCloseTo(copperTempcoAt(25), 12);
  });
  it("sweeps the trace's lengths: 20 mm to 40 mm on the 0.1 mm grid, ρ·L/(w·t) each", () => {
    const vs = sweepValues(r);
    expect(vs.length).toBe(201);
    expect(vs[0]).toBeCloseTo(traceResistance({ width: 10e-3, length: 20e-3, thickness: 70e-6 }), 15);
    expect(isInSweep(r, { shuntOhms: vs[7] as number, gain: 50 })).toBe(true);
    expect(isInSweep(r, { shuntOhms: 0.001, gain: 50 })).toBe(false);
  });
  it("heats by IPC-2221: the candidate's self-heating is the relation's rise at full load", () => {
    const R = sweepValues(r)[0] as number;
    const d = evaluateCandidate(r, { shuntOhms: R, gain: 50 });
    expect(d.selfHeatingK).toBeCloseTo(ipc2221Rise(30, 10e-3, 70e-6, "external"), 9);
    // Rating: the power at the current that takes it from 40 °C to 155 °C.
    expect(d.ratingW).toBeGreaterThan(d.dissipationW);
  });
  it("every pair the sweep calls feasible, evaluateCandidate does too, and the other way round", () => {
    const s = solve({ ...r, limit: 10_000 });
    expect(s.feasibleCount).toBeGreaterThan(0);
    const values = sweepValues(r);
    let feasible = 0;
    for (const R of values)
      for (const G of r.amplifier.gains) if (evaluateCandidate(r, { shuntOhms: R, gain: G }).feasible) feasible++;
    expect(feasible).toBe(s.feasibleCount);
  });
  it("too narrow for its current: an inner-layer 0.5 mm trace at 30 A fails on power (far above 155 °C)", () => {
    const hot = req({
      ...battery,
      shunt: { kind: "copper-trace", trace: { width: "0.5 mm", length: "40 mm", layer: "internal" } },
    });
    const d = evaluateCandidate(hot, { shuntOhms: sweepValues(hot)[0] as number, gain: 50 });
    expect(d.reasons).toContain("power");
  });
  it("refuses a copper trace without geometry, or with two terminals, on the field at fault", () => {
    const noTrace = parseRequirement({ ...base, shunt: { kind: "copper-trace" } });
    expect(!noTrace.ok && noTrace.fieldErrors["shunt.trace"]?.[0]).toMatch(/width/);
    const two = parseRequirement({ ...battery, shunt: { ...batteryShunt, terminals: 2 } });
    expect(!two.ok && two.fieldErrors["shunt.terminals"]?.[0]).toMatch(/Kelvin taps/);
    const short = parseRequirement({
      ...battery,
      shunt: { kind: "copper-trace", trace: { width: "10 mm", length: "15 mm" } },
    });
    expect(!short.ok && short.fieldErrors["shunt.trace.length"]?.[0]).toMatch(/two trace widths/);
    const unit = parseRequirement({
      ...battery,
      shunt: { kind: "copper-trace", trace: { width: "10 mA", length: "15 mm" } },
    });
    expect(!unit.ok && unit.fieldErrors["shunt.trace.width"]?.[0]).toMatch(
      /Trace width: 10 mA is a current, not a length/,
    );
  });
  it("a form's blank trace boxes mean no trace: fine for a resistor, refused for a copper trace", () => {
    const blankTrace = { width: "", length: "", thickness: "35 um", layer: "external" } as const;
    expect(req({ ...base, shunt: { trace: blankTrace } }).shunt.trace).toBeNull();
    const copper = parseRequirement({ ...base, shunt: { kind: "copper-trace", trace: blankTrace } });
    expect(!copper.ok && copper.fieldErrors["shunt.trace"]?.[0]).toMatch(/needs its trace/);
  });
  it("a normalized copper requirement reads back the same (saved designs re-open)", () => {
    expect(req(r as never)).toEqual(r);
  });
});
