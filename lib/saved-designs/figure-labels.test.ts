// Every field of a saved requirement has a label and a unit in the revision diff and on the compare
// page: a raw path with a bare number ("rangeSwitch.onResistance 33.3m") reads as neither.
import { describe, expect, it } from "vitest";
import {
  loggerPlanRequirement,
  loggerRequirement,
  packMonitorRequirement,
  pumpRequirement,
} from "@/lib/build-sheet/fixtures";
import { parseRequirement } from "@/lib/design";
import { flatten, formatField, requirementFields } from "./figures";

const withGainPair = {
  ...loggerRequirement,
  amplifier: { gainSet: { series: "E24", min: 2, max: 100, tolerance: "0.1 %" } },
};

describe("requirement field labels", () => {
  for (const [name, input] of Object.entries({
    loggerRequirement,
    pumpRequirement,
    loggerPlanRequirement,
    packMonitorRequirement,
    withGainPair,
  })) {
    it(`label every field of ${name} as stored`, () => {
      const parsed = parseRequirement(input);
      if (!parsed.ok) throw new Error(parsed.message);
      const unlabelled = Object.keys(flatten(parsed.requirement)).filter((k) => !(k in requirementFields));
      expect(unlabelled).toEqual([]);
    });
  }

  it("print the range switch's on-resistance and delay with their units", () => {
    expect(formatField(0.0333, requirementFields["rangeSwitch.onResistance"])).toBe("33.3 mΩ");
    expect(formatField(100e-6, requirementFields["rangeSwitch.delay"])).toBe("100 µs");
  });
});
