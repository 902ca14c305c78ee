// Test-only helper: parse a requirement or fail loudly.
import { parseRequirement, type Requirement, type RequirementInput } from "./requirement";

export function req(input: RequirementInput): Requirement {
  const r = parseRequirement(input);
  if (!r.ok) throw new Error(r.message);
  return r.requirement;
}

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
