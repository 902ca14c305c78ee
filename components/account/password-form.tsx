"use client";
// Change password: PUT /api/me/password {currentPassword, newPassword} → 200 {ok: true}, or 422 with
// fieldErrors on currentPassword / newPassword (the password rules live with that route).
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field, TextInput } from "@/components/ui/field";
import { sendJson, type Refusal } from "./send-json";

export function PasswordForm() {
  const [currentPassword, setCurrent] = useState("");
  const [newPassword, setNew] = useState("");
  const [repeat, setRepeat] = useState("");
  const [busy, setBusy] = useState(false);
  const [refusal, setRefusal] = useState<Refusal | null>(null);
  const [changed, setChanged] = useState(false);
  const mismatch = repeat.length > 0 && repeat !== newPassword;
  const errorOf = (field: string) => refusal?.fieldErrors?.[field]?.join(" ");

  async function change() {
    if (newPassword !== repeat) return;
    setBusy(true);
    setChanged(false);
    setRefusal(null);
    const result = await sendJson<{ ok: true }>("/api/me/password", "PUT", { currentPassword, newPassword });
    setBusy(false);
    if (!result.ok) return setRefusal(result.refusal);
    setChanged(true);
    setCurrent("");
    setNew("");
    setRepeat("");
  }

  return (
    <form
      className="flex flex-col gap-3"
      aria-label="Change password"
      onSubmit={(e) => {
        e.preventDefault();
        void change();
      }}
    >
      <Field id="pw-current" label="Current password" error={errorOf("currentPassword")}>
        <TextInput
          id="pw-current"
          type="password"
          autoComplete="current-password"
          required
          value={currentPassword}
          aria-invalid={!!errorOf("currentPassword")}
          aria-describedby="pw-current-error"
          onChange={(e) => setCurrent(e.target.value)}
        />
      </Field>
      <Field id="pw-new" label="New password" error={errorOf("newPassword")}>
        <TextInput
          id="pw-new"
          type="password"
          autoComplete="new-password"
          required
          value={newPassword}
          aria-invalid={!!errorOf("newPassword")}
          aria-describedby="pw-new-error"
          onChange={(e) => setNew(e.target.value)}
        />
      </Field>
      <Field id="pw-repeat" label="New password again" error={mismatch ? "The two new passwords differ." : undefined}>
        <TextInput
          id="pw-repeat"
          type="password"
          autoComplete="new-password"
          required
          value={repeat}
          aria-invalid={mismatch}
          aria-describedby="pw-repeat-error"
          onChange={(e) => setRepeat(e.target.value)}
        />
      </Field>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" variant="primary" disabled={busy || mismatch}>
          Change password
        </Button>
        <p role="status" aria-live="polite" className="text-xs">
          {refusal && !refusal.fieldErrors && <span className="text-bad">{refusal.message}</span>}
          {changed && <span className="text-good">Password changed.</span>}
        </p>
      </div>
    </form>
  );
}
