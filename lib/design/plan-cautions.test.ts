import { describe, expect, it } from "vitest";
import { planCautions, rangeSwitchW, unprotectedShuntW } from "./plan-cautions";
import { evaluatePlan } from "./plan-evaluation";
import { solve } from "./solve";
import { demoLoggerInput, req } from "./test-helpers";

// docs/model.md §6: the demo logger, 3 µA–180 mA on a 3.0 V cell, 60 mV allowed.
const logger = req(demoLoggerInput);

describe("cautions for a range plan", () => {
  const proposed = solve(logger).rangePlan;
  if (!proposed) throw new Error("no plan");
  const e = evaluatePlan(logger, proposed);
  if (!e.ok) throw new Error(e.message);

  it("a low range left in at full current: the supply across it, V²/R, beyond its rating (Ohm's and Joule's laws)", () => {
    const low = e.ranges[0];
    if (!low) throw new Error("no low range");
    // 180 mA through tens of ohms would need volts the 3.0 V cell does not have: the cell sets the drop.
    expect(0.18 * low.shuntOhms).toBeGreaterThan(3);
    expect(unprotectedShuntW(logger, low)).toBeCloseTo((3 * 3) / low.shuntOhms, 12);
    const c = planCautions(logger, e).find((x) => x.key === "range-switch");
    expect(c?.severity).toBe("bad");
    expect(c?.text).toMatch(/browns out/);
    expect(c?.text).toMatch(/it burns/);
    expect(c?.text).toMatch(/make-before-break/);
    expect(c?.text).toMatch(/60 mV/);
  });

  it("keeps the usual notes (fuse, codes) after the hazards", () => {
    const keys = planCautions(logger, e).map((c) => c.key);
    expect(keys).toContain("fuse");
    expect(keys).toContain("codes");
    expect(keys.indexOf("range-switch")).toBeLessThan(keys.indexOf("fuse"));
  });
});

describe("the range switch's own dissipation", () => {
  it("is I²·Ron (Joule's law), with the default Ron of a tenth of the drop at full current", () => {
    // DEFAULTS.md: Ron = 0.1 · 60 mV / 180 mA = 33.3 mΩ; 180 mA² · 33.3 mΩ = 1.08 mW (by hand).
    expect(logger.rangeSwitch.onResistance).toBeCloseTo(0.006 / 0.18, 12);
    expect(rangeSwitchW(logger, 0.18)).toBeCloseTo(1.08e-3, 12);
    expect(rangeSwitchW(logger, -0.18)).toBeCloseTo(1.08e-3, 12);
  });
});
