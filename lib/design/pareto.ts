// The exact Pareto front over (burdenV, lsbA, errorAtMinPercent), all minimised.

/**
 * Indices of the undominated points. Points must come in lexicographic order of
 * (a, b, c) ascending and no two may be equal in all three; then a point is dominated
 * exactly when an earlier point is no worse in b and c, which a 2-D staircase answers.
 */
export function paretoFrontSorted(order: ArrayLike<number>, b: ArrayLike<number>, c: ArrayLike<number>): Uint8Array {
  const n = b.length;
  const onFront = new Uint8Array(n);
  const stB: number[] = []; // b ascending
  const stC: number[] = []; // c strictly descending
  for (let k = 0; k < order.length; k++) {
    const p = order[k] as number;
    const pb = b[p] as number;
    const pc = c[p] as number;
    // last staircase entry with b ≤ pb
    let lo = 0;
    let hi = stB.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if ((stB[mid] as number) <= pb) lo = mid + 1;
      else hi = mid;
    }
    const j = lo - 1;
    if (j >= 0 && (stC[j] as number) <= pc) continue;
    onFront[p] = 1;
    let end = lo;
    while (end < stB.length && (stC[end] as number) >= pc) end++;
    stB.splice(lo, end - lo, pb);
    stC.splice(lo, end - lo, pc);
  }
  return onFront;
}

/** Brute-force dominance, for tests and small sets: does x dominate y (all ≤, one <)? */
export function dominates(x: readonly number[], y: readonly number[]): boolean {
  let strictly = false;
  for (let i = 0; i < x.length; i++) {
    const xi = x[i] as number;
    const yi = y[i] as number;
    if (xi > yi) return false;
    if (xi < yi) strictly = true;
  }
  return strictly;
}
