import { describe, expect, it } from "vitest";
import { benchCheck } from "./bench-check";
import { readoutOwnSources } from "./budget-readout-signed";
import { errorAt } from "./error-budget";
import { req } from "./test-helpers";

describe("benchCheck", () => {
  const r = req({ current: { min: "2 mA", typical: "40 mA", max: "180 mA" }, supply: { voltage: "3 V" } });
  const choice = { shuntOhms: 0.274, gain: 50 };
  const rows = benchCheck(r, choice);
  it("has rows at Imin, typical, 10 %, 50 % and 100 % of Imax", () => {
    expect(rows.map((x) => x.currentA)).toEqual([0.002, 0.04, 0.018, 0.09, 0.18]);
  });
  it("expects I·R·G with a band from the worst-case budget", () => {
    for (const row of rows) {
      expect(row.expectedV).toBeCloseTo(row.currentA * 0.274 * 50, 12);
      // The bench reads the amplifier's output with its own meter: the design's readout's own
      // error (here its class's typical figures, not stated) is not in the band.
      const w =
        errorAt(r, choice, row.currentA)
          .terms.filter((t) => !readoutOwnSources.includes(t.source))
          .reduce((s, t) => s + Math.abs(t.errorA), 0) *
        0.274 *
        50;
      expect(row.maxV - row.expectedV).toBeCloseTo(w, 12);
      expect(row.minV).toBeLessThan(row.expectedV);
    }
    // At 180 mA: 2.466 V expected.
    expect(rows.at(-1)?.expectedV).toBeCloseTo(2.466, 12);
  });
  it("leaves the typical row out when no typical current is given", () => {
    expect(
      benchCheck(req({ current: { min: "2 mA", max: "180 mA" }, supply: { voltage: "3 V" } }), choice),
    ).toHaveLength(4);
  });
});
