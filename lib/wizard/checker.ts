// The page's side of the check worker: one worker per page, started on first use (or when the
// wizard mounts, to have it warm), each call a promise answered by id.
import type { CheckAnswer, CheckCall, CheckReply, CheckRequest } from "./check-protocol";

let worker: Worker | null = null;
let nextId = 1;
const waiting = new Map<number, { resolve: (a: unknown) => void; reject: (e: Error) => void }>();

function start(): Worker {
  if (worker) return worker;
  const w = new Worker(new URL("./check.worker.ts", import.meta.url), { name: "sensewright-check" });
  w.onmessage = (event: MessageEvent<CheckReply>) => {
    const reply = event.data;
    const p = waiting.get(reply.id);
    if (!p) return;
    waiting.delete(reply.id);
    if (reply.ok) p.resolve(reply.answer);
    else p.reject(new Error(reply.message));
  };
  // A worker that fails to load fails every call waiting on it; the next call starts a fresh one.
  w.onerror = (event) => {
    for (const p of waiting.values()) p.reject(new Error(`The form check stopped: ${event.message}`));
    waiting.clear();
    w.terminate();
    worker = null;
  };
  worker = w;
  return w;
}

/** Start the worker now, so the first check does not wait for it to load. */
export const warmChecker = () => void start();

export function check<C extends CheckCall>(call: C): Promise<CheckAnswer<C>> {
  const w = start();
  const id = nextId++;
  return new Promise((resolve, reject) => {
    waiting.set(id, { resolve: resolve as (a: unknown) => void, reject });
    w.postMessage({ id, call } satisfies CheckRequest);
  });
}
