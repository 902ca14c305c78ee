// A duration in words for the profile summary (its length, a battery's life).

/** A duration in the largest sensible unit: "3.2 h", "41 days", "2.3 years". */
export function formatDuration(seconds: number): string {
  if (!Number.isFinite(seconds) || seconds < 0) return "—";
  const fmt = (v: number) => String(Number(v.toPrecision(3)));
  if (seconds < 120) return `${fmt(seconds)} s`;
  if (seconds < 2 * 3600) return `${fmt(seconds / 60)} min`;
  if (seconds < 72 * 3600) return `${fmt(seconds / 3600)} h`;
  if (seconds < 730 * 86400) return `${fmt(seconds / 86400)} days`;
  return `${fmt(seconds / (365.25 * 86400))} years`;
}
