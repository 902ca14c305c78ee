// GET /api/designs/[id]/profiles/[profileId]'s own chart code (lib/profile/chart.ts: judge the
// recording, decimate it, the plan's overlay), warmed as its module loads (lib/warm-up/run.ts), on
// the demo logger as one pair and as a range plan, against a made-up recording.
import { evaluatePlan, designKindOf } from "@/lib/design";
import type { DesignView } from "@/lib/design-view";
import {
  fixtureView,
  loggerPlanRequirement,
  loggerRequirement,
  parsed,
  proposedPlan,
} from "@/lib/build-sheet/fixtures";
import { judgeRecording, profileChart } from "@/lib/profile";
import { warmOnLoad } from "./run";

/** Samples in the made-up recording: enough for the loops to run hot (a stored one has up to 1,000,000). */
const SAMPLES = 50_000;

/** A logger's day in miniature: asleep at a few µA, a radio burst near 180 mA every 500 samples. */
function recording() {
  const timesS = new Float64Array(SAMPLES);
  const currentsA = new Float64Array(SAMPLES);
  for (let k = 0; k < SAMPLES; k++) {
    timesS[k] = k * 1e-3;
    currentsA[k] = k % 500 < 20 ? 0.17 + 0.01 * Math.sin(k) : 4e-6 + 1e-6 * Math.sin(k / 7);
  }
  return { timesS, currentsA };
}

function designs(): DesignView[] {
  const pair = fixtureView(loggerRequirement);
  const requirement = parsed(loggerPlanRequirement);
  const plan = proposedPlan(requirement);
  const e = evaluatePlan(requirement, plan);
  if (!e.ok) throw new Error(`the demo logger's plan is not sound: ${e.message}`);
  const metrics = { ranges: e.ranges, switchRule: e.switchRule, protection: e.protection };
  return [pair, { ...pair, requirement, ...designKindOf({ choice: null, plan, metrics }) }];
}

export const warmProfileChartRoute = () =>
  warmOnLoad("profile chart route", () => {
    const { timesS, currentsA } = recording();
    return designs().flatMap((design) => {
      // Stored at an older revision, so the chart judges it again against the current one.
      const { summary } = judgeRecording(design, timesS, currentsA);
      const stored = { revision: design.revision - 1, summary, timesS, currentsA };
      // The whole recording, and a zoomed window, as the chart asks for them.
      return [
        () => JSON.stringify(profileChart(design, stored, { width: 800 })),
        () => JSON.stringify(profileChart(design, stored, { fromS: 10, toS: 12.5, width: 800 })),
      ];
    });
  });
