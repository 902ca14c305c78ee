// A library part as the requirement's amplifier, shunt or readout group, for the wizard's steps.
import type { RequirementInput } from "@/lib/design";
import type { AdcValues, AmplifierValues, MeterValues, ShuntValues } from "./schema";

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

type ReadoutGroup = NonNullable<RequirementInput["readout"]>;

/**
 * The requirement's `readout` for a library ADC: every figure under the same name (API.md v2), so
 * its own error counts in the budget. The part's highest sample rate is the design's rate until
 * the designer lowers it.
 */
export function adcRequirement(adc: AdcValues): ReadoutGroup {
  return {
    kind: "adc",
    bits: adc.bits,
    fullScale: adc.fullScale,
    sampleRateHz: adc.sampleRateHz,
    reference: { tolerance: adc.reference.tolerance, tempco: adc.reference.tempco },
    offsetLsb: adc.offsetLsb,
    gainError: adc.gainError,
    inlLsb: adc.inlLsb,
  };
}

/** The requirement's `readout` for a library meter range, its accuracy as ±(% of reading + digits). */
export function meterRequirement(meter: MeterValues): ReadoutGroup {
  return {
    kind: "meter",
    fullScale: meter.fullScale,
    counts: meter.counts,
    accuracy: { percentOfReading: meter.accuracy.percentOfReading, digits: meter.accuracy.digits },
  };
}
