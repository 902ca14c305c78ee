"use client";
// The team's designs: search, status filter, sortable columns, and picking 2–4 to compare.
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from "@tanstack/react-table";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { SortableHead } from "@/components/candidates/sortable-head";
import { formatSI } from "@/lib/design/format";
import { StatusBadge } from "@/components/review/status-badge";
import { Button } from "@/components/ui/button";

export type DesignRow = {
  id: string;
  name: string;
  project: string | null;
  status: "draft" | "in-review" | "approved" | "returned";
  revision: number;
  updatedAt: string;
  authorName: string;
  shuntOhms?: number;
  gain?: number;
};

const statuses: DesignRow["status"][] = ["draft", "in-review", "approved", "returned"];
const col = createColumnHelper<DesignRow>();
const when = (iso: string) => new Date(iso).toISOString().slice(0, 16).replace("T", " ");

export function DesignsTable({ designs }: { designs: DesignRow[] }) {
  const router = useRouter();
  const [search, setSearch] = useState("");
  const [status, setStatus] = useState<"" | DesignRow["status"]>("");
  const [sorting, setSorting] = useState<SortingState>([{ id: "updatedAt", desc: true }]);
  const [picked, setPicked] = useState<string[]>([]);

  const rows = useMemo(() => {
    const q = search.trim().toLowerCase();
    return designs.filter(
      (d) =>
        (!status || d.status === status) &&
        (!q || [d.name, d.project ?? "", d.authorName].some((s) => s.toLowerCase().includes(q))),
    );
  }, [designs, search, status]);

  const columns = useMemo(
    () => [
      col.display({
        id: "pick",
        header: () => <span className="sr-only">Pick to compare</span>,
        cell: ({ row }) => {
          const on = picked.includes(row.original.id);
          return (
            <input
              type="checkbox"
              checked={on}
              disabled={!on && picked.length >= 4}
              onChange={() =>
                setPicked(on ? picked.filter((x) => x !== row.original.id) : [...picked, row.original.id])
              }
              aria-label={`Pick ${row.original.name} to compare`}
            />
          );
        },
      }),
      col.accessor("name", {
        header: "Name",
        cell: ({ row }) => (
          <Link
            href={`/designs/${row.original.id}`}
            className="font-medium text-ink underline-offset-2 hover:underline"
          >
            {row.original.name}
          </Link>
        ),
      }),
      col.accessor((d) => d.project ?? "", {
        id: "project",
        header: "Project",
        cell: (i) => i.getValue() || <span className="text-ink-faint">—</span>,
      }),
      col.accessor("status", { header: "Status", cell: (i) => <StatusBadge status={i.getValue()} /> }),
      col.accessor("revision", { header: "Revision" }),
      col.accessor((d) => d.shuntOhms ?? 0, {
        id: "choice",
        header: "Choice",
        cell: ({ row }) =>
          row.original.shuntOhms !== undefined && row.original.gain !== undefined
            ? `${formatSI(row.original.shuntOhms, "Ω")} × ${Number(row.original.gain.toPrecision(4))}`
            : "—",
      }),
      col.accessor("authorName", { header: "Author" }),
      col.accessor("updatedAt", { header: "Updated (UTC)", cell: (i) => when(i.getValue()) }),
    ],
    [picked],
  );

  const table = useReactTable({
    data: rows,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getRowId: (d) => d.id,
  });

  const compareOk = picked.length >= 2 && picked.length <= 4;
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-3 text-xs">
        <div className="flex flex-col gap-0.5">
          <label htmlFor="designs-search" className="text-ink-muted">
            Search designs
          </label>
          <input
            id="designs-search"
            type="search"
            value={search}
            onChange={(e) => setSearch(e.target.value)}
            placeholder="Name, project or author"
            className="w-64 rounded border border-line bg-panel px-2 py-1.5 text-sm"
          />
        </div>
        <div className="flex flex-col gap-0.5">
          <label htmlFor="designs-status" className="text-ink-muted">
            Status
          </label>
          <select
            id="designs-status"
            value={status}
            onChange={(e) => setStatus(e.target.value as typeof status)}
            className="rounded border border-line bg-panel px-2 py-1.5 text-sm"
          >
            <option value="">Any status</option>
            {statuses.map((s) => (
              <option key={s} value={s}>
                {s}
              </option>
            ))}
          </select>
        </div>
        <div className="ml-auto flex items-center gap-2">
          <span className="text-ink-muted num" role="status">
            {picked.length === 0 ? "Tick 2 to 4 designs to compare them" : `${picked.length} picked`}
          </span>
          <Button
            variant="secondary"
            disabled={!compareOk}
            onClick={() => router.push(`/compare?ids=${picked.join(",")}`)}
          >
            Compare
          </Button>
        </div>
      </div>
      <div className="overflow-x-auto rounded-panel border border-line bg-panel">
        <table className="w-full text-sm" aria-label="Designs">
          <SortableHead table={table} cellClass="px-3 py-2" />
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="border-t border-line hover:bg-sunken/50">
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="whitespace-nowrap px-3 py-1.5 num">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
            {rows.length === 0 && (
              <tr>
                <td colSpan={columns.length} className="px-3 py-6 text-center text-ink-muted">
                  {designs.length === 0 ? "No designs yet." : "No design matches the search and filter."}
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
    </div>
  );
}
