"use client";
// Personal API tokens: create one (its secret is shown here once, then never again), see the
// list with when each was last used, revoke. The list comes from the server page; after a change
// the page refreshes it.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field, Select, TextInput } from "@/components/ui/field";
import { formatWhen } from "@/lib/saved-designs/when";
import { sendJson, type Refusal } from "./send-json";
import type { TokenRow } from "@/lib/api-description/responses";

export type { TokenRow };

const when = (iso: string | null, none: string) => (iso ? formatWhen(iso) : none);

export function TokensSection({ tokens, teamName }: { tokens: TokenRow[]; teamName: string }) {
  const router = useRouter();
  const [name, setName] = useState("");
  const [access, setAccess] = useState<"read" | "write">("read");
  const [expiry, setExpiry] = useState("90");
  const [busy, setBusy] = useState(false);
  const [refusal, setRefusal] = useState<Refusal | null>(null);
  const [created, setCreated] = useState<{ name: string; token: string } | null>(null);
  const [copied, setCopied] = useState(false);

  async function create() {
    setBusy(true);
    setRefusal(null);
    setCopied(false);
    const result = await sendJson<{ id: string; token: string }>("/api/tokens", "POST", {
      name,
      access,
      expiresInDays: expiry === "never" ? null : Number(expiry),
    });
    setBusy(false);
    if (!result.ok) return setRefusal(result.refusal);
    setCreated({ name, token: result.data.token });
    setName("");
    router.refresh();
  }

  async function revoke(t: TokenRow) {
    if (!window.confirm(`Revoke the token "${t.name}"? Scripts using it stop working at once.`)) return;
    setRefusal(null);
    const result = await sendJson(`/api/tokens/${t.id}`, "DELETE");
    if (!result.ok) return setRefusal(result.refusal);
    router.refresh();
  }

  return (
    <div className="flex flex-col gap-4">
      <p className="text-sm text-ink-muted">
        A script sends <code className="rounded bg-sunken px-1 text-xs">Authorization: Bearer &lt;token&gt;</code> and
        acts as you in <strong className="text-ink">{teamName}</strong> (the team you are in when you create it), never
        with more than your role there now. A read token may only fetch; a write token may do what you may do. Every
        route is described in the{" "}
        <a href="/api-docs" className="text-copper hover:underline">
          API reference
        </a>
        .
      </p>
      {created && (
        <div className="flex flex-col gap-2 rounded border border-copper bg-copper-soft/40 p-3" data-testid="new-token">
          <p className="text-sm font-medium">
            Token “{created.name}” created. Copy it now: it is shown only this once and cannot be shown again.
          </p>
          <div className="flex flex-wrap items-center gap-2">
            <TextInput
              readOnly
              aria-label="New token secret"
              value={created.token}
              className="max-w-xl font-mono text-xs"
              onFocus={(e) => e.currentTarget.select()}
            />
            <Button
              onClick={() => {
                void navigator.clipboard?.writeText(created.token).then(() => setCopied(true));
              }}
            >
              {copied ? "Copied" : "Copy"}
            </Button>
            <Button variant="ghost" onClick={() => setCreated(null)}>
              I have stored it
            </Button>
          </div>
        </div>
      )}
      <form
        aria-label="Create a token"
        className="grid gap-3 sm:grid-cols-[minmax(0,2fr)_minmax(0,1fr)_minmax(0,1fr)_auto] sm:items-start"
        onSubmit={(e) => {
          e.preventDefault();
          void create();
        }}
      >
        <Field
          id="token-name"
          label="Token name"
          hint="What uses it, e.g. night rig"
          error={refusal?.fieldErrors?.name?.[0]}
        >
          <TextInput
            id="token-name"
            value={name}
            maxLength={80}
            required
            aria-invalid={!!refusal?.fieldErrors?.name}
            aria-describedby="token-name-error"
            onChange={(e) => setName(e.target.value)}
          />
        </Field>
        <Field id="token-access" label="Access">
          <Select id="token-access" value={access} onChange={(e) => setAccess(e.target.value as "read" | "write")}>
            <option value="read">read: fetch only</option>
            <option value="write">write: act as me</option>
          </Select>
        </Field>
        <Field id="token-expiry" label="Expires">
          <Select id="token-expiry" value={expiry} onChange={(e) => setExpiry(e.target.value)}>
            <option value="30">in 30 days</option>
            <option value="90">in 90 days</option>
            <option value="365">in a year</option>
            <option value="never">never</option>
          </Select>
        </Field>
        <Button type="submit" variant="primary" disabled={busy} className="sm:mt-5">
          Create token
        </Button>
      </form>
      <p role="status" aria-live="polite" className="text-xs text-bad">
        {refusal && !refusal.fieldErrors?.name ? refusal.message : ""}
      </p>
      {tokens.length === 0 ? (
        <p className="text-sm text-ink-muted">You have no tokens.</p>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Your API tokens</caption>
            <thead className="text-2xs uppercase tracking-wide text-ink-muted">
              <tr>
                <th className="px-2 py-1 font-medium">Name</th>
                <th className="px-2 py-1 font-medium">Access</th>
                <th className="px-2 py-1 font-medium">Team</th>
                <th className="px-2 py-1 font-medium">Starts with</th>
                <th className="px-2 py-1 font-medium">Created</th>
                <th className="px-2 py-1 font-medium">Expires</th>
                <th className="px-2 py-1 font-medium">Last used</th>
                <th className="px-2 py-1" />
              </tr>
            </thead>
            <tbody>
              {tokens.map((t) => {
                const expired = t.expired;
                return (
                  <tr key={t.id} className="border-t border-line" data-testid={`token-${t.name}`}>
                    <td className="px-2 py-1.5 font-medium">{t.name}</td>
                    <td className="px-2 py-1.5">{t.access}</td>
                    <td className="px-2 py-1.5 text-ink-muted">{t.teamName}</td>
                    <td className="px-2 py-1.5 font-mono text-xs text-ink-muted">{t.hint}…</td>
                    <td className="num px-2 py-1.5 text-ink-muted">{when(t.createdAt, "")}</td>
                    <td className={`num px-2 py-1.5 ${expired ? "text-bad" : "text-ink-muted"}`}>
                      {expired ? "expired " : ""}
                      {when(t.expiresAt, "never")}
                    </td>
                    <td className="num px-2 py-1.5 text-ink-muted">{when(t.lastUsedAt, "not yet")}</td>
                    <td className="px-2 py-1 text-right">
                      <Button variant="ghost" onClick={() => revoke(t)} aria-label={`Revoke ${t.name}`}>
                        Revoke
                      </Button>
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}
