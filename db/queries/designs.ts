// Designs and their immutable revisions. Every write is one transaction with its audit event;
// an edit is a compare-and-set on designs.revision, so a stale edit writes nothing.
import { and, asc, desc, eq, ilike, inArray, or, sql, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { z } from "zod";
import { designKindOf, parseRequirement, type Choice, type DesignKind, type Requirement } from "@/lib/design";
import type { PlanChoice } from "@/lib/design/plan-choice";
import type { DesignView } from "@/lib/design-view";
import { isUuid } from "@/lib/ids";
import { getDb, type Tx } from "../client";
import { designRevisions, designs, reviews, users, type DesignStatus } from "../schema";
import { recordAudit } from "./audit";
import { preparedOnce } from "./prepared";
import { RevisionMemo, revisionKey } from "@/lib/saved-designs/revision-memo";

/** Ids come from URLs: anything that is not a UUID cannot name a design (and must not reach SQL as one). */
export { isUuid };

/**
 * A stored requirement, read back through the engine's schema so defaults added since it was saved
 * are filled in (the normalized form parses to itself). Kept as stored if it no longer parses.
 */
export function storedRequirement(stored: unknown): Requirement {
  const parsed = parseRequirement(stored);
  return parsed.ok ? parsed.requirement : (stored as Requirement);
}

/**
 * The stored requirement of one revision, parsed once per process: the parse (zod, every default)
 * cost more than the query that read it, and a revision's requirement never changes.
 */
const parsedRequirements = new RevisionMemo<Requirement>(4000);
const revisionRequirement = (designId: string, revision: number, stored: unknown) =>
  parsedRequirements.get(revisionKey(designId, revision), () => storedRequirement(stored));

/** What one save stores: the normalized requirement and either a pair or a plan, with the engine's figures. */
export type SavedFigures = { requirement: Requirement } & DesignKind;

export type NewDesign = SavedFigures & {
  teamId: string;
  userId: string;
  name: string;
  project?: string | null;
};

/** The immutable row of one save. */
function insertRevision(
  tx: Tx,
  designId: string,
  revision: number,
  input: SavedFigures & { name: string; userId: string },
) {
  return tx.insert(designRevisions).values({
    designId,
    revision,
    name: input.name,
    requirement: input.requirement,
    choice: input.choice,
    plan: input.plan,
    metrics: input.metrics,
    authorId: input.userId,
  });
}

/** Creates the design and its revision 1 together. */
/** A new design and its first revision; inside `inTx` when the caller holds a transaction (idempotency). */
export async function createDesign(input: NewDesign, inTx?: Tx): Promise<{ id: string; revision: 1; status: "draft" }> {
  const db = await getDb();
  const run = <T>(fn: (tx: Tx) => Promise<T>) => (inTx ? fn(inTx) : db.transaction(fn));
  return run(async (tx) => {
    const [row] = await tx
      .insert(designs)
      .values({ teamId: input.teamId, name: input.name, project: input.project ?? null, createdBy: input.userId })
      .returning({ id: designs.id });
    if (!row) throw new Error("design not created");
    await insertRevision(tx, row.id, 1, input);
    await recordAudit(
      {
        teamId: input.teamId,
        actorId: input.userId,
        action: "design.created",
        targetType: "design",
        targetId: row.id,
        details: {
          name: input.name,
          revision: 1,
          ...(input.kind === "pair"
            ? { shuntOhms: input.choice.shuntOhms, gain: input.choice.gain }
            : { ranges: input.plan.ranges.length }),
        },
      },
      tx,
    );
    return { id: row.id, revision: 1 as const, status: "draft" as const };
  });
}

const author = alias(users, "author");

/** A designs-list row (the current revision's pair and author), plus any extra columns, for both list queries. */
function listedDesigns<X extends Record<string, SQL.Aliased | SQL>>(db: Awaited<ReturnType<typeof getDb>>, extra: X) {
  return db
    .select({
      id: designs.id,
      name: designs.name,
      project: designs.project,
      status: designs.status,
      revision: designs.revision,
      updatedAt: designs.updatedAt,
      authorName: author.name,
      // A pair's shunt and gain, or (for a range plan) how many ranges it has.
      shuntOhms: sql<number | null>`(${designRevisions.choice}->>'shuntOhms')::float8`,
      gain: sql<number | null>`(${designRevisions.choice}->>'gain')::float8`,
      planRanges: sql<number | null>`jsonb_array_length(${designRevisions.plan}->'ranges')`,
      ...extra,
    })
    .from(designs)
    .innerJoin(
      designRevisions,
      and(eq(designRevisions.designId, designs.id), eq(designRevisions.revision, designs.revision)),
    )
    .innerJoin(author, eq(author.id, designRevisions.authorId))
    .$dynamic();
}

/** The team's designs, newest change first; makers see approved ones only. */
export async function listDesigns(teamId: string, opts: { approvedOnly?: boolean } = {}) {
  const db = await getDb();
  const where = opts.approvedOnly
    ? and(eq(designs.teamId, teamId), eq(designs.status, "approved"))
    : eq(designs.teamId, teamId);
  const rows = await listedDesigns(db, {}).where(where).orderBy(desc(designs.updatedAt), desc(designs.id));
  return rows.map((r) => ({ ...r, updatedAt: r.updatedAt.toISOString() }));
}

/**
 * A position in the designs list: the last row's `updated_at` as PostgreSQL writes it (microseconds
 * kept, which a JS Date would round away) and its id, the tie-breaker.
 */
export type DesignListKey = { updatedAt: string; id: string };

export type DesignListQuery = {
  approvedOnly?: boolean;
  status?: DesignStatus;
  /** Matched anywhere in the name or the project, case-insensitively. */
  q?: string;
  limit: number;
  after?: DesignListKey;
};

/** `q` as a literal ILIKE pattern: its own %, _ and \ match themselves. */
const containsPattern = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/**
 * One page of the team's designs, newest change first, by keyset: rows strictly after `after` in
 * (updated_at desc, id desc), read along the index designs_team_updated (or designs_team_status_updated
 * when filtered by status), so a page costs the same at row 10 as at row 10,000 and designs added
 * meanwhile (newer, so before the first page) shift nothing.
 */
export async function pageDesigns(teamId: string, opts: DesignListQuery) {
  const db = await getDb();
  const status = opts.approvedOnly ? "approved" : opts.status;
  const where: (SQL | undefined)[] = [eq(designs.teamId, teamId)];
  if (opts.approvedOnly && opts.status && opts.status !== "approved") return { designs: [], next: null };
  if (status) where.push(eq(designs.status, status));
  if (opts.q) {
    const pattern = containsPattern(opts.q);
    where.push(or(ilike(designs.name, pattern), ilike(designs.project, pattern)));
  }
  if (opts.after) {
    where.push(
      sql`(${designs.updatedAt}, ${designs.id}) < (${opts.after.updatedAt}::timestamptz, ${opts.after.id}::uuid)`,
    );
  }
  const rows = await listedDesigns(db, {
    sortKey: sql<string>`to_char(${designs.updatedAt} at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"')`,
  })
    .where(and(...where))
    .orderBy(desc(designs.updatedAt), desc(designs.id))
    .limit(opts.limit + 1);
  const more = rows.length > opts.limit;
  const page = more ? rows.slice(0, opts.limit) : rows;
  const last = page.at(-1);
  return {
    designs: page.map(({ sortKey: _key, ...r }) => ({ ...r, updatedAt: r.updatedAt.toISOString() })),
    next: more && last ? { updatedAt: last.sortKey, id: last.id } : null,
  };
}

/** Designs, each with its current revision and that revision's author's name, plus any extra columns. */
const designsWithCurrent = <X extends Record<string, SQL.Aliased | SQL>>(
  db: Awaited<ReturnType<typeof getDb>>,
  extra: X,
) =>
  db
    .select({ design: designs, current: designRevisions, authorName: author.name, ...extra })
    .from(designs)
    .innerJoin(
      designRevisions,
      and(eq(designRevisions.designId, designs.id), eq(designRevisions.revision, designs.revision)),
    )
    .innerJoin(author, eq(author.id, designRevisions.authorId))
    .$dynamic();

/** The design with its current revision, scoped by team: another team's design is null. */
export async function getDesign(designId: string, teamId: string) {
  if (!isUuid(designId)) return null;
  const rows = await designsWithCurrent(await getDb(), {})
    .where(and(eq(designs.id, designId), eq(designs.teamId, teamId)))
    .limit(1);
  return rows[0] ?? null;
}

export type ApprovalInfo = { revision: number; byName: string; byId: string; at: string };

const approver = alias(users, "approver");

/**
 * The approval given on each revision row, joined in the same read as the revisions: the latest
 * "approve" review on that design and revision (each approval belongs to the revision it was given
 * on), or nulls. Uses the reviews (design, revision) index once per revision.
 */
const approvalOnRevision = (db: Awaited<ReturnType<typeof getDb>>) =>
  db
    .select({ byName: approver.name, byId: approver.id, at: reviews.createdAt })
    .from(reviews)
    .innerJoin(approver, eq(approver.id, reviews.authorId))
    .where(
      and(
        eq(reviews.designId, designRevisions.designId),
        eq(reviews.revision, designRevisions.revision),
        eq(reviews.verdict, "approve"),
      ),
    )
    .orderBy(desc(reviews.createdAt))
    .limit(1)
    .as("approval");

/** The approval columns of a row read with approvalOnRevision, as the screens take it. */
function approvalOf(revision: number, a: { byName: string; byId: string; at: Date } | null): ApprovalInfo | null {
  return a ? { revision, byName: a.byName, byId: a.byId, at: a.at.toISOString() } : null;
}

/** A revision's head: what a list of revisions shows, without its requirement and figures. */
const revisionHead = {
  revision: designRevisions.revision,
  name: designRevisions.name,
  choice: designRevisions.choice,
  plan: designRevisions.plan,
  authorId: designRevisions.authorId,
  authorName: users.name,
  createdAt: designRevisions.createdAt,
};

/** The design's revisions: all, or the numbers in `only`. */
const revisionsOf = (designId: string, only?: number[]) =>
  only
    ? and(eq(designRevisions.designId, designId), inArray(designRevisions.revision, only))
    : eq(designRevisions.designId, designId);

/**
 * Revisions of a design with their requirement and figures, oldest first; all of them, or only the
 * numbers in `only` (a diff needs two, not fifty). Assumes the design was scoped already.
 */
export async function listRevisions(designId: string, only?: number[]) {
  const db = await getDb();
  const approval = approvalOnRevision(db);
  const rows = await db
    .select({
      ...revisionHead,
      requirement: designRevisions.requirement,
      metrics: designRevisions.metrics,
      approval: { byName: approval.byName, byId: approval.byId, at: approval.at },
    })
    .from(designRevisions)
    .innerJoin(users, eq(users.id, designRevisions.authorId))
    .leftJoinLateral(approval, sql`true`)
    .where(revisionsOf(designId, only))
    .orderBy(asc(designRevisions.revision));
  return rows.map(({ choice, plan, metrics, approval: given, ...r }) => ({
    ...r,
    ...designKindOf({ choice, plan, metrics }),
    requirement: revisionRequirement(designId, r.revision, r.requirement),
    createdAt: r.createdAt.toISOString(),
    approval: approvalOf(r.revision, given),
  }));
}
export type RevisionRecord = Awaited<ReturnType<typeof listRevisions>>[number];

/** A stored revision's pair or plan, told apart: exactly one of the two is set (a check constraint says so). */
const pairOrPlan = (choice: Choice | null, plan: PlanChoice | null) =>
  plan ? { kind: "plan" as const, choice: null, plan } : { kind: "pair" as const, choice: choice!, plan: null };

/** What today's model needs to re-check a revision: its requirement and its pair or plan. */
export type RevisionBasisRow = { designId: string; revision: number; requirement: Requirement } & (
  { kind: "pair"; choice: Choice; plan: null } | { kind: "plan"; choice: null; plan: PlanChoice }
);

/** The requirement and the pair or plan of each revision asked for, in one read; missing ones are left out. */
export async function revisionBasesOf(keys: { designId: string; revision: number }[]): Promise<RevisionBasisRow[]> {
  const asked = keys.filter((k) => isUuid(k.designId) && Number.isInteger(k.revision));
  if (asked.length === 0) return [];
  const db = await getDb();
  const pairs = sql.join(
    asked.map((k) => sql`(${k.designId}::uuid, ${k.revision}::int)`),
    sql`, `,
  );
  const rows = await db
    .select({
      designId: designRevisions.designId,
      revision: designRevisions.revision,
      requirement: designRevisions.requirement,
      choice: designRevisions.choice,
      plan: designRevisions.plan,
    })
    .from(designRevisions)
    .where(sql`(${designRevisions.designId}, ${designRevisions.revision}) in (${pairs})`);
  return rows.map((r): RevisionBasisRow => ({
    designId: r.designId,
    revision: r.revision,
    requirement: revisionRequirement(r.designId, r.revision, r.requirement),
    ...pairOrPlan(r.choice, r.plan),
  }));
}

/**
 * The head of every revision (number, name, author, time, choice, approval), oldest first: a design
 * page lists fifty revisions, and parsing and shipping fifty requirements and candidate records
 * cost more than the rest of the page.
 */
export async function listRevisionHeads(designId: string) {
  return (await revisionHeadsOfEach([designId])).get(designId) ?? [];
}

/** The heads of several designs' revisions, each with its approval, in one read whatever their number, by design. */
async function revisionHeadsOfEach(designIds: string[]) {
  const db = await getDb();
  const approval = approvalOnRevision(db);
  const rows = await db
    .select({
      ...revisionHead,
      designId: designRevisions.designId,
      approval: { byName: approval.byName, byId: approval.byId, at: approval.at },
    })
    .from(designRevisions)
    .innerJoin(users, eq(users.id, designRevisions.authorId))
    .leftJoinLateral(approval, sql`true`)
    .where(inArray(designRevisions.designId, designIds))
    .orderBy(asc(designRevisions.designId), asc(designRevisions.revision));
  const heads = rows.map(({ choice, plan, designId, approval: given, ...r }) => ({
    designId,
    head: {
      ...r,
      ...pairOrPlan(choice, plan),
      createdAt: r.createdAt.toISOString(),
      approval: approvalOf(r.revision, given),
    },
  }));
  const out = new Map(designIds.map((id) => [id, [] as (typeof heads)[number]["head"][]]));
  for (const { designId, head } of heads) out.get(designId)?.push(head);
  return out;
}
export type RevisionHead = Awaited<ReturnType<typeof listRevisionHeads>>[number];

/** A revision head as headsJson reads it: timestamps as PostgreSQL's JSON text. */
type HeadJson = Omit<RevisionHead, "kind" | "createdAt" | "approval"> & {
  createdAt: string;
  approval: { byName: string; byId: string; at: string } | null;
};

const head = alias(designRevisions, "head");
const headAuthor = alias(users, "head_author");
const approving = alias(reviews, "approving");

/**
 * The heads of the outer row's design, oldest first, each with its approval (as approvalOnRevision
 * picks it), as one JSON array: the design and its revisions in one query, since each query costs
 * PGlite more than its plan and rows.
 */
// (An alias interpolated into sql`` prints its name only; the FROM spells out table and alias.)
const headsJson = sql<HeadJson[]>`(select coalesce(json_agg(json_build_object(
    'revision', ${head.revision}, 'name', ${head.name}, 'choice', ${head.choice}, 'plan', ${head.plan},
    'authorId', ${head.authorId}, 'authorName', ${headAuthor.name}, 'createdAt', ${head.createdAt},
    'approval', (select json_build_object('byName', ${approver.name}, 'byId', ${approver.id}, 'at', ${approving.createdAt})
      from ${reviews} ${sql.identifier("approving")} join ${users} ${sql.identifier("approver")} on ${approver.id} = ${approving.authorId}
      where ${approving.designId} = ${head.designId} and ${approving.revision} = ${head.revision} and ${approving.verdict} = 'approve'
      order by ${approving.createdAt} desc limit 1)
  ) order by ${head.revision}), '[]'::json)
  from ${designRevisions} ${sql.identifier("head")} join ${users} ${sql.identifier("head_author")} on ${headAuthor.id} = ${head.authorId} where ${head.designId} = ${designs.id})`;

/** A head of headsJson as revisionHeadsOfEach reads it. */
function headFromJson({ choice, plan, createdAt, approval, ...r }: HeadJson): RevisionHead {
  return {
    ...r,
    ...pairOrPlan(choice, plan),
    createdAt: new Date(createdAt).toISOString(),
    approval: approval && approvalOf(r.revision, { ...approval, at: new Date(approval.at) }),
  };
}

/**
 * Designs with their current revision, its author's name and every revision's head (plus any
 * extra columns), in one query.
 */
export const designsWithHeads = <X extends Record<string, SQL.Aliased | SQL>>(
  db: Awaited<ReturnType<typeof getDb>>,
  extra: X,
) => designsWithCurrent(db, { heads: headsJson, ...extra });

/** A row of designsWithHeads as the screens see it, with its heads. */
export function designWithHeadsOf(row: {
  design: typeof designs.$inferSelect;
  current: typeof designRevisions.$inferSelect;
  authorName: string;
  heads: HeadJson[];
}): { view: DesignView; heads: RevisionHead[] } {
  const heads = row.heads.map(headFromJson);
  return { view: designViewOf(row, heads), heads };
}

/** The saved design as the screens see it, or null when it is not this team's. */
export async function getDesignView(designId: string, teamId: string): Promise<DesignView | null> {
  return (await getDesignWithHeads(designId, teamId))?.view ?? null;
}

/** The design as the screens see it and the heads of its revisions, in one query, for a page that shows both. */
export async function getDesignWithHeads(
  designId: string,
  teamId: string,
): Promise<{ view: DesignView; heads: RevisionHead[] } | null> {
  if (!isUuid(designId)) return null;
  const [row] = await designsWithHeads(await getDb(), {})
    .where(and(eq(designs.id, designId), eq(designs.teamId, teamId)))
    .limit(1);
  return row ? designWithHeadsOf(row) : null;
}

// The ids as one array parameter: one text, so one kept statement, however many designs are asked.
const designViews = preparedOnce((db) =>
  designsWithHeads(db, {})
    .where(
      and(sql`${designs.id} = any(${sql.placeholder("ids")}::uuid[])`, eq(designs.teamId, sql.placeholder("teamId"))),
    )
    .prepare("design_views"),
);

/**
 * Several designs as the screens see them, in the order asked, null where one is not this team's
 * (or the id is not one): one query however many designs, for the compare page.
 */
export async function getDesignViews(designIds: string[], teamId: string): Promise<(DesignView | null)[]> {
  const ids = [...new Set(designIds.filter(isUuid))];
  if (ids.length === 0) return designIds.map(() => null);
  const rows = await designViews(await getDb()).execute({ ids, teamId });
  const views = new Map(rows.map((r) => [r.design.id, designWithHeadsOf(r).view]));
  return designIds.map((id) => views.get(id) ?? null);
}

export function designViewOf(
  { design, current, authorName }: NonNullable<Awaited<ReturnType<typeof getDesign>>>,
  revisions: RevisionHead[],
): DesignView {
  const approval = revisions.find((r) => r.revision === design.revision)?.approval ?? null;
  return {
    id: design.id,
    name: design.name,
    project: design.project,
    status: design.status,
    revision: design.revision,
    requirement: revisionRequirement(design.id, current.revision, current.requirement),
    ...designKindOf(current),
    authorId: current.authorId,
    authorName,
    updatedAt: design.updatedAt.toISOString(),
    approval:
      approval && design.status === "approved"
        ? { byName: approval.byName, at: approval.at, revision: approval.revision }
        : null,
    revisions: revisions.map((r) => ({ revision: r.revision, authorName: r.authorName, createdAt: r.createdAt })),
  };
}

export type ReviseInput = SavedFigures & {
  designId: string;
  teamId: string;
  userId: string;
  /** The revision the caller was editing: the write happens only if it is still the current one. */
  expectedRevision: number;
  name: string;
  project: string | null;
  changed: string[];
};

export type ReviseResult =
  { ok: true; revision: number } | { ok: false; reason: "not-found" | "conflict"; message: string };

/** Writes a new revision in draft, or nothing at all when the caller's revision is stale. */
export async function reviseDesign(input: ReviseInput): Promise<ReviseResult> {
  if (!isUuid(input.designId)) return { ok: false, reason: "not-found", message: "That design was not found." };
  const db = await getDb();
  return db.transaction(async (tx) => {
    const updated = await tx
      .update(designs)
      .set({
        revision: sql`${designs.revision} + 1`,
        status: "draft",
        name: input.name,
        project: input.project,
        updatedAt: sql`now()`,
      })
      .where(
        and(
          eq(designs.id, input.designId),
          eq(designs.teamId, input.teamId),
          eq(designs.revision, input.expectedRevision),
        ),
      )
      .returning({ revision: designs.revision, status: designs.status });
    const row = updated[0];
    if (!row) {
      const exists = await tx
        .select({ revision: designs.revision })
        .from(designs)
        .where(and(eq(designs.id, input.designId), eq(designs.teamId, input.teamId)));
      if (!exists[0]) return { ok: false, reason: "not-found", message: "That design was not found." } as const;
      return {
        ok: false,
        reason: "conflict",
        message: `Someone else saved this design first: it is at revision ${exists[0].revision}, you edited revision ${input.expectedRevision}. Nothing was saved; reload to see their changes.`,
      } as const;
    }
    await insertRevision(tx, input.designId, row.revision, input);
    await recordAudit(
      {
        teamId: input.teamId,
        actorId: input.userId,
        action: "design.revised",
        targetType: "design",
        targetId: input.designId,
        details: { from: input.expectedRevision, revision: row.revision, changed: input.changed, status: "draft" },
      },
      tx,
    );
    return { ok: true, revision: row.revision } as const;
  });
}

export type StatusChange = { ok: true } | { ok: false; reason: "not-found" | "conflict"; message: string };

/**
 * Moves a design to `to` only if it is still at `revision` and in one of `from`; audited with the
 * change. Refuses (conflict) when someone changed it meanwhile.
 */
export async function changeDesignStatus(input: {
  designId: string;
  teamId: string;
  actorId: string;
  revision: number;
  from: readonly DesignStatus[];
  to: DesignStatus;
  action: string;
  details?: Record<string, unknown>;
  tx?: Tx;
}): Promise<StatusChange> {
  const run = async (tx: Tx): Promise<StatusChange> => {
    const updated = await tx
      .update(designs)
      .set({ status: input.to, updatedAt: sql`now()` })
      .where(
        and(
          eq(designs.id, input.designId),
          eq(designs.teamId, input.teamId),
          eq(designs.revision, input.revision),
          sql`${designs.status} in (${sql.join(
            input.from.map((s) => sql`${s}`),
            sql`, `,
          )})`,
        ),
      )
      .returning({ id: designs.id });
    if (!updated[0])
      return {
        ok: false,
        reason: "conflict",
        message: "The design changed while you were looking at it; reload and try again.",
      };
    await recordAudit(
      {
        teamId: input.teamId,
        actorId: input.actorId,
        action: input.action,
        targetType: "design",
        targetId: input.designId,
        details: { revision: input.revision, to: input.to, ...input.details },
      },
      tx,
    );
    return { ok: true };
  };
  if (input.tx) return run(input.tx);
  const db = await getDb();
  return db.transaction(run);
}
