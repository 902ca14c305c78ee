// "Best" on the compare page is weighed only between designs the engine still stands behind: a
// design whose saved figures fail under today's model (issue 14's readout rule) is not ranked.
import { describe, expect, it } from "vitest";
import { bestIndexes } from "./compare";
import { metricFields } from "./figures";

const error = metricFields.errorAtMinPercent;

describe("bestIndexes with designs left out of the ranking", () => {
  it("marks the best of all designs when every one is ranked", () => {
    expect(bestIndexes([5.24, 5.84, 6.1], error)).toEqual([0]);
    expect(bestIndexes([5.24, 5.84, 6.1], error, [true, true, true])).toEqual([0]);
  });

  it("passes over a design that is not ranked, however good its saved figure", () => {
    expect(bestIndexes([5.24, 5.84, 6.1], error, [false, true, true])).toEqual([1]);
  });

  it("marks nothing when fewer than two designs are ranked", () => {
    expect(bestIndexes([5.24, 5.84], error, [false, true])).toEqual([]);
    expect(bestIndexes([5.24, 5.84], error, [false, false])).toEqual([]);
  });
});
