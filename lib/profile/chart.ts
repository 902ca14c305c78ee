// One profile as its chart asks for it (GET /api/designs/[id]/profiles/[profileId]): the stored
// summary, the summary against the design's current revision, and the series decimated to the
// chart's width. Its own module so the route and the route's start-up warm-up run the same code.
import type { DesignView } from "@/lib/design-view";
import { clipCurrent, type ProfileSummary } from "@/lib/design/profile";
import { decimateMinMax } from "./decimate";
import { judgeRecording } from "./design";
import { planSeriesOverlay } from "./plan-series";

/** A stored recording: its samples and the revision and summary it was judged at on upload. */
type Recording = { revision: number; summary: ProfileSummary; timesS: Float64Array; currentsA: Float64Array };

/** The window to draw: `fromS`..`toS` seconds (the whole recording when left out) in `width` pixel columns. */
export type ChartWindow = { fromS?: number; toS?: number; width: number };

/**
 * On a range plan the series also says which range each stretch was read on and the load voltage
 * through the path in use.
 */
export function profileChart<P extends Recording>(design: DesignView, profile: P, span: ChartWindow) {
  const { timesS, currentsA, ...item } = profile;
  const judged = judgeRecording(design, timesS, currentsA);
  const head = {
    ...item,
    startS: timesS[0],
    endS: timesS[timesS.length - 1],
    current: {
      revision: design.revision,
      summary: item.revision === design.revision ? item.summary : judged.summary,
    },
  };
  if (judged.kind === "pair") {
    const series = decimateMinMax(timesS, currentsA, {
      ...span,
      clipA: clipCurrent(judged.design),
      lsbA: judged.design.lsbA,
    });
    return { ...head, design: { kind: "pair" as const, ...judged.design }, series };
  }
  // A plan: clipping and steps are judged on the range each sample was read on (the overlay).
  const bare = decimateMinMax(timesS, currentsA, { ...span, clipA: Infinity, lsbA: -Infinity });
  const { clipped, belowStep, ...plan } = planSeriesOverlay(timesS, currentsA, judged.trace, judged.design, bare);
  const lowest = judged.design.ranges[0]!;
  return {
    ...head,
    design: {
      kind: "plan" as const,
      supplyV: judged.design.supplyV,
      fullScaleV: judged.design.fullScaleV,
      switchDelayS: judged.design.switchDelayS,
      lsbA: lowest.resolvableStepA,
      ranges: judged.design.ranges,
      switchPoints: judged.design.switchPoints,
    },
    series: { ...bare, clipped, belowStep, plan },
  };
}
