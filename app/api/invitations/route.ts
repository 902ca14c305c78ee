import { createInvitation, listInvitations } from "@/db/queries/invitations";
import { apiRoute } from "@/lib/auth/gate";
import { HttpError, json, refused } from "@/lib/http";
import { invitationPath, mailInvitation } from "@/lib/mail/invitation";
import { linkTo } from "@/lib/mail/send";
import { invitationBodySchema } from "@/lib/route-schemas";

export const GET = apiRoute({ action: "team.manage-invitations", doing: "see invitations" }, async ({ caller }) => ({
  invitations: await listInvitations(caller.teamId),
}));

/** Invites someone by e-mail (or founds a new team whose first owner they become); mails the single-use link. */
export const POST = apiRoute(
  { action: "team.manage-invitations", body: invitationBodySchema },
  async ({ caller, body }) => {
    const created = await createInvitation({
      teamId: caller.teamId,
      invitedBy: caller.userId,
      email: body.email,
      role: body.role ?? "owner",
      newTeam: body.newTeam,
    });
    if (!created.ok) throw refused(created);
    const mailed = await mailInvitation({
      inviterTeamId: caller.teamId,
      actor: caller,
      invitationId: created.id,
      email: created.email,
      role: created.role,
      teamName: created.teamName,
      token: created.token,
      newTeam: !!body.newTeam,
    });
    return json(
      {
        id: created.id,
        email: created.email,
        role: created.role,
        teamName: created.teamName,
        status: "pending",
        expiresAt: created.expiresAt,
        // Shown once to the owner who sent it (only its hash is stored), e.g. to pass on by hand.
        link: linkTo(invitationPath(created.token)),
        mailed,
      },
      201,
    );
  },
);
