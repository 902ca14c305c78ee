"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field, Select, TextInput } from "@/components/ui/field";
import { fieldsOf, formToBody, partToForm } from "@/lib/library/fields";
import type { PartKind } from "@/lib/library/schema";
import type { AdcPart, AmplifierPart, ApiError, MeterPart, ShuntPart } from "@/lib/api-description/responses";

export type Part = AmplifierPart | ShuntPart | AdcPart | MeterPart;

export const kindWord: Record<PartKind, string> = {
  amplifiers: "amplifier",
  shunts: "shunt family",
  adcs: "ADC",
  meters: "meter range",
};

/** Adds a part (part = null) or edits one; unit strings are read by the server, errors land beside the field. */
export function PartForm({
  kind,
  part,
  onDone,
}: {
  kind: PartKind;
  part: Part | null;
  onDone: (message: string) => void;
}) {
  const [form, setForm] = useState(() => partToForm(kind, part));
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const idBase = `${kind}-${part?.id ?? "new"}`;

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setMessage(null);
    setErrors({});
    const body = formToBody(kind, form);
    const res = await fetch(part ? `/api/library/${kind}/${part.id}` : `/api/library/${kind}`, {
      method: part ? "PATCH" : "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify(part ? { ...body, updatedAt: part.updatedAt } : body),
    }).catch(() => null);
    setBusy(false);
    if (!res) return setMessage("The server could not be reached; nothing was saved.");
    const data = (await res.json().catch(() => ({}))) as Partial<ApiError & Part>;
    if (!res.ok) {
      const fieldErrors = data.fieldErrors ?? {};
      setErrors(fieldErrors);
      const onFields = Object.keys(fieldErrors).some((k) => fieldsOf[kind].some((f) => f.key === k));
      setMessage(
        onFields
          ? "Nothing was saved: correct the marked fields."
          : (data.message ?? `The change was refused (${res.status}).`),
      );
      return;
    }
    onDone(part ? `Saved ${String(data.name)}.` : `Added ${String(data.name)} to the library.`);
  }

  return (
    <form
      onSubmit={submit}
      className="flex flex-col gap-3"
      aria-label={part ? `Edit ${kindWord[kind]}` : `Add ${kindWord[kind]}`}
    >
      <div className="grid grid-cols-1 gap-x-4 gap-y-2 sm:grid-cols-2 lg:grid-cols-4">
        {fieldsOf[kind].map((f) => {
          const id = `${idBase}-${f.key}`;
          const error = errors[f.key]?.[0];
          const common = { id, "aria-invalid": error ? true : undefined, "aria-describedby": `${id}-error ${id}-hint` };
          if (f.kind === "checkbox") {
            return (
              <label key={f.key} className="flex items-center gap-2 self-end pb-2 text-sm">
                <input
                  type="checkbox"
                  checked={form[f.key] === true}
                  onChange={(e) => setForm({ ...form, [f.key]: e.target.checked })}
                  className="size-4 accent-copper"
                />
                {f.label}
              </label>
            );
          }
          return (
            <div key={f.key} className={f.key === "name" ? "sm:col-span-2" : undefined}>
              <Field id={id} label={f.label} hint={f.hint} error={error}>
                {f.kind === "select" ? (
                  <Select
                    {...common}
                    value={String(form[f.key] ?? "")}
                    onChange={(e) => setForm({ ...form, [f.key]: e.target.value })}
                  >
                    {f.options?.map((o) => (
                      <option key={o.value} value={o.value}>
                        {o.label}
                      </option>
                    ))}
                  </Select>
                ) : (
                  <TextInput
                    {...common}
                    required={f.key === "name"}
                    value={String(form[f.key] ?? "")}
                    onChange={(e) => setForm({ ...form, [f.key]: e.target.value })}
                  />
                )}
              </Field>
            </div>
          );
        })}
      </div>
      <div className="flex items-center gap-2">
        <Button type="submit" variant="primary" disabled={busy}>
          {busy ? "Saving…" : part ? "Save changes" : `Add ${kindWord[kind]}`}
        </Button>
        <Button onClick={() => onDone("")}>Cancel</Button>
        <p role="status" aria-live="polite" className="text-xs font-medium text-bad">
          {message}
        </p>
      </div>
    </form>
  );
}
