import { asc, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, getDb } from "../client";
import { libraryAdcs, libraryAmplifiers, libraryMeters, libraryShunts, teams } from "../schema";
import { seedDemoLibrary } from "../seed/library";
import { listLibrary } from "./library";

let teamId = "";
let otherTeamId = "";

beforeAll(async () => {
  const db = await getDb();
  const [team] = await db.insert(teams).values({ name: "Library read test team" }).returning();
  const [other] = await db.insert(teams).values({ name: "Library read other team" }).returning();
  teamId = team!.id;
  otherTeamId = other!.id;
  // Every kind of part (the demo library has some of each), and another team's that must not show.
  await seedDemoLibrary({ teamId, userIds: {} as never });
  await seedDemoLibrary({ teamId: otherTeamId, userIds: {} as never });
});

afterAll(closeDb);

const iso = <T extends { createdAt: Date; updatedAt: Date }>(r: T) => ({
  ...r,
  createdAt: r.createdAt.toISOString(),
  updatedAt: r.updatedAt.toISOString(),
});

describe("listLibrary", () => {
  it("reads the four tables in one query exactly as four selects of the team's rows by name read them", async () => {
    const db = await getDb();
    const [amplifiers, shunts, adcs, meters] = await Promise.all(
      [libraryAmplifiers, libraryShunts, libraryAdcs, libraryMeters].map((t) =>
        db.select().from(t).where(eq(t.teamId, teamId)).orderBy(asc(t.name)),
      ),
    );
    const library = await listLibrary(teamId);
    expect(library.amplifiers.length).toBeGreaterThan(1);
    expect(library.shunts.length).toBeGreaterThan(1);
    expect(library.adcs.length).toBeGreaterThan(0);
    expect(library.meters.length).toBeGreaterThan(0);
    // toStrictEqual: the same keys, numbers to the last bit, arrays and objects alike.
    expect(library).toStrictEqual({
      amplifiers: amplifiers!.map(iso),
      shunts: shunts!.map(iso),
      adcs: adcs!.map(iso),
      meters: meters!.map(iso),
    });
    expect(library.amplifiers.every((a) => a.teamId === teamId)).toBe(true);
  });

  it("reads an empty library as four empty lists", async () => {
    const db = await getDb();
    const [empty] = await db.insert(teams).values({ name: "Library read empty team" }).returning();
    expect(await listLibrary(empty!.id)).toStrictEqual({ amplifiers: [], shunts: [], adcs: [], meters: [] });
  });
});
