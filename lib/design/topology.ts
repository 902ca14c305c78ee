// The amplifier topologies and their words: a module of its own, without zod or the unit parser,
// so a table or form that only lists them (the parts library) does not download the requirement's
// schema.

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
