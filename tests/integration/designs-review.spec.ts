// Designs over HTTP: engine checks on save, stale-write refusal, the review flow's rules, and the
// mail the built-in outbox keeps (read back through the owner's outbox).
import { expect, test } from "@playwright/test";
import { apiAs } from "../fixtures/auth";
import { choice, createDesign, requirement, unique } from "./authz-helpers";

type Outbox = { messages: { to: string; subject: string; text: string; sentAt: string }[] };

test("a save is checked by the engine: outside the sweep, infeasible or bad requirement → 422 naming the field", async () => {
  const designer = await apiAs("designer");
  const off = await designer.post("/api/designs", {
    data: { name: "x", requirement, choice: { shuntOhms: 0.275, gain: 50 } },
  });
  expect(off.status()).toBe(422);
  expect(Object.keys((await off.json()).fieldErrors)).toEqual(["choice.shuntOhms"]);
  const gain = await designer.post("/api/designs", {
    data: { name: "x", requirement, choice: { shuntOhms: 0.274, gain: 33 } },
  });
  expect(Object.keys((await gain.json()).fieldErrors)).toEqual(["choice.gain"]);
  const infeasible = await designer.post("/api/designs", {
    data: { name: "x", requirement, choice: { shuntOhms: 0.01, gain: 10 } },
  });
  expect(infeasible.status()).toBe(422);
  expect((await infeasible.json()).message).toContain("do not meet the requirement");
  const bad = await designer.post("/api/designs", {
    data: { name: "x", requirement: { ...requirement, current: { min: "5 V", max: "180 mA" } }, choice },
  });
  expect(bad.status()).toBe(422);
  expect((await bad.json()).fieldErrors["requirement.current.min"][0]).toContain("is a voltage, not a current");
  const noName = await designer.post("/api/designs", { data: { name: "  ", requirement, choice } });
  expect(Object.keys((await noName.json()).fieldErrors)).toEqual(["name"]);
});

test("a stale edit is refused with 409 and changes nothing", async () => {
  const designer = await apiAs("designer");
  const owner = await apiAs("owner");
  const id = await createDesign(designer, `Stale ${unique()}`);
  expect(
    await (await owner.patch(`/api/designs/${id}`, { data: { revision: 1, name: "Owner's edit" } })).json(),
  ).toEqual({ revision: 2 });
  const before = await (await designer.get(`/api/designs/${id}`)).json();
  const stale = await designer.patch(`/api/designs/${id}`, {
    data: { revision: 1, name: "Designer's late edit", choice: { shuntOhms: 0.267, gain: 50 } },
  });
  expect(stale.status()).toBe(409);
  expect((await stale.json()).message).toContain("Someone else saved this design first");
  const after = await (await designer.get(`/api/designs/${id}`)).json();
  expect(after).toEqual(before);
  expect(after.revisions).toHaveLength(2);
  expect(after.name).toBe("Owner's edit");
});

test("an edit re-evaluates the figures, and the revision diff names what changed", async () => {
  const designer = await apiAs("designer");
  const id = await createDesign(designer, `Diff ${unique()}`);
  const res = await designer.patch(`/api/designs/${id}`, {
    data: { revision: 1, choice: { shuntOhms: "267 mohm", gain: 50 } },
  });
  expect(res.status()).toBe(200);
  const d = await (await designer.get(`/api/designs/${id}`)).json();
  expect(d.metrics.burdenV).toBeCloseTo(0.18 * 0.267, 12); // Ohm's law
  const diff = await (await designer.get(`/api/designs/${id}/revisions?a=1&b=2`)).json();
  const paths = diff.changes.map((c: { group: string; path: string }) => `${c.group}.${c.path}`);
  expect(paths).toContain("choice.shuntOhms");
  expect(paths).toContain("figures.burdenV");
  expect(paths.some((p: string) => p.startsWith("requirement."))).toBe(false);
  const shunt = diff.changes.find((c: { path: string }) => c.path === "shuntOhms");
  expect([shunt.aText, shunt.bText]).toEqual(["274 mΩ", "267 mΩ"]);
  expect((await designer.get(`/api/designs/${id}/revisions?a=1&b=9`)).status()).toBe(404);
});

test("review flow: submit mails reviewers, a verdict mails the author, and the rules hold", async () => {
  const designer = await apiAs("designer");
  const reviewer = await apiAs("reviewer");
  const owner = await apiAs("owner");
  const name = `Mailed ${unique()}`;
  const id = await createDesign(designer, name);

  expect((await reviewer.post(`/api/designs/${id}/reviews`, { data: { verdict: "approve", body: "" } })).status()).toBe(
    409,
  ); // still a draft
  const submit = await designer.post(`/api/designs/${id}/submit`, { data: {} });
  expect(submit.status()).toBe(200);
  expect(await submit.json()).toMatchObject({ status: "in-review", revision: 1 });
  expect((await designer.post(`/api/designs/${id}/submit`, { data: {} })).status()).toBe(409); // already in review

  const noReason = await reviewer.post(`/api/designs/${id}/reviews`, { data: { verdict: "return", body: " " } });
  expect(noReason.status()).toBe(422);
  expect(Object.keys((await noReason.json()).fieldErrors)).toEqual(["body"]);
  const returned = await reviewer.post(`/api/designs/${id}/reviews`, {
    data: { verdict: "return", body: "Check the drop at the radio burst." },
  });
  expect(returned.status()).toBe(201);
  expect((await (await designer.get(`/api/designs/${id}`)).json()).status).toBe("returned");

  // Returned → edit → new draft revision → submit again → approve.
  expect((await designer.patch(`/api/designs/${id}`, { data: { revision: 1, name: `${name} b` } })).status()).toBe(200);
  expect((await designer.post(`/api/designs/${id}/submit`, { data: { revision: 2 } })).status()).toBe(200);
  const comment = await reviewer.post(`/api/designs/${id}/reviews`, {
    data: { verdict: "comment", body: "Looks better." },
  });
  const reply = await designer.post(`/api/designs/${id}/reviews`, {
    data: { verdict: "comment", body: "Thanks.", parentId: (await comment.json()).id },
  });
  expect(reply.status()).toBe(201);
  expect(
    (
      await reviewer.post(`/api/designs/${id}/reviews`, {
        data: { verdict: "approve", body: "", parentId: (await comment.json()).id },
      })
    ).status(),
  ).toBe(422);
  expect(
    (
      await reviewer.post(`/api/designs/${id}/reviews`, { data: { verdict: "approve", body: "Good to build." } })
    ).status(),
  ).toBe(201);
  const approved = await (await designer.get(`/api/designs/${id}`)).json();
  expect(approved).toMatchObject({
    status: "approved",
    revision: 2,
    approval: { revision: 2, byName: "Demo Reviewer" },
  });
  expect(approved.revisions.map((r: { approval: unknown }) => r.approval === null)).toEqual([true, false]);
  expect(approved.reviews.find((r: { body: string }) => r.body === "Thanks.").parentId).toBe((await comment.json()).id);
  expect((await designer.post(`/api/designs/${id}/submit`, { data: {} })).status()).toBe(409); // approved already

  // Mail goes out after each response (Next's after()): wait, bounded, until the last of it is kept.
  const readMine = async () =>
    ((await (await owner.get("/api/outbox")).json()) as Outbox).messages.filter((m) => m.subject.includes(name));
  await expect.poll(async () => (await readMine()).length, { timeout: 10_000 }).toBeGreaterThanOrEqual(6);
  const mine = await readMine();
  const toReviewer = mine.filter(
    (m) => m.to === "reviewer@harbourline.example" && m.subject.startsWith("Review requested"),
  );
  expect(toReviewer).toHaveLength(2); // two submits
  expect(toReviewer[0]!.text).toContain(`/designs/${id}`);
  expect(toReviewer[0]!.text).toContain("274 mΩ");
  const verdicts = mine.filter((m) => m.to === "designer@harbourline.example");
  expect(verdicts.map((m) => m.subject)).toEqual(
    expect.arrayContaining([
      `${name} returned (revision 1)`,
      `${name} b approved (revision 2)`,
      `Comment on ${name} b (revision 2)`,
    ]),
  );
  expect(verdicts.find((m) => m.subject.includes("returned"))!.text).toContain("Check the drop at the radio burst.");
  // The reviewer hears of the designer's reply to their comment.
  expect(mine.some((m) => m.to === "reviewer@harbourline.example" && m.text.includes("Thanks."))).toBe(true);
});

test("an owner cannot give the verdict on a revision they wrote", async () => {
  const owner = await apiAs("owner");
  const id = await createDesign(owner, `Own ${unique()}`);
  expect((await owner.post(`/api/designs/${id}/submit`, { data: {} })).status()).toBe(200);
  const self = await owner.post(`/api/designs/${id}/reviews`, { data: { verdict: "approve", body: "" } });
  expect(self.status()).toBe(403);
  expect((await (await owner.get(`/api/designs/${id}`)).json()).status).toBe("in-review");
});

test("invitations: single use, revocable, and the outbox carries the link", async () => {
  const owner = await apiAs("owner");
  const anon = await apiAs(null);
  const email = `joiner-${unique()}@invitee.example`;
  const res = await owner.post("/api/invitations", { data: { email, role: "reviewer" } });
  expect(res.status()).toBe(201);
  const { link, id } = await res.json();
  expect((await owner.post("/api/invitations", { data: { email, role: "reviewer" } })).status()).toBe(409);
  const findMail = async () =>
    ((await (await owner.get("/api/outbox")).json()) as Outbox).messages.find((m) => m.to === email);
  await expect.poll(findMail, { timeout: 10_000 }).toBeDefined();
  const mail = (await findMail())!;
  expect(mail.text).toContain(link);
  const token = new URL(link).pathname.split("/").pop();
  expect(
    (await anon.post("/api/invitations/accept", { data: { token, name: "Joiner", password: "short" } })).status(),
  ).toBe(422);
  expect(
    (
      await anon.post("/api/invitations/accept", { data: { token, name: "Joiner", password: "joiner-password" } })
    ).status(),
  ).toBe(201);
  expect(
    (
      await anon.post("/api/invitations/accept", { data: { token, name: "Joiner", password: "joiner-password" } })
    ).status(),
  ).toBe(409);
  expect((await owner.delete(`/api/invitations/${id}`)).status()).toBe(409); // accepted already
  const team = await (await owner.get("/api/team")).json();
  expect(team.members.find((m: { email: string }) => m.email === email).role).toBe("reviewer");

  const other = await owner.post("/api/invitations", {
    data: { email: `revoked-${unique()}@invitee.example`, role: "maker" },
  });
  const o = await other.json();
  expect((await owner.delete(`/api/invitations/${o.id}`)).status()).toBe(200);
  const revokedToken = new URL(o.link).pathname.split("/").pop();
  const late = await anon.post("/api/invitations/accept", {
    data: { token: revokedToken, name: "Late", password: "late-password" },
  });
  expect(late.status()).toBe(409);
  expect((await late.json()).message).toContain("revoked");

  const log = await (await owner.get("/api/team/audit")).json();
  const actions = log.events.map((e: { action: string }) => e.action);
  expect(actions).toEqual(expect.arrayContaining(["invitation.created", "invitation.accepted", "invitation.revoked"]));
});

test("the last owner cannot be removed; removing a member is audited", async () => {
  const owner = await apiAs("owner");
  const team = await (await owner.get("/api/team")).json();
  const me = team.members.find((m: { email: string }) => m.email === "owner@harbourline.example");
  const refused = await owner.delete(`/api/team/members/${me.userId}`);
  expect(refused.status()).toBe(409);
  expect((await refused.json()).message).toContain("at least one owner");
});
