import { and, asc, eq, inArray, sql } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { getDb } from "../client";
import { preparedOnce } from "./prepared";
import { alias } from "drizzle-orm/pg-core";
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

/** What the gate reads of a member: identity, team, role and session version. */
const memberColumns = {
  userId: users.id,
  email: users.email,
  name: users.name,
  teamId: teams.id,
  teamName: teams.name,
  role: memberships.role,
  sessionVersion: users.sessionVersion,
};

/**
 * The caller as the database sees them now: identity, team, current role and session version (or null
 * if no longer a member).
 */
export async function getMember(userId: string, teamId: string) {
  const db = await getDb();
  const rows = await db
    .select(memberColumns)
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(and(eq(memberships.userId, userId), eq(memberships.teamId, teamId)))
    .limit(1);
  return rows[0] ?? null;
}

/** A team the user belongs to, as the header's team switcher lists it. */
export type TeamOfUser = { id: string; name: string; role: Role };

/**
 * getMember and listTeamsOf in one read, for a signed-in page (its header lists the teams): the
 * member of `teamId`, with every team of the user in the order joined, or null if not a member.
 */
export async function getMemberWithTeams(userId: string, teamId: string) {
  const rows = await memberWithTeams(await getDb()).execute({ userId, teamId });
  return rows[0] ?? null;
}

const memberWithTeams = preparedOnce((db) => {
  const mine = alias(memberships, "mine");
  const myTeam = alias(teams, "my_team");
  const teamsOfUser = db
    .select({
      list: sql<
        TeamOfUser[]
      >`coalesce(json_agg(json_build_object('id', ${myTeam.id}, 'name', ${myTeam.name}, 'role', ${mine.role}) order by ${mine.createdAt}), '[]'::json)`.as(
        "list",
      ),
    })
    .from(mine)
    .innerJoin(myTeam, eq(myTeam.id, mine.teamId))
    .where(eq(mine.userId, memberships.userId));
  return db
    .select({ ...memberColumns, teams: sql<TeamOfUser[]>`(${teamsOfUser})` })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(and(eq(memberships.userId, sql.placeholder("userId")), eq(memberships.teamId, sql.placeholder("teamId"))))
    .limit(1)
    .prepare("member_with_teams");
});

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

/** `before`: the role the member had (the same as asked when nothing changed). */
export type RoleChangeResult =
  { ok: true; before: Role } | { ok: false; reason: "not-found" | "conflict"; message: string };

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
    if (!before)
      return { ok: false, reason: "not-found", message: "That person is not a member of this team." } as const;
    if (before === role) return { ok: true, before } as const;
    if (before === "owner") {
      const owners = await tx
        .select({ n: sql<number>`count(*)::int` })
        .from(memberships)
        .where(and(eq(memberships.teamId, teamId), eq(memberships.role, "owner")));
      if ((owners[0]?.n ?? 0) <= 1) {
        return {
          ok: false,
          reason: "conflict",
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
    return { ok: true, before } as const;
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

/** Every team the user belongs to, with their role there, oldest membership first. */
export async function listTeamsOf(userId: string) {
  const db = await getDb();
  return db
    .select({ id: teams.id, name: teams.name, role: memberships.role })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(memberships.createdAt));
}

export type MailPreferences = { submitted: boolean; returned: boolean; approved: boolean; comments: boolean };

/** The account as the /account page and GET /api/me show it. */
export async function getAccount(userId: string) {
  const db = await getDb();
  const [row] = await db
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      submitted: users.mailOnSubmitted,
      returned: users.mailOnReturned,
      approved: users.mailOnApproved,
      comments: users.mailOnComments,
    })
    .from(users)
    .where(eq(users.id, userId));
  if (!row) return null;
  const { submitted, returned, approved, comments, ...user } = row;
  return { user, mail: { submitted, returned, approved, comments } satisfies MailPreferences };
}

/** Display name and mail choices; audited in the team the change was made from. */
export async function updateAccount(
  userId: string,
  teamId: string,
  change: { name?: string; mail?: Partial<MailPreferences> },
): Promise<void> {
  const db = await getDb();
  await db.transaction(async (tx) => {
    const set: Partial<typeof users.$inferInsert> = {};
    if (change.name !== undefined) set.name = change.name;
    if (change.mail?.submitted !== undefined) set.mailOnSubmitted = change.mail.submitted;
    if (change.mail?.returned !== undefined) set.mailOnReturned = change.mail.returned;
    if (change.mail?.approved !== undefined) set.mailOnApproved = change.mail.approved;
    if (change.mail?.comments !== undefined) set.mailOnComments = change.mail.comments;
    if (Object.keys(set).length === 0) return;
    await tx.update(users).set(set).where(eq(users.id, userId));
    await recordAudit(
      {
        teamId,
        actorId: userId,
        action: "account.updated",
        targetType: "user",
        targetId: userId,
        details: { changed: Object.keys(change).filter((k) => change[k as keyof typeof change] !== undefined) },
      },
      tx,
    );
  });
}

/** Who of these users wants this kind of review mail. */
export async function wantingMail(userIds: string[], kind: keyof MailPreferences): Promise<Set<string>> {
  if (userIds.length === 0) return new Set();
  const db = await getDb();
  const column = {
    submitted: users.mailOnSubmitted,
    returned: users.mailOnReturned,
    approved: users.mailOnApproved,
    comments: users.mailOnComments,
  }[kind];
  const rows = await db
    .select({ id: users.id })
    .from(users)
    .where(and(inArray(users.id, userIds), eq(column, true)));
  return new Set(rows.map((r) => r.id));
}
