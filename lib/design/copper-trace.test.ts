// Copper-trace shunts against handbook and standard values. Sources beside each check.
import { describe, expect, it } from "vitest";
import {
  COPPER_RESISTIVITY_20C,
  COPPER_TEMPCO_20C,
  areaMil2,
  copperTempcoAt,
  defaultTraceTolerance,
  ipc2221Current,
  ipc2221Rise,
  traceLengthFor,
  traceLengths,
  traceResistance,
  traceValues,
} from "./copper-trace";

describe("copper's resistivity and tempco (IACS, as IEC 60028 states it)", () => {
  it("1 m of 1 mm² annealed copper is 17.241 mΩ at 20 °C: the standard's 1/58 Ω·mm²/m", () => {
    expect(COPPER_RESISTIVITY_20C).toBe(1.7241e-8);
    const R = traceResistance({ width: 1e-3, length: 1, thickness: 1e-3 }, 20);
    expect(R).toBeCloseTo(1 / 58, 5); // 0.0172414 Ω
  });
  it("its tempco is 0.00393/K at 20 °C, 0.003854/K referred to 25 °C: α20/(1 + 5·α20)", () => {
    expect(COPPER_TEMPCO_20C).toBe(0.00393);
    expect(copperTempcoAt(25)).toBeCloseTo(0.00393 / 1.01965, 9);
    // The same law both ways: R(75 °C)/R(25 °C) = 1 + α25·50.
    const g = { width: 2e-3, length: 20e-3, thickness: 35e-6 };
    expect(traceResistance(g, 75) / traceResistance(g, 25)).toBeCloseTo(1 + copperTempcoAt(25) * 50, 12);
  });
  it("a 1 mm by 10 mm trace of 35 µm copper is 4.93 mΩ at 20 °C (ρ·L/(w·t) by hand: 1.7241e-8·0.01/(1e-3·35e-6))", () => {
    expect(traceResistance({ width: 1e-3, length: 10e-3, thickness: 35e-6 }, 20)).toBeCloseTo(4.926e-3, 6);
    expect(traceLengthFor(traceResistance({ width: 1e-3, length: 10e-3, thickness: 35e-6 }), 1e-3, 35e-6)).toBeCloseTo(
      10e-3,
      12,
    );
  });
});

describe("IPC-2221 trace heating, I = k·ΔT^0.44·A^0.725 (A in mil²)", () => {
  // Worked by hand from the published relation: 1 A on 1 oz (35 µm ≈ 1.378 mil) outer-layer
  // copper at a 10 K rise needs A = (1/(0.048·10^0.44))^(1/0.725) = 16.30 mil², a width of
  // 11.83 mil (0.30 mm). The "about 12 mil for 1 A" rule of thumb agrees (from memory).
  const oneOz = 1.378 * 25.4e-6;
  it("1 A, 10 K, external: 16.30 mil², 11.83 mil wide", () => {
    const area = (1 / (0.048 * 10 ** 0.44)) ** (1 / 0.725);
    expect(area).toBeCloseTo(16.3, 1);
    const width = (area / 1.378) * 25.4e-6;
    expect(width / 25.4e-6).toBeCloseTo(11.83, 1);
    expect(areaMil2(width, oneOz)).toBeCloseTo(area, 9);
    expect(ipc2221Current(10, width, oneOz, "external")).toBeCloseTo(1, 9);
    expect(ipc2221Rise(1, width, oneOz, "external")).toBeCloseTo(10, 9);
  });
  it("an inner layer (k = 0.024) carries half the current at the same rise", () => {
    expect(ipc2221Current(10, 0.3e-3, oneOz, "internal")).toBeCloseTo(
      ipc2221Current(10, 0.3e-3, oneOz, "external") / 2,
      12,
    );
    expect(ipc2221Current(0, 0.3e-3, oneOz, "external")).toBe(0);
  });
});

describe("trace candidates and tolerance", () => {
  it("lengths run on a 0.1 mm grid from two widths to the longest allowed", () => {
    const ls = traceLengths(2e-3, 10e-3);
    expect(ls[0]).toBeCloseTo(4e-3, 12);
    expect(ls.at(-1)).toBeCloseTo(10e-3, 12);
    expect(ls).toHaveLength(61);
    expect(traceLengths(2e-3, 3e-3)).toHaveLength(0);
    const vs = traceValues(2e-3, 35e-6, 10e-3);
    expect(vs[0]).toBeCloseTo(traceResistance({ width: 2e-3, length: 4e-3, thickness: 35e-6 }), 15);
  });
  it("the default tolerance is thickness ±10 % plus ±25 µm of etch on the width (from memory)", () => {
    expect(defaultTraceTolerance(1e-3)).toBeCloseTo(0.125, 12);
    expect(defaultTraceTolerance(5e-3)).toBeCloseTo(0.105, 12);
  });
});
