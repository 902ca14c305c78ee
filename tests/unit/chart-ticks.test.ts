// Tick thinning on narrow charts: labels of a log axis never outnumber the room for them.
import { describe, expect, it } from "vitest";
import { logTicks, thinTicks } from "@/components/charts/axes";

describe("thinTicks", () => {
  it("keeps every tick when there is room", () => {
    const t = logTicks(0.02, 0.09);
    expect(thinTicks(t, 20)).toEqual(t);
  });
  it("keeps the decades first on a narrow axis", () => {
    // 1, 2, 5 per decade over two decades: 1e-3 … 1e-1
    const t = logTicks(1e-3, 1e-1);
    expect(t.length).toBeGreaterThan(4);
    expect(thinTicks(t, 4)).toEqual([1e-3, 1e-2, 1e-1]);
  });
  it("takes every n-th when even the decades do not fit", () => {
    const t = thinTicks(logTicks(0.05, 0.09), 2);
    expect(t.length).toBeLessThanOrEqual(2);
    expect(t.length).toBeGreaterThanOrEqual(1);
    expect(thinTicks([1e-6, 1e-5, 1e-4, 1e-3, 1e-2, 1e-1], 3)).toEqual([1e-6, 1e-4, 1e-2]);
  });
});
