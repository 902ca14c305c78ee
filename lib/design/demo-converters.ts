// The demo designs' converters (docs/model.md §6), stated once: the seed (db/seed/designs.ts), the
// wizard's start values (./requirement-options) and the tests read them from here. Invented parts
// of ordinary classes; plain data, so a screen that imports it loads neither zod nor the parser.
// No import of ./requirement (it imports ./requirement-options, which imports this): the seed's
// `satisfies RequirementInput` and requirement.ts's typed start values check these shapes.

/**
 * The demo logger's converter (an invented part of an ordinary
 * class: external 2.5 V reference ±0.05 %, 10 ppm/K; ±2 LSB offset, ±0.1 % gain error, ±1 LSB INL),
 * zeroed once at production test (a one-point calibration).
 */
export const demoLoggerReadout = {
  readout: {
    kind: "adc",
    bits: 12,
    fullScale: "2.5 V",
    reference: { tolerance: "0.05 %", tempco: "10 ppm/K" },
    offsetLsb: 2,
    gainError: "0.1 %",
    inlLsb: 1,
  },
  calibration: "one-point",
} as const;

/**
 * The demo pump controller's converter (invented: reference ±0.1 %,
 * 25 ppm/K; ±3 LSB offset, ±0.2 % gain error, ±1.5 LSB INL at 12 bits on 3.3 V), calibrated at the
 * end of the line at zero and near full scale (two points).
 */
export const demoPumpReadout = {
  readout: {
    kind: "adc",
    bits: 12,
    fullScale: "3.3 V",
    reference: { tolerance: "0.1 %", tempco: "25 ppm/K" },
    offsetLsb: 3,
    gainError: "0.2 %",
    inlLsb: 1.5,
  },
  calibration: "two-point",
} as const;
