"use client";

import { signIn } from "next-auth/react";
import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { Field, TextInput } from "@/components/ui/field";

/** The invitee's form: a name and password for a new account, or the existing account's password. */
export function AcceptInvitationForm({
  token,
  email,
  hasAccount,
}: {
  token: string;
  email: string;
  hasAccount: boolean;
}) {
  const router = useRouter();
  const [error, setError] = useState<{ message: string; fieldErrors?: Record<string, string[]> } | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    const password = String(form.get("password") ?? "");
    if (!hasAccount && password.length < 10) {
      setError({
        message: "Choose a password of at least 10 characters.",
        fieldErrors: { password: [`at least 10 characters (this one has ${password.length})`] },
      });
      return;
    }
    if (!hasAccount && password !== String(form.get("confirm") ?? "")) {
      setError({ message: "The two passwords differ.", fieldErrors: { confirm: ["does not match the password"] } });
      return;
    }
    setBusy(true);
    setError(null);
    const res = await fetch("/api/invitations/accept", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ token, name: String(form.get("name") ?? ""), password }),
    });
    const data = (await res.json().catch(() => ({}))) as { message?: string; fieldErrors?: Record<string, string[]> };
    if (!res.ok) {
      setBusy(false);
      // Field messages go beside their fields, in words; the line above the button says what to do.
      const fieldErrors = data.fieldErrors
        ? Object.fromEntries(
            Object.entries(data.fieldErrors).map(([k, v]) => [
              k,
              v.map((m) => m.replace(new RegExp(`^${k}:\\s*`, "i"), "")),
            ]),
          )
        : undefined;
      setError({
        message: fieldErrors ? "Check the marked fields." : (data.message ?? `The server refused (${res.status}).`),
        fieldErrors,
      });
      return;
    }
    const signedIn = await signIn("credentials", { email, password, redirect: false });
    setBusy(false);
    if (!signedIn || signedIn.error) {
      router.replace("/sign-in");
      return;
    }
    router.replace("/designs");
    router.refresh();
  }

  const fe = (k: string) => error?.fieldErrors?.[k]?.join("; ");
  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-3" noValidate>
      <Field id="invite-email" label="E-mail">
        <TextInput id="invite-email" value={email} readOnly aria-readonly className="text-ink-muted" />
      </Field>
      {!hasAccount && (
        <Field id="name" label="Your name" hint="How your team sees you." error={fe("name")}>
          <TextInput id="name" name="name" autoComplete="name" required aria-invalid={!!fe("name")} />
        </Field>
      )}
      <Field
        id="password"
        label={hasAccount ? "Your existing password" : "Choose a password"}
        hint={hasAccount ? "You already have an account with this e-mail." : "At least 10 characters."}
        error={fe("password")}
      >
        <TextInput
          id="password"
          name="password"
          type="password"
          autoComplete={hasAccount ? "current-password" : "new-password"}
          required
          aria-invalid={!!fe("password")}
        />
      </Field>
      {!hasAccount && (
        <Field id="confirm" label="Password again" error={fe("confirm")}>
          <TextInput
            id="confirm"
            name="confirm"
            type="password"
            autoComplete="new-password"
            required
            aria-invalid={!!fe("confirm")}
          />
        </Field>
      )}
      <p aria-live="polite" className="text-xs font-medium text-bad" data-testid="accept-error">
        {error?.message}
      </p>
      <Button type="submit" variant="primary" disabled={busy}>
        {busy ? "Joining…" : "Join the team"}
      </Button>
    </form>
  );
}
