"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { Badge } from "@/components/ui/badge";
import { formatSI } from "@/lib/design/format";
import type { ApiError, RevisionPairDiff } from "@/lib/api-description/responses";
import type { Change } from "@/lib/saved-designs/diff";
import { formatWhen } from "@/lib/saved-designs/when";

/** Rows shown before "Show all": the recent history a review reads; the rest one click away. */
const RECENT = 10;

const narrowSelect = "rounded border border-line bg-panel px-2 py-1 text-sm num focus:border-copper focus:outline-none";

const groupNames = {
  design: "Design",
  requirement: "Requirement",
  choice: "Choice",
  plan: "Range plan",
  figures: "Figures",
} as const;

/**
 * What a row of the history shows of a revision, and no more: a page lists fifty of them, and each
 * revision's name, author id and full plan would ride along in the page's data for nothing.
 */
export type HistoryRow = {
  revision: number;
  authorName: string;
  createdAt: string; // ISO
  approval: { byName: string; at: string } | null;
} & (
  | { kind: "pair"; choice: { shuntOhms: number; gain: number }; plan: null }
  | { kind: "plan"; choice: null; plan: { ranges: { shuntOhms: number; gain: number }[] } }
);

/** What changed from revision `a` to `b`, as the server worked it out (the page brings the first pair). */
export type RevisionDiff = { a: number; b: number; changes: Change[] };

async function fetchDiff(designId: string, a: number, b: number): Promise<Change[]> {
  const res = await fetch(`/api/designs/${designId}/revisions?a=${a}&b=${b}`);
  const data = (await res.json().catch(() => ({}))) as Partial<RevisionPairDiff & ApiError>;
  if (!res.ok || !data.changes) throw new Error(data.message ?? `The server answered ${res.status}.`);
  return data.changes as Change[];
}

/**
 * Every saved revision, and what changed between any two of them. The list holds each revision's
 * head only; the changes between a pair are worked out on the server (the two revisions' full
 * records), the page's first pair with the page and any other pair when it is picked.
 */
export function RevisionHistory({
  designId,
  revisions,
  firstDiff,
}: {
  designId: string;
  revisions: HistoryRow[];
  firstDiff: RevisionDiff;
}) {
  const [a, setA] = useState(firstDiff.a);
  const [all, setAll] = useState(false);
  const newestFirst = [...revisions].reverse();
  const shown = all ? newestFirst : newestFirst.slice(0, RECENT);
  const [b, setB] = useState(firstDiff.b);
  const isFirst = a === firstDiff.a && b === firstDiff.b;
  const diff = useQuery({
    queryKey: ["revision-diff", designId, a, b],
    queryFn: () => fetchDiff(designId, a, b),
    enabled: a !== b && !isFirst,
    initialData: isFirst ? firstDiff.changes : undefined,
    placeholderData: keepPreviousData,
    staleTime: Infinity, // revisions never change
    retry: false,
  });
  const changes = a === b ? [] : (diff.data ?? []);
  return (
    <div className="flex flex-col gap-3">
      <div className="overflow-x-auto">
        <table className="w-full text-left text-sm">
          <thead className="text-xs text-ink-muted">
            <tr className="border-b border-line">
              <th className="py-1 pr-3 font-medium">Revision</th>
              {/* On a phone the author goes under the revision number, so the row fits without scrolling. */}
              <th className="hidden py-1 pr-3 font-medium sm:table-cell">Author</th>
              <th className="py-1 pr-3 font-medium">Saved</th>
              <th className="py-1 pr-3 text-right font-medium">Shunt</th>
              <th className="py-1 pr-3 text-right font-medium">Gain</th>
              <th className="py-1 font-medium">Approval</th>
            </tr>
          </thead>
          <tbody>
            {shown.map((r) => (
              <tr key={r.revision} className="border-b border-line last:border-0">
                <td className="py-1 pr-3">
                  {r.revision}
                  <span className="block text-xs text-ink-muted sm:hidden">{r.authorName}</span>
                </td>
                <td className="hidden py-1 pr-3 sm:table-cell">{r.authorName}</td>
                <td className="py-1 pr-3 text-xs text-ink-muted">{formatWhen(r.createdAt)}</td>
                {r.kind === "plan" ? (
                  <>
                    {/* A plan: its shunts and gains, lowest range first, one range a line. */}
                    <td className="py-1 pr-3 text-right num" title={`A range plan of ${r.plan.ranges.length} ranges`}>
                      {r.plan.ranges.map((x, k) => (
                        <span key={k} className="block whitespace-nowrap">
                          {formatSI(x.shuntOhms, "Ω")}
                        </span>
                      ))}
                    </td>
                    <td className="py-1 pr-3 text-right num">
                      {r.plan.ranges.map((x, k) => (
                        <span key={k} className="block whitespace-nowrap">
                          {formatSI(x.gain, "")}
                        </span>
                      ))}
                    </td>
                  </>
                ) : (
                  <>
                    <td className="whitespace-nowrap py-1 pr-3 text-right num">{formatSI(r.choice.shuntOhms, "Ω")}</td>
                    <td className="whitespace-nowrap py-1 pr-3 text-right num">{formatSI(r.choice.gain, "")}</td>
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
        {newestFirst.length > RECENT && (
          <button
            type="button"
            onClick={() => setAll((v) => !v)}
            aria-expanded={all}
            className="mt-1 text-xs text-copper hover:underline"
          >
            {all ? `Show the ${RECENT} most recent only` : `Show all ${newestFirst.length} revisions`}
          </button>
        )}
      </div>
      {revisions.length > 1 ? (
        <div className="flex flex-col gap-2" data-testid="revision-diff">
          <div className="flex flex-wrap items-center gap-2 text-xs">
            <span className="font-medium text-ink-muted">What changed from</span>
            <RevisionSelect label="From revision" value={a} onChange={setA} revisions={revisions} />
            <span className="text-ink-muted">to</span>
            <RevisionSelect label="To revision" value={b} onChange={setB} revisions={revisions} />
          </div>
          {diff.isError && a !== b ? (
            <p className="text-xs text-bad" role="alert">
              The changes from revision {a} to {b} could not be read: {diff.error.message}
            </p>
          ) : diff.isFetching && !diff.isPlaceholderData && changes.length === 0 ? (
            <p className="text-xs text-ink-faint">Reading the changes…</p>
          ) : changes.length === 0 ? (
            <p className="text-xs text-ink-faint">
              {a === b ? "Pick two different revisions." : "Nothing differs between these revisions."}
            </p>
          ) : (
            <table className={`w-full text-left text-sm ${diff.isPlaceholderData ? "opacity-60" : ""}`}>
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
