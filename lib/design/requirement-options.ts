// What a requirement offers to choose from (load behaviours, amplifier topologies) and the
// wizard's start values, without the schema: a screen that lists them loads neither zod nor the
// unit parser. ./requirement re-exports all of it (and types the start values as its input).

export const loadModels = ["constant-current", "resistive", "constant-power"] as const;
export type LoadModel = (typeof loadModels)[number];

// The topologies live in ./topology (the parts library lists them too).
export { topologies, topologyLabels, type Topology } from "./topology";

/** The demo soil-moisture logger (docs/model.md §6): the wizard's start values. */
export const defaultRequirementInput = {
  current: { min: "3 uA", max: "180 mA" },
  supply: { voltage: "3.0 V", side: "low" },
  drop: { max: "60 mV" },
  readout: { kind: "adc", bits: 12, fullScale: "2.5 V" },
  resolution: { countsAtMin: 10 },
} as const;
