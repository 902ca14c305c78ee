// What a design's page shows from the database, in one query: the design, its current revision,
// every revision's head, its reviews and its audit trail, and the team's parts library. Each query costs PGlite a fixed amount
// well above these rows' plan and transfer, and the page made five of them.
import { and, eq, sql } from "drizzle-orm";
import type { DesignView } from "@/lib/design-view";
import { getDb } from "../client";
import { designs } from "../schema";
import { targetAuditFromJson, targetAuditJson, type TargetAuditRecord } from "./audit";
import { designsWithHeads, designWithHeadsOf, isUuid, type RevisionHead } from "./designs";
import { libraryOf, teamLibraryColumns, type LibraryJson } from "./library";
import { preparedOnce } from "./prepared";
import { reviewFromJson, reviewsJson, type ReviewRecord } from "./reviews";

const designPage = preparedOnce((db) =>
  designsWithHeads(db, {
    reviews: reviewsJson(sql`${designs.id}`),
    audit: targetAuditJson(sql`${sql.placeholder("teamId")}`, "design", sql`${designs.id}::text`),
    ...teamLibraryColumns(),
  })
    .where(and(eq(designs.id, sql.placeholder("designId")), eq(designs.teamId, sql.placeholder("teamId"))))
    .limit(1)
    .prepare("design_page"),
);

export type DesignPageData = {
  view: DesignView;
  heads: RevisionHead[];
  reviews: ReviewRecord[];
  audit: TargetAuditRecord[];
  /** The team's parts library, as listLibrary reads it (a pair's build sheet names its parts from it). */
  library: LibraryJson;
};

/**
 * The design (scoped by team; null when it is not this team's or the id is not a UUID) with the
 * same heads as getDesignWithHeads, reviews as listReviews, audit as listTargetAudit and library as
 * listLibrary read.
 * Reviews and audit are read before the caller's right to the design is checked: the page drops
 * them with the design when the policy says no.
 */
export async function getDesignPage(designId: string, teamId: string): Promise<DesignPageData | null> {
  if (!isUuid(designId)) return null;
  const [row] = await designPage(await getDb()).execute({ designId, teamId });
  if (!row) return null;
  return {
    ...designWithHeadsOf(row),
    reviews: row.reviews.map(reviewFromJson),
    audit: row.audit.map(targetAuditFromJson),
    library: libraryOf(row),
  };
}
