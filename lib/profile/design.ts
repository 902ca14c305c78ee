// The figures of a saved design that a profile is judged against, taken from its requirement and
// the engine's metrics at that revision (the engine computed lsbA; nothing is recomputed here).
import type { DesignView } from "@/lib/design-view";
import type { ProfileDesign } from "@/lib/design/profile";

export function profileDesignOf(design: Pick<DesignView, "requirement" | "choice" | "metrics">): ProfileDesign {
  return {
    shuntOhms: design.choice.shuntOhms,
    gain: design.choice.gain,
    supplyV: design.requirement.supply.voltage,
    fullScaleV: design.requirement.readout.fullScale,
    lsbA: design.metrics.lsbA,
    zeroLevelV: design.requirement.amplifier.reference?.voltage ?? 0,
  };
}
