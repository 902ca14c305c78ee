import type { Metadata } from "next";
import Link from "next/link";
import { TeamAuditLog } from "@/components/team/audit-log";
import { InvitationsPanel } from "@/components/team/invitations-panel";
import { RemoveMembers } from "@/components/team/member-removal";
import { MemberTable } from "@/components/team/member-table";
import { listTeamAudit } from "@/db/queries/audit";
import { listDesigns } from "@/db/queries/designs";
import { listInvitations } from "@/db/queries/invitations";
import { listMembers } from "@/db/queries/users";
import { requirePageCaller } from "@/lib/auth/gate";
import { can } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Team" };

export default async function TeamPage() {
  const caller = await requirePageCaller("/team");
  const members = await listMembers(caller.teamId);
  const manages = can(caller, "team.manage-members");
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-lg font-semibold">{caller.teamName}</h1>
        <p className="text-ink-muted">
          {manages
            ? "You are an owner: you can change each member's role. A team always keeps at least one owner."
            : "Members and their roles. Only owners change roles."}
        </p>
      </div>
      <MemberTable
        members={members.map((m) => ({ ...m, joinedAt: m.joinedAt.toISOString() }))}
        canEdit={manages}
        selfId={caller.userId}
      />
      {manages && <OwnerSections teamId={caller.teamId} selfId={caller.userId} members={members} />}
    </div>
  );
}

/** Invitations, removing members, the outbox and the team's log: owners only. */
async function OwnerSections({
  teamId,
  selfId,
  members,
}: {
  teamId: string;
  selfId: string;
  members: Awaited<ReturnType<typeof listMembers>>;
}) {
  const [invitations, audit, designs] = await Promise.all([
    listInvitations(teamId),
    listTeamAudit(teamId, 200),
    listDesigns(teamId),
  ]);
  return (
    <>
      <p className="text-xs text-ink-muted">
        Mail the workbench has sent for the team is in the{" "}
        <Link href="/outbox" className="text-copper underline">
          outbox
        </Link>{" "}
        while no SMTP server is configured.
      </p>
      <InvitationsPanel invitations={invitations} />
      <RemoveMembers members={members} selfId={selfId} />
      <TeamAuditLog
        entries={audit.map((e) => ({ ...e, at: e.at.toISOString() }))}
        designNames={Object.fromEntries(designs.map((d) => [d.id, d.name]))}
      />
    </>
  );
}
