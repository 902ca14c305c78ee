// What a recorded current profile says about a design: charge, average and peak current, the
// burden and the load voltage it leaves, clipping and sub-step samples. The definitions are fixed
// (docs/model.md, "Current profiles") so scripts reading the summary can rely on them.
import type { Amps, Ohms, Seconds, Volts } from "./units";

/** The few figures of a design a profile is judged against. */
export type ProfileDesign = {
  shuntOhms: Ohms;
  gain: number;
  supplyV: Volts;
  /** The readout's full scale (ADC or meter range). */
  fullScaleV: Volts;
  /** One readout step referred to current (the engine's lsbA). */
  lsbA: Amps;
};

export type ProfileSummary = {
  samples: number;
  durationS: Seconds;
  chargeC: number;
  averageCurrentA: Amps;
  peakCurrentA: Amps;
  maxBurdenV: Volts;
  minLoadVoltageV: Volts;
  clippedPercent: number;
  belowResolutionPercent: number;
  /** The current above which the ideal output passes full scale: fullScaleV / (shunt × gain). */
  clipCurrentA: Amps;
  /** The current below which a sample reads under one step (= lsbA). */
  lsbA: Amps;
};

/** The voltage a current drops across the shunt (Ohm's law). */
export function burdenV(currentA: Amps, shuntOhms: Ohms): Volts {
  return currentA * shuntOhms;
}

/** What the load is left with at that current: the supply less the burden. */
export function loadVoltageV(currentA: Amps, d: Pick<ProfileDesign, "shuntOhms" | "supplyV">): Volts {
  return d.supplyV - burdenV(currentA, d.shuntOhms);
}

/** The current at which the ideal output I·R·G reaches the readout's full scale. */
export function clipCurrent(d: ProfileDesign): Amps {
  return d.fullScaleV / (d.shuntOhms * d.gain);
}

/** Whether a sample's ideal output I·R·G exceeds the readout's full scale. */
export function isClipped(currentA: Amps, d: ProfileDesign): boolean {
  return currentA * d.shuntOhms * d.gain > d.fullScaleV;
}

/** Whether a sample's current is below one readout step. */
export function isBelowStep(currentA: Amps, d: ProfileDesign): boolean {
  return currentA < d.lsbA;
}

export function summarizeProfile(timesS: Float64Array, currentsA: Float64Array, d: ProfileDesign): ProfileSummary {
  const n = timesS.length;
  if (n < 2 || currentsA.length !== n) throw new Error("a profile needs at least two samples of time and current");
  let charge = 0;
  let peak = -Infinity;
  let clipped = 0;
  let below = 0;
  for (let k = 0; k < n; k++) {
    const i = currentsA[k]!;
    if (i > peak) peak = i;
    if (isClipped(i, d)) clipped++;
    if (isBelowStep(i, d)) below++;
    if (k > 0) charge += ((currentsA[k - 1]! + i) / 2) * (timesS[k]! - timesS[k - 1]!);
  }
  const durationS = timesS[n - 1]! - timesS[0]!;
  const maxBurdenV = burdenV(peak, d.shuntOhms);
  return {
    samples: n,
    durationS,
    chargeC: charge,
    averageCurrentA: charge / durationS,
    peakCurrentA: peak,
    maxBurdenV,
    minLoadVoltageV: loadVoltageV(peak, d),
    clippedPercent: (100 * clipped) / n,
    belowResolutionPercent: (100 * below) / n,
    clipCurrentA: clipCurrent(d),
    lsbA: d.lsbA,
  };
}

/** Battery life at the profile's average current: capacity in coulombs (1 mAh = 3.6 C). */
export function batteryLifeS(capacityC: number, averageCurrentA: Amps): Seconds | null {
  if (!(capacityC > 0) || !(averageCurrentA > 0)) return null;
  return capacityC / averageCurrentA;
}

/** 1 mAh is 3.6 C (1e-3 A × 3600 s). */
export const COULOMBS_PER_MAH = 3.6;
