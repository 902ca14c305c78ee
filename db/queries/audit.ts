import { and, desc, eq, sql, type SQL } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { getDb } from "../client";
import { auditEvents, users } from "../schema";

export type AuditInput = {
  teamId: string | null;
  actorId: string | null;
  action: string;
  targetType?: string;
  targetId?: string;
  details?: Record<string, unknown>;
};

/** Records an audit event; pass the transaction so the event commits (or not) with the change. */
export async function recordAudit(event: AuditInput, tx?: Tx | Db): Promise<void> {
  const db = tx ?? (await getDb());
  await db.insert(auditEvents).values({
    teamId: event.teamId,
    actorId: event.actorId,
    action: event.action,
    targetType: event.targetType ?? null,
    targetId: event.targetId ?? null,
    details: event.details ?? {},
  });
}

const auditColumns = {
  id: auditEvents.id,
  action: auditEvents.action,
  targetType: auditEvents.targetType,
  targetId: auditEvents.targetId,
  details: auditEvents.details,
  at: auditEvents.at,
  actorName: users.name,
  actorEmail: users.email,
};

export async function listTeamAudit(teamId: string, limit = 200) {
  const db = await getDb();
  return db
    .select(auditColumns)
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorId))
    .where(eq(auditEvents.teamId, teamId))
    .orderBy(desc(auditEvents.at))
    .limit(limit);
}

export async function listTargetAudit(teamId: string, targetType: string, targetId: string) {
  const db = await getDb();
  return db
    .select(auditColumns)
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorId))
    .where(
      and(eq(auditEvents.teamId, teamId), eq(auditEvents.targetType, targetType), eq(auditEvents.targetId, targetId)),
    )
    .orderBy(desc(auditEvents.at), desc(auditEvents.id));
}
export type TargetAuditRecord = Awaited<ReturnType<typeof listTargetAudit>>[number];

/**
 * listTargetAudit as one JSON array column of another query (the design page reads its design,
 * revisions, reviews and audit in one query): the same rows, newest first, timestamps as text.
 */
export function targetAuditJson(teamId: SQL | string, targetType: string, targetId: SQL) {
  const pairs = Object.entries(auditColumns).flatMap(([key, column]) => [sql.raw(`'${key}'`), column]);
  return sql<
    (Omit<TargetAuditRecord, "at"> & { at: string })[]
  >`(select coalesce(json_agg(json_build_object(${sql.join(pairs, sql`, `)}) order by ${auditEvents.at} desc, ${auditEvents.id} desc), '[]'::json)
    from ${auditEvents} left join ${users} on ${users.id} = ${auditEvents.actorId}
    where ${auditEvents.teamId} = ${teamId} and ${auditEvents.targetType} = ${targetType} and ${auditEvents.targetId} = ${targetId})`;
}

/** A row of targetAuditJson as listTargetAudit reads it. */
export const targetAuditFromJson = (row: Omit<TargetAuditRecord, "at"> & { at: string }): TargetAuditRecord => ({
  ...row,
  at: new Date(row.at),
});
