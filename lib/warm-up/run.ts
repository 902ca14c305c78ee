// Warming a route's own code before a person's first call. Next bundles instrumentation apart
// from the route handlers, so the engine lib/server-start.ts runs at start is another module
// instance than the one a route runs: the same source, with its own closures, its own JIT feedback
// and its own lazily built tables. Start-up asks each slow route once without a session
// (warmRoutes: the gate answers 401), which loads the route's module; the module then calls
// `warmOnLoad`, and its own copy of the code runs on made-up inputs, off any request and without
// a caller. V8 optimises a function only after it has run hot, so one run is not enough: the
// first solve with a diagnosis took 8× a warm one, the third still 2× (measured 2026-12-02).
// Start-up waits for these (routeWarmUpsSettled) before it says the routes are loaded. A failure
// is logged and never stops the server.

const registry = Symbol.for("sensewright.routeWarmUps");
type WithRegistry = typeof globalThis & { [registry]?: Promise<void>[] };

/** Rounds of every step: a route's steps run its hot functions many times a round (measured 2026-12-02). */
const ROUNDS = 4;
/** Rounds stop past this (a machine under load): a partly warmed route is still a working one. */
const BUDGET_MS = 10_000;

/** Whether this process serves requests: not `next build` loading a route to read it, nor `next dev`. */
const serving = () => process.env.NODE_ENV === "production" && process.env.NEXT_PHASE !== "phase-production-build";

/** Lets the request that loaded the module, and any other, be answered between two steps. */
const yieldToRequests = () => new Promise<void>((resolve) => setImmediate(resolve));

/**
 * Runs the steps `prepare` returns, `ROUNDS` times over, once per process, starting after the
 * current request. Each step is a route's own code on inputs that need no database and no caller.
 */
export function warmOnLoad(name: string, prepare: () => (() => unknown)[]) {
  if (!serving()) return;
  ((globalThis as WithRegistry)[registry] ??= []).push(warm(name, prepare));
}

async function warm(name: string, prepare: () => (() => unknown)[]) {
  const t0 = performance.now();
  try {
    await yieldToRequests();
    const steps = prepare();
    let rounds = 0;
    for (; rounds < ROUNDS && performance.now() - t0 < BUDGET_MS; rounds++) {
      for (const step of steps) {
        step();
        await yieldToRequests();
      }
    }
    console.log(`[start] ${name} warmed: ${rounds} rounds in ${Math.round(performance.now() - t0)} ms`);
  } catch (err) {
    console.warn(`[start] ${name} not warmed: ${(err as Error).message}`);
  }
}

/** Resolves when every route warm-up begun so far has ended, or after `limitMs` at most. */
export async function routeWarmUpsSettled(limitMs: number): Promise<void> {
  const pending = (globalThis as WithRegistry)[registry] ?? [];
  let timer: NodeJS.Timeout | undefined;
  await Promise.race([
    Promise.allSettled(pending),
    new Promise<void>((resolve) => {
      timer = setTimeout(resolve, limitMs);
    }),
  ]);
  clearTimeout(timer);
}
