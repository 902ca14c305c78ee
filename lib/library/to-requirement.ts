// A library part as the requirement's amplifier or shunt group, for the wizard's parts step.
import type { RequirementInput } from "@/lib/design";
import type { AmplifierValues, ShuntValues } from "./schema";

type AmplifierGroup = NonNullable<RequirementInput["amplifier"]>;
type ShuntGroup = NonNullable<RequirementInput["shunt"]>;

/** The gains a resistor-set part sweeps: 1 + Rf/Rg from E12 pairs between its lowest and highest gain. */
export function resistorSetGains(gains: readonly number[]) {
  const sorted = [...gains].sort((x, y) => x - y);
  return { series: "E12", min: Math.max(1, sorted[0] ?? 1), max: sorted.at(-1) ?? 1 };
}

/**
 * The requirement's `amplifier` group for a library amplifier. `supplyV` is the amplifier's own
 * supply in the design (clamped into the part's supply range; its highest by default).
 * A resistor-set part sweeps G = 1 + Rf/Rg from E12 pairs (E24 pairs make too many gains for a wide shunt range) between its lowest and highest gain.
 */
export function amplifierRequirement(amp: AmplifierValues, supplyV?: number): AmplifierGroup {
  const supply = Math.min(amp.supplyMaxV, Math.max(amp.supplyMinV, supplyV ?? amp.supplyMaxV));
  const gains = amp.gainMode === "fixed" ? [...amp.gains] : resistorSetGains(amp.gains);
  return {
    gains,
    offset: amp.offsetV,
    offsetDrift: amp.offsetDriftVPerK,
    gainError: amp.gainErrorFraction,
    gainDrift: amp.gainDriftPerK,
    biasCurrent: amp.biasCurrentA,
    noiseDensity: amp.noiseDensityVPerRtHz,
    gbw: amp.gbwHz,
    supply,
    swingLow: amp.swingLowV,
    swingHigh: amp.swingHighV,
    cmrrDb: amp.cmrrDb,
    topology: amp.topology,
    ...(amp.commonModeMinV !== null && amp.commonModeMaxV !== null
      ? { commonMode: { min: amp.commonModeMinV, max: amp.commonModeMaxV } }
      : {}),
  };
}

/** The requirement's `shunt` group for a library shunt family (its series, value range and ratings). */
export function shuntRequirement(shunt: ShuntValues): ShuntGroup {
  return {
    series: shunt.series,
    min: shunt.minOhms,
    max: shunt.maxOhms,
    tolerance: shunt.toleranceFraction,
    tempco: shunt.tempcoPerK,
    ratings: [...shunt.ratingsW],
  };
}
