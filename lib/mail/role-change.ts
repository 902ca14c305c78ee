// The mail that tells a member an owner changed their role. Always sent: a change of who may do
// what is an account notice, like an invitation, not review news, so the review-mail choices on
// /account do not cover it. Not sent when the owner changed their own role (they know).
import "server-only";
import type { Role } from "@/db/schema";
import { roleMeans } from "@/lib/role-words";
import { sendMail } from "./send";

export function mailRoleChanged(input: {
  teamId: string;
  teamName: string;
  actor: { userId: string; name: string };
  member: { userId: string; email: string };
  from: Role;
  to: Role;
}): number {
  if (input.from === input.to || input.member.userId === input.actor.userId) return 0;
  return sendMail({
    teamId: input.teamId,
    actorId: input.actor.userId,
    to: [input.member.email],
    subject: `Your role in ${input.teamName} is now ${input.to}`,
    text:
      `${input.actor.name} changed your role in "${input.teamName}" on Sensewright from ${input.from} to ${input.to}.\n\n` +
      `As a ${input.to} you will ${roleMeans[input.to]}. It takes effect on your next page.\n\n` +
      `If you did not expect this, ask an owner of the team. The team page lists who they are:`,
    path: "/team",
    about: { type: "user", id: input.member.userId, kind: "role-changed" },
  });
}
