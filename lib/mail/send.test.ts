// Mail through the real path: nodemailer → the outbox transport → the database, scoped by the team
// column; and a failing server that must not throw but leave an audit event.
import nodemailer from "nodemailer";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, getDb } from "@/db/client";
import { listTeamAudit } from "@/db/queries/audit";
import { listTeamMail } from "@/db/queries/mail";
import { teams } from "@/db/schema";
import { deliverMail } from "./send";
import { mailState } from "./transport";

let teamId = "";
let otherTeamId = "";

beforeAll(async () => {
  const db = await getDb();
  teamId = (await db.insert(teams).values({ name: "Mail team" }).returning())[0]!.id;
  otherTeamId = (await db.insert(teams).values({ name: "Other mail team" }).returning())[0]!.id;
});

afterAll(() => closeDb());

const mail = (to: string[], subject: string, text = "Shunt 274 mΩ, burden 49.3 mV.") => ({
  teamId,
  actorId: null,
  to,
  subject,
  text,
  path: "/designs/abc",
  about: { type: "design", id: "abc", kind: "test" },
});

describe("deliverMail", () => {
  it("keeps one message per recipient in the team's outbox, with the text and the link", async () => {
    expect(mailState().outbox).toBe(true);
    expect(await deliverMail(mail(["A@x.example", "b@x.example", "a@x.example"], "Two recipients µ"))).toBe(2);
    const box = await listTeamMail(teamId);
    expect(box.map((m) => m.to).sort()).toEqual(["a@x.example", "b@x.example"]);
    expect(box[0]!.subject).toBe("Two recipients µ");
    expect(box[0]!.text).toContain("Shunt 274 mΩ, burden 49.3 mV.");
    expect(box[0]!.text).toMatch(/http:\/\/localhost:\d+\/designs\/abc/);
    expect(await listTeamMail(otherTeamId)).toEqual([]);
  });

  it("files a message under the team that sent it, whatever its text claims", async () => {
    const planted = `Design\nX-Sensewright-Team: ${otherTeamId}\n`;
    expect(await deliverMail(mail(["c@x.example"], planted.replace(/\n/g, " "), planted))).toBe(1);
    expect((await listTeamMail(teamId)).some((m) => m.to === "c@x.example")).toBe(true);
    expect(await listTeamMail(otherTeamId)).toEqual([]);
  });

  it("reports a failed send in the audit trail instead of throwing", async () => {
    const state = mailState();
    const saved = state.transport;
    state.transport = nodemailer.createTransport({ host: "127.0.0.1", port: 1, connectionTimeout: 2000 });
    try {
      expect(await deliverMail(mail(["c@x.example"], "Will fail"))).toBe(0);
    } finally {
      state.transport = saved;
    }
    const log = await listTeamAudit(teamId);
    expect(log[0]).toMatchObject({
      action: "mail.failed",
      targetType: "design",
      targetId: "abc",
      details: { to: "c@x.example", subject: "Will fail" },
    });
  });
});
