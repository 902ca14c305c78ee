// The statement cache against PGlite's own query(): the same rows and errors, statements kept and
// closed, and PostgreSQL's plan-cache rule (five custom plans, then a generic one when it costs no
// more: PostgreSQL 17 manual, PREPARE, "Notes"; pg_prepared_statements counts both).
import { PGlite, types } from "@electric-sql/pglite";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { withStatementCache } from "./statement-cache";

let raw: PGlite;
beforeAll(async () => {
  raw = new PGlite();
  await raw.exec(`create table t (id int primary key, name text not null, at timestamptz, tags int[], doc jsonb,
    amount numeric, ok boolean, bytes bytea)`);
  await raw.query(`insert into t values (1, 'one', '2026-12-03T04:05:06.789Z', '{1,2}', '{"a":[1,"x"]}', 12.5, true, '\\x0102'),
    (2, 'two', null, null, null, null, null, null)`);
});
afterAll(() => raw.close());

const all = () => true;

const kept = async () =>
  (
    await raw.query<{ statement: string; generic_plans: number; custom_plans: number }>(
      "select statement, generic_plans, custom_plans from pg_prepared_statements order by prepare_time",
    )
  ).rows;

// Drizzle's options for its row reads (drizzle-orm/pglite/session.js): arrays, dates left as text.
const drizzleLike = { rowMode: "array" as const, parsers: { [types.TIMESTAMPTZ]: (v: string) => v } };

describe("withStatementCache", () => {
  it("answers as PGlite's query does, in both row modes and with a caller's parsers", async () => {
    const cached = withStatementCache(raw, { keeps: all });
    const text = "select * from t where id = any($1::int[]) or name = $2 order by id";
    for (const options of [undefined, drizzleLike]) {
      const params = [[1, 2], null];
      const mine = await cached.query(text, params, options);
      const theirs = await raw.query(text, params, options);
      expect(mine.rows).toEqual(theirs.rows);
      expect(mine.fields).toEqual(theirs.fields);
      expect(mine.rows).toHaveLength(2);
    }
    const params = [new Date("2026-01-02T03:04:05Z"), { k: [1, 2] }, null];
    const sent = await cached.query("select $1::timestamptz as at, $2::jsonb as doc, $3::text as none", params);
    expect(sent.rows).toEqual(
      (await raw.query("select $1::timestamptz as at, $2::jsonb as doc, $3::text as none", params)).rows,
    );
  });

  it("parses a text once, and PostgreSQL moves it to a generic plan after five custom ones", async () => {
    const cached = withStatementCache(raw, { keeps: all });
    const text = "select name from t where id = $1";
    for (let k = 0; k < 8; k++) expect((await cached.query<{ name: string }>(text, [1])).rows[0]?.name).toBe("one");
    const mine = (await kept()).filter((s) => s.statement === text);
    expect(mine).toHaveLength(1);
    expect(mine[0]!.custom_plans).toBe(5);
    expect(mine[0]!.generic_plans).toBe(3);
  });

  it("keeps at most its limit, closing the least recently used", async () => {
    await raw.exec("deallocate all");
    const cached = withStatementCache(raw, { keeps: all, max: 3 });
    const texts = [1, 2, 3, 4, 5].map((k) => `select ${k} as k, name from t where id = $1`);
    await cached.query(texts[0]!, [1]);
    await cached.query(texts[1]!, [1]);
    await cached.query(texts[2]!, [1]);
    await cached.query(texts[0]!, [1]); // used again: now the most recent
    await cached.query(texts[3]!, [1]); // closes texts[1], the least recent
    await cached.query(texts[4]!, [1]); // closes texts[2]
    expect((await kept()).map((s) => s.statement).sort()).toEqual([texts[0], texts[3], texts[4]].sort());
    expect((await cached.query<{ k: number }>(texts[1]!, [2])).rows[0]?.k).toBe(2);
    expect(await kept()).toHaveLength(3);
  });

  it("gives PostgreSQL's error with the query, and the next call still works", async () => {
    const cached = withStatementCache(raw, { keeps: all });
    const insert = "insert into t (id, name) values ($1, $2)";
    const failed = await cached.query(insert, [1, "again"]).catch((e: unknown) => e);
    expect(failed).toMatchObject({ code: "23505", query: insert, params: [1, "again"] });
    await cached.query(insert, [3, "three"]);
    expect((await raw.query("select name from t where id = 3")).rows).toEqual([{ name: "three" }]);
    await expect(cached.query("select nope from t", [])).rejects.toMatchObject({ code: "42703" });
    await raw.query("delete from t where id = 3");
  });

  it("parses again when a schema change alters a kept statement's result, or it was deallocated", async () => {
    const cached = withStatementCache(raw, { keeps: all });
    await raw.exec("create table s (a int)");
    await raw.exec("insert into s values (1)");
    expect((await cached.query("select * from s", [])).rows).toEqual([{ a: 1 }]);
    await raw.exec("alter table s add column b text default 'b'");
    expect((await cached.query("select * from s", [])).rows).toEqual([{ a: 1, b: "b" }]);
    expect((await kept()).filter((s) => s.statement === "select * from s")).toHaveLength(1);
    await raw.exec("deallocate all");
    expect((await cached.query("select * from s", [])).rows).toEqual([{ a: 1, b: "b" }]);
  });

  it("waits for an open transaction instead of running inside it", async () => {
    const cached = withStatementCache(raw, { keeps: all });
    const order: string[] = [];
    let commit!: () => void;
    const held = new Promise<void>((r) => (commit = r));
    const tx = raw.transaction(async (t) => {
      await t.query("insert into t (id, name) values (4, 'four')");
      order.push("inserted");
      await held;
      order.push("committing");
    });
    await new Promise((r) => setTimeout(r, 20));
    const read = cached.query<{ n: number }>("select count(*)::int as n from t where id = $1", [4]).then((r) => {
      order.push("read");
      return r.rows[0]?.n;
    });
    await new Promise((r) => setTimeout(r, 50));
    commit();
    await tx;
    expect(await read).toBe(1);
    expect(order).toEqual(["inserted", "committing", "read"]);
    await raw.query("delete from t where id = 4");
  });

  it("leaves the client's other methods working through it", async () => {
    const cached = withStatementCache(raw, { keeps: all });
    expect(cached).toBeInstanceOf(PGlite);
    const n = await cached.transaction(
      async (t) => (await t.query<{ n: number }>("select count(*)::int as n from t")).rows[0]?.n,
    );
    expect(n).toBe(2);
    expect((await cached.exec("select 1 as one"))[0]?.rows).toEqual([{ one: 1 }]);
  });
});
