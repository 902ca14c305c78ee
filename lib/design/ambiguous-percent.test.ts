// Issue 11 item 9: a bare accuracy target below 0.1 reads like a fraction (0.02 for 2 %), and a
// meter's percentOfReading is named in percent but read as a fraction; client input refuses both
// with the two readings, stored requirements still read. The readings follow the field
// definitions in DEFAULTS.md ("Percent and fraction fields"); 1 % = 0.01 is SI Brochure, 9th ed.,
// on the percent (from memory).
import { describe, expect, it } from "vitest";
import { accuracyTargetText, ambiguousPercentErrors, parseRequirementInput } from "./ambiguous-percent";
import { parseRequirement } from "./requirement";

const base = {
  current: { min: "3 uA", max: "180 mA" },
  supply: { voltage: "3.0 V" },
  drop: { max: "60 mV" },
  readout: { kind: "adc", bits: 12, fullScale: "2.5 V" },
};
const meter = (percentOfReading: unknown) => ({
  ...base,
  readout: { kind: "meter", counts: 6000, fullScale: "600 mV", accuracy: { percentOfReading, digits: 2 } },
});

function refused(input: unknown): Record<string, string[]> {
  const r = parseRequirementInput(input);
  if (r.ok) throw new Error("expected the requirement to be refused");
  expect(r.message).toContain(Object.keys(r.fieldErrors)[0]!);
  return r.fieldErrors;
}

function accepted(input: unknown) {
  const r = parseRequirementInput(input);
  if (!r.ok) throw new Error(r.message);
  return r.requirement;
}

describe("parseRequirementInput: ambiguous bare percent numbers", () => {
  it("refuses accuracy.percent 0.02 with both readings and how to write each", () => {
    const e = refused({ ...base, accuracy: { percent: 0.02 } });
    expect(Object.keys(e)).toEqual(["accuracy.percent"]);
    expect(e["accuracy.percent"]).toEqual([
      'Accuracy target (accuracy.percent): 0.02 reads as 0.02 %; if you meant 2 %, send 2 or "2 %"; for 0.02 %, send "0.02 %"',
    ]);
  });
  it("refuses a plain-number string the same way, and just below 0.1", () => {
    expect(refused({ ...base, accuracy: { percent: " 0.05 " } })["accuracy.percent"]![0]).toMatch(
      /0\.05 reads as 0\.05 %; if you meant 5 %, send 5 or "5 %"/,
    );
    expect(refused({ ...base, accuracy: { percent: 0.0999 } })["accuracy.percent"]).toBeDefined();
  });
  it("says it alongside the other refusals, first", () => {
    const e = refused({ ...base, current: { min: "2 A", max: "1 A" }, accuracy: { percent: 0.02 } });
    expect(Object.keys(e)).toEqual(["accuracy.percent", "current.min"]);
  });
  it("the wizard's wording says type, not send", () => {
    expect(ambiguousPercentErrors({ accuracy: { percent: "0.02" } }, "type")["accuracy.percent"]![0]).toMatch(
      /type 2 or "2 %"; for 0\.02 %, type "0\.02 %"/,
    );
  });
  it("keeps 0.1 and above, and any value with its sign", () => {
    expect(accepted({ ...base, accuracy: { percent: 0.1 } }).accuracy.percent).toBe(0.1);
    expect(accepted({ ...base, accuracy: { percent: 2 } }).accuracy.percent).toBe(2);
    expect(accepted({ ...base, accuracy: { percent: "0.5" } }).accuracy.percent).toBe(0.5);
    expect(accepted({ ...base, accuracy: { percent: "0.05 %" } }).accuracy.percent).toBe(0.05);
    // 500 ppm = 0.0005 = 0.05 % (the definition of ppm, 1e-6).
    expect(accepted({ ...base, accuracy: { percent: "500 ppm" } }).accuracy.percent).toBe(0.05);
    expect(accepted(base).accuracy.percent).toBe(2);
  });
  it("leaves zero, negatives and junk to the schema's own messages", () => {
    expect(refused({ ...base, accuracy: { percent: 0 } })["accuracy.percent"]![0]).toMatch(/above 0 %/);
    expect(refused({ ...base, accuracy: { percent: -0.02 } })["accuracy.percent"]![0]).toMatch(/above 0 %/);
  });
});

describe("readout.accuracy.percentOfReading (meter): named in percent, read as a fraction", () => {
  it("refuses any bare number but zero, with both readings", () => {
    const e = refused(meter(0.005));
    expect(e["readout.accuracy.percentOfReading"]).toEqual([
      'Meter accuracy (readout.accuracy.percentOfReading): a bare 0.005 reads as a share of the reading, 0.5 %, though the name says percent; for 0.5 %, send "0.5 %"; for 0.005 %, send "0.005 %"',
    ]);
    // 0.5 meant as 0.5 % would be read as 50 %: the refusal says so instead of a range message.
    expect(refused(meter("0.5"))["readout.accuracy.percentOfReading"]![0]).toMatch(/reads as a share.*50 %/);
  });
  it("keeps a value with its sign, and zero", () => {
    const r = accepted(meter("0.5 %"));
    expect(r.readout.kind === "meter" && r.readout.accuracy?.percentOfReading).toBe(0.005);
    expect(accepted(meter(0)).readout.kind).toBe("meter");
  });
  it("is not looked at on an ADC readout", () => {
    const adc = { ...base, readout: { ...base.readout, accuracy: { percentOfReading: 0.005 } } };
    expect(ambiguousPercentErrors(adc)).toEqual({});
  });
});

describe("stored requirements still read", () => {
  it("a saved 0.05 % target re-parses to itself through parseRequirement", () => {
    const saved = accepted({ ...base, accuracy: { percent: "0.05 %" } });
    const stored: unknown = JSON.parse(JSON.stringify(saved));
    // The normalized form holds the target as a bare number in percent...
    expect((stored as { accuracy: { percent: unknown } }).accuracy.percent).toBe(0.05);
    const again = parseRequirement(stored);
    if (!again.ok) throw new Error(again.message);
    expect(again.requirement).toEqual(saved);
    // ...which is why stored data must not go through the client-input refusal.
    expect(parseRequirementInput(stored).ok).toBe(false);
  });
  it("a meter's stored fraction re-parses to itself", () => {
    const saved = accepted(meter("0.5 %"));
    const again = parseRequirement(JSON.parse(JSON.stringify(saved)));
    if (!again.ok) throw new Error(again.message);
    expect(again.requirement).toEqual(saved);
  });
});

describe("accuracyTargetText", () => {
  it.each([0.05, 0.001, 0.0999, 0.1, 2, 0.37])("%s reads back to itself as client input", (p) => {
    expect(accepted({ ...base, accuracy: { percent: accuracyTargetText(p) } }).accuracy.percent).toBe(p);
  });
});
