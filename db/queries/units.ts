// Built units of a design and their bench readings. Every write is one transaction with its audit
// event; a serial already on the design (any case) stops the whole write. Callers scope the design
// by team first (lib/saved-designs/access).
import { and, asc, eq, inArray, sql } from "drizzle-orm";
import { getDb, type Tx } from "../client";
import { builtUnits, unitReadings, users } from "../schema";
import { recordAudit } from "./audit";
import { isUuid } from "./designs";

export type StoredReading = { rangeIndex: number; pointIndex: number; currentA: number; outputV: number };

export type StoredUnit = {
  id: string;
  designId: string;
  revision: number;
  serial: string;
  builtOn: string;
  recordedBy: string;
  recordedByName: string;
  createdAt: string;
  updatedAt: string;
  readings: StoredReading[];
};

export type NewUnit = { serial: string; revision: number; builtOn: string; readings: StoredReading[] };

export type UnitWrite =
  | { ok: true; ids: string[] }
  | { ok: false; reason: "duplicate-serial"; serial: string; index: number }
  | { ok: false; reason: "not-found" };

const unitColumns = {
  id: builtUnits.id,
  designId: builtUnits.designId,
  revision: builtUnits.revision,
  serial: builtUnits.serial,
  builtOn: builtUnits.builtOn,
  recordedBy: builtUnits.recordedBy,
  recordedByName: users.name,
  createdAt: builtUnits.createdAt,
  updatedAt: builtUnits.updatedAt,
};

async function withReadings(
  rows: { id: string; createdAt: Date; updatedAt: Date }[],
): Promise<Map<string, StoredReading[]>> {
  const out = new Map<string, StoredReading[]>();
  if (rows.length === 0) return out;
  const db = await getDb();
  const readings = await db
    .select({
      unitId: unitReadings.unitId,
      rangeIndex: unitReadings.rangeIndex,
      pointIndex: unitReadings.pointIndex,
      currentA: unitReadings.currentA,
      outputV: unitReadings.outputV,
    })
    .from(unitReadings)
    .where(
      inArray(
        unitReadings.unitId,
        rows.map((r) => r.id),
      ),
    )
    .orderBy(asc(unitReadings.rangeIndex), asc(unitReadings.pointIndex));
  for (const r of readings) {
    const list = out.get(r.unitId) ?? [];
    list.push({ rangeIndex: r.rangeIndex, pointIndex: r.pointIndex, currentA: r.currentA, outputV: r.outputV });
    out.set(r.unitId, list);
  }
  return out;
}

/** The design's units, oldest first (the order they were built in), with their readings. */
export async function listUnits(designId: string): Promise<StoredUnit[]> {
  return (await listUnitsOfEach([designId])).get(designId) ?? [];
}

/** Several designs' units in one read (and one of their readings), by design, each oldest first. */
export async function listUnitsOfEach(designIds: string[]): Promise<Map<string, StoredUnit[]>> {
  const out = new Map<string, StoredUnit[]>(designIds.map((id) => [id, []]));
  if (designIds.length === 0) return out;
  const db = await getDb();
  const rows = await db
    .select(unitColumns)
    .from(builtUnits)
    .innerJoin(users, eq(users.id, builtUnits.recordedBy))
    .where(inArray(builtUnits.designId, designIds))
    .orderBy(asc(builtUnits.builtOn), asc(builtUnits.createdAt), asc(builtUnits.serial));
  const readings = await withReadings(rows);
  for (const r of rows)
    out.get(r.designId)?.push({
      ...r,
      createdAt: r.createdAt.toISOString(),
      updatedAt: r.updatedAt.toISOString(),
      readings: readings.get(r.id) ?? [],
    });
  return out;
}

export async function getUnit(designId: string, unitId: string): Promise<StoredUnit | null> {
  if (!isUuid(unitId)) return null;
  const db = await getDb();
  const [row] = await db
    .select(unitColumns)
    .from(builtUnits)
    .innerJoin(users, eq(users.id, builtUnits.recordedBy))
    .where(and(eq(builtUnits.designId, designId), eq(builtUnits.id, unitId)));
  if (!row) return null;
  const readings = await withReadings([row]);
  return {
    ...row,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    readings: readings.get(row.id) ?? [],
  };
}

/** The first of `serials` already on the design (compared without case), with its index. */
async function takenSerial(
  tx: Tx,
  designId: string,
  serials: string[],
  exceptUnitId?: string,
): Promise<{ serial: string; index: number } | null> {
  const lower = serials.map((s) => s.toLowerCase());
  const rows = await tx
    .select({ id: builtUnits.id, serial: builtUnits.serial })
    .from(builtUnits)
    .where(and(eq(builtUnits.designId, designId), inArray(sql`lower(${builtUnits.serial})`, lower)));
  const taken = rows.filter((r) => r.id !== exceptUnitId);
  if (taken.length === 0) return null;
  const set = new Set(taken.map((r) => r.serial.toLowerCase()));
  const index = lower.findIndex((s) => set.has(s));
  return { serial: serials[index] ?? "", index };
}

function readingRows(unitId: string, readings: StoredReading[]) {
  return readings.map((r) => ({ unitId, ...r }));
}

/** Two writers racing for one serial: the unique index refuses the second, reported as a duplicate. */
function isUniqueViolation(e: unknown): boolean {
  for (let x: unknown = e; x && typeof x === "object"; x = (x as { cause?: unknown }).cause) {
    if ((x as { code?: unknown }).code === "23505") return true;
  }
  return false;
}

async function guarded(serials: string[], write: () => Promise<UnitWrite>): Promise<UnitWrite> {
  try {
    return await write();
  } catch (e) {
    if (!isUniqueViolation(e)) throw e;
    return { ok: false, reason: "duplicate-serial", serial: serials[0] ?? "", index: 0 };
  }
}

/** Records units (one, or a whole CSV) in one transaction: all of them or none. */
export async function insertUnits(input: {
  teamId: string;
  designId: string;
  actorId: string;
  units: NewUnit[];
  source: "form" | "csv";
}): Promise<UnitWrite> {
  const db = await getDb();
  return guarded(
    input.units.map((u) => u.serial),
    () =>
      db.transaction(async (tx) => {
        const dup = await takenSerial(
          tx,
          input.designId,
          input.units.map((u) => u.serial),
        );
        if (dup) return { ok: false as const, reason: "duplicate-serial" as const, ...dup };
        const ids: string[] = [];
        for (const u of input.units) {
          const [row] = await tx
            .insert(builtUnits)
            .values({
              designId: input.designId,
              revision: u.revision,
              serial: u.serial,
              builtOn: u.builtOn,
              recordedBy: input.actorId,
            })
            .returning({ id: builtUnits.id });
          if (!row) throw new Error("unit not stored");
          if (u.readings.length) await tx.insert(unitReadings).values(readingRows(row.id, u.readings));
          ids.push(row.id);
        }
        await recordAudit(
          {
            teamId: input.teamId,
            actorId: input.actorId,
            action: input.units.length === 1 ? "unit.recorded" : "unit.imported",
            targetType: "design",
            targetId: input.designId,
            details: { serials: input.units.map((u) => u.serial), source: input.source },
          },
          tx,
        );
        return { ok: true as const, ids };
      }),
  );
}

/** Changes a unit's serial, date or readings (readings are replaced as a set). */
export async function updateUnit(input: {
  teamId: string;
  designId: string;
  unitId: string;
  actorId: string;
  serial?: string;
  builtOn?: string;
  readings?: StoredReading[];
}): Promise<UnitWrite> {
  const db = await getDb();
  return guarded(input.serial ? [input.serial] : [], () =>
    db.transaction(async (tx) => {
      if (input.serial !== undefined) {
        const dup = await takenSerial(tx, input.designId, [input.serial], input.unitId);
        if (dup) return { ok: false as const, reason: "duplicate-serial" as const, ...dup };
      }
      const set: Partial<typeof builtUnits.$inferInsert> = {};
      if (input.serial !== undefined) set.serial = input.serial;
      if (input.builtOn !== undefined) set.builtOn = input.builtOn;
      const updated = await tx
        .update(builtUnits)
        .set({ ...set, updatedAt: sql`now()` })
        .where(and(eq(builtUnits.designId, input.designId), eq(builtUnits.id, input.unitId)))
        .returning({ id: builtUnits.id });
      if (!updated[0]) return { ok: false as const, reason: "not-found" as const };
      if (input.readings) {
        await tx.delete(unitReadings).where(eq(unitReadings.unitId, input.unitId));
        if (input.readings.length) await tx.insert(unitReadings).values(readingRows(input.unitId, input.readings));
      }
      await recordAudit(
        {
          teamId: input.teamId,
          actorId: input.actorId,
          action: "unit.edited",
          targetType: "design",
          targetId: input.designId,
          details: {
            unitId: input.unitId,
            changed: [
              ...(input.serial !== undefined ? ["serial"] : []),
              ...(input.builtOn !== undefined ? ["builtOn"] : []),
              ...(input.readings ? ["readings"] : []),
            ],
          },
        },
        tx,
      );
      return { ok: true as const, ids: [input.unitId] };
    }),
  );
}

export async function deleteUnit(input: {
  teamId: string;
  designId: string;
  unitId: string;
  actorId: string;
  serial: string;
}): Promise<boolean> {
  const db = await getDb();
  return db.transaction(async (tx) => {
    const gone = await tx
      .delete(builtUnits)
      .where(and(eq(builtUnits.designId, input.designId), eq(builtUnits.id, input.unitId)))
      .returning({ id: builtUnits.id });
    if (!gone[0]) return false;
    await recordAudit(
      {
        teamId: input.teamId,
        actorId: input.actorId,
        action: "unit.deleted",
        targetType: "design",
        targetId: input.designId,
        details: { unitId: input.unitId, serial: input.serial },
      },
      tx,
    );
    return true;
  });
}
