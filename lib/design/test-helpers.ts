// Test-only helper: parse a requirement or fail loudly.
import { parseRequirement, type Requirement, type RequirementInput } from "./requirement";
import { demoLoggerReadout } from "./demo-converters";
import type { PlanProfileDesign } from "./plan-switching";

export function req(input: RequirementInput): Requirement {
  const r = parseRequirement(input);
  if (!r.ok) throw new Error(r.message);
  return r.requirement;
}

/**
 * A converter with no error of its own, stated as such (every figure 0): for hand calculations
 * that check other terms alone. Left out, the figures would be the class's typical ones.
 */
export const idealConverter = {
  reference: { tolerance: 0, tempco: 0 },
  offsetLsb: 0,
  gainError: 0,
  inlLsb: 0,
} as const;

// The demo designs' converters: one statement, shared with the seed and the wizard's start values.
export { demoLoggerReadout, demoPumpReadout } from "./demo-converters";

/** docs/model.md §6: the demo logger, 3 µA asleep to 180 mA transmitting, from a 3.0 V cell, 60 mV allowed. */
export const demoLoggerInput = {
  current: { min: "3 uA", max: "180 mA" },
  supply: { voltage: "3.0 V", side: "low" },
  drop: { max: "60 mV" },
  ...demoLoggerReadout,
  resolution: { countsAtMin: 10 },
} as const satisfies RequirementInput;

/** docs/model.md §6: the logger's burst range (2 mA–180 mA), as saved before issue 14: no readout stated. */
export const loggerBurstInput = {
  current: { min: "2 mA", max: "180 mA" },
  supply: { voltage: "3.0 V" },
  drop: { max: "60 mV" },
} as const satisfies RequirementInput;

/** The burst range's 12-bit, 2.5 V converter with every error figure stated as zero (the pre-issue-14 assumption). */
export const idealLoggerAdc = { kind: "adc", bits: 12, fullScale: "2.5 V", ...idealConverter } as const;

/**
 * Issue 11's sensor node: a 3.3 V node at 5 µA–250 mA, 50 mV allowed, 12-bit at 3.3 V, 1 % from
 * 1 mA over −20…60 °C. No single pair covers it; the diagnosis must still say what would work.
 */
export const sensorNodeInput: RequirementInput = {
  current: { min: "5 uA", max: "250 mA" },
  supply: { voltage: "3.3 V" },
  drop: { max: "50 mV" },
  readout: { kind: "adc", bits: 12, fullScale: "3.3 V" },
  accuracy: { percent: 1, bandMin: "1 mA" },
  temperature: { min: "-20 °C", max: "60 °C" },
};
// A two-range plan with round numbers, so every figure below can be counted by hand:
// range 0 is 10 Ω + 0.1 Ω of switch up to 1 mA, range 1 is 0.1 Ω + 0.1 Ω down to 0.8 mA;
// switch up above 1 mA, back down below 0.8 mA; 3 V supply, 60 mV allowed drop.
export function twoRangeDesign(delayS: number): PlanProfileDesign {
  return {
    supplyV: 3,
    fullScaleV: 2.5,
    dropMaxV: 0.06,
    switchDelayS: delayS,
    switchPoints: [{ upA: 1e-3, downA: 0.8e-3 }],
    ranges: [
      {
        minA: 1e-6,
        maxA: 1e-3,
        shuntOhms: 10,
        gain: 100,
        switchOhms: 0.1,
        lsbA: 1e-7,
        resolvableStepA: 0.2e-3,
        clipCurrentA: 2.5e-3,
      },
      {
        minA: 0.8e-3,
        maxA: 0.1,
        shuntOhms: 0.1,
        gain: 100,
        switchOhms: 0.1,
        lsbA: 1e-4,
        resolvableStepA: 1e-3,
        clipCurrentA: 0.25,
      },
    ],
  };
}
