"use client";
// "Import design": reads a design file (from a design's "Design file (JSON)" download) and posts
// it to /api/designs/import, which saves it as a new draft in the caller's team; then opens it.
// Refusals are shown as the API words them, field by field, and nothing is saved.
import { useRouter } from "next/navigation";
import { useId, useRef, useState } from "react";

type Refusal = { message: string; fieldErrors?: Record<string, string[]> };

const MAX_BYTES = 1_000_000;

/** Shown by the designs page only to callers the policy lets create designs. */
export function ImportDesign() {
  const router = useRouter();
  const inputId = useId();
  const input = useRef<HTMLInputElement>(null);
  const [busy, setBusy] = useState(false);
  const [refusal, setRefusal] = useState<Refusal | null>(null);

  async function onFile(file: File) {
    setRefusal(null);
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
      const res = await fetch("/api/designs/import", {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: text,
      });
      const body = (await res.json().catch(() => ({ message: `The server answered ${res.status}.` }))) as Refusal & {
        id?: string;
      };
      if (res.status === 201 && body.id) {
        router.push(`/designs/${body.id}`);
        router.refresh();
        return;
      }
      setRefusal({ message: body.message ?? `The server answered ${res.status}.`, fieldErrors: body.fieldErrors });
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
        {refusal && (
          <div className="text-bad" data-testid="import-error">
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
