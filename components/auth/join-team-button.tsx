"use client";

import Link from "next/link";
import { useState } from "react";
import { Button, buttonClass } from "@/components/ui/button";
import type { ApiError } from "@/lib/api-description/responses";

/** For a signed-in invitee with an account: one press joins; no password is asked or sent. */
export function JoinTeamButton({
  token,
  teamName,
  currentTeam,
  email,
}: {
  token: string;
  teamName: string;
  currentTeam: string;
  email: string;
}) {
  const [state, setState] = useState<"idle" | "busy" | "joined">("idle");
  const [error, setError] = useState<string | null>(null);

  async function join() {
    setState("busy");
    setError(null);
    const res = await fetch("/api/invitations/accept", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ token }),
    });
    if (res.ok) return setState("joined");
    const data = (await res.json().catch(() => ({}))) as Partial<ApiError>;
    setError(data.message ?? `The server refused (${res.status}).`);
    setState("idle");
  }

  if (state === "joined") {
    return (
      <div className="flex flex-col gap-3" data-testid="joined">
        <p>
          You are now a member of <strong>{teamName}</strong>. This session goes on working in {currentTeam}.
        </p>
        <Link href="/designs" className={buttonClass("secondary", "self-start")}>
          Back to the workbench
        </Link>
      </div>
    );
  }
  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm">
        You are signed in as <code className="font-mono">{email}</code>, the invited account.
      </p>
      <Button variant="primary" onClick={join} disabled={state === "busy"}>
        {state === "busy" ? "Joining…" : `Join ${teamName}`}
      </Button>
      <p aria-live="polite" className="text-xs font-medium text-bad empty:hidden" data-testid="accept-error">
        {error}
      </p>
    </div>
  );
}
