import { listRevisionHeads, reviseDesign } from "@/db/queries/designs";
import { listReviews } from "@/db/queries/reviews";
import { apiRoute } from "@/lib/auth/gate";
import { HttpError, refused } from "@/lib/http";
import { designFor } from "@/lib/saved-designs/access";
import { savedDesignFigures } from "@/lib/saved-designs/bench";
import { changedFields } from "@/lib/saved-designs/diff";
import { evaluatePicked, patchDesignSchema, pickedOf } from "@/lib/saved-designs/service";

export const GET = apiRoute({ action: "design.read", doing: "open designs" }, async ({ caller, params }) => {
  const { design, current, authorName } = await designFor(caller, params.id ?? "");
  const revisions = await listRevisionHeads(design.id);
  const approval = revisions.find((r) => r.revision === design.revision)?.approval ?? null;
  return {
    id: design.id,
    name: design.name,
    project: design.project,
    status: design.status,
    revision: design.revision,
    requirement: current.requirement,
    ...savedDesignFigures(current),
    authorId: current.authorId,
    authorName,
    createdAt: design.createdAt.toISOString(),
    updatedAt: design.updatedAt.toISOString(),
    approval: design.status === "approved" ? approval : null,
    revisions: revisions.map((r) => ({
      revision: r.revision,
      name: r.name,
      authorName: r.authorName,
      createdAt: r.createdAt,
      kind: r.kind,
      ...(r.kind === "plan" ? { plan: r.plan } : { choice: r.choice }),
      approval: r.approval,
    })),
    reviews: await listReviews(design.id),
  };
});

export const PATCH = apiRoute({ action: "design.edit", body: patchDesignSchema }, async ({ caller, body, params }) => {
  const { design, current } = await designFor(caller, params.id ?? "");
  if (body.revision !== design.revision) {
    throw new HttpError(
      409,
      `Someone else saved this design first: it is at revision ${design.revision}, you edited revision ${body.revision}. Nothing was saved; reload to see their changes.`,
    );
  }
  if (
    body.name === undefined &&
    body.project === undefined &&
    body.requirement === undefined &&
    body.choice === undefined &&
    body.plan === undefined
  ) {
    throw new HttpError(422, "Nothing to change: send name, project, requirement, choice or plan.", {
      "(body)": ["send at least one of name, project, requirement, choice, plan"],
    });
  }
  // A body's own choice or plan wins (either kind may become the other); else the saved one is re-evaluated.
  // A requirement in the body is the client's; else the saved one is re-read as stored.
  const evaluated = evaluatePicked(
    body.requirement ?? current.requirement,
    body.plan !== undefined || body.choice !== undefined
      ? pickedOf(body)
      : pickedOf({ choice: current.choice ?? undefined, plan: current.plan ?? undefined }),
    body.requirement === undefined ? "stored" : "input",
  );
  const name = body.name ?? design.name;
  const project = body.project === undefined ? design.project : (body.project ?? null);
  const changed = changedFields(
    {
      name: design.name,
      project: design.project,
      requirement: current.requirement,
      choice: current.choice,
      plan: current.plan,
    },
    { name, project, requirement: evaluated.requirement, choice: evaluated.choice, plan: evaluated.plan },
  );
  // API v2: a PATCH that changes nothing (a rename to the same name included) makes no revision.
  if (changed.length === 0) return { revision: design.revision, unchanged: true };
  const result = await reviseDesign({
    ...evaluated,
    designId: design.id,
    teamId: caller.teamId,
    userId: caller.userId,
    expectedRevision: body.revision,
    name,
    project,
    changed,
  });
  if (!result.ok) throw refused(result);
  return { revision: result.revision };
});
