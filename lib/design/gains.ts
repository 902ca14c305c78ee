// Amplifier gains: a fixed list, or every G = 1 + Rf/Rg a pair of standard resistors can give.
import { seriesTables, type SeriesName } from "./eseries";

/** Gains current-sense amplifiers commonly come in (common practice, no source). */
export const commonFixedGains: readonly number[] = [10, 20, 25, 50, 60, 100, 200, 500];

/** Gains from standard resistor pairs; `tolerance` is each gain-setting resistor's. */
export type GainSet = { series: SeriesName; min: number; max: number; tolerance: number };

const key = (g: number) => Number(g.toPrecision(12));

/**
 * Distinct non-inverting gains 1 + Rf/Rg (base 1) or difference-stage gains Rf/Rg (base 0) with
 * Rf and Rg both from `series` (any decades), within [min, max], ascending. Ratios that coincide
 * to 12 digits count once.
 */
export function resistorPairGains(set: Omit<GainSet, "tolerance">, base: 0 | 1 = 1): number[] {
  const table = seriesTables[set.series];
  const seen = new Set<number>();
  const rMin = set.min - base;
  const rMax = set.max - base;
  if (!(rMax > 0)) return [];
  const eLo = Math.floor(Math.log10(Math.max(rMin, 1e-12))) - 1;
  const eHi = Math.ceil(Math.log10(rMax)) + 1;
  for (const f of table) {
    for (const g of table) {
      for (let e = eLo; e <= eHi; e++) {
        const ratio = (f / g) * 10 ** e;
        const gain = key(base + ratio);
        if (gain >= set.min * (1 - 1e-12) && gain <= set.max * (1 + 1e-12)) seen.add(gain);
      }
    }
  }
  return [...seen].sort((a, b) => a - b);
}

/**
 * A resistor pair giving `gain` (Rg in the 1 kΩ decade, Rf from the series), or null when
 * the series has no pair for it. For the parts list.
 */
export function resistorPairFor(
  gain: number,
  series: SeriesName,
  base: 0 | 1 = 1,
): { rfOhms: number; rgOhms: number } | null {
  const ratio = gain - base;
  if (!(ratio > 0)) return null;
  const table = seriesTables[series];
  for (const g of table) {
    const rg = key(g * 1000);
    const rfWanted = ratio * rg;
    const e0 = Math.floor(Math.log10(rfWanted));
    for (const e of [e0, e0 + 1]) {
      for (const f of table) {
        const rf = key(f * 10 ** e);
        if (Math.abs(key(base + rf / rg) - key(gain)) <= 1e-9 * gain) return { rfOhms: rf, rgOhms: rg };
      }
    }
  }
  return null;
}
