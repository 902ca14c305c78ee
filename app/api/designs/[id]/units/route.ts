import { getUnit, insertUnits } from "@/db/queries/units";
import { apiRoute } from "@/lib/auth/gate";
import { summarizeUnits } from "@/lib/built-units/judge";
import {
  benchOf,
  buildRevision,
  readingsToStore,
  unitsContext,
  unitsSummaryFor,
  writeRefusal,
} from "@/lib/built-units/record";
import { recordUnitSchema, todayIso } from "@/lib/built-units/schemas";
import { json } from "@/lib/http";

/** The design's built units, each judged, with the yield measured and predicted and the spread check. */
export const GET = apiRoute({ action: "design.read", doing: "read built units" }, async ({ caller, params }) => {
  const { summary } = await unitsSummaryFor(caller, params.id ?? "");
  return summary;
});

/** Records one unit's bench readings: 201 with its judgement, cause and calibration. */
export const POST = apiRoute({ action: "unit.record", body: recordUnitSchema }, async ({ caller, params, body }) => {
  const { design, revisions } = await unitsContext(caller, params.id ?? "");
  const basis = buildRevision(design, revisions, body.revision);
  const readings = readingsToStore(benchOf(basis), body.readings);
  const written = await insertUnits({
    teamId: caller.teamId,
    designId: design.id,
    actorId: caller.userId,
    source: "form",
    units: [{ serial: body.serial, revision: basis.revision, builtOn: body.builtOn ?? todayIso(), readings }],
  });
  if (!written.ok) throw writeRefusal(written);
  const stored = await getUnit(design.id, written.ids[0]!);
  const view = summarizeUnits(stored ? [stored] : [], revisions).units[0];
  return json(view, 201);
});
