// The built-unit service: which revision a unit is judged against, readings paired with the sheet's
// test points (or a 422 naming the reading), and the summary the routes and the page answer with.
import "server-only";
import { listRevisions } from "@/db/queries/designs";
import { listUnits, listUnitsOfEach, type StoredReading, type UnitWrite } from "@/db/queries/units";
import type { Caller } from "@/lib/auth/gate";
import { benchCheck, matchTestPoints, type BenchCheckRow } from "@/lib/design";
import { HttpError, type FieldErrors } from "@/lib/http";
import { designFor, rangePlanNotYet } from "@/lib/saved-designs/access";
import { summarizeUnits, type RevisionBasis } from "./judge";

/** The single-pair revisions (a unit is judged against one pair; range plans take no units yet). */
async function revisionBases(designId: string): Promise<RevisionBasis[]> {
  return (await listRevisions(designId)).flatMap((r) =>
    r.kind === "pair"
      ? [{ revision: r.revision, requirement: r.requirement, choice: r.choice, approved: r.approval !== null }]
      : [],
  );
}

export async function unitsContext(caller: Caller, designId: string) {
  const { design, current } = await designFor(caller, designId);
  if (current.plan) throw rangePlanNotYet("Recording built units");
  return { design, revisions: await revisionBases(design.id) };
}

export async function unitsSummaryFor(caller: Caller, designId: string) {
  const { design, revisions } = await unitsContext(caller, designId);
  return { design, summary: summarizeUnits(await listUnits(design.id), revisions), revisions };
}

/**
 * The revision a new unit is built from: the one asked for, or the approved current one. A design
 * that is not approved, or a revision without an approval, takes no units (422 on `revision`).
 */
export function buildRevision(
  design: { status: string; revision: number },
  revisions: RevisionBasis[],
  asked?: number,
): RevisionBasis {
  if (design.status !== "approved") {
    throw new HttpError(
      422,
      `This design is ${design.status === "in-review" ? "in review" : design.status}, not approved: units are recorded only against an approved revision.`,
      { revision: [`revision ${design.revision} is not approved`] },
    );
  }
  const wanted = asked ?? design.revision;
  const found = revisions.find((r) => r.revision === wanted);
  if (!found)
    throw new HttpError(422, `Revision ${wanted} does not exist on this design.`, { revision: ["no such revision"] });
  if (!found.approved)
    throw new HttpError(422, `Revision ${wanted} was never approved: build from an approved revision.`, {
      revision: [`revision ${wanted} is not approved`],
    });
  return found;
}

/** Readings paired with the sheet's test points, ready to store, or 422 naming each reading at fault. */
export function readingsToStore(
  bench: BenchCheckRow[],
  readings: { currentA: number; outputV: number }[],
): StoredReading[] {
  const matched = matchTestPoints(bench, readings);
  if (!matched.ok) {
    const fieldErrors: FieldErrors = {};
    for (const e of matched.errors) (fieldErrors[e.path] ??= []).push(e.message);
    throw new HttpError(422, `Invalid input at ${matched.errors[0]!.path}: ${matched.errors[0]!.message}`, fieldErrors);
  }
  return matched.rows.map((r, pointIndex) => ({
    rangeIndex: 0,
    pointIndex,
    currentA: r.bench.currentA,
    outputV: r.reading.outputV,
  }));
}

export function benchOf(basis: RevisionBasis): BenchCheckRow[] {
  return benchCheck(basis.requirement, basis.choice);
}

/** A refused write as the API's error. */
export function writeRefusal(result: Exclude<UnitWrite, { ok: true }>, field = "serial"): HttpError {
  if (result.reason === "not-found") return new HttpError(404, "That unit was not found on this design.");
  return new HttpError(
    422,
    `Serial "${result.serial}" is already recorded on this design; each unit needs its own serial. Nothing was stored.`,
    {
      [field]: [`"${result.serial}" is already on this design`],
    },
  );
}

export type BuiltYield = { measuredYield: number | null; predictedYield: number | null; unitsBuilt: number };

/**
 * The yield figures the compare page shows beside each design's figures, in the order given; null
 * where no unit is recorded. The designs' units in one read, revisions only where units are.
 */
export async function builtYieldsOf(designIds: string[]): Promise<(BuiltYield | null)[]> {
  const units = await listUnitsOfEach(designIds);
  return Promise.all(
    designIds.map(async (id) => {
      const stored = units.get(id) ?? [];
      if (stored.length === 0) return null;
      const s = summarizeUnits(stored, await revisionBases(id));
      return { measuredYield: s.yield.measured, predictedYield: s.yield.predicted, unitsBuilt: s.yield.units };
    }),
  );
}
