// Invitations (a single-use link, only its hash kept, 7 days), accepting one, founding a new team
// through one, and removing members. A team always keeps at least one owner.
import { createHash, randomBytes } from "node:crypto";
import { and, desc, eq, gt, isNull, sql } from "drizzle-orm";
import { getDb } from "../client";
import { invitations, memberships, teams, users, type Role } from "../schema";
import { recordAudit } from "./audit";
import { bumpSessionVersion } from "./users";

export const INVITATION_DAYS = 7;
const DAY_MS = 24 * 60 * 60 * 1000;

export const hashToken = (token: string) => createHash("sha256").update(token, "utf8").digest("hex");

export type InvitationStatus = "pending" | "accepted" | "revoked" | "expired";

function statusOf(
  i: { acceptedAt: Date | null; revokedAt: Date | null; expiresAt: Date },
  now = new Date(),
): InvitationStatus {
  if (i.acceptedAt) return "accepted";
  if (i.revokedAt) return "revoked";
  return i.expiresAt <= now ? "expired" : "pending";
}

export type CreateInvitationResult =
  | {
      ok: true;
      id: string;
      token: string;
      teamId: string;
      teamName: string;
      email: string;
      role: Role;
      expiresAt: string;
    }
  | { ok: false; reason: "conflict"; message: string };

/**
 * Invites `email` to the caller's team with `role` — or, with `newTeam`, creates that team and
 * invites `email` as its first owner.
 */
export async function createInvitation(input: {
  teamId: string;
  invitedBy: string;
  email: string;
  role: Role;
  newTeam?: string;
}): Promise<CreateInvitationResult> {
  const db = await getDb();
  const email = input.email.trim().toLowerCase();
  const token = randomBytes(32).toString("base64url");
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * DAY_MS);
  return db.transaction(async (tx): Promise<CreateInvitationResult> => {
    let teamId = input.teamId;
    let teamName = "";
    if (input.newTeam) {
      const [team] = await tx.insert(teams).values({ name: input.newTeam.trim() }).returning();
      if (!team) throw new Error("team not created");
      teamId = team.id;
      teamName = team.name;
    } else {
      const member = await tx
        .select({ id: users.id })
        .from(memberships)
        .innerJoin(users, eq(users.id, memberships.userId))
        .where(and(eq(memberships.teamId, teamId), sql`lower(${users.email}) = ${email}`));
      if (member[0]) return { ok: false, reason: "conflict", message: `${email} is already a member of this team.` };
      const pending = await tx
        .select({ id: invitations.id })
        .from(invitations)
        .where(
          and(
            eq(invitations.teamId, teamId),
            sql`lower(${invitations.email}) = ${email}`,
            isNull(invitations.acceptedAt),
            isNull(invitations.revokedAt),
            gt(invitations.expiresAt, sql`now()`),
          ),
        );
      if (pending[0])
        return {
          ok: false,
          reason: "conflict",
          message: `${email} already has a pending invitation; revoke it first to send a new one.`,
        };
      const [team] = await tx.select({ name: teams.name }).from(teams).where(eq(teams.id, teamId));
      teamName = team?.name ?? "";
    }
    const role: Role = input.newTeam ? "owner" : input.role;
    const [row] = await tx
      .insert(invitations)
      .values({ teamId, email, role, tokenHash: hashToken(token), invitedBy: input.invitedBy, expiresAt })
      .returning({ id: invitations.id });
    if (!row) throw new Error("invitation not stored");
    // Audited in the inviting team's log (and, for a new team, in that team's log too).
    const details = {
      email,
      role,
      expiresAt: expiresAt.toISOString(),
      ...(input.newTeam ? { newTeam: teamName, newTeamId: teamId } : {}),
    };
    await recordAudit(
      {
        teamId: input.teamId,
        actorId: input.invitedBy,
        action: "invitation.created",
        targetType: "invitation",
        targetId: row.id,
        details,
      },
      tx,
    );
    if (input.newTeam) {
      await recordAudit(
        {
          teamId,
          actorId: input.invitedBy,
          action: "team.created",
          targetType: "team",
          targetId: teamId,
          details: { name: teamName, firstOwner: email },
        },
        tx,
      );
    }
    return { ok: true, id: row.id, token, teamId, teamName, email, role, expiresAt: expiresAt.toISOString() };
  });
}

export async function listInvitations(teamId: string) {
  const db = await getDb();
  const rows = await db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      expiresAt: invitations.expiresAt,
      acceptedAt: invitations.acceptedAt,
      revokedAt: invitations.revokedAt,
      createdAt: invitations.createdAt,
      invitedByName: users.name,
    })
    .from(invitations)
    .innerJoin(users, eq(users.id, invitations.invitedBy))
    .where(eq(invitations.teamId, teamId))
    .orderBy(desc(invitations.createdAt));
  return rows.map((r) => ({
    id: r.id,
    email: r.email,
    role: r.role,
    status: statusOf(r),
    invitedByName: r.invitedByName,
    createdAt: r.createdAt.toISOString(),
    expiresAt: r.expiresAt.toISOString(),
    acceptedAt: r.acceptedAt?.toISOString() ?? null,
    revokedAt: r.revokedAt?.toISOString() ?? null,
  }));
}

export type RevokeResult =
  { ok: true; revokedAt: string } | { ok: false; reason: "not-found" | "conflict"; message: string };

export async function revokeInvitation(teamId: string, id: string, actorId: string): Promise<RevokeResult> {
  const db = await getDb();
  return db.transaction(async (tx): Promise<RevokeResult> => {
    const [inv] = await tx
      .select()
      .from(invitations)
      .where(and(eq(invitations.id, id), eq(invitations.teamId, teamId)))
      .for("update");
    if (!inv) return { ok: false, reason: "not-found", message: "That invitation was not found in your team." };
    const status = statusOf(inv);
    if (status !== "pending")
      return { ok: false, reason: "conflict", message: `That invitation is already ${status}.` };
    const [row] = await tx
      .update(invitations)
      .set({ revokedAt: sql`now()` })
      .where(eq(invitations.id, id))
      .returning({ revokedAt: invitations.revokedAt });
    await recordAudit(
      {
        teamId,
        actorId,
        action: "invitation.revoked",
        targetType: "invitation",
        targetId: id,
        details: { email: inv.email, role: inv.role },
      },
      tx,
    );
    return { ok: true, revokedAt: (row?.revokedAt ?? new Date()).toISOString() };
  });
}

/** The invitation a link names, with its team, whatever its state (the page explains each). */
export async function findInvitationByToken(token: string) {
  const db = await getDb();
  const rows = await db
    .select({ invitation: invitations, teamName: teams.name })
    .from(invitations)
    .innerJoin(teams, eq(teams.id, invitations.teamId))
    .where(eq(invitations.tokenHash, hashToken(token)))
    .limit(1);
  const row = rows[0];
  if (!row) return null;
  const { invitation: i } = row;
  const existing = await db
    .select({ id: users.id })
    .from(users)
    .where(sql`lower(${users.email}) = ${i.email.toLowerCase()}`);
  return {
    id: i.id,
    teamId: i.teamId,
    teamName: row.teamName,
    email: i.email,
    role: i.role,
    status: statusOf(i),
    expiresAt: i.expiresAt.toISOString(),
    hasAccount: !!existing[0],
  };
}

export type AcceptResult =
  | { ok: true; userId: string; teamId: string; teamName: string; email: string; role: Role; newAccount: boolean }
  | {
      ok: false;
      reason: "unauthenticated" | "denied" | "not-found" | "conflict" | "gone" | "invalid";
      message: string;
      field?: string;
    };

/**
 * Accepts an invitation once. An invitation for an existing account is accepted only by a caller
 * signed in as that account (`signedInUserId`): no password is ever checked here, so the call cannot
 * be used to guess one. A new account gets the name and password hash given. The token is looked up
 * first; every refusal is audited in the same transaction; marking it accepted is a compare-and-set.
 */
export async function acceptInvitation(input: {
  token: string;
  signedInUserId: string | null;
  /** Whether the request carried a password (refused for an existing account). */
  passwordOffered: boolean;
  newAccount?: { name: string; passwordHash: string };
}): Promise<AcceptResult> {
  const db = await getDb();
  return db.transaction(async (tx): Promise<AcceptResult> => {
    const tokenHash = hashToken(input.token);
    const [inv] = await tx.select().from(invitations).where(eq(invitations.tokenHash, tokenHash)).for("update");
    const [account] = inv
      ? await tx
          .select({ id: users.id })
          .from(users)
          .where(sql`lower(${users.email}) = ${inv.email.toLowerCase()}`)
      : [];
    // A refusal is recorded in the invitation's team and, when the invited e-mail has an account, in
    // that account's teams too: their owners see who tried to pull their member elsewhere.
    const refuse = async (
      refusal: "unauthenticated" | "denied" | "not-found" | "conflict" | "gone" | "invalid",
      message: string,
      reason: string,
      field?: string,
    ): Promise<AcceptResult> => {
      const accountTeams = account
        ? (
            await tx.select({ teamId: memberships.teamId }).from(memberships).where(eq(memberships.userId, account.id))
          ).map((m) => m.teamId)
        : [];
      const teamIds = [...new Set([inv?.teamId ?? null, ...accountTeams])];
      for (const teamId of teamIds) {
        await recordAudit(
          {
            teamId,
            actorId: input.signedInUserId,
            action: "invitation.refused",
            targetType: "invitation",
            targetId: inv?.id ?? `token:${tokenHash.slice(0, 16)}`,
            details: {
              reason,
              email: inv?.email ?? null,
              invitingTeamId: inv?.teamId ?? null,
              passwordOffered: input.passwordOffered,
            },
          },
          tx,
        );
      }
      return { ok: false, reason: refusal, message, ...(field ? { field } : {}) };
    };
    if (!inv) return refuse("not-found", "That invitation link is not valid.", "unknown token");
    const status = statusOf(inv);
    if (status === "accepted")
      return refuse("conflict", "That invitation has been used already; sign in instead.", "already accepted");
    if (status === "revoked") return refuse("gone", "That invitation was revoked by the team's owner.", "revoked");
    if (status === "expired")
      return refuse(
        "gone",
        `That invitation expired on ${inv.expiresAt.toISOString().slice(0, 10)}; ask the owner for a new one.`,
        "expired",
      );
    const [team] = await tx.select({ name: teams.name }).from(teams).where(eq(teams.id, inv.teamId));
    const existing = account;
    let userId: string;
    if (existing) {
      if (input.signedInUserId !== existing.id) {
        const how = `sign in as ${inv.email}, open the invitation link again and press Join`;
        return input.signedInUserId
          ? refuse(
              "denied",
              `This invitation is for ${inv.email}, not for the account you are signed in as: ${how}.`,
              "signed in as another account",
            )
          : refuse(
              "unauthenticated",
              `An account with ${inv.email} exists: ${how}. A password is never accepted here.`,
              input.passwordOffered ? "password offered for an existing account" : "not signed in",
            );
      }
      const member = await tx
        .select({ id: memberships.id })
        .from(memberships)
        .where(and(eq(memberships.teamId, inv.teamId), eq(memberships.userId, existing.id)));
      if (member[0]) return refuse("conflict", "You are a member of this team already.", "already a member");
      userId = existing.id;
    } else {
      if (!input.newAccount)
        return refuse(
          "invalid",
          "Choose a password for your new account.",
          "no password for a new account",
          "password",
        );
      if (!input.newAccount.name.trim())
        return refuse("invalid", "Give your name: it is how the team sees you.", "no name", "name");
      const [u] = await tx
        .insert(users)
        .values({ email: inv.email, name: input.newAccount.name.trim(), passwordHash: input.newAccount.passwordHash })
        .returning({ id: users.id });
      if (!u) throw new Error("user not created");
      userId = u.id;
    }
    await tx.insert(memberships).values({ teamId: inv.teamId, userId, role: inv.role });
    await tx
      .update(invitations)
      .set({ acceptedAt: sql`now()` })
      .where(and(eq(invitations.id, inv.id), isNull(invitations.acceptedAt)));
    await recordAudit(
      {
        teamId: inv.teamId,
        actorId: userId,
        action: "invitation.accepted",
        targetType: "invitation",
        targetId: inv.id,
        details: { email: inv.email, role: inv.role, newAccount: !existing },
      },
      tx,
    );
    return {
      ok: true,
      userId,
      teamId: inv.teamId,
      teamName: team?.name ?? "",
      email: inv.email,
      role: inv.role,
      newAccount: !existing,
    };
  });
}

export type RemoveResult = { ok: true } | { ok: false; reason: "not-found" | "conflict"; message: string };

/** Removes a member from the team (not their account); refuses to remove the last owner. */
export async function removeMember(teamId: string, userId: string, actorId: string): Promise<RemoveResult> {
  const db = await getDb();
  return db.transaction(async (tx): Promise<RemoveResult> => {
    const [m] = await tx
      .select({ role: memberships.role, email: users.email, name: users.name })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)))
      .for("update", { of: memberships });
    if (!m) return { ok: false, reason: "not-found", message: "That person is not a member of this team." };
    if (m.role === "owner") {
      const [owners] = await tx
        .select({ n: sql<number>`count(*)::int` })
        .from(memberships)
        .where(and(eq(memberships.teamId, teamId), eq(memberships.role, "owner")));
      if ((owners?.n ?? 0) <= 1)
        return {
          ok: false,
          reason: "conflict",
          message: "A team must keep at least one owner: make someone else owner first.",
        };
    }
    await tx.delete(memberships).where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
    // Their sessions end everywhere (a session carries one team; the others sign in again).
    await bumpSessionVersion(userId, tx);
    await recordAudit(
      {
        teamId,
        actorId,
        action: "member.removed",
        targetType: "user",
        targetId: userId,
        details: { email: m.email, name: m.name, role: m.role },
      },
      tx,
    );
    return { ok: true };
  });
}
