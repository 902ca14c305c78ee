// Stored current profiles of a design: samples as little-endian Float64 bytea, written in one
// transaction with the audit event. Callers scope the design by team first (lib/saved-designs/access).
import { and, desc, eq } from "drizzle-orm";
import type { ProfileSummary } from "@/lib/profile";
import { bytesToFloat64, float64ToBytes } from "../float64-bytes";
import { getDb } from "../client";
import { profiles, users } from "../schema";
import { recordAudit } from "./audit";

export type ProfileListItem = {
  id: string;
  fileName: string;
  samples: number;
  revision: number;
  summary: ProfileSummary;
  uploadedBy: string;
  uploadedByName: string;
  createdAt: string;
};

const listColumns = {
  id: profiles.id,
  fileName: profiles.fileName,
  samples: profiles.samples,
  revision: profiles.revision,
  summary: profiles.summary,
  uploadedBy: profiles.uploadedBy,
  uploadedByName: users.name,
  createdAt: profiles.createdAt,
};

/** A row as `listColumns` selects it: the summary column is typed by the schema ($type). */
type ListRow = Omit<ProfileListItem, "createdAt"> & { createdAt: Date };

function toItem(r: ListRow): ProfileListItem {
  return { ...r, createdAt: r.createdAt.toISOString() };
}

export async function listProfiles(designId: string): Promise<ProfileListItem[]> {
  const db = await getDb();
  const rows = await db
    .select(listColumns)
    .from(profiles)
    .innerJoin(users, eq(users.id, profiles.uploadedBy))
    .where(eq(profiles.designId, designId))
    .orderBy(desc(profiles.createdAt));
  return rows.map(toItem);
}

export async function insertProfile(input: {
  teamId: string;
  designId: string;
  revision: number;
  fileName: string;
  timesS: Float64Array;
  currentsA: Float64Array;
  summary: ProfileSummary;
  userId: string;
  userName: string;
}): Promise<{ id: string }> {
  const db = await getDb();
  const stored = await db.transaction(async (tx) => {
    const [row] = await tx
      .insert(profiles)
      .values({
        designId: input.designId,
        revision: input.revision,
        fileName: input.fileName,
        samples: input.timesS.length,
        timesS: float64ToBytes(input.timesS),
        currentsA: float64ToBytes(input.currentsA),
        summary: input.summary,
        uploadedBy: input.userId,
      })
      .returning({ id: profiles.id, createdAt: profiles.createdAt });
    if (!row) throw new Error("profile not stored");
    await recordAudit(
      {
        teamId: input.teamId,
        actorId: input.userId,
        action: "profile.upload",
        targetType: "design",
        targetId: input.designId,
        details: { profileId: row.id, fileName: input.fileName, samples: input.timesS.length },
      },
      tx,
    );
    return row;
  });
  // The chart asks for this profile next: keep the decoded samples rather than read them back.
  remember(`${input.designId}/${stored.id}`, {
    id: stored.id,
    fileName: input.fileName,
    samples: input.timesS.length,
    revision: input.revision,
    summary: input.summary,
    uploadedBy: input.userId,
    uploadedByName: input.userName,
    createdAt: stored.createdAt.toISOString(),
    timesS: input.timesS,
    currentsA: input.currentsA,
  });
  return { id: stored.id };
}

export type StoredProfile = ProfileListItem & { timesS: Float64Array; currentsA: Float64Array };

// Profiles never change once stored: keep the last few decoded ones so zooming does not
// re-read and re-decode megabytes of samples on every request.
const cache = new Map<string, StoredProfile>();
const CACHE_SIZE = 4;

export async function getProfile(designId: string, profileId: string): Promise<StoredProfile | null> {
  const key = `${designId}/${profileId}`;
  const hit = cache.get(key);
  if (hit) {
    cache.delete(key);
    cache.set(key, hit);
    return hit;
  }
  const db = await getDb();
  const [row] = await db
    .select({ ...listColumns, timesS: profiles.timesS, currentsA: profiles.currentsA })
    .from(profiles)
    .innerJoin(users, eq(users.id, profiles.uploadedBy))
    .where(and(eq(profiles.designId, designId), eq(profiles.id, profileId)));
  if (!row) return null;
  const stored: StoredProfile = {
    ...toItem(row),
    timesS: bytesToFloat64(row.timesS),
    currentsA: bytesToFloat64(row.currentsA),
  };
  remember(key, stored);
  return stored;
}

function remember(key: string, stored: StoredProfile) {
  cache.set(key, stored);
  if (cache.size > CACHE_SIZE) cache.delete(cache.keys().next().value!);
}

/** Who uploaded a profile of this design (null: no such profile). */
export async function profileUploader(
  designId: string,
  profileId: string,
): Promise<{ uploadedBy: string; fileName: string } | null> {
  const db = await getDb();
  const [row] = await db
    .select({ uploadedBy: profiles.uploadedBy, fileName: profiles.fileName })
    .from(profiles)
    .where(and(eq(profiles.designId, designId), eq(profiles.id, profileId)));
  return row ?? null;
}

export async function deleteProfile(input: {
  teamId: string;
  designId: string;
  profileId: string;
  actorId: string;
}): Promise<boolean> {
  const db = await getDb();
  return db.transaction(async (tx) => {
    const rows = await tx
      .delete(profiles)
      .where(and(eq(profiles.designId, input.designId), eq(profiles.id, input.profileId)))
      .returning({ fileName: profiles.fileName });
    if (!rows[0]) return false;
    cache.delete(`${input.designId}/${input.profileId}`);
    await recordAudit(
      {
        teamId: input.teamId,
        actorId: input.actorId,
        action: "profile.delete",
        targetType: "design",
        targetId: input.designId,
        details: { profileId: input.profileId, fileName: rows[0].fileName },
      },
      tx,
    );
    return true;
  });
}
