// A TanStack table's header row with sort buttons and aria-sort, shared by the app's tables.
import { flexRender, type Table } from "@tanstack/react-table";

export function SortableHead<T>({ table, cellClass = "px-2 py-1.5" }: { table: Table<T>; cellClass?: string }) {
  return (
    <thead className="bg-sunken text-left text-2xs tracking-wide text-ink-muted">
      {table.getHeaderGroups().map((hg) => (
        <tr key={hg.id}>
          {hg.headers.map((h) => {
            const sorted = h.column.getIsSorted();
            return (
              <th
                key={h.id}
                className={`whitespace-nowrap font-medium ${cellClass}`}
                aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}
              >
                {h.column.getCanSort() ? (
                  <button
                    type="button"
                    className="inline-flex items-center gap-0.5 hover:text-ink"
                    onClick={h.column.getToggleSortingHandler()}
                  >
                    {flexRender(h.column.columnDef.header, h.getContext())}
                    <span aria-hidden className="text-ink-faint">
                      {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}
                    </span>
                  </button>
                ) : (
                  flexRender(h.column.columnDef.header, h.getContext())
                )}
              </th>
            );
          })}
        </tr>
      ))}
    </thead>
  );
}
