"use client";
// Display name and which review mail this person receives (PATCH /api/me).
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field, TextInput } from "@/components/ui/field";
import { sendJson, type Refusal } from "./send-json";
import type { MailChoices } from "@/lib/api-description/responses";

export type MailPreferences = MailChoices;

const mailChoices: { key: keyof MailPreferences; label: string; hint: string }[] = [
  { key: "submitted", label: "A design is submitted for review", hint: "sent to the team's reviewers" },
  { key: "returned", label: "My design is returned", hint: "with the reviewer's reason" },
  { key: "approved", label: "My design is approved", hint: "the build sheet is ready" },
  { key: "comments", label: "Someone comments on my design or replies to me", hint: "" },
];

export function ProfileForm({ name: initialName, mail: initialMail }: { name: string; mail: MailPreferences }) {
  const router = useRouter();
  const [name, setName] = useState(initialName);
  const [mail, setMail] = useState(initialMail);
  const [busy, setBusy] = useState(false);
  const [refusal, setRefusal] = useState<Refusal | null>(null);
  const [saved, setSaved] = useState(false);

  async function save() {
    setBusy(true);
    setSaved(false);
    setRefusal(null);
    const result = await sendJson("/api/me", "PATCH", { name, mail });
    setBusy(false);
    if (!result.ok) return setRefusal(result.refusal);
    setSaved(true);
    router.refresh();
  }

  return (
    <form
      className="flex flex-col gap-4"
      aria-label="Name and review mail"
      onSubmit={(e) => {
        e.preventDefault();
        void save();
      }}
    >
      <Field
        id="account-name"
        label="Display name"
        hint="How the team sees you in reviews and the log"
        error={refusal?.fieldErrors?.name?.[0]}
      >
        <TextInput
          id="account-name"
          value={name}
          maxLength={120}
          aria-invalid={!!refusal?.fieldErrors?.name}
          aria-describedby="account-name-error"
          onChange={(e) => setName(e.target.value)}
        />
      </Field>
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-xs font-medium text-ink-muted">Send me mail when…</legend>
        {mailChoices.map((c) => (
          <label key={c.key} className="flex items-start gap-2 text-sm">
            <input
              type="checkbox"
              className="mt-0.5 accent-copper"
              checked={mail[c.key]}
              onChange={(e) => setMail({ ...mail, [c.key]: e.target.checked })}
            />
            <span>
              {c.label}
              {c.hint && <span className="block text-2xs text-ink-faint">{c.hint}</span>}
            </span>
          </label>
        ))}
        <p className="text-2xs text-ink-faint">
          Account notices always come: an invitation, and a change of your role in a team (it changes what you may do).
        </p>
      </fieldset>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" variant="primary" disabled={busy}>
          Save name and mail choices
        </Button>
        <p role="status" aria-live="polite" className="text-xs">
          {refusal && !refusal.fieldErrors?.name && <span className="text-bad">{refusal.message}</span>}
          {saved && <span className="text-good">Saved.</span>}
        </p>
      </div>
    </form>
  );
}
