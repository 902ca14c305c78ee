import { deleteUnit, getUnit, listUnits, updateUnit } from "@/db/queries/units";
import { apiRoute, authorize } from "@/lib/auth/gate";
import { summarizeUnits } from "@/lib/built-units/judge";
import { benchOf, readingsToStore, unitsContext, writeRefusal } from "@/lib/built-units/record";
import { editUnitSchema } from "@/lib/built-units/schemas";
import { HttpError } from "@/lib/http";

const unitNotFound = () => new HttpError(404, "That unit was not found on this design.");

async function found(caller: Parameters<typeof unitsContext>[0], designId: string, unitId: string) {
  const ctx = await unitsContext(caller, designId);
  const unit = await getUnit(ctx.design.id, unitId);
  if (!unit) throw unitNotFound();
  return { ...ctx, unit };
}

/** One unit, judged against its revision's bench check (and the design's prediction). */
export const GET = apiRoute({ action: "design.read", doing: "read built units" }, async ({ caller, params }) => {
  const { design, revisions, unit } = await found(caller, params.id ?? "", params.unitId ?? "");
  const all = summarizeUnits(await listUnits(design.id), revisions);
  const view = all.units.find((u) => u.id === unit.id);
  if (!view) throw unitNotFound();
  return view;
});

const refusalFor = (unit: { recordedByName: string; serial: string }, verb: string) =>
  `Unit ${unit.serial} was recorded by ${unit.recordedByName}: a maker may ${verb} only the units they recorded (owners and designers may ${verb} any).`;

/** Changes a unit's serial, date or readings; makers only their own units. */
export const PATCH = apiRoute(
  { action: "unit.change", doing: "edit built units", body: editUnitSchema },
  async ({ caller, params, body }) => {
    const { design, revisions, unit } = await found(caller, params.id ?? "", params.unitId ?? "");
    authorize(caller, "unit.change", { doing: "edit built units", refusal: refusalFor(unit, "edit") }, unit);
    if (body.serial === undefined && body.builtOn === undefined && body.readings === undefined)
      throw new HttpError(422, "Nothing to change: send serial, builtOn or readings.", {
        "(body)": ["send at least one of serial, builtOn, readings"],
      });
    const basis = revisions.find((r) => r.revision === unit.revision);
    if (!basis) throw unitNotFound();
    const readings = body.readings ? readingsToStore(benchOf(basis), body.readings) : undefined;
    const written = await updateUnit({
      teamId: caller.teamId,
      designId: design.id,
      unitId: unit.id,
      actorId: caller.userId,
      serial: body.serial,
      builtOn: body.builtOn,
      readings,
    });
    if (!written.ok) throw writeRefusal(written);
    const stored = await getUnit(design.id, unit.id);
    return summarizeUnits(stored ? [stored] : [], revisions).units[0] ?? {};
  },
);

/** Removes a unit and its readings; makers only their own units. */
export const DELETE = apiRoute({ action: "unit.change", doing: "delete built units" }, async ({ caller, params }) => {
  const { design, unit } = await found(caller, params.id ?? "", params.unitId ?? "");
  authorize(caller, "unit.change", { doing: "delete built units", refusal: refusalFor(unit, "delete") }, unit);
  const gone = await deleteUnit({
    teamId: caller.teamId,
    designId: design.id,
    unitId: unit.id,
    actorId: caller.userId,
    serial: unit.serial,
  });
  if (!gone) throw unitNotFound();
  return { deleted: true, id: unit.id };
});
