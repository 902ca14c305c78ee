// Switching the drop's form keeps the requirement: Ohm's-law-free arithmetic, share = drop / supply
// (the issue's own example: 60 mV of 3 V is 2 %).
import { describe, expect, it } from "vitest";
import { convertDrop } from "./drop-mode";
import { readableDefaults, type WizardValues } from "./form-values";

const v = (supply: string, drop: WizardValues["drop"]): WizardValues => ({
  ...readableDefaults,
  supply: { voltage: supply, side: "low" },
  drop,
});

describe("convertDrop", () => {
  it("turns volts into a share of the supply and back", () => {
    expect(convertDrop(v("3 V", { max: "60 mV" }), "share")).toBe("2 %");
    expect(convertDrop(v("3 V", { fraction: "2 %" }), "volts")).toBe("60 mV");
    expect(convertDrop(v("24 V", { fraction: "5 %" }), "volts")).toBe("1.2 V");
  });
  it("gives nothing to convert without a supply or a drop", () => {
    expect(convertDrop(v("", { max: "60 mV" }), "share")).toBeNull();
    expect(convertDrop(v("3 V", { max: "" }), "share")).toBeNull();
  });
});
