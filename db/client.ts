// The one database handle of the process: PGlite on PGLITE_DIR, or a PostgreSQL server with DATABASE_URL.
// Cached on globalThis because Next loads this module separately for instrumentation, routes and pages.
import { execFile } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { promisify } from "node:util";
import type { PgDatabase, PgQueryResultHKT } from "drizzle-orm/pg-core";
import { env } from "@/lib/env";
import { byteaParsers, byteaSerializers } from "./bytea";
import { acquireDataDirLock } from "./lock";
import * as schema from "./schema";
import { withStatementCache } from "./statement-cache";

export type Db = PgDatabase<PgQueryResultHKT, typeof schema>;
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
export type DatabaseKind = "pglite" | "postgres";

type Handle = { db: Db; kind: DatabaseKind; close: () => Promise<void> };

const globalKey = Symbol.for("sensewright.db");
type GlobalWithDb = typeof globalThis & { [globalKey]?: Promise<Handle> };
const g = globalThis as GlobalWithDb;

/**
 * PGlite's buffer cache. It lives in the WebAssembly memory and is all touched at start, so it is
 * resident from the first second: initdb's 128 MB default was a fifth of a demo server's memory.
 * Pages it misses come from the operating system's file cache, and 32 MB holds the designs list's
 * and a design page's working set on a 10,000-design team (npm run bench -- server).
 */
const PGLITE_SHARED_BUFFERS = "32MB";

const migrationsFolder = () => path.join(process.cwd(), "db", "migrations");

/**
 * A new data directory made in a short-lived child process. PGlite runs initdb in a WebAssembly
 * instance of its own that takes 300–400 MB and is garbage once done, but the collector may keep it
 * for minutes; in a child it is the operating system's again the moment the child exits.
 */
async function initDataDirApart(dir: string) {
  const script = `import { PGlite } from "@electric-sql/pglite";
const db = new PGlite({ dataDir: process.env.NEW_PGLITE_DIR });
await db.waitReady;
await db.close();`;
  await promisify(execFile)(process.execPath, ["--input-type=module", "-e", script], {
    cwd: process.cwd(),
    env: { ...process.env, NEW_PGLITE_DIR: dir, NODE_OPTIONS: "" },
    timeout: 120_000,
  });
}

async function open(): Promise<Handle> {
  const { DATABASE_URL, PGLITE_DIR } = env();
  if (DATABASE_URL) {
    const { Pool } = await import("pg");
    const { drizzle } = await import("drizzle-orm/node-postgres");
    const { migrate } = await import("drizzle-orm/node-postgres/migrator");
    const pool = new Pool({ connectionString: DATABASE_URL, max: 10 });
    const db = drizzle(pool, { schema });
    await migrate(db, { migrationsFolder: migrationsFolder() });
    return { db: db, kind: "postgres", close: () => pool.end() };
  }
  const inMemory = PGLITE_DIR.startsWith("memory://");
  if (!inMemory) {
    acquireDataDirLock(path.resolve(PGLITE_DIR));
    if (!fs.existsSync(path.join(path.resolve(PGLITE_DIR), "PG_VERSION")))
      await initDataDirApart(path.resolve(PGLITE_DIR));
  }
  const { PGlite } = await import("@electric-sql/pglite");
  // Trigram search on design names (migration 0008 creates the extension; PGlite ships it separately).
  const { pg_trgm } = await import("@electric-sql/pglite/contrib/pg_trgm");
  const { drizzle } = await import("drizzle-orm/pglite");
  const { migrate } = await import("drizzle-orm/pglite/migrator");
  const client = new PGlite({
    dataDir: inMemory ? undefined : path.resolve(PGLITE_DIR),
    extensions: { pg_trgm },
    startParams: [...PGlite.defaultStartParams, "-c", `shared_buffers=${PGLITE_SHARED_BUFFERS}`],
    parsers: byteaParsers,
    serializers: byteaSerializers,
  });
  const db = drizzle(withStatementCache(client), { schema });
  await migrate(db, { migrationsFolder: migrationsFolder() });
  return { db: db, kind: "pglite", close: () => client.close() };
}

function handle(): Promise<Handle> {
  if (!g[globalKey]) {
    g[globalKey] = open().catch((e: unknown) => {
      delete g[globalKey];
      throw e;
    });
  }
  return g[globalKey];
}

/** The database, opened and migrated on first use. */
export async function getDb(): Promise<Db> {
  return (await handle()).db;
}

export async function databaseKind(): Promise<DatabaseKind> {
  return (await handle()).kind;
}

export async function closeDb(): Promise<void> {
  const h = g[globalKey];
  delete g[globalKey];
  if (h) await (await h).close();
}
