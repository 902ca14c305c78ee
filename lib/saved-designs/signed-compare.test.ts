// Compare with bidirectional designs (issue 14): the negative end gets its own rows (drop and heat
// by Ohm's and Joule's laws, the output against the floor from the engine), and "best" is marked
// only between designs whose figures mean the same thing: a one-way design's dead zone (where it
// reads zero) is not a signed one's (where the sign is uncertain), and a signed span's "minimum
// current" figures are taken at its accuracy band's low end, not at current.min.
import { describe, expect, it } from "vitest";
import { fixtureView } from "@/lib/build-sheet/fixtures";
import { evaluateCandidate, signedOutputEnds, type RequirementInput } from "@/lib/design";
import { idealConverter } from "@/lib/design/test-helpers";
import { bestIndexes } from "./compare";
import { basisDiffers, basisLabel } from "./figure-basis";
import { metricFields } from "./figures";
import { reverseFields, reverseFigures } from "./signed-compare";

// Two invented pack monitors for the same −30 A … +10 A span, on different shunts.
const pack: RequirementInput = {
  current: { min: "-30 A", max: "10 A" },
  supply: { voltage: "24 V", side: "low" },
  drop: { max: "60 mV" },
  // A converter with no error of its own, stated, so the hand figures below hold the stage's alone.
  readout: { kind: "adc", bits: 14, fullScale: "2.5 V", ...idealConverter },
  accuracy: { percent: 5, bandMin: "3 A" },
  amplifier: { gains: [20, 50, 100], reference: { voltage: "1.8 V" } },
};
const small = fixtureView(pack, { name: "Pack A", choice: { shuntOhms: 0.001, gain: 50 } });
const large = fixtureView(pack, { name: "Pack B", choice: { shuntOhms: 0.0015, gain: 20 } });
const oneWay = fixtureView(
  { ...pack, current: { min: "3 A", max: "10 A" }, amplifier: { gains: [50] } },
  { name: "Discharge only", choice: { shuntOhms: 0.001, gain: 50 } },
);

describe("the negative direction's rows", () => {
  it("are the engine's figures at −30 A: |I|·R, I²·R and the output against the floor", () => {
    const a = reverseFigures(small);
    expect(a.reverseCurrentA).toBe(-30);
    expect(a.reverseBurdenV).toBeCloseTo(0.03, 12); // 30 A × 1 mΩ
    expect(a.reverseDissipationW).toBeCloseTo(0.9, 12); // (30 A)² × 1 mΩ
    // 1.8 V − 30 A × 1 mΩ × 50 = 0.3 V nominal; the worst case lies below it, above the 10 mV floor.
    const ends = signedOutputEnds(small.requirement, small.choice)!;
    expect(ends.lowNominalV).toBeCloseTo(0.3, 12);
    expect(a.reverseOutputWorstV).toBe(ends.lowWorstV);
    expect(a.reverseOutputWorstV).toBeLessThan(0.3);
    expect(a.floorRoomV).toBeCloseTo(ends.lowWorstV - 0.01, 12);
  });

  it("mark the lower drop and heat best between designs for the same span", () => {
    const values = [reverseFigures(small), reverseFigures(large)];
    expect(basisDiffers("reverseBurdenV", [small.requirement, large.requirement])).toEqual([]);
    // 30 mV against 45 mV, 900 mW against 1.35 W: the 1 mΩ design is best on both.
    expect(
      bestIndexes(
        values.map((v) => v.reverseBurdenV),
        reverseFields.reverseBurdenV,
      ),
    ).toEqual([0]);
    expect(
      bestIndexes(
        values.map((v) => v.reverseDissipationW),
        reverseFields.reverseDissipationW,
      ),
    ).toEqual([0]);
    // The output rows have no better direction: more room is not better on its own (less of the window used).
    expect(reverseFields.floorRoomV?.better).toBeUndefined();
  });

  it("are blank for a one-way design", () => {
    expect(reverseFigures(oneWay)).toEqual({});
  });
});

describe("best marks between a one-way and a bidirectional design", () => {
  const reqs = [oneWay.requirement, small.requirement];
  it("leave the dead zone unranked: reading zero below it is not the sign's uncertain band", () => {
    const apart = basisDiffers("deadZoneA", reqs);
    expect(apart).toEqual(["span.direction"]);
    expect(basisLabel(apart[0]!, () => undefined)).toBe("span direction (one way or both)");
  });

  it("leave the power rating unranked: a signed design's is chosen for its larger, negative end", () => {
    expect(basisDiffers("ratingW", reqs)).toEqual(["span.reverse"]);
    expect(basisDiffers("ratingW", [small.requirement, large.requirement])).toEqual([]);
  });

  it("rank the minimum-current figures by the current they are taken at, the signed span's band low end", () => {
    // Both are taken at 3 A: the one-way span's minimum, the signed span's accuracy band low end.
    expect(basisDiffers("errorAtMinPercent", reqs)).toEqual([]);
    const other = fixtureView({ ...pack, accuracy: { percent: 5, bandMin: "5 A" } }, { choice: small.choice });
    expect(basisDiffers("errorAtMinPercent", [oneWay.requirement, other.requirement])).toEqual(["span.lowEnd"]);
  });

  it("count the zero level in the output at full load and the headroom left", () => {
    // 1.8 V + 10 A × 1 mΩ × 50 = 2.3 V; 2.5 V − 2.3 V = 0.2 V (one-way: 0.5 V and 2 V).
    const signed = evaluateCandidate(small.requirement, small.choice);
    expect(signed.outputAtMaxV).toBeCloseTo(2.3, 12);
    expect(signed.headroomV).toBeCloseTo(0.2, 12);
    const plain = evaluateCandidate(oneWay.requirement, oneWay.choice);
    expect(plain.outputAtMaxV).toBeCloseTo(0.5, 12);
    // The headroom of a one-way and a signed design is not ranked against each other.
    expect(basisDiffers("headroomV", reqs)).toContain("span.direction");
    expect(metricFields.headroomV?.better).toBe("higher");
  });
});
