// What the built-in mail catcher received.
import { desc, sql } from "drizzle-orm";
import { getDb } from "../client";
import { mailMessages } from "../schema";

export async function storeMail(m: { to: string; from: string; subject: string; text: string; raw: string }) {
  const db = await getDb();
  await db.insert(mailMessages).values(m);
}

/** The team's header that every mail carries, so an outbox shows one team's mail only. */
export const TEAM_HEADER = "X-Sensewright-Team";

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
    .where(sql`position(${`${TEAM_HEADER}: ${teamId}`} in ${mailMessages.raw}) > 0`)
    .orderBy(desc(mailMessages.sentAt))
    .limit(limit);
  return rows.map((r) => ({ ...r, sentAt: r.sentAt.toISOString() }));
}
