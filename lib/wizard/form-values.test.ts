// A diagnosis suggestion applied through the form must reach the engine as the very value it tried.
import { describe, expect, it } from "vitest";
import { parseRequirementInput } from "@/lib/design/ambiguous-percent";
import { e24Ladder } from "@/lib/design/diagnosis";
import { parseRequirement } from "@/lib/design/requirement";
import { solve } from "@/lib/design/solve";
import { formValueFor, readableDefaults } from "./form-values";

describe("formValueFor", () => {
  it.each([
    ["current.min", "current", "min", e24Ladder(1e-7, 10)],
    ["accuracy.bandMin", "accuracy", "bandMin", e24Ladder(1e-6, 1)],
    ["drop.max", "drop", "max", e24Ladder(1e-4, 10)],
    ["amplifier.filterHz", "amplifier", "filterHz", [0.1, 0.2, 0.5, 1, 2, 5, 10, 20e3, 50e3, 100e3]],
    // Below 0.1 % too: the form writes those with their sign, as a bare number there is refused.
    ["accuracy.percent", "accuracy", "percent", e24Ladder(0.01, 100)],
    ["shunt.tolerance", "shunt", "tolerance", [0.0025, 0.001, 0.0005]],
    ["shunt.tempco", "shunt", "tempco", [25e-6, 15e-6, 10e-6, 5e-6]],
  ] as const)("%s reads back exactly", (field, group, key, values) => {
    for (const to of values) {
      const input: Record<string, object> = {
        current: { min: "1 nA", max: "20 A" },
        supply: { voltage: "30 V" },
      };
      if (group === "accuracy") input.accuracy = { bandMin: "1 uA" };
      input[group] = { ...input[group], [key]: formValueFor({ field, to }) };
      const r = parseRequirementInput(input, "type");
      if (!r.ok) throw new Error(`${field} ${to}: ${r.message}`);
      const back: unknown = Reflect.get(Reflect.get(r.requirement, group) as object, key);
      expect(back).toBe(to);
    }
  });
  it("a suggestion applied to the wizard's form gives the count it promised", () => {
    const values = {
      ...readableDefaults,
      current: { min: "1 mA", max: "250 mA" },
      supply: { voltage: "3.3 V", side: "low" as const },
      drop: { max: "50 mV" },
      readout: { kind: "adc" as const, bits: 12, fullScale: "3.3 V", sampleRateHz: "1 kHz" },
      accuracy: { percent: "1", bandMin: "1 mA" },
      temperature: { min: "-20 °C", max: "60 °C" },
    };
    const { gainSet: _pair, ...amplifier } = values.amplifier;
    const form = { ...values, amplifier };
    const first = parseRequirement(form);
    if (!first.ok) throw new Error(first.message);
    const relax = solve(first.requirement).diagnosis?.relax ?? [];
    expect(relax.length).toBeGreaterThan(0);
    for (const s of relax) {
      const [group, key] = s.field.split(".") as [string, string];
      const changed = { ...form, [group]: { ...(Reflect.get(form, group) as object), [key]: formValueFor(s) } };
      const again = parseRequirement(changed);
      if (!again.ok) throw new Error(again.message);
      const solved = solve(again.requirement, { diagnose: false });
      expect(solved.feasibleCount).toBe(s.feasibleCount);
      // A change that yields a plan of ranges yields that plan through the form too.
      expect(solved.rangePlan?.ranges.length ?? 0).toBe(s.rangeCount);
    }
  });
  it("a longer copper trace, applied as the form's length, gives the count it promised", () => {
    const form = {
      current: { min: "10 mA", max: "1 A" },
      supply: { voltage: "12 V", side: "low" as const },
      drop: { max: "100 mV" },
      readout: { kind: "adc" as const, bits: 12, fullScale: "2.5 V" },
      resolution: { countsAtMin: 10 },
      accuracy: { percent: 50 },
      shunt: { kind: "copper-trace" as const, trace: { width: "1 mm", length: "5 mm", thickness: "35 um" } },
      amplifier: { gains: [20, 50, 100] },
    };
    const first = parseRequirement(form);
    if (!first.ok) throw new Error(first.message);
    const s = solve(first.requirement).diagnosis?.relax.find((x) => x.field === "shunt.trace.length");
    if (!s) throw new Error("no longer trace suggested");
    expect(formValueFor(s)).toMatch(/ mm$/);
    const again = parseRequirement({
      ...form,
      shunt: { ...form.shunt, trace: { ...form.shunt.trace, length: formValueFor(s) } },
    });
    if (!again.ok) throw new Error(again.message);
    expect(solve(again.requirement, { diagnose: false }).feasibleCount).toBe(s.feasibleCount);
  });
});
