// The account routes over HTTP: GET/PATCH /api/me, PUT /api/me/team, and review mail that honours
// each person's choices (issue 17 items 4 and 5). Mail is read back from the built-in outbox.
import { expect, test, type APIRequestContext } from "@playwright/test";
import { apiAs } from "../fixtures/auth";
import { createDesign, makeTwoTeamMember, submitDesign, unique } from "./authz-helpers";

type Outbox = { messages: { to: string | string[]; subject: string }[] };
const mailTo = async (owner: APIRequestContext, email: string, subjectPart: string) => {
  const box = (await (await owner.get("/api/outbox")).json()) as Outbox;
  return box.messages.filter((m) => [m.to].flat().join(",").includes(email) && m.subject.includes(subjectPart));
};

test.describe.serial("account", () => {
  let owner: APIRequestContext;
  let designer: APIRequestContext;
  let reviewer: APIRequestContext;
  test.beforeAll(async () => {
    [owner, designer, reviewer] = await Promise.all([apiAs("owner"), apiAs("designer"), apiAs("reviewer")]);
  });
  test.afterAll(async () => {
    await Promise.all([owner, designer, reviewer].map((c) => c?.dispose()));
  });

  test("GET /api/me: the user, their teams with roles, the current team", async () => {
    const me = (await (await designer.get("/api/me")).json()) as {
      user: { id: string; email: string; name: string };
      teams: { id: string; name: string; role: string }[];
      currentTeamId: string;
      mail: Record<string, boolean>;
    };
    expect(me.user.email).toBe("designer@harbourline.example");
    expect(me.teams).toEqual([{ id: me.currentTeamId, name: expect.any(String), role: "designer" }]);
    expect(me.mail).toEqual({ submitted: true, returned: true, approved: true, comments: true });
  });

  test("PATCH /api/me changes the display name; bad input is 422 on its field and changes nothing", async () => {
    const bad = await designer.patch("/api/me", { data: { name: "  ", mail: { submitted: "yes" } } });
    expect(bad.status()).toBe(422);
    expect(Object.keys(((await bad.json()) as { fieldErrors: object }).fieldErrors).sort()).toEqual([
      "mail.submitted",
      "name",
    ]);
    const before = (await (await designer.get("/api/me")).json()) as { user: { name: string } };
    const renamed = (await (await designer.patch("/api/me", { data: { name: "Dana Designer" } })).json()) as {
      user: { name: string };
    };
    expect(renamed.user.name).toBe("Dana Designer");
    expect((await designer.patch("/api/me", { data: { name: before.user.name } })).status()).toBe(200);
  });

  test("a reviewer who turns off 'submitted' mail gets none; turned back on, gets it", async () => {
    expect((await reviewer.patch("/api/me", { data: { mail: { submitted: false } } })).status()).toBe(200);
    const quiet = `Quiet ${unique()}`;
    await submitDesign(designer, await createDesign(designer, quiet));

    expect((await reviewer.patch("/api/me", { data: { mail: { submitted: true } } })).status()).toBe(200);
    const loud = `Loud ${unique()}`;
    await submitDesign(designer, await createDesign(designer, loud));
    // Mail goes out after each response (Next's after()), in order: once the second submit's mail is
    // kept, the first one's would have been too.
    await expect.poll(async () => (await mailTo(owner, "reviewer@harbourline.example", loud)).length).toBe(1);
    expect(await mailTo(owner, "reviewer@harbourline.example", quiet)).toHaveLength(0);
  });

  test("an author who turns off comment and return mail gets neither, but still gets approvals", async () => {
    expect((await designer.patch("/api/me", { data: { mail: { comments: false, returned: false } } })).status()).toBe(
      200,
    );
    try {
      const name = `Muted ${unique()}`;
      const id = await createDesign(designer, name);
      expect(
        (await reviewer.post(`/api/designs/${id}/reviews`, { data: { verdict: "comment", body: "hm" } })).status(),
      ).toBe(201);
      await submitDesign(designer, id);
      expect(
        (await reviewer.post(`/api/designs/${id}/reviews`, { data: { verdict: "return", body: "too hot" } })).status(),
      ).toBe(201);
      await submitDesign(designer, id);
      expect(
        (await reviewer.post(`/api/designs/${id}/reviews`, { data: { verdict: "approve", body: "" } })).status(),
      ).toBe(201);
      // The approval's mail is the last queued: once it is kept, the comment's and return's would be.
      await expect
        .poll(async () => (await mailTo(owner, "designer@harbourline.example", name)).map((m) => m.subject))
        .toEqual([expect.stringMatching(/approved/)]);
    } finally {
      await designer.patch("/api/me", { data: { mail: { comments: true, returned: true } } });
    }
  });

  test("PUT /api/me/team: only to one's own teams; the switch changes what every route sees", async () => {
    const two = await makeTwoTeamMember(owner);
    try {
      const refused = await two.ctx.put("/api/me/team", { data: { teamId: "00000000-0000-4000-8000-000000000000" } });
      expect(refused.status()).toBe(404);
      expect((await two.ctx.put("/api/me/team", { data: { teamId: "harbourline" } })).status()).toBe(422);
      expect((await two.ctx.put("/api/me/team", { data: { teamId: two.harbourlineId } })).status()).toBe(200);
      expect((await two.ctx.put("/api/me/team", { data: { teamId: two.ownTeamId } })).status()).toBe(200);
      const me = (await (await two.ctx.get("/api/me")).json()) as { currentTeamId: string };
      expect(me.currentTeamId).toBe(two.ownTeamId);
      const team = (await (await two.ctx.get("/api/team")).json()) as { members: { email: string; role: string }[] };
      expect(team.members).toEqual([expect.objectContaining({ email: two.email, role: "owner" })]);
      // A design made here is this team's only: Harbourline's owner cannot see it.
      const id = await createDesign(two.ctx, `Own bench ${unique()}`);
      expect((await owner.get(`/api/designs/${id}`)).status()).toBe(404);
    } finally {
      await two.ctx.dispose();
    }
  });
});
