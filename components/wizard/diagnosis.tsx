"use client";
// When nothing is feasible: the engine's diagnosis in words — the changes that would work (one
// click puts a change into the form), what fails most, and the pairs that come closest.
import { useFormContext } from "react-hook-form";
import { formatPercent, formatSI } from "@/lib/design/format";
import { rejectReasonLabels, rejectReasons } from "@/lib/design/candidate";
import type { Diagnosis, RelaxSuggestion } from "@/lib/design/diagnosis";
import { formValueFor, type WizardValues } from "@/lib/wizard/form-values";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";

/** Constraint names short enough for a line per pair. */
const shortNames: Record<(typeof rejectReasons)[number], string> = {
  drop: "drop",
  commonMode: "common mode",
  output: "output",
  counts: "counts at the minimum",
  power: "power",
  bandwidth: "bandwidth",
  accuracy: "accuracy",
  deadZone: "dead zone",
};

export function DiagnosisView({ diagnosis, evaluated }: { diagnosis: Diagnosis; evaluated: number }) {
  const { setValue } = useFormContext<WizardValues>();
  const apply = (s: RelaxSuggestion) =>
    setValue(s.field as never, formValueFor(s) as never, {
      shouldDirty: true,
      shouldTouch: true,
      shouldValidate: true,
    });
  const failing = rejectReasons
    .map((r) => ({ r, n: diagnosis.failing[r] }))
    .filter((x) => x.n > 0)
    .sort((a, b) => b.n - a.n);
  return (
    <div className="flex flex-col gap-3 text-xs" data-testid="diagnosis">
      {diagnosis.relax.length > 0 ? (
        <div className="flex flex-col gap-1.5">
          <p className="font-medium text-ink">One change that would work:</p>
          <ul className="flex flex-col gap-1.5">
            {diagnosis.relax.map((s, i) => (
              <li key={`${s.field}-${s.gives}`} className="flex items-center justify-between gap-2">
                <span className="min-w-0">
                  {i > 0 && <span className="text-ink-muted">or </span>}
                  {s.says}
                  {s.gives === "rangePlan" && (
                    <span className="ml-1.5 whitespace-nowrap" data-testid="relax-plan">
                      <Badge tone="signal">range plan</Badge>
                    </span>
                  )}
                </span>
                <Button className="shrink-0" onClick={() => apply(s)} aria-label={`Apply: ${s.says}`}>
                  Apply
                </Button>
              </li>
            ))}
          </ul>
          <p className="text-2xs text-ink-faint">
            Each was checked by solving again with that one change; the counts are what it gives. A change marked
            &ldquo;range plan&rdquo; makes no single shunt and gain work, but lets the span be split into switched
            ranges.
          </p>
        </div>
      ) : (
        <p className="text-ink">
          No single change to the accuracy target or band, the allowed drop, the minimum current, the counts wanted, the
          ADC&apos;s bits, an output filter or the shunt&apos;s tolerance or tempco makes a pair feasible or a range
          plan possible on its own. Change several at once, or look at what fails below.
        </p>
      )}
      {diagnosis.rangePlan && <p className="text-ink-muted">{diagnosis.rangePlan}</p>}
      <div>
        <p className="mb-1 font-medium text-ink">What fails (every failure of every pair counted)</p>
        <ul className="flex flex-col gap-0.5">
          {failing.map(({ r, n }) => (
            <li key={r} className="flex justify-between gap-2">
              <span>{rejectReasonLabels[r]}</span>
              <span className="num shrink-0 whitespace-nowrap text-ink-muted">
                {n.toLocaleString("en")} of {evaluated.toLocaleString("en")}
              </span>
            </li>
          ))}
        </ul>
      </div>
      {diagnosis.closest.length > 0 && (
        <div>
          <p className="mb-1 font-medium text-ink">Closest pairs</p>
          <ul className="flex flex-col gap-0.5">
            {diagnosis.closest.slice(0, 3).map((c) => (
              <li key={`${c.shuntOhms}-${c.gain}`} className="num">
                {formatSI(c.shuntOhms, "Ω")} × {Number(c.gain.toPrecision(4))}:{" "}
                <span className="text-ink-muted">
                  misses{" "}
                  {Object.entries(c.violations)
                    .map(([r, v]) => `${shortNames[r as keyof typeof shortNames]} by ${formatPercent(v, 2)}`)
                    .join("; ")}
                </span>
              </li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}
