import { z } from "zod";
import { changeDesignStatus } from "@/db/queries/designs";
import { apiRoute } from "@/lib/auth/gate";
import { HttpError } from "@/lib/http";
import { designFor } from "@/lib/saved-designs/access";
import { mailSubmitted } from "@/lib/saved-designs/notify";

const body = z.object({ revision: z.number().int().min(1).optional() });

/** draft or returned → in-review; mails the team's reviewers. */
export const POST = apiRoute(
  { roles: ["owner", "designer"], doing: "submit designs for review", body },
  async ({ caller, params, body }) => {
    const { design, current } = await designFor(caller, params.id ?? "");
    if (body.revision !== undefined && body.revision !== design.revision)
      throw new HttpError(
        409,
        `The design is at revision ${design.revision} now, not ${body.revision}; reload before submitting.`,
      );
    if (design.status === "in-review") throw new HttpError(409, "The design is already in review.");
    if (design.status === "approved")
      throw new HttpError(
        409,
        `Revision ${design.revision} is already approved; edit the design to start a new revision.`,
      );
    const changed = await changeDesignStatus({
      designId: design.id,
      teamId: caller.teamId,
      actorId: caller.userId,
      revision: design.revision,
      from: ["draft", "returned"],
      to: "in-review",
      action: "design.submitted",
    });
    if (!changed.ok) throw new HttpError(changed.status, changed.message);
    const mailed = await mailSubmitted(caller.teamId, caller, {
      id: design.id,
      name: design.name,
      project: design.project,
      revision: design.revision,
      choice: current.choice,
      metrics: current.metrics,
    });
    return { id: design.id, revision: design.revision, status: "in-review", mailed };
  },
);
