// Axis ticks for the profile chart: round steps (1, 2, 5 × 10^n) on linear axes, decades on log axes.

export function linearTicks(min: number, max: number, count = 5): number[] {
  if (!(max > min) || !Number.isFinite(min) || !Number.isFinite(max)) return [min];
  const raw = (max - min) / count;
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * mag).find((s) => s >= raw) ?? 10 * mag;
  const out: number[] = [];
  for (let v = Math.ceil(min / step) * step; v <= max + step * 1e-9; v += step)
    out.push(Math.abs(v) < step * 1e-9 ? 0 : v);
  return out;
}

export function logTicks(min: number, max: number): number[] {
  if (!(min > 0) || !(max > min)) return [];
  const out: number[] = [];
  for (let e = Math.ceil(Math.log10(min) - 1e-9); e <= Math.floor(Math.log10(max) + 1e-9); e++) out.push(10 ** e);
  return out;
}

/** A battery capacity typed by the user ("220 mAh", "2.4 Ah", "800 C") in coulombs, or null. */
export function parseCapacityC(text: string): number | null {
  // Trimmed and capped first; one way to match, so linear time (issue 10, item 1).
  const trimmed = text.trim();
  if (trimmed.length > 64) return null;
  const m = /^([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:e[+-]?\d+)?) ?(uAh|µAh|mAh|Ah|kC|C|mC)?$/i.exec(
    trimmed.replace(/\s+/g, " "),
  );
  if (!m) return null;
  const value = Number(m[1]);
  const unit = (m[2] ?? "mAh").toLowerCase().replace("µ", "u");
  const scale: Record<string, number> = { uah: 3.6e-3, mah: 3.6, ah: 3600, c: 1, mc: 1e-3, kc: 1e3 };
  const c = value * (scale[unit] ?? Number.NaN);
  return Number.isFinite(c) && c > 0 ? c : null;
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
