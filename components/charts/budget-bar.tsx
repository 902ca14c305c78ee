// The error budget at one current as a single bar split by source, with the figures beside it.
import type { BudgetTerm } from "@/lib/design/error-budget";
import { formatPercent, formatSI } from "@/lib/design/format";
import { budgetBackground } from "./palette";

export function BudgetBar({ terms, currentA, label }: { terms: BudgetTerm[]; currentA: number; label: string }) {
  const total = terms.reduce((s, t) => s + Math.abs(t.errorA), 0);
  const shown = terms.map((t, i) => ({
    ...t,
    tone: budgetBackground(i),
    share: total > 0 ? Math.abs(t.errorA) / total : 0,
  }));
  return (
    <figure className="flex flex-col gap-2">
      <figcaption className="text-xs text-ink-muted">
        {label}: worst case {formatSI(total, "A")} at {formatSI(currentA, "A")} (
        {formatPercent(total / Math.abs(currentA))} of reading)
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
              className="border-r border-panel last:border-r-0"
              style={{ width: `${t.share * 100}%`, background: t.tone }}
              title={`${t.label}: ${formatSI(t.errorA, "A")}`}
            />
          ))}
      </div>
      <table className="w-full text-2xs">
        <tbody>
          {shown.map((t) => (
            <tr key={t.source} className="border-b border-line/60 last:border-0">
              <td className="py-0.5 pr-2">
                <span
                  className="mr-1.5 inline-block h-2.5 w-2.5 rounded-sm align-middle"
                  style={{ background: t.tone }}
                  aria-hidden
                />
                {t.label}
                {t.basis ? <span className="text-ink-muted"> ({t.basis})</span> : null}
                {t.removedA ? (
                  <span className="text-ink-faint"> (calibration took out {formatSI(t.removedA, "A")})</span>
                ) : null}
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
