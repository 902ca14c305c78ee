// The invitation mail: the single-use link goes only here (and once to the owner who sent it).
import "server-only";
import { INVITATION_DAYS } from "@/db/queries/invitations";
import { sendMail } from "./send";

export const invitationPath = (token: string) => `/invitations/${token}`;

export function mailInvitation(input: {
  inviterTeamId: string;
  actor: { userId: string; name: string };
  invitationId: string;
  email: string;
  role: string;
  teamName: string;
  token: string;
  newTeam: boolean;
}) {
  const what = input.newTeam
    ? `${input.actor.name} started the team "${input.teamName}" on Sensewright and invites you to run it as its first owner.`
    : `${input.actor.name} invites you to join "${input.teamName}" on Sensewright as a ${input.role}.`;
  return sendMail({
    teamId: input.inviterTeamId,
    actorId: input.actor.userId,
    to: [input.email],
    subject: input.newTeam
      ? `You are invited to own ${input.teamName} on Sensewright`
      : `You are invited to join ${input.teamName} on Sensewright`,
    text: `${what}\n\nThe link below works once and expires in ${INVITATION_DAYS} days. Open it to join: without an account you choose your name and password there; with one, you sign in as it and press Join:`,
    path: invitationPath(input.token),
    about: { type: "invitation", id: input.invitationId, kind: "invitation" },
  });
}
