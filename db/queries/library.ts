// The team's parts library: amplifiers, shunt families, ADCs and meter ranges, scoped by team on every query.
import { and, asc, eq, getTableColumns, inArray, sql } from "drizzle-orm";
import type {
  AdcValues,
  AmplifierValues,
  ImportedParts,
  MeterValues,
  PartKind,
  ShuntValues,
} from "@/lib/library/schema";
import { getDb, type Tx } from "../client";
import {
  libraryAdcs,
  libraryAmplifiers,
  libraryMeters,
  libraryShunts,
  type LibraryAdc,
  type LibraryAmplifier,
  type LibraryMeter,
  type LibraryShunt,
} from "../schema";
import { recordAudit } from "./audit";

/** A row as the API sends it: dates as ISO strings. */
export type Json<T> = { [K in keyof T]: T[K] extends Date ? string : T[K] };
export type AmplifierJson = Json<LibraryAmplifier>;
export type ShuntJson = Json<LibraryShunt>;
export type AdcJson = Json<LibraryAdc>;
export type MeterJson = Json<LibraryMeter>;

function toJson<T extends { createdAt: Date; updatedAt: Date }>(row: T): Json<T> {
  return { ...row, createdAt: row.createdAt.toISOString(), updatedAt: row.updatedAt.toISOString() } as Json<T>;
}

const tables = {
  amplifiers: libraryAmplifiers,
  shunts: libraryShunts,
  adcs: libraryAdcs,
  meters: libraryMeters,
} as const;
const auditType: Record<PartKind, string> = {
  amplifiers: "library-amplifier",
  shunts: "library-shunt",
  adcs: "library-adc",
  meters: "library-meter",
};

export type LibraryJson = { amplifiers: AmplifierJson[]; shunts: ShuntJson[]; adcs: AdcJson[]; meters: MeterJson[] };

/**
 * One table's rows of a team as a JSON array (keys as the schema names them, by name), for reading
 * the four tables in one query: each query costs PGlite far more than the few rows a library holds.
 */
function teamRowsAsJson(table: (typeof tables)[PartKind]) {
  const pairs = Object.entries(getTableColumns(table)).flatMap(([key, column]) => [sql.raw(`'${key}'`), column]);
  return sql`(select coalesce(json_agg(json_build_object(${sql.join(pairs, sql`, `)}) order by ${table.name}), '[]'::json) from ${table} where ${table.teamId} = ${sql.placeholder("teamId")})`;
}

/** A row read as JSON, as drizzle reads it: timestamps to Date (the JSON has them as text). */
const withDates = <T extends { createdAt: Date; updatedAt: Date }>(row: Json<T>): T =>
  ({ ...row, createdAt: new Date(row.createdAt), updatedAt: new Date(row.updatedAt) }) as unknown as T;

/** The four library tables of the team named by the "teamId" placeholder, as columns of one row. */
export const teamLibraryColumns = () => ({
  amplifiers: sql<Json<LibraryAmplifier>[]>`${teamRowsAsJson(libraryAmplifiers)}`,
  shunts: sql<Json<LibraryShunt>[]>`${teamRowsAsJson(libraryShunts)}`,
  adcs: sql<Json<LibraryAdc>[]>`${teamRowsAsJson(libraryAdcs)}`,
  meters: sql<Json<LibraryMeter>[]>`${teamRowsAsJson(libraryMeters)}`,
});

/** A row read with teamLibraryColumns, as the API sends the library. */
export function libraryOf(row: {
  amplifiers: Json<LibraryAmplifier>[];
  shunts: Json<LibraryShunt>[];
  adcs: Json<LibraryAdc>[];
  meters: Json<LibraryMeter>[];
}): LibraryJson {
  return {
    amplifiers: row.amplifiers.map((r) => toJson(withDates<LibraryAmplifier>(r))),
    shunts: row.shunts.map((r) => toJson(withDates<LibraryShunt>(r))),
    adcs: row.adcs.map((r) => toJson(withDates<LibraryAdc>(r))),
    meters: row.meters.map((r) => toJson(withDates<LibraryMeter>(r))),
  };
}

export async function listLibrary(teamId: string): Promise<LibraryJson> {
  const db = await getDb();
  const [row] = await db
    .select(teamLibraryColumns())
    .from(sql`(select 1) as one`)
    .prepare("list_library")
    .execute({ teamId });
  return libraryOf(row!);
}

export async function getAmplifier(teamId: string, id: string): Promise<LibraryAmplifier | null> {
  const db = await getDb();
  const [row] = await db
    .select()
    .from(libraryAmplifiers)
    .where(and(eq(libraryAmplifiers.teamId, teamId), eq(libraryAmplifiers.id, id)));
  return row ?? null;
}

export async function getShunt(teamId: string, id: string): Promise<LibraryShunt | null> {
  const db = await getDb();
  const [row] = await db
    .select()
    .from(libraryShunts)
    .where(and(eq(libraryShunts.teamId, teamId), eq(libraryShunts.id, id)));
  return row ?? null;
}

async function nameTaken(tx: Tx, kind: PartKind, teamId: string, name: string, exceptId?: string): Promise<boolean> {
  const t = tables[kind];
  const rows = await tx
    .select({ id: t.id })
    .from(t)
    .where(and(eq(t.teamId, teamId), eq(t.name, name)));
  return rows.some((r) => r.id !== exceptId);
}

export type WriteResult<T> =
  { ok: true; row: T } | { ok: false; reason: "not-found" | "conflict" | "invalid"; message: string; field?: string };

const duplicate = (name: string) =>
  ({
    ok: false,
    reason: "invalid",
    message: `A part named "${name}" is already in the library; choose another name.`,
    field: "name",
  }) as const;

export async function createAmplifier(
  teamId: string,
  values: AmplifierValues,
  actorId: string,
): Promise<WriteResult<AmplifierJson>> {
  const db = await getDb();
  return db.transaction(async (tx) => {
    if (await nameTaken(tx, "amplifiers", teamId, values.name)) return duplicate(values.name);
    const [row] = await tx
      .insert(libraryAmplifiers)
      .values({ ...values, teamId })
      .returning();
    await recordAudit(
      {
        teamId,
        actorId,
        action: "library.create",
        targetType: auditType.amplifiers,
        targetId: row!.id,
        details: { name: values.name },
      },
      tx,
    );
    return { ok: true, row: toJson(row!) };
  });
}

export async function createShunt(
  teamId: string,
  values: ShuntValues,
  actorId: string,
): Promise<WriteResult<ShuntJson>> {
  const db = await getDb();
  return db.transaction(async (tx) => {
    if (await nameTaken(tx, "shunts", teamId, values.name)) return duplicate(values.name);
    const [row] = await tx
      .insert(libraryShunts)
      .values({ ...values, teamId })
      .returning();
    await recordAudit(
      {
        teamId,
        actorId,
        action: "library.create",
        targetType: auditType.shunts,
        targetId: row!.id,
        details: { name: values.name },
      },
      tx,
    );
    return { ok: true, row: toJson(row!) };
  });
}

/**
 * Replaces a part's fields (already merged and checked). With `expectedUpdatedAt`, a part changed
 * by someone else since it was read is refused (conflict) rather than overwritten.
 */
export async function updateAmplifier(
  teamId: string,
  id: string,
  values: AmplifierValues,
  expectedUpdatedAt: string | undefined,
  actorId: string,
): Promise<WriteResult<AmplifierJson>> {
  const db = await getDb();
  return db.transaction(async (tx) => {
    const [current] = await tx
      .select()
      .from(libraryAmplifiers)
      .where(and(eq(libraryAmplifiers.teamId, teamId), eq(libraryAmplifiers.id, id)))
      .for("update");
    if (!current) return { ok: false, reason: "not-found", message: "That amplifier was not found in the library." };
    if (expectedUpdatedAt && current.updatedAt.toISOString() !== expectedUpdatedAt)
      return {
        ok: false,
        reason: "conflict",
        message: "Someone changed this amplifier since you opened it; reload and make your change again.",
      };
    if (await nameTaken(tx, "amplifiers", teamId, values.name, id)) return duplicate(values.name);
    const [row] = await tx
      .update(libraryAmplifiers)
      .set({ ...values, updatedAt: new Date() })
      .where(and(eq(libraryAmplifiers.teamId, teamId), eq(libraryAmplifiers.id, id)))
      .returning();
    await recordAudit(
      {
        teamId,
        actorId,
        action: "library.update",
        targetType: auditType.amplifiers,
        targetId: id,
        details: { name: values.name },
      },
      tx,
    );
    return { ok: true, row: toJson(row!) };
  });
}

export async function updateShunt(
  teamId: string,
  id: string,
  values: ShuntValues,
  expectedUpdatedAt: string | undefined,
  actorId: string,
): Promise<WriteResult<ShuntJson>> {
  const db = await getDb();
  return db.transaction(async (tx) => {
    const [current] = await tx
      .select()
      .from(libraryShunts)
      .where(and(eq(libraryShunts.teamId, teamId), eq(libraryShunts.id, id)))
      .for("update");
    if (!current) return { ok: false, reason: "not-found", message: "That shunt was not found in the library." };
    if (expectedUpdatedAt && current.updatedAt.toISOString() !== expectedUpdatedAt)
      return {
        ok: false,
        reason: "conflict",
        message: "Someone changed this shunt since you opened it; reload and make your change again.",
      };
    if (await nameTaken(tx, "shunts", teamId, values.name, id)) return duplicate(values.name);
    const [row] = await tx
      .update(libraryShunts)
      .set({ ...values, updatedAt: new Date() })
      .where(and(eq(libraryShunts.teamId, teamId), eq(libraryShunts.id, id)))
      .returning();
    await recordAudit(
      {
        teamId,
        actorId,
        action: "library.update",
        targetType: auditType.shunts,
        targetId: id,
        details: { name: values.name },
      },
      tx,
    );
    return { ok: true, row: toJson(row!) };
  });
}

/** A readout part (ADC or meter range) by kind: one table each, the same rules as the other parts. */
type ReadoutKind = "adcs" | "meters";
type ReadoutValues = { adcs: AdcValues; meters: MeterValues };
type ReadoutRow = { adcs: LibraryAdc; meters: LibraryMeter };
const readoutWord: Record<ReadoutKind, string> = { adcs: "ADC", meters: "meter range" };

export async function getReadoutPart<K extends ReadoutKind>(
  kind: K,
  teamId: string,
  id: string,
): Promise<ReadoutRow[K] | null> {
  const db = await getDb();
  const t = tables[kind] as typeof libraryAdcs;
  const [row] = await db
    .select()
    .from(t)
    .where(and(eq(t.teamId, teamId), eq(t.id, id)));
  return (row as ReadoutRow[K] | undefined) ?? null;
}

export async function createReadoutPart<K extends ReadoutKind>(
  kind: K,
  teamId: string,
  values: ReadoutValues[K],
  actorId: string,
): Promise<WriteResult<Json<ReadoutRow[K]>>> {
  const db = await getDb();
  return db.transaction(async (tx) => {
    if (await nameTaken(tx, kind, teamId, values.name)) return duplicate(values.name);
    const t = tables[kind] as typeof libraryAdcs;
    const [row] = await tx
      .insert(t)
      .values({ ...(values as AdcValues), teamId })
      .returning();
    await recordAudit(
      {
        teamId,
        actorId,
        action: "library.create",
        targetType: auditType[kind],
        targetId: row!.id,
        details: { name: values.name },
      },
      tx,
    );
    return { ok: true, row: toJson(row!) as unknown as Json<ReadoutRow[K]> };
  });
}

/** As updateAmplifier: a part changed since it was read (updatedAt) is refused, never overwritten. */
export async function updateReadoutPart<K extends ReadoutKind>(
  kind: K,
  teamId: string,
  id: string,
  values: ReadoutValues[K],
  expectedUpdatedAt: string | undefined,
  actorId: string,
): Promise<WriteResult<Json<ReadoutRow[K]>>> {
  const db = await getDb();
  const t = tables[kind] as typeof libraryAdcs;
  return db.transaction(async (tx) => {
    const [current] = await tx
      .select({ updatedAt: t.updatedAt })
      .from(t)
      .where(and(eq(t.teamId, teamId), eq(t.id, id)))
      .for("update");
    if (!current)
      return { ok: false, reason: "not-found", message: `That ${readoutWord[kind]} was not found in the library.` };
    if (expectedUpdatedAt && current.updatedAt.toISOString() !== expectedUpdatedAt)
      return {
        ok: false,
        reason: "conflict",
        message: `Someone changed this ${readoutWord[kind]} since you opened it; reload and make your change again.`,
      };
    if (await nameTaken(tx, kind, teamId, values.name, id)) return duplicate(values.name);
    const [row] = await tx
      .update(t)
      .set({ ...(values as AdcValues), updatedAt: new Date() })
      .where(and(eq(t.teamId, teamId), eq(t.id, id)))
      .returning();
    await recordAudit(
      {
        teamId,
        actorId,
        action: "library.update",
        targetType: auditType[kind],
        targetId: id,
        details: { name: values.name },
      },
      tx,
    );
    return { ok: true, row: toJson(row!) as unknown as Json<ReadoutRow[K]> };
  });
}

export async function deletePart(kind: PartKind, teamId: string, id: string, actorId: string): Promise<boolean> {
  const db = await getDb();
  const t = tables[kind];
  return db.transaction(async (tx) => {
    const rows = await tx
      .delete(t)
      .where(and(eq(t.teamId, teamId), eq(t.id, id)))
      .returning({ name: t.name });
    if (!rows[0]) return false;
    await recordAudit(
      {
        teamId,
        actorId,
        action: "library.delete",
        targetType: auditType[kind],
        targetId: id,
        details: { name: rows[0].name },
      },
      tx,
    );
    return true;
  });
}

/** Imports parts in one transaction: a name already in the library is updated, a new one added. */
export async function importParts(
  teamId: string,
  parts: ImportedParts,
  actorId: string,
): Promise<{ created: number; updated: number }> {
  const db = await getDb();
  return db.transaction(async (tx) => {
    // One table per kind, all keyed (team, name); the rows passed their kind's schema. Typed as one
    // of them for drizzle, as the readout routes do.
    const t = tables[parts.kind] as typeof libraryAdcs;
    const names = parts.rows.map((r) => r.name);
    const existing = new Set(
      (
        await tx
          .select({ name: t.name })
          .from(t)
          .where(and(eq(t.teamId, teamId), inArray(t.name, names)))
      ).map((r) => r.name),
    );
    const now = new Date();
    for (const values of parts.rows) {
      const v = values as AdcValues;
      await tx
        .insert(t)
        .values({ ...v, teamId })
        .onConflictDoUpdate({ target: [t.teamId, t.name], set: { ...v, updatedAt: now } });
    }
    const updated = names.filter((n) => existing.has(n)).length;
    const result = { created: names.length - updated, updated };
    await recordAudit(
      { teamId, actorId, action: "library.import", targetType: auditType[parts.kind], details: result },
      tx,
    );
    return result;
  });
}
