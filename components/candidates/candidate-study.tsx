"use client";
// One candidate examined across the span: error against current (with pinned comparisons),
// what it does to the load, every figure, the error budget and the cautions.
import { useMemo, useState } from "react";
import { evaluateCandidate } from "@/lib/design/candidate";
import { errorAt, errorCurve, loadCurve } from "@/lib/design/error-budget";
import type { Requirement } from "@/lib/design/requirement";
import type { CandidateDetail, Choice } from "@/lib/design/types";
import { formatSI } from "@/lib/design/format";
import { BudgetBar } from "@/components/charts/budget-bar";
import { type ErrorSeries } from "@/components/charts/error-curve-chart";
import { SpanErrorChart } from "@/components/charts/signed-error-chart";
import { LoadChart } from "@/components/charts/load-chart";
import { Panel } from "@/components/ui/panel";
import { candidateKey } from "@/lib/wizard/candidate-key";
import { designCautions } from "@/lib/design/cautions";
import { Cautions } from "./cautions";
import { Figures } from "./figures";

const label = (c: Choice) => `${formatSI(c.shuntOhms, "Ω")} × ${Number(c.gain.toPrecision(4))}`;

export function CandidateStudy({
  req,
  choice,
  pinned = [],
  title = "Selected candidate",
  saved,
}: {
  req: Requirement;
  choice: Choice;
  pinned?: Choice[];
  title?: string;
  /** Figures stored with a saved revision; shown instead of a fresh evaluation. */
  saved?: CandidateDetail;
}) {
  const fresh = useMemo(() => (saved ? null : evaluateCandidate(req, choice)), [req, choice, saved]);
  const detail = saved ?? fresh!;
  const series: ErrorSeries[] = useMemo(
    () => [
      { key: candidateKey(choice), label: label(choice), points: errorCurve(req, choice, 60), primary: true },
      ...pinned
        .filter((p) => candidateKey(p) !== candidateKey(choice))
        .slice(0, 3)
        .map((p) => ({
          key: candidateKey(p),
          label: `${label(p)} (pinned)`,
          points: errorCurve(req, p, 60),
          primary: false,
        })),
    ],
    [req, choice, pinned],
  );
  const load = useMemo(() => loadCurve(req, choice, 60), [req, choice]);
  const [budgetAt, setBudgetAt] = useState<"min" | "typical" | "max">("min");
  const budgetCurrent =
    budgetAt === "max"
      ? req.current.max
      : budgetAt === "typical" && req.current.typical !== undefined
        ? req.current.typical
        : req.current.min;
  const budget = useMemo(() => errorAt(req, choice, budgetCurrent), [req, choice, budgetCurrent]);
  const cautions = designCautions(req, detail);

  return (
    <div className="flex flex-col gap-4">
      <div className="grid grid-cols-1 gap-4 xl:grid-cols-2">
        <Panel title="Error across the span">
          <SpanErrorChart
            series={series}
            targetPercent={req.accuracy.percent}
            bandMinA={req.accuracy.bandMin}
            bandMaxA={req.accuracy.bandMax}
          />
        </Panel>
        <Panel title="Error budget by source">
          <div className="mb-2 flex gap-1 text-2xs" role="group" aria-label="Budget at">
            {(["min", "typical", "max"] as const)
              .filter((k) => k !== "typical" || req.current.typical !== undefined)
              .map((k) => (
                <button
                  key={k}
                  type="button"
                  aria-pressed={budgetAt === k}
                  onClick={() => setBudgetAt(k)}
                  className={`rounded border px-2 py-0.5 ${budgetAt === k ? "border-copper bg-copper-soft text-copper-strong" : "border-line text-ink-muted hover:text-ink"}`}
                >
                  at {k === "min" ? (req.current.min < 0 ? "−Imax" : "Imin") : k === "max" ? "Imax" : "typical"}
                </button>
              ))}
          </div>
          <BudgetBar terms={budget.terms} currentA={budgetCurrent} label={label(choice)} />
        </Panel>
      </div>
      <Panel title="On the load: voltage left and burden across the span">
        <LoadChart points={load} supplyV={req.supply.voltage} loadMinV={req.drop.loadMin} dropMaxV={req.drop.max} />
      </Panel>
      <Panel title={`${title}: ${label(choice)}`}>
        <div className="flex flex-col gap-3" data-testid="candidate-detail">
          <Cautions cautions={cautions} />
          <Figures req={req} m={detail} />
        </div>
      </Panel>
    </div>
  );
}
