// PGlite's statistics kept the way autovacuum would keep a server's: a never-analyzed table is
// analyzed, a table that changed little is left alone, one that grew past the rule is analyzed again.
// The rule (50 rows + 10 %) is PostgreSQL's documented autovacuum_analyze_* defaults.
import { sql } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { z } from "zod";
import { closeDb, getDb } from "../client";
import { teams } from "../schema";
import { refreshPlannerStatistics } from "./planner-statistics";

afterAll(closeDb);

const estimate = z.object({ rows: z.array(z.object({ n: z.coerce.number() })) });

async function estimatedTeams(): Promise<number> {
  const db = await getDb();
  const r = estimate.parse(await db.execute(sql`select reltuples::float8 as n from pg_class where relname = 'teams'`));
  return r.rows[0]?.n ?? Number.NaN;
}

// Vitest runs on an in-memory PGlite unless DATABASE_URL names a server (vitest.config.ts).
const pglite = !process.env.DATABASE_URL;

describe("planner statistics", () => {
  it.runIf(pglite)("analyzes never-analyzed tables, then nothing until enough rows change", async () => {
    const db = await getDb();
    await db.insert(teams).values([{ name: "Statistics team first" }]);
    expect(await refreshPlannerStatistics()).toContain("teams");
    expect(await refreshPlannerStatistics()).toEqual([]);

    const before = await estimatedTeams();
    // 40 rows: under the 50-row threshold, so left alone.
    const names = Array.from({ length: 40 }, (_, k) => ({ name: `Statistics team ${k}` }));
    await db.insert(teams).values(names);
    expect(await refreshPlannerStatistics()).toEqual([]);
    // 60 more (100 new in all): past it, so analyzed, and the estimate now counts them.
    await db.insert(teams).values(names.concat(names.slice(0, 20)).map((t, k) => ({ name: `${t.name}b${k}` })));
    expect(await refreshPlannerStatistics()).toEqual(["teams"]);
    expect(await estimatedTeams()).toBe(before + 100);
    await db.delete(teams).where(sql`${teams.name} like 'Statistics team %'`);
  });

  it.runIf(pglite)("analyzes a table whose index build set its row count but gathered no statistics", async () => {
    const db = await getDb();
    await db.execute(sql`create table statistics_probe (x integer)`);
    await db.execute(sql`insert into statistics_probe select generate_series(1, 500)`);
    await db.execute(sql`create index statistics_probe_x on statistics_probe (x)`);
    expect(await refreshPlannerStatistics()).toContain("statistics_probe");
    await db.execute(sql`drop table statistics_probe`);
  });

  // A GIN index with fastupdate on queues new rows in a pending list that only a vacuum merges, and
  // every search reads that list in full (PostgreSQL docs, "GIN Fast Update Technique"). PGlite
  // never vacuums, so every GIN index of ours must write straight into the index.
  it("keeps no GIN index with a pending list (fastupdate off)", async () => {
    const db = await getDb();
    const gin = z.object({ rows: z.array(z.object({ name: z.string(), options: z.array(z.string()).nullable() })) });
    const { rows } = gin.parse(
      await db.execute(sql`
        select c.relname as name, c.reloptions as options
        from pg_class c join pg_namespace n on n.oid = c.relnamespace join pg_am a on a.oid = c.relam
        where n.nspname = 'public' and c.relkind = 'i' and a.amname = 'gin'
        order by c.relname`),
    );
    expect(rows.map((r) => r.name)).toEqual(["designs_name_trgm", "designs_project_trgm"]);
    for (const r of rows) expect(r.options, r.name).toContain("fastupdate=false");
  });

  it.runIf(!pglite)("leaves a PostgreSQL server to its autovacuum", async () => {
    expect(await refreshPlannerStatistics()).toEqual([]);
  });
});
