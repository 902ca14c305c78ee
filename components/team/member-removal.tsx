"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import type { ApiError, TeamMember } from "@/lib/api-description/responses";

type Member = Pick<TeamMember, "userId" | "name" | "email" | "role">;

/** Owners remove members from the team (their account and their designs stay). */
export function RemoveMembers({ members, selfId }: { members: Member[]; selfId: string }) {
  const router = useRouter();
  const [confirming, setConfirming] = useState<string | null>(null);
  const [message, setMessage] = useState<{ tone: "ok" | "bad"; text: string } | null>(null);
  const owners = members.filter((m) => m.role === "owner").length;

  async function remove(m: Member) {
    setMessage(null);
    const res = await fetch(`/api/team/members/${m.userId}`, { method: "DELETE" });
    const data = (await res.json().catch(() => ({}))) as Partial<ApiError>;
    setConfirming(null);
    setMessage(
      res.ok
        ? { tone: "ok", text: `${m.name} is no longer a member of the team.` }
        : { tone: "bad", text: data.message ?? `Refused (${res.status}).` },
    );
    router.refresh();
  }

  return (
    <Panel title="Remove members">
      <p className="mb-2 text-xs text-ink-muted">
        A removed member can no longer sign in to this team; what they wrote stays, under their name. The last owner
        cannot be removed.
      </p>
      <ul className="flex flex-col divide-y divide-line text-sm">
        {members.map((m) => {
          const lastOwner = m.role === "owner" && owners <= 1;
          return (
            <li key={m.userId} className="flex items-center gap-3 py-1.5">
              <span className="min-w-0 flex-1">
                {m.name} <span className="text-xs text-ink-muted">({m.role})</span>
                {m.userId === selfId && <span className="ml-1 text-xs text-ink-faint">you</span>}
              </span>
              {confirming === m.userId ? (
                <span className="flex items-center gap-2 text-xs">
                  Remove {m.name}?
                  <Button variant="danger" className="px-2 py-0.5 text-xs" onClick={() => remove(m)}>
                    Remove
                  </Button>
                  <Button variant="ghost" className="px-2 py-0.5 text-xs" onClick={() => setConfirming(null)}>
                    Keep
                  </Button>
                </span>
              ) : (
                <Button
                  variant="ghost"
                  className="px-2 py-0.5 text-xs"
                  disabled={lastOwner}
                  title={lastOwner ? "The team's only owner stays" : undefined}
                  aria-label={`Remove ${m.name}`}
                  onClick={() => setConfirming(m.userId)}
                >
                  Remove…
                </Button>
              )}
            </li>
          );
        })}
      </ul>
      <p aria-live="polite" className={`mt-2 text-xs ${message?.tone === "bad" ? "text-bad" : "text-good"}`}>
        {message?.text}
      </p>
    </Panel>
  );
}
