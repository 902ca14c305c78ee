// The catcher's reader against messages built by nodemailer itself (the library that sends them).
import nodemailer from "nodemailer";
import { describe, expect, it } from "vitest";
import { parseMail } from "./parse";

async function build(message: nodemailer.SendMailOptions): Promise<string> {
  const t = nodemailer.createTransport({ streamTransport: true, buffer: true, newline: "unix" });
  const info = await t.sendMail(message);
  return (info.message as Buffer).toString("utf8");
}

describe("parseMail", () => {
  it("reads recipient, sender, subject and a plain ASCII text", async () => {
    const raw = await build({
      from: "a@x.example",
      to: "b@y.example",
      subject: "Review requested",
      text: "Hello\nSecond line",
    });
    expect(parseMail(raw)).toEqual({
      from: "a@x.example",
      to: "b@y.example",
      subject: "Review requested",
      text: "Hello\nSecond line",
    });
  });

  it("decodes non-ASCII subjects and quoted-printable bodies with units", async () => {
    const text = `Shunt 274 mΩ, gain 50, error 1.2 µA — ${"long line ".repeat(20)}`;
    const raw = await build({ from: "a@x.example", to: "b@y.example", subject: "Adapter 1 mV per µA approved", text });
    const parsed = parseMail(raw);
    expect(parsed.subject).toBe("Adapter 1 mV per µA approved");
    expect(parsed.text).toBe(text.trimEnd());
  });

  it("takes the plain part of a multipart message", async () => {
    const raw = await build({
      from: "a@x.example",
      to: "b@y.example",
      subject: "s",
      text: "plain part ✓",
      html: "<p>html part</p>",
    });
    expect(parseMail(raw).text).toBe("plain part ✓");
  });
});
