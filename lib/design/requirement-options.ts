// What a requirement offers to choose from (load behaviours, amplifier topologies) and the
// wizard's start values, without the schema: a screen that lists them loads neither zod nor the
// unit parser. ./requirement re-exports all of it (and types the start values as its input).

export const loadModels = ["constant-current", "resistive", "constant-power"] as const;
export type LoadModel = (typeof loadModels)[number];

/** How the amplifier is built (API.md v2): an integrated part, or an op-amp stage with its resistors. */
export const topologies = ["current-sense", "difference", "non-inverting", "instrumentation"] as const;
export type Topology = (typeof topologies)[number];

/** The topologies in the trade's words, for forms and tables. */
export const topologyLabels: Record<Topology, string> = {
  "current-sense": "Current-sense amplifier (integrated, fixed gains)",
  difference: "Difference amplifier (op-amp and four resistors)",
  "non-inverting": "Non-inverting op-amp stage (ground-referenced, low side only)",
  instrumentation: "Instrumentation amplifier",
};

/** The demo soil-moisture logger (docs/model.md §6): the wizard's start values. */
export const defaultRequirementInput = {
  current: { min: "3 uA", max: "180 mA" },
  supply: { voltage: "3.0 V", side: "low" },
  drop: { max: "60 mV" },
  readout: { kind: "adc", bits: 12, fullScale: "2.5 V" },
  resolution: { countsAtMin: 10 },
} as const;
