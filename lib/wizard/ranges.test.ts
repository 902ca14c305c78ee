// The working range (common practice, no source): absurd entries get a plain message naming the field.
import { describe, expect, it } from "vitest";
import { parseRequirement } from "@/lib/design/requirement";
import { outOfRange, outOfRangeTyped } from "./ranges";

const req = (over: Record<string, unknown>) => {
  const p = parseRequirement({
    current: { min: "3 uA", max: "180 mA" },
    supply: { voltage: "3 V" },
    ...over,
  });
  if (!p.ok) throw new Error(p.message);
  return p.requirement;
};

describe("outOfRange", () => {
  it("passes an ordinary requirement", () => {
    expect(outOfRange(req({}))).toEqual({});
  });
  it("names the field and writes the value plainly", () => {
    // Beyond the working range, inside the engine's own limit (±100 kA, lib/design/requirement.ts).
    const e = outOfRange(req({ current: { min: "3 uA", max: 5e4 } }));
    expect(e["current.max"]?.[0]).toBe(
      "Maximum current: 50 kA is outside the range this workbench designs for (1 pA to 10 kA)",
    );
  });
  it("refuses a supply beyond the working range, with prefixes where they exist", () => {
    const e = outOfRange(req({ supply: { voltage: "2 GV" }, drop: { max: "60 mV" } }));
    expect(e["supply.voltage"]?.[0]).toBe(
      "Supply voltage: 2 GV is outside the range this workbench designs for (1 mV to 100 kV)",
    );
  });
});

describe("outOfRangeTyped", () => {
  it("checks a typed field while the rest of the form is incomplete", () => {
    expect(outOfRangeTyped({ current: { max: "1e30 A" }, supply: { voltage: "" } })).toEqual({
      "current.max": ["Maximum current: 1 × 10^30 A is outside the range this workbench designs for (1 pA to 10 kA)"],
    });
    expect(outOfRangeTyped({ current: { max: "180 mA" } })).toEqual({});
  });
});
