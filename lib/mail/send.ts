// Sending mail: plain text with a link, one message per recipient, never failing the change that
// caused it — a failure is logged and recorded in the audit trail. Routes queue mail with `sendMail`,
// which delivers after the response has gone (Next's `after()`), so a slow mail server never holds a
// request up.
import "server-only";
import { after } from "next/server";
import { recordAudit } from "@/db/queries/audit";
import { publicUrl } from "@/lib/env";
import type { OutboxMailOptions } from "./outbox-transport";
import { mailState } from "./transport";

export type Mail = {
  teamId: string;
  actorId: string | null;
  to: string[];
  subject: string;
  /** Plain text; the link is appended on its own line. */
  text: string;
  path: string;
  /** What the mail is about, for the audit trail when it fails. */
  about: { type: string; id: string; kind: string };
};

export const FROM = "Sensewright <no-reply@sensewright.invalid>";

export const linkTo = (path: string) => new URL(path, publicUrl()).toString();

const recipientsOf = (mail: Mail) => [...new Set(mail.to.map((t) => t.trim().toLowerCase()).filter(Boolean))];

/**
 * Queues the mail to go out once the current request has been answered; returns how many recipients
 * it is addressed to. Call it while handling a request (route handler or server action).
 */
export function sendMail(mail: Mail): number {
  const recipients = recipientsOf(mail);
  if (recipients.length > 0) after(() => deliverMail(mail));
  return recipients.length;
}

/** Sends now; returns how many went out. Never throws. */
export async function deliverMail(mail: Mail): Promise<number> {
  const link = linkTo(mail.path);
  let sent = 0;
  for (const to of recipientsOf(mail)) {
    try {
      const message: OutboxMailOptions = {
        teamId: mail.teamId,
        from: FROM,
        to,
        subject: mail.subject,
        text: `${mail.text.trimEnd()}\n\n${link}\n\n-- \nSent by Sensewright for your team.\n`,
      };
      await mailState().transport.sendMail(message);
      sent++;
    } catch (e) {
      console.error(`[mail] could not send "${mail.subject}" to ${to}:`, (e as Error).message);
      await recordAudit({
        teamId: mail.teamId,
        actorId: mail.actorId,
        action: "mail.failed",
        targetType: mail.about.type,
        targetId: mail.about.id,
        details: { kind: mail.about.kind, to, subject: mail.subject, error: (e as Error).message.slice(0, 300) },
      }).catch((err: unknown) => console.error("[mail] could not record the failure", err));
    }
  }
  return sent;
}
