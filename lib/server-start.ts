// Node-only start-up work, imported by instrumentation.ts.
import { getDb, databaseKind } from "@/db/client";
import { seedDemoIfEmpty } from "@/db/seed";
import { stampPeerAddresses } from "@/lib/auth/client-address";
import { ensureAuthSecret } from "@/lib/auth/secret";
import { env } from "@/lib/env";

export async function startServer() {
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
  await warmUp();
}

/**
 * First-use costs paid before the first request rather than by it: the engine's first sweep (JIT,
 * unit tables), the database's first reads, and the build sheet's typeface and PDF modules (the
 * typeface is built once per process and shared). A failure here is logged and never stops the start.
 */
async function warmUp() {
  const t0 = performance.now();
  try {
    const { parseRequirement, solve } = await import("@/lib/design");
    const { fixtureView, loggerRequirement } = await import("@/lib/build-sheet/fixtures");
    const parsed = parseRequirement(loggerRequirement);
    if (parsed.ok) solve(parsed.requirement);
    const { pingDatabase } = await import("@/db/queries/health");
    await pingDatabase();
    const { renderBuildSheet } = await import("@/lib/build-sheet/render");
    await renderBuildSheet(fixtureView(loggerRequirement, { status: "draft" }), {
      team: "warm-up",
      generatedAt: new Date(),
    });
    console.log(`[start] engine, database and build sheet warmed in ${Math.round(performance.now() - t0)} ms`);
  } catch (err) {
    console.warn(`[start] warm-up skipped: ${(err as Error).message}`);
  }
}
