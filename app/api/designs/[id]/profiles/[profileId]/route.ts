import { deleteProfile, getProfile, profileUploader } from "@/db/queries/profiles";
import { apiRoute, authorize } from "@/lib/auth/gate";
import { designViewFor, pairDesignViewFor } from "@/lib/saved-designs/access";
import { profileWindowQuery } from "@/lib/route-schemas";
import { HttpError } from "@/lib/http";
import { isUuid } from "@/lib/ids";
import { clipCurrent, decimateMinMax, profileDesignOf, summarizeProfile } from "@/lib/profile";

const profileNotFound = () => new HttpError(404, "That profile was not found on this design.");

function profileIdOf(raw: string | undefined): string {
  if (!raw || !isUuid(raw)) throw profileNotFound();
  return raw;
}

/**
 * One profile: the summary stored at upload, the summary against the design's current revision, and
 * the series decimated to `width` pixel columns over `from`..`to` seconds (the whole recording by default).
 */
export const GET = apiRoute(
  { action: "design.read", doing: "read current profiles", query: profileWindowQuery },
  async ({ caller, params, query }) => {
    const design = await pairDesignViewFor(caller, params.id ?? "", "Checking a current profile");
    const profile = await getProfile(design.id, profileIdOf(params.profileId));
    if (!profile) throw profileNotFound();
    const judged = profileDesignOf(design);
    const { timesS, currentsA, ...item } = profile;
    const series = decimateMinMax(timesS, currentsA, {
      fromS: query.from,
      toS: query.to,
      width: query.width,
      clipA: clipCurrent(judged),
      lsbA: judged.lsbA,
    });
    return {
      ...item,
      startS: timesS[0],
      endS: timesS[timesS.length - 1],
      current: {
        revision: design.revision,
        summary: item.revision === design.revision ? item.summary : summarizeProfile(timesS, currentsA, judged),
      },
      design: judged,
      series,
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
