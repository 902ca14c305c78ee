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
  /** A bidirectional design's zero-current output level (left out: 0 V). */
  zeroLevelV?: Volts;
};

export type ProfileSummary = {
  samples: number;
  durationS: Seconds;
  /** Net charge: the trapezoid integral of the signed current, C. */
  chargeC: number;
  /** Charge carried by the positive samples alone, and by the negative ones (as a positive number), C. */
  chargeInC: number;
  chargeOutC: number;
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

/**
 * Whether a sample's ideal output leaves the readout's window: above full scale, or (a negative
 * current on a design with a zero-current level) below zero volts.
 */
export function isClipped(currentA: Amps, d: ProfileDesign): boolean {
  const v = (d.zeroLevelV ?? 0) + currentA * d.shuntOhms * d.gain;
  return v > d.fullScaleV || (currentA < 0 && v < 0);
}

/** Whether a sample's current magnitude is below one readout step. */
export function isBelowStep(currentA: Amps, d: ProfileDesign): boolean {
  return Math.abs(currentA) < d.lsbA;
}

/**
 * The trapezoid between two samples split into its positive and negative areas: a segment that
 * crosses zero crosses it where the straight line between the samples does.
 */
export function segmentCharge(i0: Amps, i1: Amps, dt: Seconds): { inC: number; outC: number } {
  if (i0 >= 0 && i1 >= 0) return { inC: ((i0 + i1) / 2) * dt, outC: 0 };
  if (i0 <= 0 && i1 <= 0) return { inC: 0, outC: (-(i0 + i1) / 2) * dt };
  const tz = (dt * i0) / (i0 - i1); // time to the crossing
  const first = (i0 / 2) * tz;
  const second = (i1 / 2) * (dt - tz);
  return first > 0 ? { inC: first, outC: -second } : { inC: second, outC: -first };
}

export function summarizeProfile(timesS: Float64Array, currentsA: Float64Array, d: ProfileDesign): ProfileSummary {
  const n = timesS.length;
  if (n < 2 || currentsA.length !== n) throw new Error("a profile needs at least two samples of time and current");
  let charge = 0;
  let chargeIn = 0;
  let chargeOut = 0;
  let peak = -Infinity;
  let largest = 0;
  let clipped = 0;
  let below = 0;
  for (let k = 0; k < n; k++) {
    const i = currentsA[k]!;
    if (i > peak) peak = i;
    if (Math.abs(i) > largest) largest = Math.abs(i);
    if (isClipped(i, d)) clipped++;
    if (isBelowStep(i, d)) below++;
    if (k > 0) {
      const dt = timesS[k]! - timesS[k - 1]!;
      charge += ((currentsA[k - 1]! + i) / 2) * dt;
      const seg = segmentCharge(currentsA[k - 1]!, i, dt);
      chargeIn += seg.inC;
      chargeOut += seg.outC;
    }
  }
  const durationS = timesS[n - 1]! - timesS[0]!;
  // The drop is |I|·R either way; the load is left least at the largest magnitude.
  const maxBurdenV = burdenV(largest, d.shuntOhms);
  return {
    samples: n,
    durationS,
    chargeC: charge,
    chargeInC: chargeIn,
    chargeOutC: chargeOut,
    averageCurrentA: charge / durationS,
    peakCurrentA: peak,
    maxBurdenV,
    minLoadVoltageV: loadVoltageV(largest, d),
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
