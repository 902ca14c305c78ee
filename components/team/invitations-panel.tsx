"use client";

import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Field, Select, TextInput } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import type { ApiError, InvitationCreated, InvitationRow } from "@/lib/api-description/responses";
import { formatWhen } from "@/lib/saved-designs/when";

const tone = { pending: "signal", accepted: "good", revoked: "neutral", expired: "warn" } as const;

type Message = { tone: "ok" | "bad"; text: string; link?: string } | null;

async function call(url: string, method: string, body?: unknown) {
  const res = await fetch(url, {
    method,
    headers: { "content-type": "application/json" },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const data = (await res.json().catch(() => ({}))) as Partial<ApiError & InvitationCreated>;
  return { ok: res.ok, status: res.status, data };
}

/** Owners invite by e-mail with a role, see every invitation's state and revoke pending ones. */
export function InvitationsPanel({ invitations }: { invitations: InvitationRow[] }) {
  const router = useRouter();
  const [message, setMessage] = useState<Message>(null);
  const [fieldErrors, setFieldErrors] = useState<Record<string, string[]>>({});
  const [busy, setBusy] = useState(false);
  const [mode, setMode] = useState<"member" | "team">("member");

  async function invite(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    const target = e.currentTarget;
    setBusy(true);
    setMessage(null);
    setFieldErrors({});
    const body =
      mode === "team"
        ? { email: form.get("email"), newTeam: form.get("newTeam") }
        : { email: form.get("email"), role: form.get("role") };
    const r = await call("/api/invitations", "POST", body);
    setBusy(false);
    if (!r.ok) {
      setFieldErrors(r.data.fieldErrors ?? {});
      setMessage({ tone: "bad", text: r.data.message ?? `The invitation was refused (${r.status}).` });
      return;
    }
    target.reset();
    setMessage({
      tone: "ok",
      text:
        mode === "team"
          ? `Team “${r.data.teamName}” started; its first owner has been mailed a single-use link.`
          : "Invitation mailed. The link works once and expires in 7 days.",
      link: r.data.link,
    });
    router.refresh();
  }

  async function revoke(inv: InvitationRow) {
    setMessage(null);
    const r = await call(`/api/invitations/${inv.id}`, "DELETE");
    setMessage(
      r.ok
        ? { tone: "ok", text: `The invitation of ${inv.email} is revoked; its link no longer works.` }
        : { tone: "bad", text: r.data.message ?? `Refused (${r.status}).` },
    );
    router.refresh();
  }

  const fe = (k: string) => fieldErrors[k]?.join("; ");
  return (
    <Panel title="Invitations">
      <form
        onSubmit={invite}
        className="mb-4 grid grid-cols-1 gap-3 md:grid-cols-[auto_1fr_1fr_auto] md:items-start"
        aria-label="Invite"
      >
        <Field id="invite-mode" label="Invite">
          <Select id="invite-mode" value={mode} onChange={(e) => setMode(e.target.value as "member" | "team")}>
            <option value="member">a member of this team</option>
            <option value="team">the first owner of a new team</option>
          </Select>
        </Field>
        <Field id="invite-email-input" label="E-mail" error={fe("email")}>
          <TextInput id="invite-email-input" name="email" type="email" required aria-invalid={!!fe("email")} />
        </Field>
        {mode === "member" ? (
          <Field id="invite-role" label="Role" error={fe("role")}>
            <Select id="invite-role" name="role" defaultValue="designer">
              <option value="designer">designer</option>
              <option value="reviewer">reviewer</option>
              <option value="maker">maker</option>
              <option value="owner">owner</option>
            </Select>
          </Field>
        ) : (
          <Field id="invite-new-team" label="New team's name" error={fe("newTeam")}>
            <TextInput id="invite-new-team" name="newTeam" required aria-invalid={!!fe("newTeam")} />
          </Field>
        )}
        <Button type="submit" variant="primary" disabled={busy} className="md:mt-5">
          Send invitation
        </Button>
      </form>
      <div aria-live="polite" className={`mb-3 text-xs ${message?.tone === "bad" ? "text-bad" : "text-good"}`}>
        {message?.text}
        {message?.link && (
          <span className="mt-1 block text-ink-muted">
            Link (shown this once):{" "}
            <code className="break-all font-mono text-ink" data-testid="invitation-link">
              {message.link}
            </code>
          </span>
        )}
      </div>
      {invitations.length === 0 ? (
        <p className="text-xs text-ink-faint">No invitations sent yet.</p>
      ) : (
        // The table scrolls inside its own frame on a phone, never the page.
        <div className="overflow-x-auto">
          <table className="w-full text-left text-sm">
            <thead className="border-b border-line text-xs text-ink-muted">
              <tr>
                <th className="py-1 pr-3 font-medium">E-mail</th>
                <th className="py-1 pr-3 font-medium">Role</th>
                <th className="py-1 pr-3 font-medium">State</th>
                <th className="py-1 pr-3 font-medium">Sent</th>
                <th className="py-1 pr-3 font-medium">Expires</th>
                <th className="py-1" />
              </tr>
            </thead>
            <tbody>
              {invitations.map((i) => (
                <tr key={i.id} className="border-b border-line last:border-0" data-testid="invitation-row">
                  <td className="py-1 pr-3 font-mono text-xs">{i.email}</td>
                  <td className="py-1 pr-3">{i.role}</td>
                  <td className="py-1 pr-3">
                    <Badge tone={tone[i.status]}>{i.status}</Badge>
                  </td>
                  <td className="py-1 pr-3 text-xs text-ink-muted">
                    {formatWhen(i.createdAt)} by {i.invitedByName}
                  </td>
                  <td className="py-1 pr-3 text-xs text-ink-muted">{formatWhen(i.expiresAt)}</td>
                  <td className="py-1 text-right">
                    {i.status === "pending" && (
                      <Button
                        variant="ghost"
                        className="px-2 py-0.5 text-xs"
                        onClick={() => revoke(i)}
                        aria-label={`Revoke the invitation of ${i.email}`}
                      >
                        Revoke
                      </Button>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </Panel>
  );
}
