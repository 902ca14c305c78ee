// Next gives each route its own copy of the modules it imports, so the engine warmed at start
// (lib/server-start.ts) is not the copy a route runs. Start-up asks each slow first-use route once
// (warmRoutes), which loads its module; the module then calls one of these, off any request, so
// its own copy of the engine has run (compiled, its unit tables built) before a person's first call.
import { parseRequirement, solve } from "@/lib/design";
import { fixtureView, loggerRequirement } from "@/lib/build-sheet/fixtures";
import { clipCurrent, decimateMinMax, judgeRecording } from "@/lib/profile";

/** Runs `work` once, soon and off the request that loaded the module; a failure is only logged. */
function soon(name: string, work: () => void) {
  if (process.env.NEXT_PHASE === "phase-production-build") return;
  setTimeout(() => {
    try {
      work();
    } catch (err) {
      console.warn(`[start] ${name} not warmed: ${(err as Error).message}`);
    }
  }, 0).unref();
}

/** One sweep of the demo logger's requirement, as POST /api/solve runs it. */
export const warmSolver = () =>
  soon("solver", () => {
    const parsed = parseRequirement(loggerRequirement);
    if (parsed.ok) solve(parsed.requirement);
  });

/** A profile judged and decimated as a chart request does, on a made-up 100,000-sample recording. */
export const warmProfileChart = () =>
  soon("profile chart", () => {
    const design = fixtureView(loggerRequirement);
    const n = 100_000;
    const times = new Float64Array(n);
    const currents = new Float64Array(n);
    for (let k = 0; k < n; k++) {
      times[k] = k * 1e-3;
      currents[k] = 0.05 + 0.04 * Math.sin(k / 50);
    }
    const judged = judgeRecording(design, times, currents);
    if (judged.kind === "pair")
      decimateMinMax(times, currents, { width: 800, clipA: clipCurrent(judged.design), lsbA: judged.design.lsbA });
  });
