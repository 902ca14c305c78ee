// Start points for the wizard, from the invented demo scenario (docs/model.md §6).
import { defaultRequirementInput } from "@/lib/design/requirement-options";
import type { RequirementInput } from "@/lib/design/requirement";

export type Scenario = { key: string; title: string; summary: string; input: RequirementInput };

/**
 * The soil-moisture logger while awake (100 µA idle to 180 mA radio bursts), read by a 24-bit
 * converter through an amplifier on a split supply (output reaches 0 V): one range covers it.
 * Not down to the 3 µA sleep current: on a shunt that keeps 60 mV at 180 mA, 3 µA is about 1 µV,
 * under the amplifier's offset and noise, so no single range reads it (the diagnosis says so).
 */
export const loggerOneRange: RequirementInput = {
  current: { min: "100 uA", max: "180 mA" },
  supply: { voltage: "3.0 V", side: "low" },
  drop: { max: "60 mV" },
  load: { model: "constant-current" },
  readout: { kind: "adc", bits: 24, fullScale: "2.5 V" },
  resolution: { countsAtMin: 10 },
  accuracy: { percent: 2 },
  temperature: { min: "0 °C", max: "70 °C" },
  amplifier: { swingLow: "0 V" },
};

export const scenarios: Scenario[] = [
  {
    key: "logger-24",
    title: "Soil-moisture logger, 24-bit converter",
    summary: "100 µA awake to 180 mA on radio bursts from a 3.0 V cell; one range works.",
    input: loggerOneRange,
  },
  {
    key: "logger-12",
    title: "Soil-moisture logger, 12-bit converter",
    summary: "The same span through a 12-bit converter: no single range works, so the solver plans ranges.",
    input: defaultRequirementInput,
  },
];
