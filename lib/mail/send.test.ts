// Mail through the real path: nodemailer → the local SMTP catcher → the database; and a failing
// server that must not throw but leave an audit event.
import nodemailer from "nodemailer";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, getDb } from "@/db/client";
import { listTeamAudit } from "@/db/queries/audit";
import { listTeamMail } from "@/db/queries/mail";
import { teams } from "@/db/schema";
import { sendMail } from "./send";
import { mailState } from "./transport";

let teamId = "";
let otherTeamId = "";
const key = Symbol.for("sensewright.mail");
const g = globalThis as Record<symbol, unknown>;

beforeAll(async () => {
  const db = await getDb();
  teamId = (await db.insert(teams).values({ name: "Mail team" }).returning())[0]!.id;
  otherTeamId = (await db.insert(teams).values({ name: "Other mail team" }).returning())[0]!.id;
});

afterAll(async () => {
  const state = (await mailState()) as { close?: () => Promise<void> };
  await state.close?.();
  await closeDb();
});

const mail = (to: string[], subject: string) => ({
  teamId,
  actorId: null,
  to,
  subject,
  text: "Shunt 274 mΩ, burden 49.3 mV.",
  path: "/designs/abc",
  about: { type: "design", id: "abc", kind: "test" },
});

describe("sendMail", () => {
  it("delivers one message per recipient into the catcher, with the text and the link", async () => {
    expect((await mailState()).catcher).toBe(true);
    expect(await sendMail(mail(["A@x.example", "b@x.example", "a@x.example"], "Two recipients µ"))).toBe(2);
    const box = await listTeamMail(teamId);
    expect(box.map((m) => m.to).sort()).toEqual(["a@x.example", "b@x.example"]);
    expect(box[0]!.subject).toBe("Two recipients µ");
    expect(box[0]!.text).toContain("Shunt 274 mΩ, burden 49.3 mV.");
    expect(box[0]!.text).toMatch(/http:\/\/localhost:\d+\/designs\/abc/);
    expect(await listTeamMail(otherTeamId)).toEqual([]);
  });

  it("reports a failed send in the audit trail instead of throwing", async () => {
    const saved = g[key];
    g[key] = Promise.resolve({
      transport: nodemailer.createTransport({ host: "127.0.0.1", port: 1, connectionTimeout: 2000 }),
      catcher: true,
    });
    try {
      expect(await sendMail(mail(["c@x.example"], "Will fail"))).toBe(0);
    } finally {
      g[key] = saved;
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
