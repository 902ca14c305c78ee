// Personal API tokens: stored as the SHA-256 of the secret; created and revoked with an entry in the
// team log in the same transaction.
import { and, desc, eq, isNull, lt, or, sql } from "drizzle-orm";
import { getDb } from "../client";
import { apiTokens, teams, type TokenAccess } from "../schema";
import { recordAudit } from "./audit";

export type NewToken = {
  userId: string;
  teamId: string;
  name: string;
  access: TokenAccess;
  secretHash: string;
  hint: string;
  expiresAt: Date | null;
};

export async function insertToken(input: NewToken): Promise<{ id: string; createdAt: Date }> {
  const db = await getDb();
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(apiTokens)
      .values(input)
      .returning({ id: apiTokens.id, createdAt: apiTokens.createdAt });
    if (!row) throw new Error("token not stored");
    await recordAudit(
      {
        teamId: input.teamId,
        actorId: input.userId,
        action: "token.created",
        targetType: "token",
        targetId: row.id,
        details: { name: input.name, access: input.access, expiresAt: input.expiresAt?.toISOString() ?? null },
      },
      tx,
    );
    return row;
  });
}

const listed = {
  id: apiTokens.id,
  name: apiTokens.name,
  access: apiTokens.access,
  hint: apiTokens.hint,
  teamId: apiTokens.teamId,
  teamName: teams.name,
  createdAt: apiTokens.createdAt,
  expiresAt: apiTokens.expiresAt,
  lastUsedAt: apiTokens.lastUsedAt,
  expired: sql<boolean>`coalesce(${apiTokens.expiresAt} <= now(), false)`,
};
/** The user's tokens that are not revoked, newest first (expired ones too, so they can be cleared). */
export async function listTokens(userId: string) {
  const db = await getDb();
  return db
    .select(listed)
    .from(apiTokens)
    .innerJoin(teams, eq(teams.id, apiTokens.teamId))
    .where(and(eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt)))
    .orderBy(desc(apiTokens.createdAt));
}

/** Revokes one of the user's own tokens; false when it is not theirs or already revoked. */
export async function revokeToken(userId: string, tokenId: string, actorId: string): Promise<boolean> {
  const db = await getDb();
  return db.transaction(async (tx) => {
    const [row] = await tx
      .update(apiTokens)
      .set({ revokedAt: sql`now()` })
      .where(and(eq(apiTokens.id, tokenId), eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt)))
      .returning({ id: apiTokens.id, teamId: apiTokens.teamId, name: apiTokens.name });
    if (!row) return false;
    await recordAudit(
      {
        teamId: row.teamId,
        actorId,
        action: "token.revoked",
        targetType: "token",
        targetId: row.id,
        details: { name: row.name },
      },
      tx,
    );
    return true;
  });
}

/** The token row a secret's hash names, whatever its state (the caller judges revoked and expired). */
export async function findTokenByHash(secretHash: string) {
  const db = await getDb();
  const [row] = await db.select().from(apiTokens).where(eq(apiTokens.secretHash, secretHash)).limit(1);
  return row ?? null;
}

/** Stamps lastUsedAt, at most once a minute per token so scripts do not turn every read into a write. */
export async function touchToken(tokenId: string): Promise<void> {
  const db = await getDb();
  await db
    .update(apiTokens)
    .set({ lastUsedAt: sql`now()` })
    .where(
      and(
        eq(apiTokens.id, tokenId),
        or(isNull(apiTokens.lastUsedAt), lt(apiTokens.lastUsedAt, sql`now() - interval '1 minute'`)),
      ),
    );
}
