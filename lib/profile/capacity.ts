// A battery capacity typed beside a profile summary, and the battery life it gives, in words.
import { parseQuantity } from "@/lib/design/units";

/**
 * A battery capacity typed by the user ("220 mAh", "2.4 Ah", "800 C") in coulombs, or null. The
 * engine's quantity parser reads it (mathjs knows A·h); a bare number is taken in mAh, the unit
 * batteries are labelled in.
 */
export function parseCapacityC(text: string): number | null {
  const bare = /^\s*[+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?\s*$/i.test(text);
  const r = parseQuantity(bare ? `${text.trim()} mAh` : text, "charge");
  return r.ok && Number.isFinite(r.value) && r.value > 0 ? r.value : null;
}

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
