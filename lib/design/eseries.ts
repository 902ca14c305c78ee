// IEC 60063 preferred numbers. The tables are typed out, not computed: E24 and below
// depart from the rounded geometric formula (2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2) and
// E192 has 9.20 where the formula gives 9.19.

export type SeriesName = "E6" | "E12" | "E24" | "E48" | "E96" | "E192";
export const seriesNames: readonly SeriesName[] = ["E6", "E12", "E24", "E48", "E96", "E192"];

const E24 = [
  1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2,
  9.1,
];
const E12 = E24.filter((_, i) => i % 2 === 0);
const E6 = E12.filter((_, i) => i % 2 === 0);

const E192 = [
  1.0, 1.01, 1.02, 1.04, 1.05, 1.06, 1.07, 1.09, 1.1, 1.11, 1.13, 1.14, 1.15, 1.17, 1.18, 1.2, 1.21, 1.23, 1.24, 1.26,
  1.27, 1.29, 1.3, 1.32, 1.33, 1.35, 1.37, 1.38, 1.4, 1.42, 1.43, 1.45, 1.47, 1.49, 1.5, 1.52, 1.54, 1.56, 1.58, 1.6,
  1.62, 1.64, 1.65, 1.67, 1.69, 1.72, 1.74, 1.76, 1.78, 1.8, 1.82, 1.84, 1.87, 1.89, 1.91, 1.93, 1.96, 1.98, 2.0, 2.03,
  2.05, 2.08, 2.1, 2.13, 2.15, 2.18, 2.21, 2.23, 2.26, 2.29, 2.32, 2.34, 2.37, 2.4, 2.43, 2.46, 2.49, 2.52, 2.55, 2.58,
  2.61, 2.64, 2.67, 2.71, 2.74, 2.77, 2.8, 2.84, 2.87, 2.91, 2.94, 2.98, 3.01, 3.05, 3.09, 3.12, 3.16, 3.2, 3.24, 3.28,
  3.32, 3.36, 3.4, 3.44, 3.48, 3.52, 3.57, 3.61, 3.65, 3.7, 3.74, 3.79, 3.83, 3.88, 3.92, 3.97, 4.02, 4.07, 4.12, 4.17,
  4.22, 4.27, 4.32, 4.37, 4.42, 4.48, 4.53, 4.59, 4.64, 4.7, 4.75, 4.81, 4.87, 4.93, 4.99, 5.05, 5.11, 5.17, 5.23, 5.3,
  5.36, 5.42, 5.49, 5.56, 5.62, 5.69, 5.76, 5.83, 5.9, 5.97, 6.04, 6.12, 6.19, 6.26, 6.34, 6.42, 6.49, 6.57, 6.65, 6.73,
  6.81, 6.9, 6.98, 7.06, 7.15, 7.23, 7.32, 7.41, 7.5, 7.59, 7.68, 7.77, 7.87, 7.96, 8.06, 8.16, 8.25, 8.35, 8.45, 8.56,
  8.66, 8.76, 8.87, 8.98, 9.09, 9.2, 9.31, 9.42, 9.53, 9.65, 9.76, 9.88,
];
// E96 is every second E192 value and E48 every second E96 value (IEC 60063 builds them so).
const E96 = E192.filter((_, i) => i % 2 === 0);
const E48 = E96.filter((_, i) => i % 2 === 0);

/** One decade of each series, 1 ≤ v < 10. */
export const seriesTables: Readonly<Record<SeriesName, readonly number[]>> = { E6, E12, E24, E48, E96, E192 };

export function isSeriesName(name: string): name is SeriesName {
  return (seriesNames as readonly string[]).includes(name);
}

/** Decade multiples lose exactness in binary; keep values to 12 significant digits. */
function scaled(mantissa: number, exponent: number): number {
  return Number((mantissa * 10 ** exponent).toPrecision(12));
}

const relativeSlack = 1e-9;

/** Every value of the series in [min, max], ascending. */
export function seriesValues(series: SeriesName, min: number, max: number): number[] {
  const out: number[] = [];
  if (!(min > 0) || !(max >= min) || !Number.isFinite(max)) return out;
  const table = seriesTables[series];
  const lo = min * (1 - relativeSlack);
  const hi = max * (1 + relativeSlack);
  for (let e = Math.floor(Math.log10(min)) - 1; e <= Math.ceil(Math.log10(max)); e++) {
    for (const m of table) {
      const v = scaled(m, e);
      if (v >= lo && v <= hi) out.push(v);
    }
  }
  return out;
}

/** The series value nearest to `value` on a logarithmic scale (what a tolerance band sees). */
export function nearestInSeries(series: SeriesName, value: number): number {
  if (!(value > 0) || !Number.isFinite(value)) throw new RangeError("nearestInSeries needs a positive finite value");
  const e = Math.floor(Math.log10(value));
  const table = seriesTables[series];
  let best = scaled(table[0] ?? 1, e);
  let bestDist = Infinity;
  for (const exp of [e - 1, e, e + 1]) {
    for (const m of table) {
      const v = scaled(m, exp);
      const d = Math.abs(Math.log(v / value));
      if (d < bestDist) {
        bestDist = d;
        best = v;
      }
    }
  }
  return best;
}

/** Whether `value` is a member of the series (any decade), to 1 part in 10⁹. */
export function isInSeries(series: SeriesName, value: number): boolean {
  if (!(value > 0) || !Number.isFinite(value)) return false;
  const n = nearestInSeries(series, value);
  return Math.abs(n - value) <= relativeSlack * value;
}
