"use client";

import { useRef, useState } from "react";
import type { ApiError, ProfileUploaded } from "@/lib/api-description/responses";

export type UploadError = Pick<ApiError, "message" | "row" | "line" | "column">;

/** Drop a recording on the zone or choose it; it uploads at once. Refusals are shown as the server words them. */
export function UploadForm({ designId, onUploaded }: { designId: string; onUploaded: (id: string) => void }) {
  const [over, setOver] = useState(false);
  const [busy, setBusy] = useState<string | null>(null);
  const [error, setError] = useState<UploadError | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const input = useRef<HTMLInputElement>(null);

  async function upload(file: File) {
    setError(null);
    setDone(null);
    if (file.size > 10_000_000) {
      setError({
        message: `${file.name} is ${(file.size / 1e6).toFixed(1)} MB; the largest recording accepted is 10 MB. Nothing was stored.`,
      });
      return;
    }
    setBusy(file.name);
    const form = new FormData();
    form.set("file", file);
    const res = await fetch(`/api/designs/${designId}/profiles`, { method: "POST", body: form }).catch(() => null);
    setBusy(null);
    if (input.current) input.current.value = "";
    if (!res) return setError({ message: "The server could not be reached; nothing was stored." });
    const data = (await res.json().catch(() => ({}))) as ApiError & Partial<ProfileUploaded>;
    if (!res.ok || !data.id)
      return setError({ ...data, message: data.message ?? `The upload was refused (${res.status}).` });
    setDone(`Stored ${file.name}: ${data.samples?.toLocaleString("en-GB")} samples.`);
    onUploaded(data.id);
  }

  return (
    <div className="flex flex-col gap-2">
      <div
        data-testid="profile-drop-zone"
        onDragOver={(e) => {
          e.preventDefault();
          setOver(true);
        }}
        onDragLeave={() => setOver(false)}
        onDrop={(e) => {
          e.preventDefault();
          setOver(false);
          const file = e.dataTransfer.files[0];
          if (file) void upload(file);
        }}
        className={`flex flex-col items-center gap-2 rounded-panel border-2 border-dashed px-4 py-5 text-center ${over ? "border-copper bg-copper-soft/40" : "border-line bg-sunken/40"}`}
      >
        <p className="font-medium">{busy ? `Uploading ${busy}…` : "Drop a current recording (CSV) here"}</p>
        <p className="max-w-prose text-xs text-ink-muted">
          A header naming a time column (<code>time</code> or <code>t</code>) and a current column (<code>current</code>{" "}
          or <code>i</code>), each with an optional unit: <code>Time (ms),current [uA]</code>. Without a unit, seconds
          and amperes. Up to 10 MB; lines starting with <code>#</code> are skipped.
        </p>
        <label className="cursor-pointer text-sm">
          <span className="sr-only">Current recording (CSV)</span>
          <input
            ref={input}
            type="file"
            accept=".csv,text/csv,text/plain"
            aria-label="Current recording (CSV)"
            disabled={busy !== null}
            onChange={(e) => {
              const file = e.target.files?.[0];
              if (file) void upload(file);
            }}
            className="text-sm file:mr-2 file:cursor-pointer file:rounded file:border file:border-line file:bg-panel file:px-3 file:py-1.5 file:text-sm file:font-medium"
          />
        </label>
      </div>
      {error && (
        <div
          role="alert"
          data-testid="profile-upload-error"
          className="rounded-panel border border-bad/40 bg-bad/10 px-3 py-2 text-sm text-bad"
        >
          <p className="font-medium">The file was refused; nothing was stored.</p>
          <p>{error.message}</p>
          {(error.row !== undefined || error.line !== undefined || error.column !== undefined) && (
            <p className="mt-1 text-xs">
              {error.row !== undefined && <>Data row {error.row} · </>}
              {error.line !== undefined && <>file line {error.line} · </>}
              {error.column !== undefined && <>column “{error.column}”</>}
            </p>
          )}
        </div>
      )}
      <p role="status" aria-live="polite" className="text-xs text-good">
        {done}
      </p>
    </div>
  );
}
