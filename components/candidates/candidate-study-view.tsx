"use client";
// One candidate examined across the span, from figures already worked out by the engine
// (candidateStudy): error against current (with pinned comparisons), what it does to the load,
// every figure, the error budget and the cautions. It computes nothing, so the design page can
// send it the saved revision's figures without the engine.
import { useState } from "react";
import type { BudgetPoint, CandidateStudyFigures } from "@/lib/design/candidate-study";
import type { Requirement } from "@/lib/design/requirement";
import type { Choice } from "@/lib/design/types";
import { formatSI } from "@/lib/design/format";
import { BudgetBar } from "@/components/charts/budget-bar";
import type { ErrorSeries } from "@/components/charts/error-curve-chart";
import { SpanErrorChart } from "@/components/charts/signed-error-chart";
import { LoadChart } from "@/components/charts/load-chart";
import { Panel } from "@/components/ui/panel";
import { candidateKey } from "@/lib/wizard/candidate-key";
import { Cautions } from "./cautions";
import { Figures } from "./figures";

export const choiceLabel = (c: Choice) => `${formatSI(c.shuntOhms, "Ω")} × ${Number(c.gain.toPrecision(4))}`;

const budgetWords = (at: BudgetPoint, signed: boolean) =>
  at === "min" ? (signed ? "−Imax" : "Imin") : at === "max" ? "Imax" : "typical";

export function CandidateStudyView({
  req,
  choice,
  figures,
  title = "Selected candidate",
}: {
  req: Requirement;
  choice: Choice;
  figures: CandidateStudyFigures;
  title?: string;
}) {
  const series: ErrorSeries[] = figures.errorCurves.map((c, k) => ({
    key: candidateKey(c.choice),
    label: k === 0 ? choiceLabel(c.choice) : `${choiceLabel(c.choice)} (pinned)`,
    points: c.points,
    primary: k === 0,
  }));
  const [budgetAt, setBudgetAt] = useState<BudgetPoint>("min");
  const budget = figures.budgets[budgetAt] ?? figures.budgets.min;

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
              .filter((k) => figures.budgets[k] !== undefined)
              .map((k) => (
                <button
                  key={k}
                  type="button"
                  aria-pressed={budgetAt === k}
                  onClick={() => setBudgetAt(k)}
                  className={`rounded border px-2 py-0.5 ${budgetAt === k ? "border-copper bg-copper-soft text-copper-strong" : "border-line text-ink-muted hover:text-ink"}`}
                >
                  at {budgetWords(k, req.current.min < 0)}
                </button>
              ))}
          </div>
          {budget && <BudgetBar terms={budget.budget.terms} currentA={budget.currentA} label={choiceLabel(choice)} />}
        </Panel>
      </div>
      <Panel title="On the load: voltage left and burden across the span">
        <LoadChart
          points={figures.load}
          supplyV={req.supply.voltage}
          loadMinV={req.drop.loadMin}
          dropMaxV={req.drop.max}
        />
      </Panel>
      <Panel title={`${title}: ${choiceLabel(choice)}`}>
        <div className="flex flex-col gap-3" data-testid="candidate-detail">
          <Cautions cautions={figures.cautions} />
          <Figures req={req} m={figures.detail} outputCeilingV={figures.outputCeilingV} />
        </div>
      </Panel>
    </div>
  );
}
