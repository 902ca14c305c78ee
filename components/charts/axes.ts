// Tick values and labels for log axes: decades (and 2, 5 within them when the span is short).
import { formatPercent, formatSI } from "@/lib/design/format";

export function logTicks(lo: number, hi: number, max = 7): number[] {
  if (!(lo > 0 && hi > lo)) return [lo];
  const a = Math.floor(Math.log10(lo));
  const b = Math.ceil(Math.log10(hi));
  const decades = b - a;
  const span = Math.log10(hi / lo);
  const mults =
    span <= 0.8 ? [1, 1.5, 2, 3, 4, 5, 6, 7, 8] : span <= 1.6 ? [1, 2, 3, 5] : decades <= 2 ? [1, 2, 5] : [1];
  const step = Math.max(1, Math.ceil(decades / max));
  const out: number[] = [];
  for (let e = a; e <= b; e += step)
    for (const m of mults) {
      const v = m * 10 ** e;
      if (v >= lo * (1 - 1e-9) && v <= hi * (1 + 1e-9)) out.push(v);
    }
  return out.length >= 2 ? out : [lo, hi];
}

/**
 * At most `max` of a log axis's ticks, so labels never run into each other on a narrow chart:
 * decades first (mantissa 1), then every n-th of what remains.
 */
export function thinTicks(values: number[], max: number): number[] {
  if (values.length <= max) return values;
  const decades = values.filter((v) => Math.abs(Math.log10(v) - Math.round(Math.log10(v))) < 1e-9);
  const pool = decades.length >= 2 ? decades : values;
  if (pool.length <= max) return pool;
  const step = Math.ceil(pool.length / Math.max(max, 2));
  return pool.filter((_, i) => i % step === 0);
}

/** A log domain at least `minRatio` wide, padded by a fraction of a decade on each side. */
export function logDomain(values: number[], pad = 0.08, minRatio = 3): [number, number] {
  const pos = values.filter((v) => v > 0 && Number.isFinite(v));
  if (pos.length === 0) return [1e-3, 1];
  let lo = Math.min(...pos);
  let hi = Math.max(...pos);
  if (hi / lo < minRatio) {
    const mid = Math.sqrt(lo * hi);
    lo = mid / Math.sqrt(minRatio);
    hi = mid * Math.sqrt(minRatio);
  }
  return [lo / 10 ** pad, hi * 10 ** pad];
}

export const siTick =
  (unit: string, sig = 2) =>
  (v: number) =>
    formatSI(v, unit, sig);
export const percentTick = (v: number) => formatPercent(v / 100, 2);

/** Room for SI tick labels ("500 µV", "5000 %") and the axis title beside them. */
export const chartMargin = { top: 10, right: 14, bottom: 40, left: 76 };
export const leftLabelOffset = 44;
export const bottomLabelOffset = 14;
