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
}
