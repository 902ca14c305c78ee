import { and, asc, eq, sql } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { getDb } from "../client";
import { memberships, teams, users, type Role } from "../schema";
import { recordAudit } from "./audit";

export async function findUserByEmail(email: string) {
  const db = await getDb();
  const rows = await db
    .select()
    .from(users)
    .where(sql`lower(${users.email}) = ${email.trim().toLowerCase()}`)
    .limit(1);
  return rows[0] ?? null;
}

/** The user's first team membership: the team a sign-in lands in. */
export async function firstMembership(userId: string) {
  const db = await getDb();
  const rows = await db
    .select({ teamId: memberships.teamId, role: memberships.role, teamName: teams.name })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(memberships.createdAt))
    .limit(1);
  return rows[0] ?? null;
}

/**
 * The caller as the database sees them now: identity, team, current role and session version (or null
 * if no longer a member).
 */
export async function getMember(userId: string, teamId: string) {
  const db = await getDb();
  const rows = await db
    .select({
      userId: users.id,
      email: users.email,
      name: users.name,
      teamId: teams.id,
      teamName: teams.name,
      role: memberships.role,
      sessionVersion: users.sessionVersion,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(and(eq(memberships.userId, userId), eq(memberships.teamId, teamId)))
    .limit(1);
  return rows[0] ?? null;
}

export async function listMembers(teamId: string) {
  const db = await getDb();
  return db
    .select({
      userId: users.id,
      email: users.email,
      name: users.name,
      role: memberships.role,
      joinedAt: memberships.createdAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.teamId, teamId))
    .orderBy(asc(users.name));
}

export type RoleChangeResult = { ok: true } | { ok: false; status: 404 | 409; message: string };

/** Changes a member's role; a team always keeps at least one owner. */
export async function changeMemberRole(
  teamId: string,
  userId: string,
  role: Role,
  actorId: string,
): Promise<RoleChangeResult> {
  const db = await getDb();
  return db.transaction(async (tx) => {
    const current = await tx
      .select({ role: memberships.role })
      .from(memberships)
      .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)))
      .for("update");
    const before = current[0]?.role;
    if (!before) return { ok: false, status: 404, message: "That person is not a member of this team." } as const;
    if (before === role) return { ok: true } as const;
    if (before === "owner") {
      const owners = await tx
        .select({ n: sql<number>`count(*)::int` })
        .from(memberships)
        .where(and(eq(memberships.teamId, teamId), eq(memberships.role, "owner")));
      if ((owners[0]?.n ?? 0) <= 1) {
        return {
          ok: false,
          status: 409,
          message: "A team must keep at least one owner: make someone else owner first.",
        } as const;
      }
    }
    await tx
      .update(memberships)
      .set({ role })
      .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
    await recordAudit(
      {
        teamId,
        actorId,
        action: "member.role-changed",
        targetType: "user",
        targetId: userId,
        details: { from: before, to: role },
      },
      tx,
    );
    return { ok: true } as const;
  });
}

/**
 * Ends every session of the user: tokens carrying an older version are refused from now on. With
 * `onlyIfVersion`, only when that is still the current version (a dead session cannot end live ones).
 */
export async function bumpSessionVersion(userId: string, tx?: Tx | Db, onlyIfVersion?: number): Promise<number | null> {
  const db = tx ?? (await getDb());
  const [row] = await db
    .update(users)
    .set({ sessionVersion: sql`${users.sessionVersion} + 1` })
    .where(
      onlyIfVersion === undefined
        ? eq(users.id, userId)
        : and(eq(users.id, userId), eq(users.sessionVersion, onlyIfVersion)),
    )
    .returning({ sessionVersion: users.sessionVersion });
  return row?.sessionVersion ?? null;
}

export async function findUserById(userId: string) {
  const db = await getDb();
  const rows = await db.select().from(users).where(eq(users.id, userId)).limit(1);
  return rows[0] ?? null;
}

/**
 * Sets a new password hash if the stored one is still `expectedHash` (a concurrent change wins once),
 * ends every session (the version goes up) and audits it, in one transaction. Returns the new session
 * version, or null when the password changed meanwhile.
 */
export async function changePassword(input: {
  userId: string;
  teamId: string;
  expectedHash: string;
  newHash: string;
}): Promise<number | null> {
  const db = await getDb();
  return db.transaction(async (tx) => {
    const [row] = await tx
      .update(users)
      .set({ passwordHash: input.newHash, sessionVersion: sql`${users.sessionVersion} + 1` })
      .where(and(eq(users.id, input.userId), eq(users.passwordHash, input.expectedHash)))
      .returning({ sessionVersion: users.sessionVersion });
    if (!row) return null;
    await recordAudit(
      {
        teamId: input.teamId,
        actorId: input.userId,
        action: "password.changed",
        targetType: "user",
        targetId: input.userId,
        details: { sessionsEnded: true },
      },
      tx,
    );
    return row.sessionVersion;
  });
}
