// Review comments and verdicts. A verdict and the status change it makes commit together, and
// only while the design is still in review at the revision the reviewer saw.
import { and, asc, eq, sql, type SQL } from "drizzle-orm";
import { getDb } from "../client";
import { designRevisions, designs, reviews, users, type Verdict } from "../schema";
import { recordAudit } from "./audit";
import { changeDesignStatus } from "./designs";

const reviewColumns = {
  id: reviews.id,
  revision: reviews.revision,
  verdict: reviews.verdict,
  body: reviews.body,
  parentId: reviews.parentId,
  authorId: reviews.authorId,
  authorName: users.name,
  createdAt: reviews.createdAt,
};

/** A design's comments and verdicts, oldest first. */
export async function listReviews(designId: string) {
  const db = await getDb();
  const rows = await db
    .select(reviewColumns)
    .from(reviews)
    .innerJoin(users, eq(users.id, reviews.authorId))
    .where(eq(reviews.designId, designId))
    .orderBy(asc(reviews.createdAt), asc(reviews.id));
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() }));
}
export type ReviewRecord = Awaited<ReturnType<typeof listReviews>>[number];

/**
 * listReviews as one JSON array column of another query (the design page reads its design,
 * revisions, reviews and audit in one query): the same rows in the same order.
 */
export function reviewsJson(designId: SQL) {
  const pairs = Object.entries(reviewColumns).flatMap(([key, column]) => [sql.raw(`'${key}'`), column]);
  return sql<
    ReviewRecord[]
  >`(select coalesce(json_agg(json_build_object(${sql.join(pairs, sql`, `)}) order by ${reviews.createdAt}, ${reviews.id}), '[]'::json)
    from ${reviews} join ${users} on ${users.id} = ${reviews.authorId} where ${reviews.designId} = ${designId})`;
}

/** A row of reviewsJson as listReviews reads it (the JSON's timestamp is PostgreSQL's text, not ISO). */
export const reviewFromJson = (row: ReviewRecord): ReviewRecord => ({
  ...row,
  createdAt: new Date(row.createdAt).toISOString(),
});

export type AddReviewInput = {
  designId: string;
  teamId: string;
  actorId: string;
  verdict: Verdict;
  body: string;
  /** The revision commented on; verdicts always go to the current revision. */
  revision: number;
  parentId?: string | null;
};

export type AddReviewResult =
  | { ok: true; id: string; revision: number; status: string }
  | {
      ok: false;
      reason: "not-found" | "conflict" | "invalid";
      message: string;
      fieldErrors?: Record<string, string[]>;
    };

export async function addReview(input: AddReviewInput): Promise<AddReviewResult> {
  const db = await getDb();
  return db.transaction(async (tx): Promise<AddReviewResult> => {
    const [design] = await tx
      .select({ status: designs.status, revision: designs.revision })
      .from(designs)
      .where(and(eq(designs.id, input.designId), eq(designs.teamId, input.teamId)))
      .for("update");
    if (!design) return { ok: false, reason: "not-found", message: "That design was not found in your team." } as const;
    let revision = input.revision;
    if (input.parentId) {
      const [parent] = await tx
        .select({ revision: reviews.revision })
        .from(reviews)
        .where(and(eq(reviews.id, input.parentId), eq(reviews.designId, input.designId)));
      if (!parent)
        return {
          ok: false,
          reason: "invalid",
          message: "The comment you reply to is not on this design.",
          fieldErrors: { parentId: ["is not a comment on this design"] },
        } as const;
      revision = parent.revision;
    }
    const [rev] = await tx
      .select({ authorId: designRevisions.authorId })
      .from(designRevisions)
      .where(and(eq(designRevisions.designId, input.designId), eq(designRevisions.revision, revision)));
    if (!rev)
      return {
        ok: false,
        reason: "invalid",
        message: `This design has no revision ${revision}.`,
        fieldErrors: { revision: [`no revision ${revision}`] },
      } as const;
    let status: string = design.status;
    if (input.verdict !== "comment") {
      if (revision !== design.revision)
        return {
          ok: false,
          reason: "conflict",
          message: `A verdict goes on the current revision (${design.revision}); you looked at revision ${revision}. Reload and review the current one.`,
        } as const;
      if (design.status !== "in-review")
        return {
          ok: false,
          reason: "conflict",
          message: `The design is ${design.status}, not in-review: a verdict is given only while it is in review.`,
        } as const;
      const to = input.verdict === "approve" ? "approved" : "returned";
      const changed = await changeDesignStatus({
        designId: input.designId,
        teamId: input.teamId,
        actorId: input.actorId,
        revision,
        from: ["in-review"],
        to,
        action: input.verdict === "approve" ? "design.approved" : "design.returned",
        details: input.body ? { reason: input.body.slice(0, 500) } : {},
        tx,
      });
      if (!changed.ok) return changed;
      status = to;
    }
    const [row] = await tx
      .insert(reviews)
      .values({
        designId: input.designId,
        revision,
        authorId: input.actorId,
        verdict: input.verdict,
        body: input.body,
        parentId: input.parentId ?? null,
      })
      .returning({ id: reviews.id });
    if (!row) throw new Error("review not stored");
    if (input.verdict === "comment") {
      await recordAudit(
        {
          teamId: input.teamId,
          actorId: input.actorId,
          action: "design.commented",
          targetType: "design",
          targetId: input.designId,
          details: { revision, reviewId: row.id, reply: !!input.parentId },
        },
        tx,
      );
    }
    return { ok: true, id: row.id, revision, status } as const;
  });
}
