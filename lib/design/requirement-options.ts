// What a requirement offers to choose from (load behaviours, amplifier topologies) and the
// wizard's start values, without the schema: a screen that lists them loads neither zod nor the
// unit parser. ./requirement re-exports all of it (and types the start values as its input).

export const loadModels = ["constant-current", "resistive", "constant-power"] as const;
export type LoadModel = (typeof loadModels)[number];

import { demoLoggerReadout } from "./demo-converters";

// The topologies live in ./topology (the parts library lists them too).
export { topologies, topologyLabels, type Topology } from "./topology";

/**
 * The demo soil-moisture logger (docs/model.md §6): the wizard's example start values, its
 * converter's own error stated as the demo states it (db/seed/designs.ts) and zeroed once.
 */
export const defaultRequirementInput = {
  current: { min: "3 uA", max: "180 mA" },
  supply: { voltage: "3.0 V", side: "low" },
  drop: { max: "60 mV" },
  ...demoLoggerReadout,
  resolution: { countsAtMin: 10 },
} as const;
