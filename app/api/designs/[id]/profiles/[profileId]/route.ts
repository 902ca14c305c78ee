import { deleteProfile, getProfile, profileUploader } from "@/db/queries/profiles";
import { apiRoute, authorize } from "@/lib/auth/gate";
import { designViewFor } from "@/lib/saved-designs/access";
import { profileWindowQuery } from "@/lib/route-schemas";
import { HttpError } from "@/lib/http";
import { isUuid } from "@/lib/ids";
import { profileChart } from "@/lib/profile";
import { warmProfileChartRoute } from "@/lib/warm-up/profile-chart-route";

// This route's own chart code runs hot before a person's first chart (lib/warm-up/run.ts).
warmProfileChartRoute();

const profileNotFound = () => new HttpError(404, "That profile was not found on this design.");

function profileIdOf(raw: string | undefined): string {
  if (!raw || !isUuid(raw)) throw profileNotFound();
  return raw;
}

/**
 * One profile: the summary stored at upload, the summary against the design's current revision, and
 * the series decimated to `width` pixel columns over `from`..`to` seconds (the whole recording by
 * default); lib/profile/chart.ts builds it.
 */
export const GET = apiRoute(
  { action: "design.read", doing: "read current profiles", query: profileWindowQuery },
  async ({ caller, params, query }) => {
    const design = await designViewFor(caller, params.id ?? "");
    const profile = await getProfile(design.id, profileIdOf(params.profileId));
    if (!profile) throw profileNotFound();
    return profileChart(design, profile, { fromS: query.from, toS: query.to, width: query.width });
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
