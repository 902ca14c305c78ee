"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Select } from "@/components/ui/field";
import type { Role } from "@/db/schema";

type Member = { userId: string; email: string; name: string; role: Role; joinedAt: string };

const roleOptions: { value: Role; label: string }[] = [
  { value: "owner", label: "Owner — runs the team" },
  { value: "designer", label: "Designer — creates and edits designs" },
  { value: "reviewer", label: "Reviewer — approves or returns designs" },
  { value: "maker", label: "Maker — builds from approved designs" },
];

export function MemberTable({ members, canEdit, selfId }: { members: Member[]; canEdit: boolean; selfId: string }) {
  const router = useRouter();
  const [message, setMessage] = useState<{ tone: "ok" | "bad"; text: string } | null>(null);

  async function change(member: Member, role: Role) {
    setMessage(null);
    const res = await fetch(`/api/team/members/${member.userId}`, {
      method: "PATCH",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ role }),
    });
    const body = (await res.json().catch(() => ({}))) as { message?: string };
    if (!res.ok) setMessage({ tone: "bad", text: body.message ?? `The change was refused (${res.status}).` });
    else setMessage({ tone: "ok", text: `${member.name} is now a ${role}.` });
    router.refresh();
  }

  return (
    <div className="rounded-panel border border-line bg-panel">
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
                    value={m.role}
                    onChange={(e) => change(m, e.target.value as Role)}
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
      <p aria-live="polite" className={`px-4 py-2 text-xs ${message?.tone === "bad" ? "text-bad" : "text-good"}`}>
        {message?.text}
      </p>
    </div>
  );
}
