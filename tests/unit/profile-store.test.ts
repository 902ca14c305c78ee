// The stored form of a profile: samples as little-endian Float64 bytea, written with its audit
// event in one transaction; a failed write leaves nothing behind.
import { eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, getDb } from "@/db/client";
import { deleteProfile, getProfile, insertProfile, listProfiles } from "@/db/queries/profiles";
import { auditEvents, designs, profiles, teams, users } from "@/db/schema";
import { summarizeProfile } from "@/lib/profile";

let teamId = "";
let userId = "";
let designId = "";
const suffix = Math.random().toString(36).slice(2, 8);
const design = { shuntOhms: 0.1, gain: 20, supplyV: 3, fullScaleV: 2.5, lsbA: 1e-3 };

beforeAll(async () => {
  const db = await getDb();
  const [team] = await db
    .insert(teams)
    .values({ name: `Profile store ${suffix}` })
    .returning();
  teamId = team!.id;
  const [user] = await db
    .insert(users)
    .values({ email: `store-${suffix}@test.example`, name: "Store tester", passwordHash: "x" })
    .returning();
  userId = user!.id;
  const [d] = await db.insert(designs).values({ teamId, name: "Store design", createdBy: userId }).returning();
  designId = d!.id;
});
afterAll(closeDb);

describe("profile storage", () => {
  const timesS = new Float64Array([0, 0.5, 1.5]);
  const currentsA = new Float64Array([1.5, -2, 0.25]);

  it("writes the samples as little-endian Float64 and reads them back", async () => {
    const summary = summarizeProfile(timesS, currentsA, design);
    const { id } = await insertProfile({
      teamId,
      designId,
      revision: 1,
      fileName: "a.csv",
      timesS,
      currentsA,
      summary,
      userId,
      userName: "Store tester",
    });
    const db = await getDb();
    const [raw] = await db.select({ bytes: profiles.currentsA }).from(profiles).where(eq(profiles.id, id));
    // 1.5 = 0x3FF8000000000000, least significant byte first.
    expect(Array.from(raw!.bytes.subarray(0, 8))).toEqual([0, 0, 0, 0, 0, 0, 0xf8, 0x3f]);
    expect(raw!.bytes.byteLength).toBe(24);
    const [hex] = await db
      .select({ h: sql<string>`encode(${profiles.timesS}, 'hex')` })
      .from(profiles)
      .where(eq(profiles.id, id));
    expect(hex!.h.slice(16, 32)).toBe("000000000000e03f"); // 0.5 little-endian

    const back = await getProfile(designId, id);
    expect(Array.from(back!.timesS)).toEqual(Array.from(timesS));
    expect(Array.from(back!.currentsA)).toEqual(Array.from(currentsA));
    expect((await listProfiles(designId)).map((p) => p.id)).toContain(id);
    const events = await db.select().from(auditEvents).where(eq(auditEvents.targetId, designId));
    expect(events.map((e) => e.action)).toContain("profile.upload");

    expect(await deleteProfile({ teamId, designId, profileId: id, actorId: userId })).toBe(true);
    expect(await getProfile(designId, id)).toBeNull(); // the cache forgot it too
  });

  it("a write that fails stores neither the profile nor its audit event", async () => {
    const db = await getDb();
    const count = async () => (await db.select({ n: sql<number>`count(*)::int` }).from(profiles)).at(0)!.n;
    const audits = async () => (await db.select({ n: sql<number>`count(*)::int` }).from(auditEvents)).at(0)!.n;
    const [p0, a0] = [await count(), await audits()];
    const summary = summarizeProfile(timesS, currentsA, design);
    // An uploader who does not exist breaks the foreign key inside the transaction.
    await expect(
      insertProfile({
        teamId,
        designId,
        revision: 1,
        fileName: "b.csv",
        timesS,
        currentsA,
        summary,
        userId: "00000000-0000-4000-8000-000000000000",
        userName: "nobody",
      }),
    ).rejects.toThrow();
    expect([await count(), await audits()]).toEqual([p0, a0]);
  });
});
