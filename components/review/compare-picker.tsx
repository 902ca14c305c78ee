"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { buttonClass } from "@/components/ui/button";
import type { ApiError, DesignsPage } from "@/lib/api-description/responses";

/** The team's most recently changed designs the picker offers; the list page reaches the rest. */
const OFFERED = 50;

async function recentDesigns(): Promise<DesignsPage["designs"]> {
  const res = await fetch(`/api/designs?limit=${OFFERED + 1}`);
  const data = (await res.json().catch(() => ({}))) as Partial<DesignsPage & ApiError>;
  if (!res.ok || !data.designs) throw new Error(data.message ?? `The server answered ${res.status}.`);
  return data.designs;
}

/**
 * "Compare with…": pick one to three other designs of the team and open them side by side. The
 * designs are read when the picker is first opened, not with the page: most visits never open it.
 */
export function ComparePicker({ current }: { current: { id: string; name: string } }) {
  const [picked, setPicked] = useState<string[]>([]);
  const [opened, setOpened] = useState(false);
  const list = useQuery({ queryKey: ["compare-picker"], queryFn: recentDesigns, enabled: opened, retry: false });
  const others = (list.data ?? []).filter((d) => d.id !== current.id).slice(0, OFFERED);
  const toggle = (id: string) =>
    setPicked((p) => (p.includes(id) ? p.filter((x) => x !== id) : p.length < 3 ? [...p, id] : p));
  const href = `/compare?ids=${[current.id, ...picked].join(",")}`;
  return (
    <details
      className="rounded-panel border border-line bg-panel px-4 py-2 text-sm"
      onToggle={(e) => e.currentTarget.open && setOpened(true)}
    >
      <summary className="cursor-pointer text-xs font-medium text-ink-muted">
        Compare with… (up to three other designs)
      </summary>
      {list.isError ? (
        <p className="mt-2 text-xs text-bad" role="alert">
          The team&apos;s designs could not be read: {list.error.message}
        </p>
      ) : !list.data ? (
        <p className="mt-2 text-xs text-ink-faint">Reading the team&apos;s designs…</p>
      ) : others.length === 0 ? (
        <p className="mt-2 text-xs text-ink-faint">There are no other designs to compare with yet.</p>
      ) : null}
      {/* min-w-0: a fieldset is otherwise as wide as its longest unbreakable name. */}
      <fieldset className="mt-2 flex min-w-0 flex-col gap-1">
        <legend className="sr-only">Designs to compare with {current.name}</legend>
        {others.map((o) => (
          // On a phone a long name wraps under its box instead of pushing the page sideways.
          <label key={o.id} className="flex min-w-0 flex-wrap items-center gap-x-2">
            <input
              type="checkbox"
              checked={picked.includes(o.id)}
              onChange={() => toggle(o.id)}
              disabled={!picked.includes(o.id) && picked.length >= 3}
            />
            <span className="min-w-0 [overflow-wrap:anywhere]">{o.name}</span>
            <span className="text-xs text-ink-faint">
              {o.project ?? "no project"} · {o.status}
            </span>
          </label>
        ))}
      </fieldset>
      <div className="mt-2">
        {picked.length > 0 ? (
          <Link href={href} className={buttonClass("primary", "text-xs")}>
            Compare {picked.length + 1} designs
          </Link>
        ) : (
          <span className="text-xs text-ink-faint">Tick at least one design.</span>
        )}
      </div>
    </details>
  );
}
