// Node-only start-up work, imported by instrumentation.ts.
import { getDb, databaseKind } from "@/db/client";
import { seedDemoIfEmpty } from "@/db/seed";
import { stampPeerAddresses } from "@/lib/auth/client-address";
import { ensureAuthSecret } from "@/lib/auth/secret";
import { env } from "@/lib/env";
import { limitHeapGrowth } from "@/lib/heap-growth";

export async function startServer() {
  limitHeapGrowth();
  const e = env();
  stampPeerAddresses();
  ensureAuthSecret();
  if (!process.env.NEXTAUTH_URL && !process.env.AUTH_TRUST_HOST) {
    process.env.NEXTAUTH_URL = e.PUBLIC_URL ?? `http://localhost:${e.PORT}`;
  }
  try {
    await getDb();
  } catch (err) {
    console.error(`[db] ${(err as Error).message}`);
    process.exit(1);
  }
  const kind = await databaseKind();
  console.log(`[db] ${kind === "pglite" ? `PGlite at ${e.PGLITE_DIR}` : "PostgreSQL server"}, migrations applied`);
  if (e.SEED_DEMO === "1" && (await seedDemoIfEmpty())) console.log("[db] demo team Harbourline Labs loaded");
  const { startMail } = await import("@/lib/mail/start");
  await startMail();
  await keepPlannerStatistics();
  await warmUp();
  void warmRoutes(e.PORT);
}

/** How often PGlite's statistics are checked while the server runs (a server's autovacuum naps 1 min). */
const STATISTICS_CHECK_MS = 10 * 60 * 1000;

/**
 * PGlite has no autovacuum: analyze what changed since the last start now, before the first
 * request, and check again every few minutes (db/queries/planner-statistics.ts says why).
 */
async function keepPlannerStatistics() {
  const { refreshPlannerStatistics } = await import("@/db/queries/planner-statistics");
  const refresh = async () => {
    const t0 = performance.now();
    try {
      const analyzed = await refreshPlannerStatistics();
      if (analyzed.length)
        console.log(`[db] statistics of ${analyzed.join(", ")} refreshed in ${Math.round(performance.now() - t0)} ms`);
    } catch (err) {
      console.warn(`[db] statistics not refreshed: ${(err as Error).message}`);
    }
  };
  await refresh();
  setInterval(() => void refresh(), STATISTICS_CHECK_MS).unref();
}

/**
 * Next loads each route's code on its first request. Once the server answers, ask the slow
 * first-use routes once without a session: the gate answers 401 (or the sign-in redirect) with no
 * effect, and their modules, react-pdf's included, are loaded before a person's first request. A
 * module that loads then runs its own code hot (lib/warm-up/run.ts); the line below waits for that.
 */
async function warmRoutes(port: number) {
  const base = `http://127.0.0.1:${port}`;
  const none = "00000000-0000-4000-8000-000000000000";
  let up = false;
  for (let tries = 0; tries < 240 && !up; tries++) {
    try {
      // Our own health answer, not some other server's on that port (`next start -p` without PORT).
      const health = (await (await fetch(`${base}/api/health`)).json()) as { ok?: unknown; database?: unknown };
      up = health.ok === true && typeof health.database === "string";
    } catch {
      /* not listening yet */
    }
    if (!up) await new Promise((r) => setTimeout(r, 250));
  }
  if (!up) return;
  const paths: [string, string][] = [
    ["POST", "/api/solve"],
    ["GET", "/api/designs"],
    ["GET", `/api/designs/${none}/build-sheet`],
    ["GET", `/api/designs/${none}/profiles/${none}?width=800`],
    ["GET", `/designs/${none}`],
    ["GET", "/designs"],
    ["GET", `/compare?ids=${none},${none}`],
  ];
  const t0 = performance.now();
  for (const [method, path] of paths) {
    try {
      await (await fetch(`${base}${path}`, { method, redirect: "manual" })).arrayBuffer();
    } catch {
      /* a route that cannot be reached now is simply not warmed */
    }
  }
  try {
    const { routeWarmUpsSettled } = await import("@/lib/warm-up/run");
    await routeWarmUpsSettled(30_000);
  } catch (err) {
    console.warn(`[start] route warm-ups not awaited: ${(err as Error).message}`);
  }
  console.log(`[start] ${paths.length} routes loaded and warmed in ${Math.round(performance.now() - t0)} ms`);
}

/**
 * First-use costs paid before the first request rather than by it: the database's first reads and
 * the build sheet's worker threads with their typeface and PDF modules. The engine is warmed by
 * each route in its own copy (lib/warm-up): a solve here would warm only this bundle's copy. A
 * failure here is logged and never stops the start.
 */
async function warmUp() {
  const t0 = performance.now();
  try {
    const { fixtureView, loggerRequirement } = await import("@/lib/build-sheet/fixtures");
    const { pingDatabase } = await import("@/db/queries/health");
    await pingDatabase();
    // Through the pool, one sheet per worker at once, so every worker thread starts and loads
    // react-pdf and the typefaces now.
    const { renderBuildSheetOffThread, SHEET_WORKERS } = await import("@/lib/build-sheet/render-pool");
    const sample = fixtureView(loggerRequirement, { status: "draft" });
    await Promise.all(
      Array.from({ length: SHEET_WORKERS }, () =>
        renderBuildSheetOffThread(sample, { team: "warm-up", generatedAt: new Date() }),
      ),
    );
    console.log(`[start] database and build sheet warmed in ${Math.round(performance.now() - t0)} ms`);
  } catch (err) {
    console.warn(`[start] warm-up skipped: ${(err as Error).message}`);
  }
}
