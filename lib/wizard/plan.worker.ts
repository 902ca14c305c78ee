// The plan editor's engine work off the main thread: each range's own sweep, the verdict on the
// adjusted plan and its curves. Only the latest request matters; the page drops stale replies.
import { planStretches } from "@/lib/design/plan-stretches";
import { rangeCandidates } from "@/lib/design/range-candidates";
import { planVerdict } from "./plan-verdict";
import type { PlanCheckReply, PlanCheckRequest } from "./plan-protocol";

// In this worker self is the worker's scope, whose postMessage(message) the DOM's window overload describes.
const post = (reply: PlanCheckReply) => self.postMessage(reply);

self.addEventListener("message", (event: MessageEvent<PlanCheckRequest>) => {
  const { id, requirement, plan } = event.data;
  try {
    const candidates = plan.ranges.map((_, k) => rangeCandidates(requirement, plan, k));
    post({
      id,
      ok: true,
      verdict: planVerdict(requirement, plan),
      candidates,
      curves: planStretches(requirement, plan),
    });
  } catch (e) {
    post({ id, ok: false, message: e instanceof Error ? e.message : String(e) });
  }
});
