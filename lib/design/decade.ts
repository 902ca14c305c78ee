// Decade scale factors (1 mV per mA, 1 mV per µA, …): the readouts a bench meter user can read
// without arithmetic. docs/model.md §3 asks the solver to offer them.
import type { SweepArrays } from "./sweep";
import { formatSI } from "./format";

const perUnit = ["A", "mA", "µA", "nA", "pA"];

/** "1 mV per mA" for 1 V/A; null unless the transimpedance is a power of ten (to 1e-9). */
export function decadeScaleLabel(transimpedanceVPerA: number): string | null {
  if (!(transimpedanceVPerA > 0)) return null;
  const k = Math.round(Math.log10(transimpedanceVPerA));
  if (Math.abs(transimpedanceVPerA / 10 ** k - 1) > 1e-9) return null;
  // 10^k V/A is 10^(k+3−3u) mV per (milli^u) A: pick u so that leaves 1, 10 or 100 mV.
  const u = Math.min(perUnit.length - 1, Math.max(0, Math.floor((k + 3) / 3)));
  const mv = Number((10 ** (k + 3 - 3 * u)).toPrecision(6));
  return `${String(mv)} mV per ${perUnit[u] ?? "A"}`;
}

/** Feasible pairs whose transimpedance is a power of ten: the best-scoring pair per decade. */
export function decadePairs(sw: SweepArrays, scores: Float64Array): number[] {
  const nG = sw.gains.length;
  const best = new Map<number, number>();
  for (let i = 0; i < sw.values.length; i++) {
    const R = sw.values[i] as number;
    for (let j = 0; j < nG; j++) {
      const p = i * nG + j;
      if (sw.mask[p] !== 0) continue;
      const rg = R * (sw.gains[j] as number);
      const k = Math.round(Math.log10(rg));
      if (Math.abs(rg / 10 ** k - 1) > 1e-9) continue;
      const prev = best.get(k);
      if (prev === undefined || (scores[p] as number) < (scores[prev] as number)) best.set(k, p);
    }
  }
  return [...best.entries()].sort((a, b) => a[0] - b[0]).map(([, p]) => p);
}

const currentUnits: { scale: number; name: string }[] = [
  { scale: 1, name: "A" },
  { scale: 1e-3, name: "mA" },
  { scale: 1e-6, name: "µA" },
  { scale: 1e-9, name: "nA" },
  { scale: 1e-12, name: "pA" },
];

/**
 * Any scale factor as "output per unit of current" (docs/model.md §3: decade factors such as
 * "1 mV per mA" are the easiest to read off a meter): the largest current unit for which the
 * output stays below 1 V. 2.5 V/A → "2.5 mV per mA".
 */
export function decadeScale(vPerA: number): string {
  if (!(vPerA > 0) || !Number.isFinite(vPerA)) return "—";
  const unit = currentUnits.find((u) => vPerA * u.scale < 1 * (1 - 1e-12)) ?? currentUnits[currentUnits.length - 1]!;
  return `${formatSI(vPerA * unit.scale, "V")} per ${unit.name}`;
}
