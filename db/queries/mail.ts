// The built-in outbox: every message the app sent while no SMTP_URL is set, with the team it was sent
// for as a column of its own (never read back from the message, which can carry user text).
import { desc, eq } from "drizzle-orm";
import { getDb } from "../client";
import { mailMessages } from "../schema";

export async function storeMail(m: {
  teamId: string;
  to: string;
  from: string;
  subject: string;
  text: string;
  raw: string;
}) {
  const db = await getDb();
  await db.insert(mailMessages).values(m);
}

/** Messages sent on behalf of a team, newest first. */
export async function listTeamMail(teamId: string, limit = 200) {
  const db = await getDb();
  const rows = await db
    .select({
      id: mailMessages.id,
      to: mailMessages.to,
      from: mailMessages.from,
      subject: mailMessages.subject,
      text: mailMessages.text,
      sentAt: mailMessages.sentAt,
    })
    .from(mailMessages)
    .where(eq(mailMessages.teamId, teamId))
    .orderBy(desc(mailMessages.sentAt))
    .limit(limit);
  return rows.map((r) => ({ ...r, sentAt: r.sentAt.toISOString() }));
}
