"use client";

import { useState } from "react";
import { Badge } from "@/components/ui/badge";
import type { RevisionRecord } from "@/db/queries/designs";
import { formatSI } from "@/lib/design/format";
import { diffRevisions } from "@/lib/saved-designs/diff";
import { formatWhen } from "@/lib/saved-designs/when";

const narrowSelect = "rounded border border-line bg-panel px-2 py-1 text-sm num focus:border-copper focus:outline-none";

const groupNames = {
  design: "Design",
  requirement: "Requirement",
  choice: "Choice",
  plan: "Range plan",
  figures: "Figures",
} as const;

/** Every saved revision, and what changed between any two of them. */
export function RevisionHistory({ revisions }: { revisions: RevisionRecord[] }) {
  const last = revisions.at(-1)?.revision ?? 1;
  const [a, setA] = useState(Math.max(1, last - 1));
  const [b, setB] = useState(last);
  const ra = revisions.find((r) => r.revision === a);
  const rb = revisions.find((r) => r.revision === b);
  const changes = ra && rb ? diffRevisions(ra, rb) : [];
  return (
    <div className="flex flex-col gap-3">
      <div className="overflow-x-auto">
        <table className="w-full text-left text-sm">
          <thead className="text-xs text-ink-muted">
            <tr className="border-b border-line">
              <th className="py-1 pr-3 font-medium">Revision</th>
              <th className="py-1 pr-3 font-medium">Author</th>
              <th className="py-1 pr-3 font-medium">Saved</th>
              <th className="py-1 pr-3 text-right font-medium">Shunt</th>
              <th className="py-1 pr-3 text-right font-medium">Gain</th>
              <th className="py-1 font-medium">Approval</th>
            </tr>
          </thead>
          <tbody>
            {[...revisions].reverse().map((r) => (
              <tr key={r.revision} className="border-b border-line last:border-0">
                <td className="py-1 pr-3">{r.revision}</td>
                <td className="py-1 pr-3">{r.authorName}</td>
                <td className="py-1 pr-3 text-xs text-ink-muted">{formatWhen(r.createdAt)}</td>
                {r.kind === "plan" ? (
                  <>
                    {/* A plan: its shunts and gains, lowest range first, one range a line. */}
                    <td className="py-1 pr-3 text-right" title={`A range plan of ${r.plan.ranges.length} ranges`}>
                      {r.plan.ranges.map((x, k) => (
                        <span key={k} className="block whitespace-nowrap">
                          {formatSI(x.shuntOhms, "Ω")}
                        </span>
                      ))}
                    </td>
                    <td className="py-1 pr-3 text-right">
                      {r.plan.ranges.map((x, k) => (
                        <span key={k} className="block whitespace-nowrap">
                          {formatSI(x.gain, "")}
                        </span>
                      ))}
                    </td>
                  </>
                ) : (
                  <>
                    <td className="whitespace-nowrap py-1 pr-3 text-right">{formatSI(r.choice.shuntOhms, "Ω")}</td>
                    <td className="whitespace-nowrap py-1 pr-3 text-right">{formatSI(r.choice.gain, "")}</td>
                  </>
                )}
                <td className="py-1 text-xs">
                  {r.approval ? (
                    <span className="flex flex-col items-start gap-0.5" title={formatWhen(r.approval.at)}>
                      <Badge tone="good">approved</Badge>
                      <span className="text-ink-muted">by {r.approval.byName}</span>
                    </span>
                  ) : (
                    <span className="text-ink-faint">—</span>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {revisions.length > 1 ? (
        <div className="flex flex-col gap-2" data-testid="revision-diff">
          <div className="flex flex-wrap items-center gap-2 text-xs">
            <span className="font-medium text-ink-muted">What changed from</span>
            <RevisionSelect label="From revision" value={a} onChange={setA} revisions={revisions} />
            <span className="text-ink-muted">to</span>
            <RevisionSelect label="To revision" value={b} onChange={setB} revisions={revisions} />
          </div>
          {changes.length === 0 ? (
            <p className="text-xs text-ink-faint">
              {a === b ? "Pick two different revisions." : "Nothing differs between these revisions."}
            </p>
          ) : (
            <table className="w-full text-left text-sm">
              <thead className="text-xs text-ink-muted">
                <tr className="border-b border-line">
                  <th className="py-1 pr-3 font-medium">Field</th>
                  <th className="py-1 pr-3 text-right font-medium">Revision {a}</th>
                  <th className="py-1 text-right font-medium">Revision {b}</th>
                </tr>
              </thead>
              <tbody>
                {changes.map((c) => (
                  <tr key={`${c.group}.${c.path}`} className="border-b border-line last:border-0">
                    <td className="py-1 pr-3">
                      <span className="mr-1 text-2xs tracking-wide text-ink-faint">{groupNames[c.group]}</span>
                      {c.label}
                    </td>
                    <td className="py-1 pr-3 text-right text-ink-muted">{c.aText}</td>
                    <td className="py-1 text-right font-medium">{c.bText}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
        </div>
      ) : (
        <p className="text-xs text-ink-faint">
          Only one revision so far; every save adds one, and the changes between any two show here.
        </p>
      )}
    </div>
  );
}

function RevisionSelect({
  label,
  value,
  onChange,
  revisions,
}: {
  label: string;
  value: number;
  onChange: (revision: number) => void;
  revisions: { revision: number }[];
}) {
  return (
    <select
      aria-label={label}
      value={value}
      onChange={(e) => onChange(Number(e.target.value))}
      className={narrowSelect}
    >
      {revisions.map((r) => (
        <option key={r.revision} value={r.revision}>
          {r.revision}
        </option>
      ))}
    </select>
  );
}
