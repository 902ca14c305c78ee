// The error budget at one current as a single bar split by source, with the figures beside it.
import { formatPercent, formatSI, type BudgetSource, type BudgetTerm } from "@/lib/design";

/** One tone per source, by kind: gain-type in copper, offset-type in teal, common mode in red, readout and noise apart. */
const tones: Record<BudgetSource, string> = {
  gainError: "bg-copper",
  gainSetResistors: "bg-copper-strong",
  shuntTolerance: "bg-copper/60",
  shuntTempco: "bg-copper/35",
  gainDrift: "bg-warn/60",
  offset: "bg-signal",
  offsetDrift: "bg-signal/60",
  biasCurrent: "bg-signal/35",
  commonMode: "bg-bad/70",
  readout: "bg-good",
  noise: "bg-ink-faint",
};

export function BudgetBar({ terms, currentA, label }: { terms: BudgetTerm[]; currentA: number; label: string }) {
  const total = terms.reduce((s, t) => s + Math.abs(t.errorA), 0);
  const shown = terms.map((t) => ({
    ...t,
    tone: tones[t.source],
    share: total > 0 ? Math.abs(t.errorA) / total : 0,
  }));
  return (
    <figure className="flex flex-col gap-2">
      <figcaption className="text-xs text-ink-muted">
        {label}: worst case {formatSI(total, "A")} at {formatSI(currentA, "A")} ({formatPercent(total / currentA)} of
        reading)
      </figcaption>
      <div
        className="flex h-4 w-full overflow-hidden rounded border border-line"
        role="img"
        aria-label={`Error budget at ${formatSI(currentA, "A")}`}
      >
        {shown
          .filter((t) => t.share > 0)
          .map((t) => (
            <div
              key={t.source}
              className={t.tone}
              style={{ width: `${t.share * 100}%` }}
              title={`${t.label}: ${formatSI(t.errorA, "A")}`}
            />
          ))}
      </div>
      <table className="w-full text-2xs">
        <tbody>
          {shown.map((t) => (
            <tr key={t.source} className="border-b border-line/60 last:border-0">
              <td className="py-0.5 pr-2">
                <span className={`mr-1.5 inline-block h-2 w-2 rounded-sm align-middle ${t.tone}`} aria-hidden />
                {t.label}
              </td>
              <td className="whitespace-nowrap py-0.5 pr-2 text-right">{formatSI(t.errorA, "A")}</td>
              <td className="whitespace-nowrap py-0.5 text-right text-ink-muted">{formatPercent(t.share)} of budget</td>
            </tr>
          ))}
        </tbody>
      </table>
    </figure>
  );
}
