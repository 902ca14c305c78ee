// The solver off the main thread: parse the raw form values with the engine's schema, sweep,
// and post the result back. Only the latest request matters; the page drops stale replies.
import { parseRequirementInput } from "@/lib/design/ambiguous-percent";
import { solve } from "@/lib/design/solve";
import { differencesFromDefaults } from "./from-defaults";
import { outOfRange } from "./ranges";
import type { DifferencesReply, SolveReply, SolveRequest } from "./solver-protocol";

// The app compiles with the DOM's types, where self is a window; in this worker it is the worker's
// scope, whose postMessage(message) the window's one-argument overload describes.
const post = (reply: SolveReply | DifferencesReply) => self.postMessage(reply);

self.addEventListener("message", (event: MessageEvent<SolveRequest>) => {
  const { id, input } = event.data;
  try {
    const parsed = parseRequirementInput(input, "type");
    if (!parsed.ok) {
      post({ id, ok: false, fieldErrors: parsed.fieldErrors, message: parsed.message });
      return;
    }
    const far = outOfRange(parsed.requirement);
    if (Object.keys(far).length > 0) {
      post({ id, ok: false, fieldErrors: far, message: Object.values(far)[0]![0]! });
      return;
    }
    const t0 = performance.now();
    const result = solve(parsed.requirement);
    post({ id, ok: true, result, solveMs: performance.now() - t0 });
    post({ id, differences: differencesFromDefaults(parsed.requirement) });
  } catch (e) {
    post({ id, ok: false, fieldErrors: {}, message: e instanceof Error ? e.message : String(e) });
  }
});
