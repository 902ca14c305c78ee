import { describe, expect, it } from "vitest";
import { insertion, InsertionError, insertionCurve } from "./insertion";
import { insertionSchema } from "./insertion-schema";

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

// A charge current flowing back through the series element (a charger into a battery, a motor
// regenerating): Ohm's law with the sign kept, V_load = V − I·R, and Joule heat I²·R either way.
describe("insertion of a negative (charge or regeneration) current", () => {
  it("parses a negative load current and refuses zero on load.current", () => {
    expect(
      insertionSchema.parse({ supply: "48 V", seriesOhms: "1 mohm", load: { current: "-20 A" } }).load.current,
    ).toBe(-20);
    const r = insertionSchema.safeParse({ supply: "48 V", seriesOhms: "1 mohm", load: { current: "0 A" } });
    expect(r.success).toBe(false);
    if (!r.success) expect(r.error.issues.map((i) => i.path.join("."))).toEqual(["load.current"]);
  });
  it("constant current −20 A through 1 mΩ from 48 V: the load side sits 20 mV above the supply", () => {
    const r = insertion({ supply: 48, seriesOhms: 1e-3, load: { model: "constant-current", current: -20 } });
    expect(r.currentA).toBe(-20);
    expect(r.burdenV).toBeCloseTo(0.02, 12); // |I|·R
    expect(r.loadVoltageV).toBeCloseTo(48.02, 12); // V − I·R with I < 0
    expect(r.powerInSeriesW).toBeCloseTo(0.4, 12); // I²·R
    expect(r.currentChangePercent).toBe(0);
  });
  it("a constant current back through any resistance has an operating point (its source sets it)", () => {
    const r = insertion({ supply: 2, seriesOhms: 100, load: { model: "constant-current", current: -0.2 } });
    expect(r.loadVoltageV).toBeCloseTo(22, 12);
  });
  it("constant power −100 W (a source) from 48 V through 1 Ω: V·I stays −100 W at the load side", () => {
    const r = insertion({ supply: 48, seriesOhms: 1, load: { model: "constant-power", current: -100 / 48 } });
    // V_load = (V + √(V² − 4·P·R))/2 with P = −100 W, R = 1 Ω: (48 + √2704)/2 = 50 V, I = −2 A
    expect(r.loadVoltageV).toBeCloseTo(50, 12);
    expect(r.currentA).toBeCloseTo(-2, 12);
    expect(r.currentChangePercent).toBeCloseTo(-4, 9); // |I| falls from 2.083 A to 2 A: −4 %
  });
  it("a resistive load cannot send current back: refused on load.model", () => {
    try {
      insertion({ supply: 48, seriesOhms: 1e-3, load: { model: "resistive", current: -1 } });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(InsertionError);
      expect((e as InsertionError).field).toBe("load.model");
    }
  });
  it("the curve over negative currents runs from −0.2 A to −40 A with the load side above the supply", () => {
    const c = insertionCurve(
      { supply: 48, seriesOhms: 1e-3, load: { model: "constant-current", current: -20 } },
      { points: 20 },
    );
    expect(c).toHaveLength(20);
    expect(c[0]!.nominalA).toBeCloseTo(-0.2, 12);
    expect(c.at(-1)!.nominalA).toBeCloseTo(-40, 12);
    for (const p of c) expect(p.loadVoltageV).toBeGreaterThan(48);
  });
});
