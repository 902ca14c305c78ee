// The check worker: the wizard's validation and quantity reading off the page's thread, so the
// page never downloads zod or the unit parser (they load here, once, after first paint).
import { parseQuantity } from "@/lib/design/units";
import type { CheckCall, CheckReply, CheckRequest } from "./check-protocol";
import { convertDrop } from "./drop-mode";
import { checkForm } from "./form-check";

// The app compiles with the DOM's types, where self is a window; in this worker it is the worker's
// scope, whose postMessage(message) the window's one-argument overload describes.
const post = (reply: CheckReply) => self.postMessage(reply);

async function answer(call: CheckCall): Promise<unknown> {
  switch (call.kind) {
    case "form":
      return checkForm(call.values);
    case "quantity":
      return parseQuantity(call.input, call.dim, call.label);
    case "convertDrop":
      return convertDrop(call.values, call.to);
  }
}

self.addEventListener("message", (event: MessageEvent<CheckRequest>) => {
  const { id, call } = event.data;
  answer(call).then(
    (a) => post({ id, ok: true, answer: a }),
    (e: unknown) => post({ id, ok: false, message: e instanceof Error ? e.message : String(e) }),
  );
});
