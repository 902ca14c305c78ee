"use client";

import { useRouter } from "next/navigation";
import { useRef, useState } from "react";
import { Badge } from "@/components/ui/badge";
import { Button, buttonClass } from "@/components/ui/button";
import { Field, Select } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { tableColumnsOf } from "@/lib/library/fields";
import type { PartKind } from "@/lib/library/schema";
import type { ApiError, LibraryBody, LibraryImported } from "@/lib/api-description/responses";
import { PartForm, kindWord, type Part } from "./part-form";

const titles: Record<PartKind, string> = {
  amplifiers: "Amplifiers",
  shunts: "Shunt families",
  adcs: "ADCs",
  meters: "Meter ranges",
};
/** In the page's order; a type import above, so the library's zod schemas stay off this page. */
const kinds = Object.keys(titles) as PartKind[];

type Notice = { tone: "good" | "bad"; text: string } | null;

export function LibraryWorkbench({
  library,
  canEdit,
}: {
  // The API's own response type (GET /api/library), not a shape declared again here.
  library: LibraryBody;
  canEdit: boolean;
}) {
  const router = useRouter();
  const [notice, setNotice] = useState<Notice>(null);
  const done = (text: string) => {
    if (text) setNotice({ tone: "good", text });
    router.refresh();
  };
  return (
    <div className="flex flex-col gap-4">
      <p
        role="status"
        aria-live="polite"
        className={`min-h-5 text-sm font-medium ${notice?.tone === "bad" ? "text-bad" : "text-good"}`}
      >
        {notice?.text}
      </p>
      {(["amplifiers", "shunts", "adcs", "meters"] as const).map((kind) => (
        <PartTable
          key={kind}
          kind={kind}
          parts={library[kind]}
          canEdit={canEdit}
          onDone={done}
          onError={(t) => setNotice({ tone: "bad", text: t })}
        />
      ))}
      <ImportExport canEdit={canEdit} onDone={done} />
    </div>
  );
}

function PartTable({
  kind,
  parts,
  canEdit,
  onDone,
  onError,
}: {
  kind: PartKind;
  parts: Part[];
  canEdit: boolean;
  onDone: (message: string) => void;
  onError: (message: string) => void;
}) {
  const [editing, setEditing] = useState<string | "new" | null>(null);
  const columns = tableColumnsOf[kind];

  async function remove(part: Part) {
    if (!window.confirm(`Remove ${part.name} from the library? Designs already saved keep their figures.`)) return;
    const res = await fetch(`/api/library/${kind}/${part.id}`, { method: "DELETE" }).catch(() => null);
    if (!res) return onError("The server could not be reached; nothing was removed.");
    const data = (await res.json().catch(() => ({}))) as Partial<ApiError>;
    if (!res.ok) return onError(data.message ?? `Removing ${part.name} was refused (${res.status}).`);
    onDone(`Removed ${part.name}.`);
  }

  const finish = (message: string) => {
    setEditing(null);
    onDone(message);
  };

  return (
    <Panel
      title={`${titles[kind]} (${parts.length})`}
      actions={
        canEdit && editing !== "new" ? (
          <Button variant="secondary" onClick={() => setEditing("new")}>
            Add {kindWord[kind]}
          </Button>
        ) : null
      }
    >
      {editing === "new" && (
        <div className="mb-4 rounded-panel border border-copper/40 bg-copper-soft/30 p-3">
          <PartForm kind={kind} part={null} onDone={finish} />
        </div>
      )}
      {parts.length === 0 ? (
        <p className="text-ink-muted">
          No {titles[kind].toLowerCase()} yet.
          {canEdit
            ? kind === "adcs" || kind === "meters"
              ? " Add one from its data sheet."
              : " Add one, or import a CSV below."
            : " Owners and designers add them."}
        </p>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full text-left text-sm" aria-label={titles[kind]}>
            <thead className="border-b border-line text-xs text-ink-muted">
              <tr>
                <th scope="col" className="px-2 py-1.5 font-medium">
                  Name
                </th>
                {columns.map((c) => (
                  <th key={c.key} scope="col" className="px-2 py-1.5 font-medium whitespace-nowrap">
                    {c.label}
                  </th>
                ))}
                {canEdit && <th className="px-2 py-1.5" aria-label="Actions" />}
              </tr>
            </thead>
            <tbody>
              {parts.map((p) => (
                <FragmentRow
                  key={p.id}
                  colSpan={columns.length + (canEdit ? 2 : 1)}
                  editing={editing === p.id}
                  form={<PartForm kind={kind} part={p} onDone={finish} />}
                >
                  <th scope="row" className="px-2 py-1.5 text-left font-medium">
                    {p.name}
                  </th>
                  {columns.map((c) => (
                    <td key={c.key} className="num px-2 py-1.5 whitespace-nowrap">
                      {c.key === "fourTerminal" ? (
                        "fourTerminal" in p && p.fourTerminal ? (
                          <Badge tone="signal">4-terminal</Badge>
                        ) : (
                          <span className="text-ink-faint">2-terminal</span>
                        )
                      ) : (
                        c.show(p)
                      )}
                    </td>
                  ))}
                  {canEdit && (
                    <td className="px-2 py-1 text-right whitespace-nowrap">
                      <Button
                        variant="ghost"
                        onClick={() => setEditing(editing === p.id ? null : p.id)}
                        aria-label={`Edit ${p.name}`}
                      >
                        Edit
                      </Button>
                      <Button variant="ghost" onClick={() => remove(p)} aria-label={`Remove ${p.name}`}>
                        Remove
                      </Button>
                    </td>
                  )}
                </FragmentRow>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </Panel>
  );
}

function FragmentRow({
  children,
  editing,
  form,
  colSpan,
}: {
  children: React.ReactNode;
  editing: boolean;
  form: React.ReactNode;
  colSpan: number;
}) {
  return (
    <>
      <tr className={`border-b border-line last:border-0 ${editing ? "bg-sunken" : ""}`}>{children}</tr>
      {editing && (
        <tr className="border-b border-line bg-sunken">
          <td colSpan={colSpan} className="px-2 py-3">
            {form}
          </td>
        </tr>
      )}
    </>
  );
}

function ImportExport({ canEdit, onDone }: { canEdit: boolean; onDone: (message: string) => void }) {
  const [kind, setKind] = useState<PartKind>("amplifiers");
  const [error, setError] = useState<string | null>(null);
  const [problems, setProblems] = useState<NonNullable<ApiError["problems"]>>([]);
  const [busy, setBusy] = useState(false);
  const fileRef = useRef<HTMLInputElement>(null);

  async function upload(e: React.FormEvent) {
    e.preventDefault();
    const file = fileRef.current?.files?.[0];
    setError(null);
    if (!file) return setError("Choose a CSV file first.");
    const form = new FormData();
    form.set("kind", kind);
    form.set("file", file);
    setBusy(true);
    const res = await fetch("/api/library/import", { method: "POST", body: form }).catch(() => null);
    setBusy(false);
    if (!res) return setError("The server could not be reached; nothing was imported.");
    const data = (await res.json().catch(() => ({}))) as Partial<LibraryImported & ApiError>;
    setProblems(!res.ok && data.problems && data.problems.length > 1 ? data.problems : []);
    if (!res.ok) return setError(data.message ?? `The import was refused (${res.status}).`);
    if (fileRef.current) fileRef.current.value = "";
    onDone(`Imported ${data.fileName}: ${data.created} added, ${data.updated} updated.`);
  }

  return (
    <Panel title="Import and export (CSV)">
      <div className="grid grid-cols-1 gap-6 md:grid-cols-2">
        <div className="flex flex-col gap-2">
          <h3 className="text-sm font-medium">Export</h3>
          <p className="text-xs text-ink-muted">
            One row per part in SI units. Amplifier and shunt columns carry the unit in their name (offsetV, minOhms…);
            ADC and meter columns keep the readout&apos;s names (fullScale in volts, offsetLsb in steps of the
            converter). A file exported here imports back unchanged.
          </p>
          <div className="flex flex-wrap gap-2">
            {kinds.map((k) => (
              <a key={k} className={buttonClass("secondary")} href={`/api/library/export?kind=${k}`} download>
                {titles[k]} CSV
              </a>
            ))}
          </div>
        </div>
        {canEdit ? (
          <form onSubmit={upload} className="flex flex-col gap-2" aria-label="Import parts">
            <h3 className="text-sm font-medium">Import</h3>
            <p className="text-xs text-ink-muted">
              All or nothing: one bad cell refuses the whole file and names its row and column. A part whose name is
              already in the library is updated. Units may go in the header (<code>offset [uV]</code>) or the cell (
              <code>35 uV</code>); lists are separated by <code>;</code>.
            </p>
            <div className="grid grid-cols-1 items-end gap-2 sm:grid-cols-[10rem_minmax(0,1fr)]">
              <Field id="import-kind" label="The file holds">
                <Select id="import-kind" value={kind} onChange={(e) => setKind(e.target.value as PartKind)}>
                  {kinds.map((k) => (
                    <option key={k} value={k}>
                      {titles[k]}
                    </option>
                  ))}
                </Select>
              </Field>
              <Field id="import-file" label="CSV file">
                <input
                  id="import-file"
                  ref={fileRef}
                  type="file"
                  accept=".csv,text/csv"
                  className="w-full min-w-0 text-sm file:mr-2 file:rounded file:border file:border-line file:bg-panel file:px-2 file:py-1"
                />
              </Field>
            </div>
            <div className="flex items-center gap-2">
              <Button type="submit" variant="primary" disabled={busy}>
                {busy ? "Importing…" : "Import"}
              </Button>
            </div>
            <p role="alert" aria-live="assertive" className="text-sm font-medium text-bad" data-testid="import-error">
              {error}
            </p>
            {problems.length > 0 && (
              <ol className="list-decimal pl-5 text-xs text-bad" data-testid="import-problems">
                {problems.map((p, i) => (
                  <li key={i}>{p.message}</li>
                ))}
              </ol>
            )}
          </form>
        ) : (
          <p className="text-sm text-ink-muted">
            Owners and designers import parts; everyone can read and export the library.
          </p>
        )}
      </div>
    </Panel>
  );
}
