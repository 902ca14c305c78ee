"use client";
// Every listed candidate: sortable, filterable (feasible, front, series, gain), SI figures;
// the selected row is the one the charts and the detail show.
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getPaginationRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from "@tanstack/react-table";
import { useMemo, useState } from "react";
import { SortableHead } from "@/components/candidates/sortable-head";
import { isInSeries, type SeriesName } from "@/lib/design/eseries";
import { rejectReasonLabels } from "@/lib/design/reject-reasons";
import type { Candidate } from "@/lib/design/types";
import { formatPercent, formatSI } from "@/lib/design/format";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { candidateKey } from "@/lib/wizard/candidate-key";

type View = "all" | "feasible" | "front";
const col = createColumnHelper<Candidate>();
const coarser: SeriesName[] = ["E24", "E12", "E6"];

export function CandidateTable({
  candidates,
  selected,
  recommended = null,
  onSelect,
  pinned,
  onTogglePin,
  transimpedanceFilter,
}: {
  candidates: Candidate[];
  selected: string | null;
  /** The top-ranked pair's key, marked in its row. */
  recommended?: string | null;
  onSelect: (key: string) => void;
  pinned: string[];
  onTogglePin: (key: string) => void;
  /** A decade scale factor (V/A) to keep, or null. */
  transimpedanceFilter: number | null;
}) {
  const [view, setView] = useState<View>(candidates.some((c) => c.feasible) ? "feasible" : "all");
  const [series, setSeries] = useState<"" | SeriesName>("");
  const [gain, setGain] = useState<string>("");
  const [sorting, setSorting] = useState<SortingState>([]);
  const gains = useMemo(() => [...new Set(candidates.map((c) => c.gain))].sort((a, b) => a - b), [candidates]);

  const rows = useMemo(
    () =>
      candidates.filter(
        (c) =>
          (view === "all" || (view === "feasible" ? c.feasible : c.pareto)) &&
          (!series || isInSeries(series, c.shuntOhms)) &&
          (!gain || c.gain === Number(gain)) &&
          (transimpedanceFilter === null ||
            Math.abs(c.transimpedanceVPerA - transimpedanceFilter) <= 1e-6 * transimpedanceFilter),
      ),
    [candidates, view, series, gain, transimpedanceFilter],
  );

  const columns = useMemo(
    () => [
      col.display({
        id: "pin",
        header: () => <span className="sr-only">Pin</span>,
        cell: ({ row }) => {
          const key = candidateKey(row.original);
          const on = pinned.includes(key);
          return (
            <input
              type="checkbox"
              checked={on}
              disabled={!on && pinned.length >= 3}
              onChange={() => onTogglePin(key)}
              onClick={(e) => e.stopPropagation()}
              aria-label={`Pin ${formatSI(row.original.shuntOhms, "Ω")} × ${row.original.gain} to the error chart`}
              title="Pin to the error chart (up to three)"
            />
          );
        },
      }),
      col.accessor("shuntOhms", { header: "Shunt", cell: (i) => formatSI(i.getValue(), "Ω") }),
      col.accessor("gain", { header: "Gain", cell: (i) => Number(i.getValue().toPrecision(4)) }),
      col.accessor("transimpedanceVPerA", { header: "R·G", cell: (i) => formatSI(i.getValue(), "V/A") }),
      col.accessor("burdenV", { header: "Burden", cell: (i) => formatSI(i.getValue(), "V") }),
      col.accessor("errorAtMinPercent", { header: "Error at Imin", cell: (i) => formatPercent(i.getValue() / 100) }),
      col.accessor("lsbA", { header: "Step", cell: (i) => formatSI(i.getValue(), "A") }),
      col.accessor("offsetErrorA", { header: "Offset", cell: (i) => formatSI(i.getValue(), "A") }),
      col.accessor("outputAtMaxV", { header: "Out at Imax", cell: (i) => formatSI(i.getValue(), "V") }),
      col.accessor("dissipationW", { header: "Dissipation", cell: (i) => formatSI(i.getValue(), "W") }),
      col.accessor("ratingW", { header: "Rating", cell: (i) => formatSI(i.getValue(), "W") }),
      col.accessor((c) => (c.pareto ? 0 : c.feasible ? 1 : 2 + c.reasons.length), {
        id: "status",
        header: "Status",
        cell: ({ row }) => {
          const c = row.original;
          if (recommended !== null && candidateKey(c) === recommended)
            return (
              <span className="inline-flex gap-1">
                <Badge tone="copper">front</Badge>
                <Badge tone="good">recommended</Badge>
              </span>
            );
          if (c.pareto) return <Badge tone="copper">front</Badge>;
          if (c.feasible) return <Badge tone="good">feasible</Badge>;
          return (
            <span title={c.reasons.map((r) => rejectReasonLabels[r]).join("; ")}>
              <Badge tone="bad">fails {c.reasons.length}</Badge>
            </span>
          );
        },
      }),
    ],
    [pinned, onTogglePin, recommended],
  );

  const table = useReactTable({
    data: rows,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getPaginationRowModel: getPaginationRowModel(),
    initialState: { pagination: { pageSize: 15 } },
    getRowId: (c) => candidateKey(c),
  });

  const selectCls = "rounded border border-line bg-panel px-1.5 py-1 text-xs";
  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-end gap-3 text-xs">
        <div className="flex flex-col gap-0.5">
          <label htmlFor="cand-view" className="text-ink-muted">
            Show
          </label>
          <select id="cand-view" className={selectCls} value={view} onChange={(e) => setView(e.target.value as View)}>
            <option value="all">Every listed candidate</option>
            <option value="feasible">Feasible only</option>
            <option value="front">Pareto front only</option>
          </select>
        </div>
        <div className="flex flex-col gap-0.5">
          <label htmlFor="cand-series" className="text-ink-muted">
            Shunt value also in
          </label>
          <select
            id="cand-series"
            className={selectCls}
            value={series}
            onChange={(e) => setSeries(e.target.value as "" | SeriesName)}
          >
            <option value="">Any series</option>
            {coarser.map((s) => (
              <option key={s} value={s}>
                {s} (easier to stock)
              </option>
            ))}
          </select>
        </div>
        <div className="flex flex-col gap-0.5">
          <label htmlFor="cand-gain" className="text-ink-muted">
            Gain
          </label>
          <select id="cand-gain" className={selectCls} value={gain} onChange={(e) => setGain(e.target.value)}>
            <option value="">Any gain</option>
            {gains.map((g) => (
              <option key={g} value={g}>
                {Number(g.toPrecision(4))}
              </option>
            ))}
          </select>
        </div>
        <span className="ml-auto text-ink-muted num" role="status">
          {rows.length} of {candidates.length} listed
        </span>
      </div>
      <div className="overflow-x-auto rounded border border-line">
        <table className="w-full text-xs" aria-label="Candidates">
          <SortableHead table={table} cellClass="px-2 py-1.5" />
          <tbody>
            {table.getRowModel().rows.map((row) => {
              const isSel = row.id === selected;
              return (
                <tr
                  key={row.id}
                  aria-selected={isSel}
                  onClick={() => onSelect(row.id)}
                  className={`cursor-pointer border-t border-line ${isSel ? "bg-copper-soft" : "hover:bg-sunken"}`}
                  data-testid="candidate-row"
                >
                  {row.getVisibleCells().map((cell, i) => (
                    <td key={cell.id} className="whitespace-nowrap px-2 py-1 num">
                      {i === 1 ? (
                        <button
                          type="button"
                          className="font-medium text-ink underline-offset-2 hover:underline"
                          onClick={(e) => (e.stopPropagation(), onSelect(row.id))}
                          aria-pressed={isSel}
                        >
                          {flexRender(cell.column.columnDef.cell, cell.getContext())}
                        </button>
                      ) : (
                        flexRender(cell.column.columnDef.cell, cell.getContext())
                      )}
                    </td>
                  ))}
                </tr>
              );
            })}
            {rows.length === 0 && (
              <tr>
                <td colSpan={columns.length} className="px-2 py-4 text-center text-ink-muted">
                  No candidate matches these filters.
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
      {table.getPageCount() > 1 && (
        <div className="flex items-center justify-end gap-2 text-xs">
          <Button variant="ghost" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
            Previous
          </Button>
          <span className="num text-ink-muted">
            page {table.getState().pagination.pageIndex + 1} of {table.getPageCount()}
          </span>
          <Button variant="ghost" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
            Next page
          </Button>
        </div>
      )}
    </div>
  );
}
