"use client";

import { signIn } from "next-auth/react";
import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { Field, TextInput } from "@/components/ui/field";
import type { ApiError } from "@/lib/api-description/responses";

type Refusal = Pick<ApiError, "message" | "fieldErrors">;

/** An invitation for an e-mail with no account yet: choose a name and a password, then sign in. */
export function NewAccountForm({ token, email }: { token: string; email: string }) {
  const router = useRouter();
  const [error, setError] = useState<Refusal | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    const password = String(form.get("password") ?? "");
    if (password !== String(form.get("confirm") ?? "")) {
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
    const data = (await res.json().catch(() => ({}))) as Partial<Refusal>;
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
    router.replace(signedIn && !signedIn.error ? "/designs" : "/sign-in");
    router.refresh();
  }

  const fe = (k: string) => error?.fieldErrors?.[k]?.join("; ");
  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-3" noValidate>
      <Field id="invite-email" label="E-mail">
        <TextInput id="invite-email" value={email} readOnly aria-readonly className="text-ink-muted" />
      </Field>
      <Field id="name" label="Your name" hint="How your team sees you." error={fe("name")}>
        <TextInput id="name" name="name" autoComplete="name" required aria-invalid={!!fe("name")} />
      </Field>
      <Field
        id="password"
        label="Choose a password"
        hint="At least 12 characters; not your e-mail address and not a commonly used password."
        error={fe("password")}
      >
        <TextInput
          id="password"
          name="password"
          type="password"
          autoComplete="new-password"
          required
          aria-invalid={!!fe("password")}
        />
      </Field>
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
      <p aria-live="polite" className="text-xs font-medium text-bad" data-testid="accept-error">
        {error?.message}
      </p>
      <Button type="submit" variant="primary" disabled={busy}>
        {busy ? "Joining…" : "Join the team"}
      </Button>
    </form>
  );
}
