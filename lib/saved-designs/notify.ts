// Who hears about a design's review, and what the mail says. Plain text, numbers via formatSI.
import "server-only";
import { listMembers, wantingMail, type MailPreferences } from "@/db/queries/users";
import { can } from "@/lib/auth/policy";
import { designKindOf, formatPercent, formatSI, type DesignKind } from "@/lib/design";
import { sendMail } from "@/lib/mail/send";

type DesignRef = { id: string; name: string; project: string | null; revision: number } & DesignKind;

/** What the mail says about a design, from its row and current revision as designFor returns them. */
export function designRefOf(
  design: { id: string; name: string; project: string | null; revision: number },
  current: Parameters<typeof designKindOf>[0],
): DesignRef {
  const { id, name, project, revision } = design;
  return { id, name, project, revision, ...designKindOf(current) };
}

function summary(d: DesignRef): string {
  const title = `Design: ${d.name}${d.project ? ` (${d.project})` : ""}, revision ${d.revision}`;
  if (d.kind === "plan") {
    const ranges = d.metrics.ranges.map(
      (r, k) =>
        `Range ${k + 1}: ${formatSI(r.minA, "A")} to ${formatSI(r.maxA, "A")}, shunt ${formatSI(r.shuntOhms, "Ω")}, gain ${formatSI(r.gain, "")}, worst drop ${formatSI(r.worstBurdenV, "V")} (switch included).`,
    );
    return [title, `A range plan of ${d.metrics.ranges.length} ranges:`, ...ranges].join("\n");
  }
  return [
    title,
    `Shunt ${formatSI(d.choice.shuntOhms, "Ω")}, gain ${formatSI(d.choice.gain, "")}, burden ${formatSI(d.metrics.burdenV, "V")} at maximum current,`,
    `worst-case error ${formatPercent(d.metrics.errorAtMinPercent / 100)} at minimum current.`,
  ].join("\n");
}

/** Only the people who want this kind of review mail (their choice on /account). */
async function keepWanting<M extends { userId: string }>(members: M[], kind: keyof MailPreferences) {
  const wanting = await wantingMail(
    members.map((m) => m.userId),
    kind,
  );
  return members.filter((m) => wanting.has(m.userId));
}

/**
 * Submit: whoever may give this revision its verdict, reviewers first (the owners only when the
 * team has no reviewer who may) — then only those who want "submitted" mail.
 */
export async function mailSubmitted(teamId: string, actor: { userId: string; name: string }, d: DesignRef) {
  const judges = (await listMembers(teamId)).filter((m) => can(m, "design.judge", { authorId: actor.userId }));
  const reviewers = judges.filter((m) => m.role === "reviewer");
  const to = await keepWanting(reviewers.length > 0 ? reviewers : judges, "submitted");
  return sendMail({
    teamId,
    actorId: actor.userId,
    to: to.map((m) => m.email),
    subject: `Review requested: ${d.name} (revision ${d.revision})`,
    text: `${actor.name} submitted a design for review.\n\n${summary(d)}\n\nOpen it to approve it, return it with a reason, or comment:`,
    path: `/designs/${d.id}`,
    about: { type: "design", id: d.id, kind: "submitted" },
  });
}

const mailKindOf = { approve: "approved", return: "returned", comment: "comments" } as const;
const verdictWords = { approve: "approved", return: "returned", comment: "commented on" } as const;

/** A verdict or comment: the revision's author and, for a reply, the author of the comment replied to. */
export async function mailReviewed(
  teamId: string,
  actor: { userId: string; name: string },
  d: DesignRef,
  review: { verdict: "approve" | "return" | "comment"; body: string; revision: number },
  recipientIds: string[],
) {
  const members = await listMembers(teamId);
  const to = await keepWanting(
    members.filter((m) => recipientIds.includes(m.userId) && m.userId !== actor.userId),
    mailKindOf[review.verdict],
  );
  const what = verdictWords[review.verdict];
  const subject =
    review.verdict === "comment"
      ? `Comment on ${d.name} (revision ${review.revision})`
      : `${d.name} ${what} (revision ${review.revision})`;
  const reason = review.body.trim()
    ? `\n\n${review.verdict === "return" ? "Reason" : review.verdict === "approve" ? "Note" : "Comment"}:\n${review.body.trim()}`
    : "";
  return sendMail({
    teamId,
    actorId: actor.userId,
    to: to.map((m) => m.email),
    subject,
    text: `${actor.name} ${what} revision ${review.revision} of your design.${reason}\n\n${summary(d)}\n\nOpen the design:`,
    path: `/designs/${d.id}`,
    about: { type: "design", id: d.id, kind: review.verdict },
  });
}
