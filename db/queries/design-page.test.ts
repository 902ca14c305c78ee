// The design page's one query against the separate reads it replaced (library included), on the demo team's designs
// (a pair approved after a return, a range plan, a draft) and one with comments, a reply and
// three revisions: the same rows, keys and numbers to the last bit, in the same order.
import { eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { z } from "zod";
import { closeDb, getDb } from "../client";
import { memberships, teams } from "../schema";
import { seedDemoIfEmpty } from "../seed/index";
import { listTargetAudit } from "./audit";
import { getDesignPage } from "./design-page";
import { listLibrary } from "./library";
import {
  designViewOf,
  getDesign,
  getDesignViews,
  getDesignWithHeads,
  listDesigns,
  listRevisionHeads,
  listRevisions,
  reviseDesign,
} from "./designs";
import { addReview, listReviews } from "./reviews";

let teamId = "";
let otherTeamId = "";
let designIds: string[] = [];

beforeAll(async () => {
  await seedDemoIfEmpty();
  const db = await getDb();
  const [team] = await db.select().from(teams);
  teamId = team!.id;
  const [other] = await db.insert(teams).values({ name: "Design page read other team" }).returning();
  otherTeamId = other!.id;
  const members = await db.select().from(memberships).where(eq(memberships.teamId, teamId));
  const userOf = (role: string) => members.find((m) => m.role === role)!.userId;
  // The draft gains two revisions, a comment on each and a reply: more rows of every kind.
  const draft = (await listDesigns(teamId)).find((d) => d.status === "draft")!;
  const [rev] = await listRevisions(draft.id, [draft.revision]);
  for (const at of [draft.revision, draft.revision + 1]) {
    const saved = await reviseDesign({
      ...rev!,
      designId: draft.id,
      teamId,
      userId: userOf("designer"),
      expectedRevision: at,
      name: `${rev!.name}, take ${at + 1}`,
      project: draft.project,
      changed: ["name"],
    });
    expect(saved.ok).toBe(true);
    const c = await addReview({
      designId: draft.id,
      teamId,
      actorId: userOf("reviewer"),
      verdict: "comment",
      body: `Check the drop at take ${at + 1}.`,
      revision: at + 1,
    });
    if (!c.ok) throw new Error(c.message);
    await addReview({
      designId: draft.id,
      teamId,
      actorId: userOf("designer"),
      verdict: "comment",
      body: "Checked.",
      revision: at + 1,
      parentId: c.id,
    });
  }
  designIds = (await listDesigns(teamId)).map((d) => d.id);
});

afterAll(closeDb);

async function separateReads(id: string, team: string) {
  const found = await getDesign(id, team);
  if (!found) return null;
  const heads = await listRevisionHeads(id);
  return {
    view: designViewOf(found, heads),
    heads,
    reviews: await listReviews(id),
    audit: await listTargetAudit(team, "design", id),
    library: await listLibrary(team),
  };
}

describe("getDesignPage", () => {
  it("reads design, heads, reviews and audit in one query exactly as the separate reads do", async () => {
    expect(designIds.length).toBeGreaterThanOrEqual(4);
    let reviewed = 0;
    for (const id of designIds) {
      const page = await getDesignPage(id, teamId);
      const reference = await separateReads(id, teamId);
      expect(reference).not.toBeNull();
      expect(page).toStrictEqual(reference);
      expect(page!.audit.length).toBeGreaterThan(0);
      reviewed += page!.reviews.length;
      expect(page!.library.amplifiers.length).toBeGreaterThan(0);
    }
    // The demo's approvals and return, and the comments above, were all compared.
    expect(reviewed).toBeGreaterThanOrEqual(7);
  });

  it("reads the same design and heads as getDesignWithHeads and getDesignViews", async () => {
    for (const id of designIds) {
      const page = (await getDesignPage(id, teamId))!;
      expect(await getDesignWithHeads(id, teamId)).toStrictEqual({ view: page.view, heads: page.heads });
    }
    const views = await getDesignViews([designIds[2]!, "nope", designIds[0]!], teamId);
    expect(views).toStrictEqual([
      (await separateReads(designIds[2]!, teamId))!.view,
      null,
      (await separateReads(designIds[0]!, teamId))!.view,
    ]);
    expect(views.some((v) => v?.approval)).toBe(true);
  });

  // Vitest runs on an in-memory PGlite unless DATABASE_URL names a server (vitest.config.ts).
  it.runIf(!process.env.DATABASE_URL)("is one named statement on PGlite, planned once for every design", async () => {
    for (const id of designIds) await getDesignPage(id, teamId);
    const db = await getDb();
    const kept = z
      .object({
        rows: z.array(z.object({ statement: z.string(), generic_plans: z.number(), custom_plans: z.number() })),
      })
      .parse(await db.execute(sql`select statement, generic_plans, custom_plans from pg_prepared_statements`)).rows;
    // Of the prepared queries these tests run, the page's (the only one with the audit trail) is kept once.
    const pages = kept.filter((k) => k.statement.includes('"audit_events"'));
    expect(pages).toHaveLength(1);
    const [page] = pages;
    expect(page!.custom_plans).toBe(5);
    expect(page!.generic_plans).toBeGreaterThanOrEqual(designIds.length * 3 - 5);
  });

  it("is null for another team's design and for an id that is not a UUID", async () => {
    expect(await getDesignPage(designIds[0]!, otherTeamId)).toBeNull();
    expect(await getDesignPage("not-a-uuid", teamId)).toBeNull();
  });
});
