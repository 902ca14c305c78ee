"use client";

// "Fill from the team library": the select both parts steps put above their fields.
import { useQuery } from "@tanstack/react-query";
import type { ReactNode } from "react";
import { fetchLibrary } from "@/lib/wizard/library";

export function useLibrary() {
  return useQuery({ queryKey: ["library"], queryFn: fetchLibrary, staleTime: 60_000, retry: false });
}

export function LibraryPicker<T extends { id: string; name: string }>({
  id,
  rows,
  value,
  onPick,
  loading,
  emptyText,
  noneText,
  optionLabel = (r) => r.name,
  note,
}: {
  id: string;
  rows: T[];
  value: string;
  onPick: (row: T | undefined) => void;
  loading: boolean;
  emptyText: string;
  noneText: string;
  optionLabel?: (row: T) => string;
  note?: ReactNode;
}) {
  return (
    <div className="col-span-2 flex flex-col gap-1">
      <label htmlFor={id} className="text-xs font-medium text-ink-muted">
        Fill from the team library
      </label>
      <select
        id={id}
        className="w-full rounded border border-line bg-panel px-2 py-1.5 text-sm"
        value={value}
        onChange={(e) => onPick(rows.find((r) => r.id === e.target.value))}
        disabled={rows.length === 0}
      >
        <option value="">{loading ? "Loading the library…" : rows.length ? noneText : emptyText}</option>
        {rows.map((r) => (
          <option key={r.id} value={r.id}>
            {optionLabel(r)}
          </option>
        ))}
      </select>
      {note}
    </div>
  );
}
