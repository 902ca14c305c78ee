import { insertProfile, listProfiles } from "@/db/queries/profiles";
import { apiRoute } from "@/lib/auth/gate";
import { can } from "@/lib/auth/policy";
import { designViewFor } from "@/lib/saved-designs/access";
import { json } from "@/lib/http";
import { judgeRecording, MAX_PROFILE_BYTES, nonFiniteFigure, parseProfileCsv } from "@/lib/profile";
import { readCsvUpload } from "@/lib/read-upload";

/** The design's stored profiles, newest first (members; makers for approved designs). */
export const GET = apiRoute({ action: "design.read", doing: "read current profiles" }, async ({ caller, params }) => {
  const design = await designViewFor(caller, params.id ?? "");
  const profiles = await listProfiles(design.id);
  return { profiles: profiles.map((p) => ({ ...p, canDelete: can(caller, "profile.delete", p) })) };
});

/**
 * Uploads a recording: multipart, field `file` (CSV). 201 {id, samples, summary}; a refused file
 * is 422 naming the row and column, over 10 MB is 413, and nothing is stored either way. On a range
 * plan the summary adds rangeSwitches, timeInRangeS and the switch's figures (API.md v2).
 */
export const POST = apiRoute({ action: "profile.upload" }, async ({ caller, params, request }) => {
  const design = await designViewFor(caller, params.id ?? "");
  const upload = await readCsvUpload(request, MAX_PROFILE_BYTES);
  const parsed = parseProfileCsv(upload.text);
  if (!parsed.ok) {
    const body = parsed.refusal.toJson();
    return json({ ...body, message: `${body.message}. Nothing was stored.` }, 422);
  }
  const { timesS, currentsA } = parsed.series;
  // A range plan's summary adds the switching rule's figures (rangeSwitches, timeInRangeS, …).
  const { summary } = judgeRecording(design, timesS, currentsA);
  const infinite = nonFiniteFigure(summary);
  if (infinite) {
    const message = `The recording's ${infinite} on this design is not a finite number (are the currents in amperes?). Nothing was stored.`;
    return json({ message, fieldErrors: { file: [message] } }, 422);
  }
  const { id } = await insertProfile({
    teamId: caller.teamId,
    designId: design.id,
    revision: design.revision,
    fileName: upload.fileName,
    timesS,
    currentsA,
    summary,
    userId: caller.userId,
    userName: caller.name,
  });
  return json(
    {
      id,
      samples: summary.samples,
      summary,
      fileName: upload.fileName,
      revision: design.revision,
      columns: parsed.series.columns,
    },
    201,
  );
});
