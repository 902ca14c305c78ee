import { listTeamMail } from "@/db/queries/mail";
import { apiRoute } from "@/lib/auth/gate";
import { HttpError } from "@/lib/http";
import { usesOutbox } from "@/lib/mail/transport";

/** The mail the built-in outbox kept for this team (only while no SMTP_URL is set), by its team column. */
export const GET = apiRoute({ action: "team.read-outbox" }, async ({ caller }) => {
  if (!usesOutbox())
    throw new HttpError(
      409,
      "Mail goes out through the SMTP server in SMTP_URL, so there is no local outbox to read; check that server's mailboxes.",
    );
  const messages = await listTeamMail(caller.teamId);
  return {
    messages: messages.map((m) => ({ to: m.to, from: m.from, subject: m.subject, text: m.text, sentAt: m.sentAt })),
  };
});
