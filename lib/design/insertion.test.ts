import { describe, expect, it } from "vitest";
import { insertion, InsertionError, insertionCurve, insertionSchema } from "./insertion";

describe("insertion", () => {
  it("parses unit strings in the body", () => {
    const body = insertionSchema.parse({
      supply: "2.0 V",
      seriesOhms: "1.9 ohm",
      load: { model: "constant-current", current: "200 mA" },
    });
    expect(body).toEqual({ supply: 2, seriesOhms: 1.9, load: { model: "constant-current", current: 0.2 } });
  });
  it("refuses a wrong dimension and a negative resistance on their paths", () => {
    const r = insertionSchema.safeParse({ supply: "2 A", seriesOhms: -1, load: { current: "200 mA" } });
    expect(r.success).toBe(false);
    if (!r.success) expect(r.error.issues.map((i) => i.path.join("."))).toEqual(["supply", "seriesOhms"]);
  });
  it("constant current: the current stays and the load loses I·R (Ohm's law)", () => {
    const r = insertion({ supply: 2, seriesOhms: 1.9, load: { model: "constant-current", current: 0.2 } });
    expect(r).toEqual({
      currentA: 0.2,
      loadVoltageV: 2 - 0.38,
      burdenV: 0.38,
      currentChangePercent: 0,
      powerInSeriesW: 0.2 * 0.2 * 1.9,
    });
  });
  it("resistive: I' = V/(RL + R) (Ohm's law)", () => {
    const r = insertion({ supply: 3, seriesOhms: 1, load: { model: "resistive", current: 0.3 } });
    expect(r.currentA).toBeCloseTo(3 / 11, 14);
    expect(r.loadVoltageV).toBeCloseTo(30 / 11, 14);
  });
  it("constant power: draws more current as its voltage falls, and V·I stays P", () => {
    const r = insertion({ supply: 5, seriesOhms: 1, load: { model: "constant-power", current: 1 } });
    expect(r.currentA).toBeGreaterThan(1);
    expect(r.loadVoltageV * r.currentA).toBeCloseTo(5, 12);
    expect(r.currentChangePercent).toBeGreaterThan(0);
    // (V + √(V² − 4PR))/2 with V = 5, P = 5, R = 1: (5 + √5)/2
    expect(r.loadVoltageV).toBeCloseTo((5 + Math.sqrt(5)) / 2, 12);
  });
  it("constant power with V² < 4·P·R has no operating point", () => {
    expect(() => insertion({ supply: 2, seriesOhms: 1, load: { model: "constant-power", current: 1.1 } })).toThrow(
      InsertionError,
    );
    expect(() => insertion({ supply: 2, seriesOhms: 1, load: { model: "constant-power", current: 1.1 } })).toThrow(
      /cannot be powered through/,
    );
    // V² = 4·P·R exactly is the last operating point: the load gets half the supply.
    expect(
      insertion({ supply: 2, seriesOhms: 1, load: { model: "constant-power", current: 0.5 } }).loadVoltageV,
    ).toBeCloseTo(1, 12);
  });
  it("a constant-current load that needs more than the supply across R is refused", () => {
    expect(() => insertion({ supply: 2, seriesOhms: 100, load: { model: "constant-current", current: 0.1 } })).toThrow(
      /cannot be powered/,
    );
  });
  it("insertionCurve spans the currents and leaves out those with no operating point", () => {
    const c = insertionCurve(
      { supply: 2, seriesOhms: 1, load: { model: "constant-power", current: 0.4 } },
      { points: 30 },
    );
    expect(c.length).toBeGreaterThan(10);
    expect(c.length).toBeLessThan(30);
    for (let i = 1; i < c.length; i++) expect((c[i]?.burdenV ?? 0) > (c[i - 1]?.burdenV ?? 0)).toBe(true);
  });
});
