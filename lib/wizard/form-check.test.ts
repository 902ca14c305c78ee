// The wizard's validation, which now runs in the check worker: each message lands on the field at
// fault and names it, as the form showed it when the schema ran on the page.
import { describe, expect, it } from "vitest";
import { checkForm } from "./form-check";
import { errorText } from "./form-errors";
import { readableDefaults, type WizardValues } from "./form-values";

const form = (over: Partial<WizardValues>): WizardValues => ({
  ...readableDefaults,
  current: { min: "2 mA", max: "180 mA" },
  supply: { voltage: "3 V", side: "low" },
  ...over,
});

describe("checkForm", () => {
  it("resolves a complete form to the engine's SI requirement", async () => {
    const r = await checkForm(form({}));
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    expect(r.requirement.current.max).toBe(0.18);
    expect(r.requirement.supply.voltage).toBe(3);
  });
  it("puts a message that names the field on the field typed wrong", async () => {
    const r = await checkForm(form({ current: { min: "2 mA", max: "2 V" } }));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(errorText(r.errors, "current.max")).toBe("Maximum current: 2 V is a voltage, not a current");
    expect(errorText(r.errors, "current.min")).toBeUndefined();
  });
  it("says a far out-of-range value while another field is still blank", async () => {
    const r = await checkForm(form({ current: { min: "2 mA", max: "1e30 A" }, supply: { voltage: "", side: "low" } }));
    if (r.ok) throw new Error("a blank supply passed");
    expect(errorText(r.errors, "current.max")).toMatch(/^Maximum current: .* is outside the range this workbench/);
    expect(errorText(r.errors, "supply.voltage")).toMatch(/Supply voltage/);
  });
  it("refuses a complete form whose value is beyond the working range, on that field", async () => {
    const r = await checkForm(form({ supply: { voltage: "2 GV", side: "low" } }));
    if (r.ok) throw new Error("2 GV passed");
    expect(Object.keys(r.errors)).toEqual(["supply"]);
    expect(errorText(r.errors, "supply.voltage")).toMatch(/^Supply voltage: .* outside the range/);
  });
  it("gives plain data that a worker can post (no functions, no element refs)", async () => {
    const r = await checkForm(form({ current: { min: "2 mA", max: "x" } }));
    expect(structuredClone(r)).toEqual(r);
    expect(JSON.stringify(r)).not.toContain('"ref":{');
  });
  it("words a list's bad entry once, quoting it, and nothing in the list's own words", async () => {
    const r = await checkForm(form({ amplifier: { ...readableDefaults.amplifier, gains: [10, "abc"] } } as never));
    if (r.ok) throw new Error("a gain of abc passed");
    expect(errorText(r.errors, "amplifier.gains")).toBe(
      "Gains swept: “abc” is not a number; give numbers separated by commas",
    );
  });
});
