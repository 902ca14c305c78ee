"use client";
// The header's team: plain text for a person in one team, a switcher for a person in several.
// Switching asks PUT /api/me/team (which re-issues the session for that team) and then opens
// the designs list, since a page of the old team's design would not exist in the new one.
import { useRouter } from "next/navigation";
import { useId, useState } from "react";
import type { ApiError, TeamOfMine } from "@/lib/api-description/responses";

export type TeamChoice = TeamOfMine;

export function TeamSwitcher({ teams, currentTeamId }: { teams: TeamChoice[]; currentTeamId: string }) {
  const router = useRouter();
  const id = useId();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const current = teams.find((t) => t.id === currentTeamId);
  if (teams.length < 2) return <span className="text-ink-muted">{current?.name}</span>;

  async function switchTo(teamId: string) {
    setBusy(true);
    setError(null);
    const res = await fetch("/api/me/team", {
      method: "PUT",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ teamId }),
    }).catch(() => null);
    const data = (await res?.json().catch(() => ({}))) as Partial<ApiError> | undefined;
    setBusy(false);
    if (!res?.ok) return setError(data?.message ?? "Could not switch team.");
    router.push("/designs");
    router.refresh();
  }

  return (
    <span className="flex items-center gap-1">
      <label htmlFor={id} className="sr-only">
        Team
      </label>
      <select
        id={id}
        data-testid="team-switcher"
        value={currentTeamId}
        disabled={busy}
        onChange={(e) => void switchTo(e.target.value)}
        className="max-w-48 truncate rounded border border-line bg-panel px-1.5 py-1 text-xs text-ink focus:border-copper focus:outline-none"
        aria-describedby={error ? `${id}-error` : undefined}
      >
        {teams.map((t) => (
          <option key={t.id} value={t.id}>
            {t.name} ({t.role})
          </option>
        ))}
      </select>
      {error && (
        <span id={`${id}-error`} role="alert" className="text-2xs text-bad">
          {error}
        </span>
      )}
    </span>
  );
}
