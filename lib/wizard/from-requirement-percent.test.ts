// A saved design whose accuracy target is below 0.1 % opens in the wizard and reads back as the
// form's input: the form writes it with its sign, since a bare number there is refused as
// ambiguous (issue 11 item 9; DEFAULTS.md "Percent and fraction fields").
import { describe, expect, it } from "vitest";
import { ambiguousPercentErrors, parseRequirementInput } from "@/lib/design/ambiguous-percent";
import { parseRequirement } from "@/lib/design/requirement";
import { revisionStart } from "./from-requirement";

const input = {
  current: { min: "2 mA", max: "180 mA" },
  supply: { voltage: "3.0 V" },
  drop: { max: "60 mV" },
  readout: { kind: "meter", counts: 6000, fullScale: "600 mV", accuracy: { percentOfReading: "0.05 %", digits: 2 } },
};

describe("revisionStart with small percentages", () => {
  it.each([0.05, 2])("a stored %s % target opens and reads back unchanged", (percent) => {
    const saved = parseRequirement({ ...input, accuracy: { percent: `${percent} %` } });
    if (!saved.ok) throw new Error(saved.message);
    // The stored form, as the database gives it back.
    const stored = parseRequirement(JSON.parse(JSON.stringify(saved.requirement)));
    if (!stored.ok) throw new Error(stored.message);
    const { values } = revisionStart(stored.requirement);
    expect(ambiguousPercentErrors(values, "type")).toEqual({});
    const again = parseRequirementInput(values, "type");
    if (!again.ok) throw new Error(again.message);
    expect(again.requirement.accuracy.percent).toBe(percent);
    expect(again.requirement.readout).toEqual(saved.requirement.readout);
  });
});
