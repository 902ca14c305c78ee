// A design name not yet used in the team: "Pump monitor" → "Pump monitor (2)", then (3), …
/** The first "name (n)", n ≥ 2, not among `taken` (compared without case); at most 200 characters. */
export function freeName(name: string, taken: string[]): string {
  const used = new Set(taken.map((t) => t.toLowerCase()));
  for (let n = 2; ; n++) {
    const suffix = ` (${n})`;
    const candidate = `${name.slice(0, 200 - suffix.length)}${suffix}`;
    if (!used.has(candidate.toLowerCase())) return candidate;
  }
}
