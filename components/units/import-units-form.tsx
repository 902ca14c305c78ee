"use client";
// Many units from one CSV: serial, optional date, one column per test point. All or nothing; a
// refusal names its row and column.
import { useState } from "react";
import { Button, buttonClass } from "@/components/ui/button";
import type { ApiError, UnitsImported } from "@/lib/api-description/responses";

export function ImportUnitsForm({ designId, onImported }: { designId: string; onImported: () => Promise<void> }) {
  const [file, setFile] = useState<File | null>(null);
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<{ ok: boolean; text: string } | null>(null);

  async function send() {
    if (!file) return;
    setBusy(true);
    setResult(null);
    const body = new FormData();
    body.set("file", file);
    const res = await fetch(`/api/designs/${designId}/units/import`, { method: "POST", body }).catch(() => null);
    const data = (await res?.json().catch(() => ({}))) as Partial<UnitsImported & ApiError> | undefined;
    setBusy(false);
    if (res?.ok) {
      setResult({ ok: true, text: `${data?.imported ?? 0} units imported.` });
      await onImported();
    } else setResult({ ok: false, text: data?.message ?? "The file could not be imported; nothing was stored." });
  }

  return (
    <div className="flex flex-col gap-2">
      <p className="text-xs text-ink-muted">
        One row per unit: a <span className="font-medium">serial</span> column, an optional{" "}
        <span className="font-medium">date</span> (YYYY-MM-DD) and one column per test point, named as on the sheet or
        by its current. Cells like “36.9 mV”, or numbers in the unit written in the header (“Maximum current [mV]”).{" "}
        <a href={`/api/designs/${designId}/units/template.csv`} download className="text-copper hover:underline">
          Blank file with the right header
        </a>
        .
      </p>
      <div className="flex flex-wrap items-center gap-2">
        <label className={buttonClass("secondary", "cursor-pointer")}>
          Choose CSV file
          <input
            type="file"
            accept=".csv,text/csv"
            className="sr-only"
            onChange={(e) => setFile(e.target.files?.[0] ?? null)}
          />
        </label>
        <span className="text-xs text-ink-muted">{file ? file.name : "no file chosen"}</span>
        <Button onClick={send} disabled={!file || busy}>
          {busy ? "Importing…" : "Import units"}
        </Button>
      </div>
      <p aria-live="polite" className={`text-sm ${result?.ok ? "text-good" : "text-bad"}`}>
        {result?.text}
      </p>
    </div>
  );
}
