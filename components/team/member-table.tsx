"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Select } from "@/components/ui/field";
import type { Role } from "@/db/schema";
import { roleMeans } from "@/lib/role-words";
import type { ApiError, TeamMember } from "@/lib/api-description/responses";

type Member = TeamMember;

const roleOptions: { value: Role; label: string }[] = [
  { value: "owner", label: "Owner — runs the team" },
  { value: "designer", label: "Designer — creates and edits designs" },
  { value: "reviewer", label: "Reviewer — approves or returns designs" },
  { value: "maker", label: "Maker — builds from approved designs" },
];

export function MemberTable({ members, canEdit, selfId }: { members: Member[]; canEdit: boolean; selfId: string }) {
  const router = useRouter();
  const [message, setMessage] = useState<{ tone: "ok" | "bad"; text: string } | null>(null);
  // A role change waits for a second, explicit click: a select is too easy to change by accident.
  const [pending, setPending] = useState<{ member: Member; role: Role } | null>(null);
  const [busy, setBusy] = useState(false);

  async function change(member: Member, role: Role) {
    setMessage(null);
    setBusy(true);
    const res = await fetch(`/api/team/members/${member.userId}`, {
      method: "PATCH",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ role }),
    });
    const body = (await res.json().catch(() => ({}))) as Partial<ApiError>;
    setBusy(false);
    setPending(null);
    if (!res.ok) setMessage({ tone: "bad", text: body.message ?? `The change was refused (${res.status}).` });
    else
      setMessage({
        tone: "ok",
        text: `${member.name} is now a ${role}: they will ${roleMeans[role]}. It takes effect on their next page, the team log records it, and they get an e-mail saying so.`,
      });
    router.refresh();
  }

  return (
    <div className="rounded-panel border border-line bg-panel">
      <div className="overflow-x-auto">
        <table className="w-full text-left">
          <thead className="border-b border-line text-xs text-ink-muted">
            <tr>
              <th className="px-4 py-2 font-medium">Name</th>
              <th className="px-4 py-2 font-medium">E-mail</th>
              <th className="px-4 py-2 font-medium">Role</th>
              <th className="px-4 py-2 font-medium">Joined</th>
            </tr>
          </thead>
          <tbody>
            {members.map((m) => (
              <tr key={m.userId} className="border-b border-line last:border-0">
                <td className="px-4 py-2">
                  {m.name}
                  {m.userId === selfId && <span className="ml-1 text-ink-faint">(you)</span>}
                </td>
                <td className="px-4 py-2 font-mono text-xs">{m.email}</td>
                <td className="px-4 py-2">
                  {canEdit ? (
                    <Select
                      aria-label={`Role of ${m.name}`}
                      value={pending?.member.userId === m.userId ? pending.role : m.role}
                      onChange={(e) => {
                        const role = e.target.value as Role;
                        setMessage(null);
                        setPending(role === m.role ? null : { member: m, role });
                      }}
                      className="max-w-xs"
                    >
                      {roleOptions.map((o) => (
                        <option key={o.value} value={o.value}>
                          {o.label}
                        </option>
                      ))}
                    </Select>
                  ) : (
                    <span data-testid={`role-${m.email}`}>{m.role}</span>
                  )}
                </td>
                <td className="px-4 py-2 text-ink-muted">{m.joinedAt.slice(0, 10)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {pending && (
        <div
          role="alertdialog"
          aria-label="Confirm the role change"
          className="flex flex-wrap items-center gap-2 border-t border-line bg-sunken px-4 py-2 text-sm"
          data-testid="role-confirm"
        >
          <span className="min-w-0 flex-1">
            Make {pending.member.name}
            {pending.member.userId === selfId ? " (you)" : ""} a {pending.role} instead of a {pending.member.role}? They
            will {roleMeans[pending.role]}.
          </span>
          <Button variant="primary" disabled={busy} onClick={() => change(pending.member, pending.role)}>
            Change the role
          </Button>
          <Button variant="ghost" disabled={busy} onClick={() => setPending(null)}>
            Keep {pending.member.role}
          </Button>
        </div>
      )}
      <p
        aria-live="polite"
        className={`px-4 py-2 text-xs ${message?.tone === "bad" ? "text-bad" : "text-good"}`}
        data-testid="role-notice"
      >
        {message?.text}
      </p>
    </div>
  );
}
