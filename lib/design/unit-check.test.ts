import { lusolve } from "mathjs";
import { describe, expect, it } from "vitest";
import { benchCheck, type BenchCheckRow } from "./bench-check";
import { buildModel } from "./model";
import { fitCalibration, judgeUnit, matchTestPoints, type UnitReading } from "./unit-check";
import { simulateBench } from "./unit-prediction";
import { req } from "./test-helpers";

// The demo pump controller's requirement and its approved pair (14.7 mΩ, gain 25): 100 mA to 6 A, high side.
const pump = req({
  current: { min: "100 mA", max: "6 A" },
  supply: { voltage: "24 V", side: "high" },
  drop: { max: "150 mV" },
  readout: { kind: "adc", bits: 12, fullScale: "3.3 V" },
  resolution: { countsAtMin: 10 },
  amplifier: { cmrrDb: 120 },
});
const choice = { shuntOhms: 0.0147, gain: 25 };
const tz = choice.shuntOhms * choice.gain;
const bench = benchCheck(pump, choice);

function judge(outputs: (I: number) => number, rows: BenchCheckRow[] = bench) {
  const readings: UnitReading[] = rows.map((b) => ({ currentA: b.currentA, outputV: outputs(b.currentA) }));
  const matched = matchTestPoints(rows, readings);
  if (!matched.ok) throw new Error(matched.errors[0]?.message);
  return judgeUnit(pump, choice, matched.rows);
}

describe("pass or fail against the sheet's bands", () => {
  // Hand-set bands: 1 V ± 50 mV at 1 A, 2 V ± 100 mV at 2 A (the numbers are ours, not the engine's).
  const hand: BenchCheckRow[] = [
    { label: "Low", currentA: 1, expectedV: 1, minV: 0.95, maxV: 1.05 },
    { label: "High", currentA: 2, expectedV: 2, minV: 1.9, maxV: 2.1 },
  ];
  const run = (low: number, high: number) => judge((I) => (I === 1 ? low : high), hand).readings.map((r) => r.inBand);

  it("puts a reading on the band's edge inside, and just beyond it outside", () => {
    expect(run(1.05, 1.9)).toEqual([true, true]);
    expect(run(0.95, 2.1)).toEqual([true, true]);
    expect(run(1.0501, 2)).toEqual([false, true]);
    expect(run(1, 1.8999)).toEqual([true, false]);
  });
  it("passes a unit only when every reading is in its band", () => {
    expect(judge((I) => I, hand).pass).toBe(true);
    expect(judge((I) => (I === 2 ? 2.2 : 1), hand).pass).toBe(false);
    expect(judge((I) => I, hand).cause).toBeNull();
  });
  it("reports each reading's error in volts and percent of the expected output", () => {
    const r = judge((I) => I * 1.02, hand).readings[1]!;
    expect(r.errorV).toBeCloseTo(0.04, 12);
    expect(r.errorPercent).toBeCloseTo(2, 10);
  });
});

describe("matching readings to test points", () => {
  it("refuses a current the sheet does not list, a second reading at a point, and a missing point", () => {
    const readings = [
      { currentA: 0.1, outputV: 0.0367 },
      { currentA: 0.1, outputV: 0.0368 },
      { currentA: 2, outputV: 0.7 },
    ];
    const m = matchTestPoints(bench, readings);
    expect(m.ok).toBe(false);
    if (m.ok) return;
    expect(m.errors.map((e) => e.path)).toEqual([
      "readings.1.currentA",
      "readings.2.currentA",
      "readings",
      "readings",
      "readings",
    ]);
    expect(m.errors[1]?.message).toMatch(/2 A is not a test point/);
    expect(m.errors[2]?.message).toMatch(/no reading at 10 % of maximum current/);
  });
  it("accepts a typed current rounded to 0.5 %", () => {
    const m = matchTestPoints(
      bench,
      bench.map((b) => ({ currentA: Number(b.currentA.toPrecision(2)) * 1.004, outputV: b.expectedV })),
    );
    expect(m.ok).toBe(true);
  });
});

describe("likely cause, each on a unit built with that fault", () => {
  it("wrong shunt value: 2 % high at every current, the next E96 value up", () => {
    // 15.0 mΩ fitted for 14.7 mΩ: the output is I·15.0 mΩ·25 (Ohm's law; E96 from IEC 60063).
    const j = judge((I) => I * 0.015 * 25);
    expect(j.pass).toBe(false);
    expect(j.causeKind).toBe("gain");
    expect(j.cause).toContain("Readings are 2 % high at every current");
    expect(j.cause).toContain(
      "the shunt may be the next value up (15 mΩ instead of 14.7 mΩ), or the gain resistor wrong",
    );
  });
  it("wrong shunt value 9.8 % high, four E96 steps up (16.2 mΩ ≈ 14.7 mΩ · 1.10)", () => {
    const j = judge((I) => I * tz * 1.098);
    expect(j.causeKind).toBe("gain");
    expect(j.cause).toContain(
      "Readings are 9.8 % high at every current: the shunt may be 4 values up (16.2 mΩ instead",
    );
  });
  it("broken sense line: a constant 30 mV at the output, 1.2 mV at the input", () => {
    const j = judge((I) => I * tz + 0.03);
    expect(j.causeKind).toBe("offset");
    expect(j.cause).toContain("Readings are 30 mV high at every current (1.2 mV at the amplifier input");
    expect(j.cause).toMatch(/sense lines/);
  });
  it("self-heating: the error grows as I³ (relative error ∝ I², as ΔTs = I²·R·θ)", () => {
    // 3 % at 6 A, so 0.75 % at 3 A and 0.03 % at 600 mA.
    const j = judge((I) => I * tz * (1 + 0.03 * (I / 6) ** 2));
    expect(j.causeKind).toBe("self-heating");
    expect(j.cause).toContain("grows faster than the current");
    expect(j.cause).toContain("0.75 % at 3 A, 3 % at 6 A");
  });
  it("dead zone: stuck at the 10 mV output floor at 100 mA where 36.75 mV was expected", () => {
    const floor = pump.amplifier.swingLow;
    const j = judge((I) => (I < 0.2 ? floor : I * tz));
    expect(j.causeKind).toBe("dead-zone");
    expect(j.readings[0]?.atFloor).toBe(true);
    expect(j.cause).toContain("stuck at the output floor (10 mV) where 36.8 mV was expected");
  });
  it("no output at all: every reading at the floor", () => {
    const j = judge(() => pump.amplifier.swingLow);
    expect(j.causeKind).toBe("no-output");
  });
  it("finds the same causes on units drawn from the engine's own model with the fault built in", () => {
    const currents = bench.map((b) => b.currentA);
    const wrongShunt = simulateBench(pump, choice, currents, { draws: 1, seed: 11, fault: { shuntOhms: 0.015 } });
    const sense = simulateBench(pump, choice, currents, { draws: 1, seed: 12, fault: { inputOffsetV: 1.2e-3 } });
    const at = (s: Float64Array[]) => (I: number) => s[currents.indexOf(I)]![0]!;
    expect(judge(at(wrongShunt)).causeKind).toBe("gain");
    expect(judge(at(sense)).causeKind).toBe("offset");
  });
});

describe("calibration: corrected = gain · raw + offset", () => {
  const pts = [
    { rawV: 0.0412, expectedV: 0.03675 },
    { rawV: 0.2281, expectedV: 0.2205 },
    { rawV: 1.1322, expectedV: 1.1025 },
    { rawV: 2.2597, expectedV: 2.205 },
  ];
  it("matches the least-squares line from the normal equations solved by hand (Cramer's rule)", () => {
    const n = pts.length;
    const sx = pts.reduce((s, p) => s + p.rawV, 0);
    const sy = pts.reduce((s, p) => s + p.expectedV, 0);
    const sxx = pts.reduce((s, p) => s + p.rawV * p.rawV, 0);
    const sxy = pts.reduce((s, p) => s + p.rawV * p.expectedV, 0);
    const det = n * sxx - sx * sx;
    const gain = (n * sxy - sx * sy) / det;
    const offset = (sxx * sy - sx * sxy) / det;
    const c = fitCalibration(pts);
    expect(c.method).toBe("least-squares");
    expect(c.gain).toBeCloseTo(gain, 10);
    expect(c.offsetV).toBeCloseTo(offset, 12);
  });
  it("matches mathjs (a general-purpose numerics package) solving (XᵀX)β = Xᵀy by LU decomposition", () => {
    const XtX = [
      [pts.reduce((s, p) => s + p.rawV * p.rawV, 0), pts.reduce((s, p) => s + p.rawV, 0)],
      [pts.reduce((s, p) => s + p.rawV, 0), pts.length],
    ];
    const Xty = [pts.reduce((s, p) => s + p.rawV * p.expectedV, 0), pts.reduce((s, p) => s + p.expectedV, 0)];
    const beta = lusolve(XtX, Xty) as number[][];
    const c = fitCalibration(pts);
    expect(c.gain).toBeCloseTo(beta[0]![0]!, 9);
    expect(c.offsetV).toBeCloseTo(beta[1]![0]!, 11);
    // The residual is the largest |corrected − expected| over the points, % of expected.
    const worst = Math.max(
      ...pts.map((p) => Math.abs(beta[0]![0]! * p.rawV + beta[1]![0]! - p.expectedV) / p.expectedV),
    );
    expect(c.residualPercent).toBeCloseTo(100 * worst, 6);
  });
  it("two points give the line through both, exactly; one point a gain only", () => {
    const two = fitCalibration([
      { rawV: 1, expectedV: 0.9 },
      { rawV: 2, expectedV: 1.9 },
    ]);
    expect(two.method).toBe("two-point");
    expect(two.gain).toBeCloseTo(1, 12);
    expect(two.offsetV).toBeCloseTo(-0.1, 12);
    expect(two.residualPercent).toBeCloseTo(0, 10);
    const one = fitCalibration([{ rawV: 2, expectedV: 1.9 }]);
    expect(one).toMatchObject({ method: "gain-only", offsetV: 0 });
    expect(one.gain).toBeCloseTo(0.95, 12);
  });
  it("takes a wrong-shunt unit back onto the expected line, leaving out readings stuck at the floor", () => {
    const j = judge((I) => I * 0.015 * 25);
    expect(j.calibration.gain).toBeCloseTo(0.0147 / 0.015, 9);
    expect(j.calibration.offsetV).toBeCloseTo(0, 12);
    for (const r of j.readings) expect(Math.abs(r.correctedErrorPercent)).toBeLessThan(1e-8);
    const floor = pump.amplifier.swingLow;
    const stuck = judge((I) => (I < 0.2 ? floor : I * tz * 1.01));
    expect(stuck.calibration.points).toBe(bench.length - 1);
    expect(stuck.calibration.gain).toBeCloseTo(1 / 1.01, 9);
    // The floor threshold: 3 readout steps or half the floor, whichever is larger (3.3 V / 4096 = 0.81 mV).
    expect(buildModel(pump).lsbV).toBeCloseTo(3.3 / 4096, 12);
  });
});
