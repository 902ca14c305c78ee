// Each issue-14 term can turn a feasible pair into a refusal (and a calibration can turn it back):
// the pair is the engine's own best for a plain low-side requirement, the term's size is worked
// out by hand in the test before the verdict is asked for.
import { describe, expect, it } from "vitest";
import { evaluateCandidate } from "./candidate";
import { errorAt } from "./error-budget";
import { solve } from "./solve";
import { req } from "./test-helpers";
import type { RequirementInput } from "./requirement";
import type { Choice } from "./types";

// 10 mA to 1 A at 5 V, 2 % of reading from 100 mA (DEFAULTS.md: bandMin is 10 % of Imax).
const base: RequirementInput = {
  current: { min: "10 mA", max: "1 A" },
  supply: { voltage: "5 V" },
  readout: { kind: "adc", bits: 16, fullScale: "2.5 V" },
  accuracy: { percent: 2 },
};
const best = solve(req(base)).candidates.find((c) => c.feasible);
if (!best) throw new Error("the plain requirement must have a feasible pair");
const choice: Choice = { shuntOhms: best.shuntOhms, gain: best.gain };
const R = choice.shuntOhms;
/** What 2 % of reading allows at the band's low end, 100 mA, in A. */
const allowanceA = 0.02 * 0.1;

describe("issue 14's terms change verdicts on purpose", () => {
  it("the pair is feasible to begin with", () => {
    expect(evaluateCandidate(req(base), choice).feasible).toBe(true);
  });

  it("an ADC gain error of 5 % alone exceeds a 2 % target; a two-point calibration takes it out of accuracy again", () => {
    // Gain-type error, % of reading: 5 % > 2 % at every current (hand arithmetic).
    const stated = { ...base, readout: { ...base.readout, gainError: "5 %" } } as RequirementInput;
    const refused = evaluateCandidate(req(stated), choice);
    expect(refused.feasible).toBe(false);
    expect(refused.reasons).toContain("accuracy");
    const calibrated = evaluateCandidate(req({ ...stated, calibration: "two-point" } as RequirementInput), choice);
    expect(calibrated.reasons).not.toContain("accuracy");
    // What a calibration never moves: a high-reading converter reaches its last code 5 % early
    // (FS·(1 − gain error)), so a pair near full scale may still clip (docs/model.md, Calibration).
    expect(calibrated.reasons.filter((r) => r !== "output")).toEqual([]);
  });

  it("an input filter's bias error (Ios·R) larger than the allowance at 100 mA refuses the pair", () => {
    // Ios taken equal to Ib when not given (DEFAULTS.md): 2 µA through 1 kΩ is 2 mV at the input,
    // 2 mV / R in current, against 2 mA allowed at 100 mA: hand figure first.
    const filtered = {
      ...base,
      amplifier: { biasCurrent: "2 uA" },
      inputFilter: { resistance: "1 kohm", capacitance: "100 nF" },
    } as RequirementInput;
    expect((2e-6 * 1e3) / R).toBeGreaterThan(allowanceA);
    const refused = evaluateCandidate(req(filtered), choice);
    expect(refused.feasible).toBe(false);
    const term = errorAt(req(filtered), choice, 0.1).terms.find((t) => t.source === "inputFilterBias");
    expect(term?.errorA ?? 0).toBeGreaterThanOrEqual((2e-6 * 1e3) / R);
  });

  it("the pads of a 2-terminal shunt as large as the shunt itself refuse the pair (+100 % of reading)", () => {
    const padded = { ...base, shunt: { terminals: 2, padResistance: R } } as RequirementInput;
    const refused = evaluateCandidate(req(padded), choice);
    expect(refused.feasible).toBe(false);
    expect(refused.reasons).toContain("accuracy");
    // Pads/R = 1 at 25 °C, more with copper's tempco over the ambient range.
    const pads = errorAt(req(padded), choice, 1).terms.find((t) => t.source === "shuntPads");
    expect(pads?.errorA ?? 0).toBeGreaterThanOrEqual(1);
  });

  it("a thermal EMF of 40 µV/K across 10 K (400 µV) over the allowance refuses the pair; none keeps it", () => {
    const hot = { ...base, shunt: { thermalEmf: "40 uV/K", gradient: "10 K" } } as RequirementInput;
    expect(400e-6 / R).toBeGreaterThan(allowanceA);
    expect(evaluateCandidate(req(hot), choice).feasible).toBe(false);
    const none = { ...base, shunt: { thermalEmf: "40 uV/K", gradient: "0 K" } } as RequirementInput;
    expect(evaluateCandidate(req(none), choice).feasible).toBe(true);
  });
});
