// Diagnosis and sweep-size refusals for a copper-trace shunt (issue 14): a trace has no shunt
// bounds, tolerance part or tempco to choose, so the words name what a designer can change, its
// width and its longest length.
import { describe, expect, it } from "vitest";
import { parseRequirement, type RequirementInput } from "./requirement";
import { solve } from "./solve";

// 10 counts at 10 mA on a 12-bit, 2.5 V ADC at gain 100 need 10 × 2.5 V/4096 / 100 / 10 mA =
// 6.1 mΩ; a 1 mm, 35 µm trace gives ρ/(w·t) = 1.72e-8/(1e-3 × 35e-6) ≈ 0.49 mΩ per mm (IEC 60028
// copper), so about 12.5 mm of trace: a board that allows 5 mm cannot reach it.
const shortTrace: RequirementInput = {
  current: { min: "10 mA", max: "1 A" },
  supply: { voltage: "12 V", side: "low" },
  drop: { max: "100 mV" },
  readout: { kind: "adc", bits: 12, fullScale: "2.5 V" },
  resolution: { countsAtMin: 10 },
  accuracy: { percent: 50 },
  shunt: { kind: "copper-trace", trace: { width: "1 mm", length: "5 mm", thickness: "35 um" } },
  amplifier: { gains: [20, 50, 100] },
};

const parse = (input: RequirementInput) => {
  const r = parseRequirement(input);
  if (!r.ok) throw new Error(r.message);
  return r.requirement;
};

describe("a copper trace too short for the counts", () => {
  const result = solve(parse(shortTrace));

  it("is infeasible, and the diagnosis offers a longer trace, never a shunt part's tolerance or tempco", () => {
    expect(result.feasibleCount).toBe(0);
    const fields = result.diagnosis!.relax.map((r) => r.field);
    expect(fields).not.toContain("shunt.tolerance");
    expect(fields).not.toContain("shunt.tempco");
    expect(fields).toContain("shunt.trace.length");
  });

  it("the longer trace it offers really gives that many feasible pairs", () => {
    const r = result.diagnosis!.relax.find((x) => x.field === "shunt.trace.length")!;
    expect(typeof r.to).toBe("number");
    expect(r.to as number).toBeGreaterThanOrEqual(12.5e-3 * 0.9);
    const again = solve(
      parse({ ...shortTrace, shunt: { ...shortTrace.shunt, trace: { ...shortTrace.shunt!.trace!, length: r.to } } }),
    );
    expect(again.feasibleCount).toBe(r.feasibleCount);
    expect(again.feasibleCount).toBeGreaterThan(0);
  });
});

describe("a trace sweep too large to run", () => {
  it("is refused on shunt.trace.length in a trace's words", () => {
    // 1 mm wide up to 10 m: 100 000 lengths on the 0.1 mm grid × 100 gains = 10 M pairs.
    const r = parseRequirement({
      ...shortTrace,
      shunt: { kind: "copper-trace", trace: { width: "1 mm", length: "10 m", thickness: "35 um" } },
      amplifier: { gains: Array.from({ length: 100 }, (_, i) => i + 1) },
    });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.fieldErrors["shunt.trace.length"]?.join(" ")).toMatch(
      /trace length and gain pairs .*shorten the trace's longest length/,
    );
    expect(r.fieldErrors["shunt.max"]).toBeUndefined();
  });
});
