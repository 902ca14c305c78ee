"use client";
// The team's designs, paged by the server (GET /api/designs: newest change first, keyset cursor),
// searched by name or project and filtered by status through the API with TanStack Query. The URL
// holds the search, the filter and the page, so a reload or a shared link shows the same page.
// Designs picked to compare stay picked across pages. On a phone only the priority columns show.
import { keepPreviousData, useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useCallback, useEffect, useMemo, useState } from "react";
import { StatusBadge } from "@/components/review/status-badge";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { formatSI } from "@/lib/design/format";
import type { ApiError } from "@/lib/api-description/responses";
import {
  designStatuses,
  listSearch,
  readListParams,
  type DesignRow,
  type DesignsPage,
  type ListParams,
} from "./list-params";

const PAGE_SIZE = 50;
const SEARCH_DELAY_MS = 300;

// Where each page was reached from, so "Previous page" can go back by cursor; lost on reload,
// when "First page" remains.
const reachedFrom = new Map<string, { cursor: string; page: number }>();

async function fetchPage(params: ListParams): Promise<DesignsPage> {
  const res = await fetch(`/api/designs${listSearch(params, { limit: String(PAGE_SIZE) })}`);
  const body = (await res.json().catch(() => null)) as (DesignsPage & Partial<ApiError>) | null;
  if (!res.ok || !body) throw new Error(body?.message ?? `The designs could not be loaded (HTTP ${res.status}).`);
  return body;
}

const sameParams = (a: ListParams, b: ListParams) => a.q === b.q && a.status === b.status && a.cursor === b.cursor;
const day = (iso: string) => iso.slice(0, 10);
const time = (iso: string) => iso.slice(11, 16);

export function DesignsTable({ initial, initialParams }: { initial: DesignsPage; initialParams: ListParams }) {
  const router = useRouter();
  const pathname = usePathname();
  const searchParams = useSearchParams();
  const params = useMemo(() => readListParams(searchParams), [searchParams]);
  const [text, setText] = useState(params.q);
  const [picked, setPicked] = useState<{ id: string; name: string }[]>([]);

  // The URL is the list's state: writing it with the History API keeps Next's router in step
  // without asking the server to render the page again.
  const go = useCallback(
    (next: ListParams, mode: "push" | "replace" = "push") => {
      const url = `${pathname}${listSearch(next)}`;
      if (mode === "push") window.history.pushState(null, "", url);
      else window.history.replaceState(null, "", url);
    },
    [pathname],
  );

  // Typing searches after a short pause, from the first page; the URL follows.
  useEffect(() => {
    const q = text.trim();
    if (q === params.q) return;
    const timer = setTimeout(() => go({ ...params, q, cursor: "" }, "replace"), SEARCH_DELAY_MS);
    return () => clearTimeout(timer);
  }, [text, params, go]);
  // Back and forward move the URL under the field: show what the URL searches for.
  const [shownQ, setShownQ] = useState(params.q);
  if (shownQ !== params.q) {
    setShownQ(params.q);
    if (text.trim() !== params.q) setText(params.q);
  }

  const list = useQuery({
    queryKey: ["designs", params.q, params.status, params.cursor],
    queryFn: () => fetchPage(params),
    placeholderData: keepPreviousData,
    initialData: sameParams(params, initialParams) ? initial : undefined,
  });
  const rows = list.data?.designs ?? [];
  const from = params.cursor ? reachedFrom.get(params.cursor) : undefined;
  const pageNumber = params.cursor ? (from ? from.page + 1 : null) : 1;

  const nextPage = () => {
    const cursor = list.data?.nextCursor;
    if (!cursor) return;
    reachedFrom.set(cursor, { cursor: params.cursor, page: pageNumber ?? 0 });
    go({ ...params, cursor });
  };
  const previousPage = () => go({ ...params, cursor: from?.cursor ?? "" });

  const toggle = (row: DesignRow) =>
    setPicked((p) =>
      p.some((x) => x.id === row.id)
        ? p.filter((x) => x.id !== row.id)
        : p.length < 4
          ? [...p, { id: row.id, name: row.name }]
          : p,
    );
  const compareOk = picked.length >= 2 && picked.length <= 4;
  const filtered = Boolean(params.q || params.status);

  return (
    <div className="flex min-w-0 flex-col gap-3">
      <div className="flex flex-wrap items-end gap-3 text-xs">
        <div className="flex min-w-0 flex-col gap-0.5">
          <label htmlFor="designs-search" className="text-ink-muted">
            Search designs
          </label>
          <input
            id="designs-search"
            type="search"
            value={text}
            maxLength={200}
            onChange={(e) => setText(e.target.value)}
            placeholder="Name or project"
            className="w-56 max-w-full rounded border border-line bg-panel px-2 py-1.5 text-sm sm:w-64"
          />
        </div>
        <div className="flex flex-col gap-0.5">
          <label htmlFor="designs-status" className="text-ink-muted">
            Status
          </label>
          <select
            id="designs-status"
            value={params.status}
            onChange={(e) => go({ ...params, status: e.target.value as ListParams["status"], cursor: "" }, "replace")}
            className="rounded border border-line bg-panel px-2 py-1.5 text-sm"
          >
            <option value="">Any status</option>
            {designStatuses.map((s) => (
              <option key={s} value={s}>
                {s}
              </option>
            ))}
          </select>
        </div>
        <div className="flex flex-wrap items-center gap-2 sm:ml-auto">
          <span className="text-ink-muted num" role="status">
            {picked.length === 0 ? "Tick 2 to 4 designs to compare them" : `${picked.length} picked`}
          </span>
          <Button
            variant="secondary"
            disabled={!compareOk}
            onClick={() => router.push(`/compare?ids=${picked.map((p) => p.id).join(",")}`)}
          >
            Compare
          </Button>
        </div>
      </div>

      <div
        className="overflow-x-auto rounded-panel border border-line bg-panel"
        aria-busy={list.isFetching}
        data-testid="designs-list"
      >
        <table className="w-full text-sm" aria-label="Designs">
          <thead className="text-left text-xs text-ink-muted">
            <tr>
              <th scope="col" className="w-8 px-2 sm:px-3 py-2">
                <span className="sr-only">Pick to compare</span>
              </th>
              <th scope="col" className="px-2 sm:px-3 py-2 font-medium">
                Name
              </th>
              <th scope="col" className="hidden px-2 sm:px-3 py-2 font-medium md:table-cell">
                Project
              </th>
              <th scope="col" className="px-2 sm:px-3 py-2 font-medium">
                Status
              </th>
              <th scope="col" className="hidden px-2 sm:px-3 py-2 font-medium lg:table-cell">
                Revision
              </th>
              <th scope="col" className="hidden px-2 sm:px-3 py-2 font-medium md:table-cell">
                Choice
              </th>
              <th scope="col" className="hidden px-2 sm:px-3 py-2 font-medium lg:table-cell">
                Author
              </th>
              <th scope="col" className="px-2 sm:px-3 py-2 font-medium" aria-sort="descending">
                Updated (UTC)
              </th>
            </tr>
          </thead>
          <tbody className={list.isPlaceholderData ? "opacity-60" : undefined}>
            {rows.map((d) => {
              const on = picked.some((p) => p.id === d.id);
              return (
                <tr key={d.id} className="border-t border-line align-top hover:bg-sunken/50">
                  <td className="px-2 sm:px-3 py-1.5">
                    <input
                      type="checkbox"
                      checked={on}
                      disabled={!on && picked.length >= 4}
                      onChange={() => toggle(d)}
                      aria-label={`Pick ${d.name} to compare`}
                    />
                  </td>
                  {/* A long unbroken name wraps anywhere rather than push the other columns out. */}
                  <td className="min-w-[8rem] max-w-md px-2 sm:px-3 py-1.5 [overflow-wrap:anywhere]">
                    <Link href={`/designs/${d.id}`} className="font-medium text-ink underline-offset-2 hover:underline">
                      {d.name}
                    </Link>
                    {d.planRanges ? (
                      <span className="ml-1.5" data-testid="range-plan-badge">
                        <Badge tone="signal">range plan · {d.planRanges} ranges</Badge>
                      </span>
                    ) : null}
                    <span className="block text-xs text-ink-muted md:hidden">{d.project ?? "no project"}</span>
                  </td>
                  <td className="hidden max-w-xs px-2 sm:px-3 py-1.5 [overflow-wrap:anywhere] md:table-cell">
                    {d.project || <span className="text-ink-faint">—</span>}
                  </td>
                  <td className="whitespace-nowrap px-2 sm:px-3 py-1.5">
                    <StatusBadge status={d.status} />
                    {d.failsCurrentModel && (
                      <span
                        className="mt-0.5 block"
                        data-testid="fails-current-model"
                        title="Its saved figures fail under the current model: open it to see what fails before building it."
                      >
                        <Badge tone="bad">fails today</Badge>
                      </span>
                    )}
                  </td>
                  <td className="hidden whitespace-nowrap px-2 sm:px-3 py-1.5 num lg:table-cell">{d.revision}</td>
                  <td className="hidden whitespace-nowrap px-2 sm:px-3 py-1.5 num md:table-cell">
                    {d.shuntOhms !== null && d.gain !== null
                      ? `${formatSI(d.shuntOhms, "Ω")} × ${Number(d.gain.toPrecision(4))}`
                      : d.planRanges
                        ? `${d.planRanges} ranges`
                        : "—"}
                  </td>
                  <td className="hidden whitespace-nowrap px-2 sm:px-3 py-1.5 lg:table-cell">{d.authorName}</td>
                  <td className="whitespace-nowrap px-2 sm:px-3 py-1.5 num">
                    {day(d.updatedAt)}
                    <span className="hidden sm:inline"> {time(d.updatedAt)}</span>
                  </td>
                </tr>
              );
            })}
            {rows.length === 0 && !list.isPending && !list.isError && (
              <tr>
                <td colSpan={8} className="px-2 sm:px-3 py-6 text-center text-ink-muted">
                  {filtered ? "No design matches the search and filter." : "No designs on this page."}
                </td>
              </tr>
            )}
            {list.isPending && (
              <tr>
                <td colSpan={8} className="px-2 sm:px-3 py-6 text-center text-ink-muted">
                  Loading designs…
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>

      {list.isError && (
        <p role="alert" className="text-sm text-bad">
          {list.error.message}{" "}
          <button type="button" className="underline" onClick={() => go({ ...params, cursor: "" }, "replace")}>
            Start again from the first page
          </button>
        </p>
      )}

      <nav className="flex flex-wrap items-center justify-between gap-2 text-xs" aria-label="Pages of designs">
        <span className="text-ink-muted num" data-testid="designs-page">
          {pageNumber ? `Page ${pageNumber}` : "A later page"} · newest change first · {rows.length}{" "}
          {rows.length === 1 ? "design" : "designs"}
          {list.isFetching ? " · loading…" : ""}
        </span>
        <div className="flex items-center gap-2">
          {params.cursor && (
            <Button variant="secondary" onClick={previousPage}>
              {from ? "Previous page" : "First page"}
            </Button>
          )}
          <Button variant="secondary" disabled={!list.data?.nextCursor || list.isFetching} onClick={nextPage}>
            Next page
          </Button>
        </div>
      </nav>
    </div>
  );
}
