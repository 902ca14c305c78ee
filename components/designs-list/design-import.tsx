"use client";
// "Import design": reads a design file (from a design's "Design file (JSON)" download) and posts
// it to /api/designs/import, which saves it as a new draft in the caller's team; then opens it.
// Refusals are shown as the API words them, field by field, and nothing is saved.
import { useRouter } from "next/navigation";
import { useId, useRef, useState } from "react";
import type { ApiError, DesignImported } from "@/lib/api-description/responses";

type Refusal = Pick<ApiError, "message" | "fieldErrors">;

const MAX_BYTES = 1_000_000;

/** Shown by the designs page only to callers the policy lets create designs. */
export function ImportDesign() {
  const router = useRouter();
  const inputId = useId();
  const input = useRef<HTMLInputElement>(null);
  const [busy, setBusy] = useState(false);
  const [refusal, setRefusal] = useState<Refusal | null>(null);
  // A name already in the team: the file is kept to import again under the name chosen here.
  const [retry, setRetry] = useState<{ file: Record<string, unknown>; name: string } | null>(null);

  async function post(text: string) {
    const res = await fetch("/api/designs/import", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: text,
    });
    const body = (await res.json().catch(() => ({ message: `The server answered ${res.status}.` }))) as ApiError &
      Partial<DesignImported>;
    if (res.status === 201 && body.id) {
      setRetry(null);
      router.push(`/designs/${body.id}`);
      router.refresh();
      return;
    }
    if (res.status === 409 && body.suggestedName) {
      setRetry({ file: JSON.parse(text) as Record<string, unknown>, name: body.suggestedName });
      setRefusal({ message: body.message });
      return;
    }
    setRetry(null);
    setRefusal({ message: body.message ?? `The server answered ${res.status}.`, fieldErrors: body.fieldErrors });
  }

  async function importAs(name: string) {
    if (!retry) return;
    setBusy(true);
    setRefusal(null);
    try {
      await post(JSON.stringify({ ...retry.file, name: name.trim() }));
    } catch {
      setRefusal({ message: "Could not reach the server; nothing was imported." });
    } finally {
      setBusy(false);
    }
  }

  async function onFile(file: File) {
    setRefusal(null);
    setRetry(null);
    if (file.size > MAX_BYTES) {
      setRefusal({ message: `${file.name} is larger than 1 MB; a design file is a few kilobytes.` });
      return;
    }
    setBusy(true);
    try {
      const text = await file.text();
      try {
        JSON.parse(text);
      } catch {
        setRefusal({ message: `${file.name} is not a JSON file; choose a design file exported from Sensewright.` });
        return;
      }
      await post(text);
    } catch {
      setRefusal({ message: "Could not reach the server; nothing was imported." });
    } finally {
      setBusy(false);
      if (input.current) input.current.value = "";
    }
  }

  return (
    <div className="flex flex-col items-end gap-1" data-testid="import-design">
      <label
        htmlFor={inputId}
        className="inline-flex cursor-pointer items-center justify-center gap-1.5 rounded border border-line bg-panel px-3 py-1.5 text-sm font-medium text-ink hover:bg-sunken focus-within:border-copper"
      >
        {busy ? "Importing…" : "Import design"}
        <input
          ref={input}
          id={inputId}
          type="file"
          accept=".json,application/json"
          className="sr-only"
          disabled={busy}
          aria-describedby={`${inputId}-status`}
          onChange={(e) => {
            const file = e.currentTarget.files?.[0];
            if (file) void onFile(file);
          }}
        />
      </label>
      <div id={`${inputId}-status`} role="status" aria-live="polite" className="max-w-md text-right text-2xs">
        {retry && (
          <form
            className="mt-1 flex flex-wrap items-center justify-end gap-1.5"
            onSubmit={(e) => {
              e.preventDefault();
              void importAs(retry.name);
            }}
          >
            <label htmlFor={`${inputId}-name`} className="text-ink-muted">
              Import as
            </label>
            <input
              id={`${inputId}-name`}
              value={retry.name}
              maxLength={200}
              onChange={(e) => setRetry({ ...retry, name: e.target.value })}
              className="w-56 max-w-full rounded border border-line bg-panel px-2 py-1 text-xs"
            />
            <button
              type="submit"
              disabled={busy || !retry.name.trim()}
              className="rounded border border-line bg-panel px-2 py-1 text-xs font-medium hover:bg-sunken"
            >
              Import under this name
            </button>
          </form>
        )}
        {refusal && (
          <div className={retry ? "text-warn" : "text-bad"} data-testid="import-error">
            <p className="font-medium">{refusal.message}</p>
            {refusal.fieldErrors && (
              <ul className="mt-0.5">
                {Object.entries(refusal.fieldErrors).map(([path, msgs]) => (
                  <li key={path}>
                    <code>{path}</code>: {msgs.join("; ")}
                  </li>
                ))}
              </ul>
            )}
          </div>
        )}
      </div>
    </div>
  );
}
