// The scale seed at a small count: the counts it promises, one design with the deep revision
// history, every design's current revision present, and the designs list paging through it all
// by keyset without a duplicate or a gap.
import { and, count, eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, getDb } from "../client";
import { pageDesigns, type DesignListKey } from "../queries/designs";
import { designRevisions, designs, profiles, reviews, teams } from "../schema";
import { DEEP_DESIGN_NAME, DEEP_REVISIONS, SCALE_TEAM, seedScaleTeam, spread } from "./scale";

const counts = { designs: 120, revisions: 400, reviews: 60, profiles: 7 };
let teamId = "";

beforeAll(async () => {
  ({ teamId } = await seedScaleTeam(counts));
});
afterAll(closeDb);

describe("scale seed", () => {
  it("spreads revisions as asked, the first design taking the deep history", () => {
    const s = spread(30_000, 10_000, 50);
    expect(s[0]).toBe(50);
    expect(s.reduce((a, b) => a + b, 0)).toBe(30_000);
    expect(Math.min(...s)).toBeGreaterThanOrEqual(2);
    expect(spread(5, 1, 50)).toEqual([5]);
  });

  it("writes the counts it was given", async () => {
    const db = await getDb();
    const inTeam = eq(designs.teamId, teamId);
    const [d] = await db.select({ n: count() }).from(designs).where(inTeam);
    const [r] = await db
      .select({ n: count() })
      .from(designRevisions)
      .innerJoin(designs, eq(designs.id, designRevisions.designId))
      .where(inTeam);
    const [v] = await db
      .select({ n: count() })
      .from(reviews)
      .innerJoin(designs, eq(designs.id, reviews.designId))
      .where(inTeam);
    const [p] = await db
      .select({ n: count() })
      .from(profiles)
      .innerJoin(designs, eq(designs.id, profiles.designId))
      .where(inTeam);
    expect([d?.n, r?.n, v?.n, p?.n]).toEqual([counts.designs, counts.revisions, counts.reviews, counts.profiles]);
  });

  it("gives one design the deep revision history, and every design its current revision", async () => {
    const db = await getDb();
    const [deep] = await db.select().from(designs).where(eq(designs.name, DEEP_DESIGN_NAME));
    expect(deep?.revision).toBe(DEEP_REVISIONS);
    const [missing] = await db
      .select({ n: count() })
      .from(designs)
      .where(
        and(
          eq(designs.teamId, teamId),
          sql`not exists (select 1 from ${designRevisions} r where r.design_id = ${designs.id} and r.revision = ${designs.revision})`,
        ),
      );
    expect(missing?.n).toBe(0);
  });

  it("refuses to seed the same database twice", async () => {
    await expect(seedScaleTeam(counts)).rejects.toThrow(SCALE_TEAM);
    const db = await getDb();
    expect(await db.select().from(teams).where(eq(teams.name, SCALE_TEAM))).toHaveLength(1);
  });

  it("pages through every design once, newest first, ties broken by id", async () => {
    const seen: { id: string; updatedAt: string }[] = [];
    let after: DesignListKey | undefined;
    for (let guard = 0; guard < 100; guard++) {
      const page = await pageDesigns(teamId, { limit: 7, after });
      seen.push(...page.designs);
      if (!page.next) break;
      after = page.next;
    }
    expect(seen).toHaveLength(counts.designs);
    expect(new Set(seen.map((d) => d.id)).size).toBe(counts.designs);
    // The seed gives groups of three designs one timestamp, so ties occur and must not lose a row.
    const times = seen.map((d) => d.updatedAt);
    expect(new Set(times).size).toBeLessThan(counts.designs);
    for (let k = 1; k < seen.length; k++) {
      const [a, b] = [seen[k - 1]!, seen[k]!];
      expect(a.updatedAt > b.updatedAt || (a.updatedAt === b.updatedAt && a.id > b.id)).toBe(true);
    }
  });

  it("searches name and project, and filters by status, across pages", async () => {
    const tide = await pageDesigns(teamId, { limit: 200, q: "tide GAUGE" });
    expect(tide.designs.length).toBeGreaterThan(0);
    expect(tide.designs.every((d) => d.project === "Tide gauge")).toBe(true);
    const approved = await pageDesigns(teamId, { limit: 200, status: "approved" });
    expect(approved.designs.every((d) => d.status === "approved")).toBe(true);
    const makers = await pageDesigns(teamId, { limit: 200, approvedOnly: true, status: "draft" });
    expect(makers.designs).toEqual([]);
    // A literal % matches only itself, not everything.
    expect((await pageDesigns(teamId, { limit: 5, q: "%" })).designs).toEqual([]);
  });
});
