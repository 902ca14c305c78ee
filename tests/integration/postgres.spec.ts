// Run by .ci/run with DATABASE_URL set: the same app, schema and migrations on a PostgreSQL server.
import { expect, test } from "@playwright/test";
import { apiAs } from "../fixtures/auth";

test.skip(!process.env.DATABASE_URL, "only with DATABASE_URL (the PostgreSQL-server run of .ci/run)");

test("health reports the PostgreSQL server and the demo team signs in on it", async () => {
  const anon = await apiAs(null);
  expect(await (await anon.get("/api/health")).json()).toEqual({ ok: true, database: "postgres" });
  const owner = await apiAs("owner");
  const team = (await (await owner.get("/api/team")).json()) as { team: { name: string }; members: unknown[] };
  expect(team.team.name).toBe("Harbourline Labs");
  expect(team.members).toHaveLength(4);
});
