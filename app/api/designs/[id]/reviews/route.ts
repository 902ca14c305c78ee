import { listRevisions } from "@/db/queries/designs";
import { addReview, listReviews } from "@/db/queries/reviews";
import { apiRoute, authorize } from "@/lib/auth/gate";
import { HttpError, json, refused } from "@/lib/http";
import { designFor } from "@/lib/saved-designs/access";
import { designRefOf, mailReviewed } from "@/lib/saved-designs/notify";
import { reviewBodySchema } from "@/lib/route-schemas";

export const GET = apiRoute({ action: "design.read", doing: "read reviews" }, async ({ caller, params }) => {
  const { design } = await designFor(caller, params.id ?? "");
  return { id: design.id, revision: design.revision, status: design.status, reviews: await listReviews(design.id) };
});

/** approve / return (owners and reviewers, never the revision's author, only in review) or comment (anyone). */
export const POST = apiRoute(
  { action: "design.comment", doing: "review designs", body: reviewBodySchema },
  async ({ caller, params, body }) => {
    const { design, current } = await designFor(caller, params.id ?? "");
    if (body.verdict !== "comment") {
      authorize(caller, "design.judge", { doing: `${body.verdict} designs` });
      // A verdict goes on the current revision (addReview refuses any other with 409), whose author
      // may not judge it.
      if ((body.revision ?? design.revision) === design.revision) {
        authorize(
          caller,
          "design.judge",
          { refusal: "You wrote this revision: its verdict must come from another reviewer or owner." },
          { authorId: current.authorId },
        );
      }
    }
    const result = await addReview({
      designId: design.id,
      teamId: caller.teamId,
      actorId: caller.userId,
      verdict: body.verdict,
      body: body.body.trim(),
      revision: body.revision ?? design.revision,
      parentId: body.parentId ?? null,
    });
    if (!result.ok) throw refused(result);
    const reviews = await listReviews(design.id);
    const parent = body.parentId ? reviews.find((r) => r.id === body.parentId) : undefined;
    const revAuthor = (await listRevisions(design.id, [result.revision]))[0]?.authorId;
    const recipients = [revAuthor ?? current.authorId, parent?.authorId].filter((x): x is string => !!x);
    const mailed = await mailReviewed(
      caller.teamId,
      caller,
      designRefOf(design, current),
      { verdict: body.verdict, body: body.body, revision: result.revision },
      recipients,
    );
    return json({ id: result.id, revision: result.revision, status: result.status, mailed }, 201);
  },
);
