// Min/max decimation per pixel: a million samples become two points per pixel column, keeping
// every peak and every dip, so the drawn line looks exactly like the full recording would.
import type { Amps, Seconds } from "@/lib/design";

export type Stretch = [fromS: Seconds, toS: Seconds];

export type DecimatedSeries = {
  fromS: Seconds;
  toS: Seconds;
  width: number;
  /** Samples in the window before decimation. */
  windowSamples: number;
  /** Points to draw, in time order (a bucket's min and max, each at its own time). */
  tS: number[];
  currentA: number[];
  /** Stretches (to a pixel's precision) where samples clip or read below one step. */
  clipped: Stretch[];
  belowStep: Stretch[];
};

/** First index with times[k] >= t. */
export function lowerBound(times: Float64Array, t: number): number {
  let lo = 0;
  let hi = times.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (times[mid]! < t) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Last index with times[k] <= t. */
function upperIndex(times: Float64Array, t: number): number {
  let lo = 0;
  let hi = times.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (times[mid]! <= t) lo = mid + 1;
    else hi = mid;
  }
  return lo - 1;
}

function pushStretch(list: Stretch[], a: number, b: number) {
  const last = list[list.length - 1];
  if (last && a <= last[1]) last[1] = Math.max(last[1], b);
  else list.push([a, b]);
}

/**
 * Decimates the window [fromS, toS] into `width` buckets of equal time. Each bucket contributes its
 * minimum and its maximum sample (in the order they occur); windows with few samples come back whole.
 * A sample above `clipA` or below `lsbA` marks its bucket's time span as clipped or below one step.
 */
export function decimateMinMax(
  times: Float64Array,
  currents: Float64Array,
  opts: { fromS?: number; toS?: number; width: number; clipA: Amps; lsbA: Amps },
): DecimatedSeries {
  const n = times.length;
  const width = Math.max(1, Math.min(10_000, Math.floor(opts.width)));
  const first = times[0] ?? 0;
  const last = times[n - 1] ?? 0;
  let fromS = opts.fromS !== undefined && Number.isFinite(opts.fromS) ? Math.max(first, opts.fromS) : first;
  let toS = opts.toS !== undefined && Number.isFinite(opts.toS) ? Math.min(last, opts.toS) : last;
  if (!(toS > fromS)) {
    fromS = first;
    toS = last;
  }
  // One sample either side of the window so the line runs to the edges.
  const start = Math.max(0, lowerBound(times, fromS) - 1);
  const end = Math.min(n - 1, upperIndex(times, toS) + 1);
  const out: DecimatedSeries = {
    fromS,
    toS,
    width,
    windowSamples: 0,
    tS: [],
    currentA: [],
    clipped: [],
    belowStep: [],
  };
  if (n === 0 || end < start) return out;
  out.windowSamples = end - start + 1;

  const mark = (k: number, a: number, b: number) => {
    const i = currents[k]!;
    if (i > opts.clipA) pushStretch(out.clipped, a, b);
    if (i < opts.lsbA) pushStretch(out.belowStep, a, b);
  };

  if (out.windowSamples <= 2 * width) {
    for (let k = start; k <= end; k++) {
      out.tS.push(times[k]!);
      out.currentA.push(currents[k]!);
      // A sample's stretch runs halfway to its neighbours.
      const a = k > start ? (times[k - 1]! + times[k]!) / 2 : times[k]!;
      const b = k < end ? (times[k]! + times[k + 1]!) / 2 : times[k]!;
      mark(k, a, b);
    }
    return out;
  }

  const span = toS - fromS;
  const bucketOf = (t: number) => Math.min(width - 1, Math.max(0, Math.floor(((t - fromS) / span) * width)));
  let k = start;
  while (k <= end) {
    const b = bucketOf(times[k]!);
    let kMin = k;
    let kMax = k;
    let clipped = false;
    let below = false;
    for (; k <= end && bucketOf(times[k]!) === b; k++) {
      const i = currents[k]!;
      if (i < currents[kMin]!) kMin = k;
      if (i > currents[kMax]!) kMax = k;
      if (i > opts.clipA) clipped = true;
      if (i < opts.lsbA) below = true;
    }
    const [k1, k2] = kMin <= kMax ? [kMin, kMax] : [kMax, kMin];
    out.tS.push(times[k1]!);
    out.currentA.push(currents[k1]!);
    if (k2 !== k1) {
      out.tS.push(times[k2]!);
      out.currentA.push(currents[k2]!);
    }
    const a = fromS + (b / width) * span;
    const z = fromS + ((b + 1) / width) * span;
    if (clipped) pushStretch(out.clipped, a, z);
    if (below) pushStretch(out.belowStep, a, z);
  }
  return out;
}
