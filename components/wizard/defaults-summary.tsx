"use client";
// Before saving: the span and supply, then every value set differently from the documented
// defaults, step by step — including steps never opened — so nothing hidden travels into a design.
import { formatSI } from "@/lib/design/format";
import type { Requirement } from "@/lib/design/requirement";
import type { StepDifferences } from "@/lib/wizard/from-defaults";

/**
 * `groups`: differencesFromDefaults(requirement), worked out after the sweep in the solver worker;
 * null for the moment until it arrives.
 */
export function DefaultsSummary({
  requirement,
  groups,
}: {
  requirement: Requirement;
  groups: StepDifferences[] | null;
}) {
  const count = groups?.reduce((n, g) => n + g.changes.length, 0) ?? 0;
  return (
    <div className="flex flex-col gap-2 text-xs" data-testid="defaults-summary">
      <p className="num">
        <span className="font-medium">What you are saving: </span>
        {formatSI(requirement.current.min, "A")} to {formatSI(requirement.current.max, "A")} from a{" "}
        {formatSI(requirement.supply.voltage, "V")} supply;{" "}
        {groups === null
          ? "comparing the other values with the documented defaults…"
          : count === 0
            ? "every other value is the documented default."
            : `${count} value${count === 1 ? "" : "s"} differ${count === 1 ? "s" : ""} from the documented defaults:`}
      </p>
      {groups?.map((g) => (
        <div key={g.step}>
          <h3 className="font-semibold text-ink-muted">{g.step}</h3>
          <ul className="flex flex-col">
            {g.changes.map((c) => (
              <li key={c.path} className="flex flex-wrap gap-x-2 border-b border-line/60 py-0.5">
                <span className="min-w-0 flex-1">{c.label}</span>
                <span className="num font-medium break-all">{c.bText}</span>
                <span className="num text-ink-faint">(default {c.aText})</span>
              </li>
            ))}
          </ul>
        </div>
      ))}
    </div>
  );
}
