import { deleteProfile, getProfile, profileUploader } from "@/db/queries/profiles";
import { apiRoute, authorize } from "@/lib/auth/gate";
import { designViewFor } from "@/lib/saved-designs/access";
import { profileWindowQuery } from "@/lib/route-schemas";
import { HttpError } from "@/lib/http";
import { isUuid } from "@/lib/ids";
import { clipCurrent, decimateMinMax, judgeRecording, planSeriesOverlay } from "@/lib/profile";

const profileNotFound = () => new HttpError(404, "That profile was not found on this design.");

function profileIdOf(raw: string | undefined): string {
  if (!raw || !isUuid(raw)) throw profileNotFound();
  return raw;
}

/**
 * One profile: the summary stored at upload, the summary against the design's current revision, and
 * the series decimated to `width` pixel columns over `from`..`to` seconds (the whole recording by default).
 * On a range plan the series also says which range each stretch was read on and the load voltage
 * through the path in use.
 */
export const GET = apiRoute(
  { action: "design.read", doing: "read current profiles", query: profileWindowQuery },
  async ({ caller, params, query }) => {
    const design = await designViewFor(caller, params.id ?? "");
    const profile = await getProfile(design.id, profileIdOf(params.profileId));
    if (!profile) throw profileNotFound();
    const { timesS, currentsA, ...item } = profile;
    const judged = judgeRecording(design, timesS, currentsA);
    const span = { fromS: query.from, toS: query.to, width: query.width };
    const head = {
      ...item,
      startS: timesS[0],
      endS: timesS[timesS.length - 1],
      current: {
        revision: design.revision,
        summary: item.revision === design.revision ? item.summary : judged.summary,
      },
    };
    if (judged.kind === "pair") {
      const series = decimateMinMax(timesS, currentsA, {
        ...span,
        clipA: clipCurrent(judged.design),
        lsbA: judged.design.lsbA,
      });
      return { ...head, design: { kind: "pair" as const, ...judged.design }, series };
    }
    // A plan: clipping and steps are judged on the range each sample was read on (the overlay).
    const bare = decimateMinMax(timesS, currentsA, { ...span, clipA: Infinity, lsbA: -Infinity });
    const { clipped, belowStep, ...plan } = planSeriesOverlay(timesS, currentsA, judged.trace, judged.design, bare);
    const lowest = judged.design.ranges[0]!;
    return {
      ...head,
      design: {
        kind: "plan" as const,
        supplyV: judged.design.supplyV,
        fullScaleV: judged.design.fullScaleV,
        switchDelayS: judged.design.switchDelayS,
        lsbA: lowest.resolvableStepA,
        ranges: judged.design.ranges,
        switchPoints: judged.design.switchPoints,
      },
      series: { ...bare, clipped, belowStep, plan },
    };
  },
);

/** Its uploader or an owner removes a profile. */
export const DELETE = apiRoute({ action: "profile.delete" }, async ({ caller, params }) => {
  const design = await designViewFor(caller, params.id ?? "");
  const profileId = profileIdOf(params.profileId);
  const found = await profileUploader(design.id, profileId);
  if (!found) throw profileNotFound();
  authorize(
    caller,
    "profile.delete",
    {
      refusal: `Only the member who uploaded "${found.fileName}" or an owner may delete it; you are signed in as a ${caller.role}.`,
    },
    found,
  );
  await deleteProfile({ teamId: caller.teamId, designId: design.id, profileId, actorId: caller.userId });
  return { deleted: true, id: profileId };
});
