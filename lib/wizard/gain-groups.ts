// Grouping candidates by gain for the charts: one group per gain when there are few,
// otherwise one per decade of gain.
export type GainGroup = { key: string; label: string; test: (gain: number) => boolean; t: number };

export function gainGroups(gains: number[], maxGroups = 8): GainGroup[] {
  const distinct = [...new Set(gains)].sort((a, b) => a - b);
  if (distinct.length === 0) return [];
  if (distinct.length <= maxGroups) {
    return distinct.map((g, i) => ({
      key: `g${g}`,
      label: `G = ${Number(g.toPrecision(4))}`,
      test: (x: number) => x === g,
      t: distinct.length === 1 ? 1 : i / (distinct.length - 1),
    }));
  }
  const lo = Math.floor(Math.log10(distinct[0]!));
  const hi = Math.floor(Math.log10(distinct.at(-1)!));
  const out: GainGroup[] = [];
  for (let e = lo; e <= hi; e++) {
    const a = 10 ** e;
    const b = 10 ** (e + 1);
    out.push({
      key: `d${e}`,
      label: `G ${Number(a.toPrecision(3))} to ${Number(b.toPrecision(3))}`,
      test: (x: number) => x >= a && x < b,
      t: hi === lo ? 1 : (e - lo) / (hi - lo),
    });
  }
  return out;
}
