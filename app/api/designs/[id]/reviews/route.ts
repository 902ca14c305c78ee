import { z } from "zod";
import { listRevisions } from "@/db/queries/designs";
import { addReview, listReviews } from "@/db/queries/reviews";
import { verdictEnum } from "@/db/schema";
import { apiRoute, assertRole } from "@/lib/auth/gate";
import { HttpError, json } from "@/lib/http";
import { designFor } from "@/lib/saved-designs/access";
import { mailReviewed } from "@/lib/saved-designs/notify";

const verdicts = verdictEnum.enumValues;
const body = z
  .object({
    verdict: z.enum(verdicts, { error: `verdict must be one of: ${verdicts.join(", ")}` }),
    body: z
      .string({ error: "body: expected text" })
      .max(10_000, { error: "body: at most 10000 characters" })
      .default(""),
    parentId: z.uuid({ error: "parentId: expected the id of a comment on this design" }).nullish(),
    revision: z.number().int().min(1).optional(),
  })
  .superRefine((v, ctx) => {
    if (v.verdict !== "approve" && !v.body.trim())
      ctx.addIssue({
        code: "custom",
        path: ["body"],
        message: v.verdict === "return" ? "Say why the design goes back" : "A comment needs some text",
      });
    if (v.verdict !== "comment" && v.parentId)
      ctx.addIssue({
        code: "custom",
        path: ["parentId"],
        message: "Only comments are replies; a verdict stands on its own",
      });
  });

export const GET = apiRoute({ doing: "read reviews" }, async ({ caller, params }) => {
  const { design } = await designFor(caller, params.id ?? "");
  return { id: design.id, revision: design.revision, status: design.status, reviews: await listReviews(design.id) };
});

/** approve / return (owners and reviewers, never the revision's author, only in review) or comment (anyone). */
export const POST = apiRoute({ doing: "review designs", body }, async ({ caller, params, body }) => {
  const { design, current } = await designFor(caller, params.id ?? "");
  if (body.verdict !== "comment") assertRole(caller, ["owner", "reviewer"], `${body.verdict} designs`);
  const result = await addReview({
    designId: design.id,
    teamId: caller.teamId,
    actorId: caller.userId,
    verdict: body.verdict,
    body: body.body.trim(),
    revision: body.revision ?? design.revision,
    parentId: body.parentId ?? null,
  });
  if (!result.ok) throw new HttpError(result.status, result.message, result.fieldErrors);
  const reviews = await listReviews(design.id);
  const parent = body.parentId ? reviews.find((r) => r.id === body.parentId) : undefined;
  const revAuthor = (await listRevisions(design.id)).find((r) => r.revision === result.revision)?.authorId;
  const recipients = [revAuthor ?? current.authorId, parent?.authorId].filter((x): x is string => !!x);
  const mailed = await mailReviewed(
    caller.teamId,
    caller,
    {
      id: design.id,
      name: design.name,
      project: design.project,
      revision: design.revision,
      choice: current.choice,
      metrics: current.metrics,
    },
    { verdict: body.verdict, body: body.body, revision: result.revision },
    recipients,
  );
  return json({ id: result.id, revision: result.revision, status: result.status, mailed }, 201);
});
