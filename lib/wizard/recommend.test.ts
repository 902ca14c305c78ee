// The recommended pair is the engine's top-ranked feasible candidate, and its reason is read off
// the same figures the table shows (shares of the limits, rounded to whole percent).
import { describe, expect, it } from "vitest";
import { parseRequirement } from "@/lib/design/requirement";
import { solve } from "@/lib/design/solve";
import { demoLoggerReadout } from "@/lib/design/test-helpers";
import { recommendationReason, recommendedOf } from "./recommend";

// The demo logger's burst range with its converter stated and zeroed once (db/seed/designs.ts).
const p = parseRequirement({
  current: { min: "2 mA", max: "180 mA" },
  supply: { voltage: "3 V" },
  drop: { max: "60 mV" },
  ...demoLoggerReadout,
});
if (!p.ok) throw new Error(p.message);
const result = solve(p.requirement);

describe("recommendedOf", () => {
  it("is the first listed candidate when it is feasible", () => {
    expect(recommendedOf(result)).toBe(result.candidates[0]);
    expect(recommendedOf(null)).toBeNull();
  });
  it("gives its reason in words with the drop against the allowed drop", () => {
    const c = recommendedOf(result)!;
    const text = recommendationReason(c, result);
    expect(text).toMatch(/^It uses the least of the three limits/);
    expect(text).toContain(`of the 60 mV allowed (${Math.round((100 * c.burdenV) / 0.06)} %)`);
    expect(text).not.toMatch(/errorAtMinPercent|burdenV|lsbA/);
  });
});
