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
    // Below the working range, which is wider than any ordinary design (1 pA).
    const e = outOfRange(req({ current: { min: "0.1 pA", max: "180 mA" } }));
    expect(e["current.min"]?.[0]).toBe(
      "Minimum current: 100 fA is outside the range this workbench designs for (1 pA to 100 kA)",
    );
  });
  it("takes currents as far as the engine does (±100 kA), so a design the API saved opens in the wizard", () => {
    expect(outOfRange(req({ current: { min: "1 kA", max: "50 kA" }, supply: { voltage: "48 V" } }))).toEqual({});
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
      "current.max": ["Maximum current: 1 × 10^30 A is outside the range this workbench designs for (1 pA to 100 kA)"],
    });
    expect(outOfRangeTyped({ current: { max: "180 mA" } })).toEqual({});
  });
});
