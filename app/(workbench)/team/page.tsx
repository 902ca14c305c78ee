import type { Metadata } from "next";
import { MemberTable } from "@/components/team/member-table";
import { listMembers } from "@/db/queries/users";
import { requirePageCaller } from "@/lib/auth/gate";

export const metadata: Metadata = { title: "Team" };

export default async function TeamPage() {
  const caller = await requirePageCaller("/team");
  const members = await listMembers(caller.teamId);
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-lg font-semibold">{caller.teamName}</h1>
        <p className="text-ink-muted">
          {caller.role === "owner"
            ? "You are an owner: you can change each member's role. A team always keeps at least one owner."
            : "Members and their roles. Only owners change roles."}
        </p>
      </div>
      <MemberTable
        members={members.map((m) => ({ ...m, joinedAt: m.joinedAt.toISOString() }))}
        canEdit={caller.role === "owner"}
        selfId={caller.userId}
      />
    </div>
  );
}
