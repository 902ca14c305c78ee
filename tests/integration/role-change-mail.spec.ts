// Issue 12, "a role change takes effect with no notice": the member is told by e-mail, after the
// answer has gone (read back through the owner's outbox), in words saying what the new role may do.
import { expect, test } from "@playwright/test";
import { apiAs } from "../fixtures/auth";
import { acceptAndSignIn, unique } from "./authz-helpers";

type Outbox = { messages: { to: string; subject: string; text: string; sentAt: string }[] };

test("changing a member's role mails them; keeping the same role mails nothing", async () => {
  const owner = await apiAs("owner");
  const email = `promoted-${unique()}@invitee.example`;
  const inv = await owner.post("/api/invitations", { data: { email, role: "maker" } });
  expect(inv.status(), await inv.text()).toBe(201);
  const member = await acceptAndSignIn(((await inv.json()) as { link: string }).link, email, "Bench Builder");
  const team = (await (await owner.get("/api/team")).json()) as { members: { userId: string; email: string }[] };
  const userId = team.members.find((m) => m.email === email)?.userId;
  expect(userId).toBeDefined();

  const changed = await owner.patch(`/api/team/members/${userId}`, { data: { role: "reviewer" } });
  expect(changed.status(), await changed.text()).toBe(200);
  expect(await changed.json()).toEqual({ userId, role: "reviewer", mailed: 1 });

  const roleMail = async () =>
    ((await (await owner.get("/api/outbox")).json()) as Outbox).messages.filter(
      (m) => m.to === email && m.subject.includes("role"),
    );
  await expect.poll(async () => (await roleMail()).length, { timeout: 10_000 }).toBe(1);
  const [mail] = await roleMail();
  expect(mail?.subject).toMatch(/^Your role in .+ is now reviewer$/);
  expect(mail?.text).toContain("from maker to reviewer");
  expect(mail?.text).toContain("As a reviewer you will approve or return designs");
  expect(mail?.text).toMatch(/\/team\n/);

  // The same role again changes nothing and sends nothing.
  const same = await owner.patch(`/api/team/members/${userId}`, { data: { role: "reviewer" } });
  expect(await same.json()).toEqual({ userId, role: "reviewer", mailed: 0 });
  // A refused change (a body naming no role) sends nothing either.
  expect((await owner.patch(`/api/team/members/${userId}`, { data: { role: "boss" } })).status()).toBe(422);
  await new Promise((r) => setTimeout(r, 1000));
  expect(await roleMail()).toHaveLength(1);
  await member.dispose();
  await owner.dispose();
});
