// Sending mail: plain text with a link, one message per recipient, never failing the change
// that caused it — a failure is logged and recorded in the audit trail.
import "server-only";
import { recordAudit } from "@/db/queries/audit";
import { TEAM_HEADER } from "@/db/queries/mail";
import { publicUrl } from "@/lib/env";
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

/** Sends; returns how many went out. Never throws. */
export async function sendMail(mail: Mail): Promise<number> {
  const recipients = [...new Set(mail.to.map((t) => t.trim().toLowerCase()).filter(Boolean))];
  if (recipients.length === 0) return 0;
  const link = linkTo(mail.path);
  let sent = 0;
  for (const to of recipients) {
    try {
      const { transport } = await mailState();
      await transport.sendMail({
        from: FROM,
        to,
        subject: mail.subject,
        text: `${mail.text.trimEnd()}\n\n${link}\n\n-- \nSent by Sensewright for your team.\n`,
        headers: { [TEAM_HEADER]: mail.teamId },
      });
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
