// "Best" across designs only where a figure is taken at the same points (the example: a
// 47.9 V load voltage from a 48 V supply does not beat 23.9 V on a 24 V design).
import { describe, expect, it } from "vitest";
import { parseRequirement, type Requirement } from "@/lib/design";
import { againstOwnLimit, basisDiffers } from "./figure-basis";

const req = (supply: string, max: string): Requirement => {
  const p = parseRequirement({ current: { min: "10 mA", max }, supply: { voltage: supply }, drop: { max: "100 mV" } });
  if (!p.ok) throw new Error(p.message);
  return p.requirement;
};

describe("basisDiffers", () => {
  it("finds the fields that make a figure mean different things", () => {
    expect(basisDiffers("loadVoltageV", [req("24 V", "6 A"), req("48 V", "6 A")])).toEqual(["supply.voltage"]);
    expect(basisDiffers("burdenV", [req("24 V", "6 A"), req("24 V", "6 A")])).toEqual([]);
  });
});

describe("againstOwnLimit", () => {
  it("puts a burden against its own allowed drop", () => {
    expect(againstOwnLimit("burdenV", 0.06, req("24 V", "6 A"))).toBe("of 100 mV allowed (60 %)");
  });
  it("says nothing for a figure with no limit", () => {
    expect(againstOwnLimit("noiseA", 1e-6, req("24 V", "6 A"))).toBeNull();
  });
});
