import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, getDb } from "../client";
import { memberships, teams, users } from "../schema";
import { listTeamAudit } from "./audit";
import { changeMemberRole, findUserByEmail, getMember, getMemberWithTeams, listMembers, listTeamsOf } from "./users";

let teamId = "";
const ids: Record<string, string> = {};
const suffix = Math.random().toString(36).slice(2, 8);

beforeAll(async () => {
  const db = await getDb();
  const [team] = await db
    .insert(teams)
    .values({ name: `Role test team ${suffix}` })
    .returning();
  teamId = team!.id;
  for (const role of ["owner", "designer", "maker"] as const) {
    const [u] = await db
      .insert(users)
      .values({ email: `${role}-${suffix}@test.example`, name: `${role} ${suffix}`, passwordHash: "x" })
      .returning();
    ids[role] = u!.id;
    await db.insert(memberships).values({ teamId, userId: u!.id, role });
  }
});

afterAll(closeDb);

describe("memberships", () => {
  it("reads a member with their teams in one query as getMember and listTeamsOf do apart", async () => {
    const db = await getDb();
    const [second] = await db
      .insert(teams)
      .values({ name: `Second team ${suffix}` })
      .returning();
    await db.insert(memberships).values({ teamId: second!.id, userId: ids.designer!, role: "maker" });
    const both = await getMemberWithTeams(ids.designer!, teamId);
    const { teams: teamList, ...member } = both!;
    expect(member).toEqual(await getMember(ids.designer!, teamId));
    expect(teamList).toEqual(await listTeamsOf(ids.designer!));
    expect(teamList.map((t) => [t.name, t.role])).toEqual([
      [`Role test team ${suffix}`, "designer"],
      [`Second team ${suffix}`, "maker"],
    ]);
    expect(await getMemberWithTeams(ids.owner!, second!.id)).toBeNull();
  });

  it("finds a user by e-mail without regard to case", async () => {
    expect((await findUserByEmail(`OWNER-${suffix}@Test.Example`))?.id).toBe(ids.owner);
  });

  it("refuses a second user with the same e-mail in another case", async () => {
    const db = await getDb();
    await expect(
      db.insert(users).values({ email: `Owner-${suffix}@test.example`, name: "dup", passwordHash: "x" }),
    ).rejects.toThrow();
  });

  it("changes a role, keeps it on the membership only, and audits it", async () => {
    expect(await changeMemberRole(teamId, ids.maker!, "designer", ids.owner!)).toEqual({ ok: true, before: "maker" });
    expect((await getMember(ids.maker!, teamId))?.role).toBe("designer");
    const log = await listTeamAudit(teamId);
    expect(log[0]).toMatchObject({
      action: "member.role-changed",
      targetId: ids.maker,
      details: { from: "maker", to: "designer" },
    });
  });

  it("never leaves a team without an owner", async () => {
    const result = await changeMemberRole(teamId, ids.owner!, "designer", ids.owner!);
    expect(result).toMatchObject({ ok: false, reason: "conflict" });
    expect((await listMembers(teamId)).filter((m) => m.role === "owner")).toHaveLength(1);
  });

  it("says so for someone outside the team", async () => {
    expect(await changeMemberRole(teamId, "00000000-0000-0000-0000-000000000000", "owner", ids.owner!)).toMatchObject({
      ok: false,
      reason: "not-found",
    });
  });
});
