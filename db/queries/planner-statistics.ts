// The planner's statistics for PGlite. A PostgreSQL server's autovacuum re-analyzes a table once
// enough of it changed; PGlite runs no background workers, so a table loaded after the last ANALYZE
// (or never analyzed) keeps no statistics and the planner guesses: on the scale team the designs
// list went from a backward index scan of 51 rows (0.8 ms) to a sort of all 10,000 (160 ms).
import { sql } from "drizzle-orm";
import { z } from "zod";
import { databaseKind, getDb } from "../client";

/**
 * autovacuum's own rule (PostgreSQL docs, "The Autovacuum Daemon"): analyze when the rows changed
 * since the last ANALYZE exceed autovacuum_analyze_threshold + autovacuum_analyze_scale_factor ×
 * rows, defaults 50 and 0.1. PGlite keeps no change counts across restarts, so "changed" is
 * measured as the difference between the row count now and the count the last ANALYZE saw.
 */
const THRESHOLD_ROWS = 50;
const SCALE_FACTOR = 0.1;

// Both drivers answer raw SQL with `{ rows }`; read through a schema rather than a cast.
const estimates = z.object({
  rows: z.array(z.object({ name: z.string(), estimated: z.coerce.number(), analyzed: z.boolean() })),
});
const counts = z.object({ rows: z.array(z.object({ n: z.coerce.number() })) });

/** The public tables whose statistics are missing, or whose row count moved past autovacuum's rule. */
async function staleTables(): Promise<string[]> {
  const db = await getDb();
  const { rows } = estimates.parse(
    await db.execute(sql`
      select c.relname as name, c.reltuples::float8 as estimated,
        exists (select 1 from pg_stats s where s.schemaname = 'public' and s.tablename = c.relname) as analyzed
      from pg_class c join pg_namespace n on n.oid = c.relnamespace
      where n.nspname = 'public' and c.relkind = 'r'
      order by c.relname`),
  );
  const stale: string[] = [];
  for (const t of rows) {
    const counted = counts.parse(await db.execute(sql`select count(*)::float8 as n from ${sql.identifier(t.name)}`));
    const now = counted.rows[0]?.n ?? 0;
    // No column statistics yet (reltuples alone is not enough: CREATE INDEX sets it and analyzes
    // nothing), or the row count moved past autovacuum's rule since the count the planner holds.
    const never = !t.analyzed && now > 0;
    const estimated = Math.max(0, t.estimated); // -1 until first analyzed (PostgreSQL 14+)
    if (never || Math.abs(now - estimated) > THRESHOLD_ROWS + SCALE_FACTOR * estimated) stale.push(t.name);
  }
  return stale;
}

/**
 * ANALYZE the tables whose statistics are missing or stale, on PGlite only (a server does this
 * itself). Returns the tables analyzed. Called at start and after bulk loads (the seeds).
 */
export async function refreshPlannerStatistics(): Promise<string[]> {
  if ((await databaseKind()) !== "pglite") return [];
  const stale = await staleTables();
  if (stale.length === 0) return [];
  const db = await getDb();
  await db.execute(
    sql`analyze ${sql.join(
      stale.map((t) => sql.identifier(t)),
      sql`, `,
    )}`,
  );
  return stale;
}
