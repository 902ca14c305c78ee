import { z } from "zod";
import { createInvitation, listInvitations } from "@/db/queries/invitations";
import { apiRoute } from "@/lib/auth/gate";
import { HttpError, json, refused } from "@/lib/http";
import { invitationPath, mailInvitation } from "@/lib/mail/invitation";
import { linkTo } from "@/lib/mail/send";
import { roleSchema } from "@/lib/team-schemas";
import { textField } from "@/lib/text-field";

const body = z
  .object({
    email: z
      .string({ error: "email: expected an e-mail address" })
      .trim()
      .toLowerCase()
      .pipe(z.email({ error: "email: not an e-mail address" })),
    role: roleSchema.optional(),
    newTeam: textField({
      label: "newTeam",
      min: 1,
      minMessage: "newTeam: give the new team a name",
      max: 120,
    }).optional(),
  })
  .superRefine((v, ctx) => {
    if (!v.newTeam && !v.role)
      ctx.addIssue({ code: "custom", path: ["role"], message: "Choose the role the new member gets" });
    if (v.newTeam && v.role && v.role !== "owner")
      ctx.addIssue({ code: "custom", path: ["role"], message: "The first member of a new team is its owner" });
  });

export const GET = apiRoute({ action: "team.manage-invitations", doing: "see invitations" }, async ({ caller }) => ({
  invitations: await listInvitations(caller.teamId),
}));

/** Invites someone by e-mail (or founds a new team whose first owner they become); mails the single-use link. */
export const POST = apiRoute({ action: "team.manage-invitations", body }, async ({ caller, body }) => {
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
});
