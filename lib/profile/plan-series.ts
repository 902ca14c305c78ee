// What the profile chart draws over a range plan's recording: the stretches read on each range,
// the stretches clipped or below one step on the range they were read on, and the load voltage at
// each drawn point through the path in use (the engine's pathOhms). Pixel-sized buckets, as the
// decimation uses, so a million samples give at most one stretch per pixel column.
import { pathOhms, type PlanProfileDesign, type RangeTrace } from "@/lib/design/plan-switching";
import { loadVoltageV } from "@/lib/design/profile";
import { lowerBound, type DecimatedSeries, type Stretch } from "./decimate";

export type RangeStretch = { range: number; fromS: number; toS: number };

export type PlanSeriesOverlay = {
  /** Stretches in time order, each read on one range (0-based; the chart labels them from 1). */
  ranges: RangeStretch[];
  /** The range each drawn point was read on, and the load voltage it left. */
  rangeAt: number[];
  loadV: number[];
  clipped: Stretch[];
  belowStep: Stretch[];
};

function push(list: Stretch[], a: number, b: number) {
  const last = list[list.length - 1];
  if (last && a <= last[1]) last[1] = Math.max(last[1], b);
  else list.push([a, b]);
}

export function planSeriesOverlay(
  times: Float64Array,
  currents: Float64Array,
  trace: RangeTrace,
  d: PlanProfileDesign,
  series: DecimatedSeries,
): PlanSeriesOverlay {
  const { fromS, toS, width } = series;
  const span = toS - fromS || 1;
  const out: PlanSeriesOverlay = { ranges: [], rangeAt: [], loadV: [], clipped: [], belowStep: [] };
  const start = Math.max(0, lowerBound(times, fromS) - 1);
  const end = Math.min(times.length - 1, lowerBound(times, toS));
  const bucketOf = (t: number) => Math.min(width - 1, Math.max(0, Math.floor(((t - fromS) / span) * width)));
  let k = start;
  while (k <= end) {
    const b = bucketOf(times[k]!);
    // A bucket shows the highest range read in it: a switch up is what a reader looks for.
    let range = -1;
    let clipped = false;
    let below = false;
    for (; k <= end && bucketOf(times[k]!) === b; k++) {
      const r = trace.rangeOf[k]!;
      const I = currents[k]!;
      if (r > range) range = r;
      if (I > d.ranges[r]!.clipCurrentA) clipped = true;
      if (I < d.ranges[r]!.resolvableStepA) below = true;
    }
    const a = Math.max(fromS, fromS + (b / width) * span);
    const z = Math.min(toS, fromS + ((b + 1) / width) * span);
    const last = out.ranges[out.ranges.length - 1];
    if (last && last.range === range) last.toS = z;
    else out.ranges.push({ range, fromS: a, toS: z });
    if (clipped) push(out.clipped, a, z);
    if (below) push(out.belowStep, a, z);
  }
  series.tS.forEach((t, i) => {
    const idx = Math.min(times.length - 1, lowerBound(times, t));
    const r = trace.rangeOf[idx]!;
    const I = series.currentA[i]!;
    out.rangeAt.push(r);
    out.loadV.push(loadVoltageV(I, { shuntOhms: pathOhms(d, r, I), supplyV: d.supplyV }));
  });
  return out;
}
