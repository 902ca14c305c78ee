// The route warm-ups (lib/warm-up): a step that fails is logged and never thrown, the start-up's
// wait ends at its limit, and every step the solve and chart routes warm with runs without error
// (a body the engine refused would leave the route cold with only a log line to say so).
import { afterEach, describe, expect, it, vi } from "vitest";

const registry = Symbol.for("sensewright.routeWarmUps");

afterEach(() => {
  vi.unstubAllEnvs();
  vi.restoreAllMocks();
  delete (globalThis as Record<symbol, unknown>)[registry];
});

describe("warmOnLoad", () => {
  it("does nothing outside a production server (tests, next dev, next build)", async () => {
    const { warmOnLoad } = await import("@/lib/warm-up/run");
    const prepare = vi.fn(() => []);
    warmOnLoad("test", prepare);
    vi.stubEnv("NODE_ENV", "production");
    vi.stubEnv("NEXT_PHASE", "phase-production-build");
    warmOnLoad("test", prepare);
    await new Promise((r) => setImmediate(r));
    expect(prepare).not.toHaveBeenCalled();
  });

  it("runs each step in rounds, logs a failure and never throws it", async () => {
    vi.stubEnv("NODE_ENV", "production");
    const log = vi.spyOn(console, "log").mockImplementation(() => {});
    const warn = vi.spyOn(console, "warn").mockImplementation(() => {});
    const { warmOnLoad, routeWarmUpsSettled } = await import("@/lib/warm-up/run");
    let runs = 0;
    warmOnLoad("good", () => [() => runs++]);
    warmOnLoad("bad", () => [
      () => {
        throw new Error("no engine today");
      },
    ]);
    await routeWarmUpsSettled(5_000);
    expect(runs).toBeGreaterThan(1);
    expect(log.mock.calls.flat().join("\n")).toMatch(/\[start\] good warmed: \d+ rounds/);
    expect(warn.mock.calls.flat().join("\n")).toContain("[start] bad not warmed: no engine today");
  });

  it("lets the start-up's wait end at its limit", async () => {
    vi.stubEnv("NODE_ENV", "production");
    const { routeWarmUpsSettled } = await import("@/lib/warm-up/run");
    (globalThis as Record<symbol, unknown>)[registry] = [new Promise(() => {})];
    const t0 = performance.now();
    await routeWarmUpsSettled(50);
    expect(performance.now() - t0).toBeLessThan(2_000);
  });
});

describe("the routes' warm-up steps", () => {
  it("solve and chart every body without an error", async () => {
    vi.stubEnv("NODE_ENV", "production");
    const warn = vi.spyOn(console, "warn").mockImplementation(() => {});
    const log = vi.spyOn(console, "log").mockImplementation(() => {});
    const { routeWarmUpsSettled } = await import("@/lib/warm-up/run");
    const { warmSolveRoute } = await import("@/lib/warm-up/solve-route");
    const { warmProfileChartRoute } = await import("@/lib/warm-up/profile-chart-route");
    warmSolveRoute();
    warmProfileChartRoute();
    await routeWarmUpsSettled(120_000);
    expect(warn).not.toHaveBeenCalled();
    const lines = log.mock.calls.flat().join("\n");
    expect(lines).toMatch(/solve route warmed: [1-9]/);
    expect(lines).toMatch(/profile chart route warmed: [1-9]/);
  }, 120_000);
});
