"use client";

import Link from "next/link";
import { useState } from "react";
import { buttonClass } from "@/components/ui/button";
import type { DesignStatus } from "@/db/schema";

type Other = { id: string; name: string; project: string | null; status: DesignStatus };

/** "Compare with…": pick one to three other designs of the team and open them side by side. */
export function ComparePicker({ current, others }: { current: { id: string; name: string }; others: Other[] }) {
  const [picked, setPicked] = useState<string[]>([]);
  if (others.length === 0) return null;
  const toggle = (id: string) =>
    setPicked((p) => (p.includes(id) ? p.filter((x) => x !== id) : p.length < 3 ? [...p, id] : p));
  const href = `/compare?ids=${[current.id, ...picked].join(",")}`;
  return (
    <details className="rounded-panel border border-line bg-panel px-4 py-2 text-sm">
      <summary className="cursor-pointer text-xs font-medium text-ink-muted">
        Compare with… (up to three other designs)
      </summary>
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
