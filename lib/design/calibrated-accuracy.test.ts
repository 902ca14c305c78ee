import { describe, expect, it } from "vitest";
import { errorAt } from "./error-budget";
import { buildModel, noiseRmsA } from "./model";
import { shuntFigures } from "./pair";
import { calibratedAccuracy, calibratedErrorA } from "./calibrated-accuracy";
import { req } from "./test-helpers";

const pump = req({
  current: { min: "10 mA", max: "6 A" }, // low enough that the calibrated crossing lies inside the span
  supply: { voltage: "24 V", side: "high" },
  drop: { max: "150 mV" },
  // An ideal converter, stated: the hand calculation below counts only its half step (the
  // readout's own error has its own tests in readout-error.test.ts).
  readout: {
    kind: "adc",
    bits: 12,
    fullScale: "3.3 V",
    reference: { tolerance: 0, tempco: 0 },
    offsetLsb: 0,
    gainError: 0,
    inlLsb: 0,
  },
  amplifier: { cmrrDb: 120 },
});
const choice = { shuntOhms: 0.0147, gain: 25 };

describe("what calibration removes and what remains", () => {
  it("keeps exactly the terms that move after calibration (DESIGN.md §3's budget, term by term)", () => {
    const R = choice.shuntOhms;
    const G = choice.gain;
    const m = buildModel(pump);
    const theta = shuntFigures(m, R).theta;
    const dT = 45; // 0 to 70 °C about 25 °C
    for (const I of [0.1, 1, 6]) {
      const byHand =
        I * pump.shunt.tempco * (dT + I * I * R * theta) + // shunt tempco, ambient and self-heating
        I * pump.amplifier.gainDrift * dT + // gain drift
        (pump.amplifier.offsetDrift * dT) / R + // offset drift
        3.3 / 4096 / (2 * R * G) + // half a readout step
        pump.accuracy.crestFactor * noiseRmsA(m, R, G); // noise
      expect(calibratedErrorA(pump, choice, I)).toBeCloseTo(byHand, 12);
      expect(calibratedErrorA(pump, choice, I)).toBeLessThan(errorAt(pump, choice, I).worstA);
    }
  });
  it("lists removed and remaining terms, with why each remains", () => {
    const c = calibratedAccuracy(pump, choice);
    expect(c.removed.map((r) => r.source)).toEqual([
      "gainError",
      "gainSetResistors",
      "shuntTolerance",
      "offset",
      "biasCurrent",
      "commonMode",
    ]);
    // The converter's own lines stay (at the zeros stated above): a bench fit never reaches them.
    expect(c.remaining.map((r) => r.source)).toEqual([
      "shuntTempco",
      "gainDrift",
      "offsetDrift",
      "readout",
      "noise",
      "readoutReference",
      "readoutGain",
      "readoutOffset",
      "readoutInl",
    ]);
    for (const r of c.remaining) expect(r.why).not.toBe("");
  });
  it("reaches a better worst case than the uncalibrated unit, and a lower current meeting the target", () => {
    const c = calibratedAccuracy(pump, choice);
    expect(c.bandWorstPercent).toBeLessThan(c.uncalibratedBandWorstPercent);
    expect(c.lowestAccurateCurrentA).not.toBeNull();
    const I = c.lowestAccurateCurrentA!;
    // At the crossing the calibrated worst case equals the target (2 %).
    expect((100 * calibratedErrorA(pump, choice, I)) / I).toBeCloseTo(pump.accuracy.percent, 4);
    expect(c.curve.every((p) => p.calibratedPercent <= p.uncalibratedPercent)).toBe(true);
  });
});
