"use client";
// The solve status while a sweep runs: "Solving…" at once, and for a sweep past SLOW_MS (the
// largest reach 2,000,000 pairs) the time it has taken so far, ticking, and that an edit stops it.
import { useEffect, useState } from "react";
import { formatSI } from "@/lib/design/format";
import type { Sweeping } from "@/lib/wizard/use-solver";

export function SweepProgress({ sweeping }: { sweeping: Sweeping }) {
  const [now, setNow] = useState(() => performance.now());
  useEffect(() => {
    if (!sweeping) return;
    const t = setInterval(() => setNow(performance.now()), 100);
    return () => clearInterval(t);
  }, [sweeping]);
  const spinner = (
    <span
      className="inline-block h-2.5 w-2.5 animate-spin rounded-full border-2 border-copper border-t-transparent"
      aria-hidden
    />
  );
  if (!sweeping)
    return (
      <span className="inline-flex items-center gap-1.5">
        {spinner}
        Solving…
      </span>
    );
  const seconds = Math.max(0, now - sweeping.since) / 1000;
  return (
    <span className="inline-flex flex-wrap items-center gap-1.5" data-testid="sweep-progress">
      {spinner}
      Solving… a large sweep, {formatSI(seconds, "s", 2)} so far; the page stays usable, and a new edit replaces it.
    </span>
  );
}
