// The build side of a range plan: the downloads (its own build sheet, parts list, every range's
// netlist deck or one at a time, the design file), the parts for every range and how to run the
// bench check. Each range's figures and bench rows are in the plan's figures above; every figure
// comes from the engine, worded by lib/build-sheet exactly as on the printed sheet.
import { BuildHeader, PartsTable } from "@/components/design/build-parts";
import { planSheetData } from "@/lib/build-sheet/plan-sheet-data";
import type { DesignViewer, PlanDesignView } from "@/lib/design-view";
import { savedPlanVerdict } from "@/lib/design/saved-verdict";

export function PlanBuildPanel({ design, viewer }: { design: PlanDesignView; viewer: DesignViewer }) {
  const maker = viewer.leadsWithBuildSheet;
  // A plan that fails under today's model has no sheet to build from: say so (the page's notice names why).
  const verdict = savedPlanVerdict(design.requirement, design.plan);
  if (verdict.fails)
    return (
      <section
        aria-labelledby="build-sheet-heading"
        data-testid="build-sheet-panel"
        className="rounded-panel border border-bad/40 bg-panel p-4"
      >
        <h2 id="build-sheet-heading" className="text-sm font-semibold">
          No build sheet for this revision
        </h2>
        <p className="mt-1 text-xs text-ink-muted">{verdict.statement}</p>
      </section>
    );
  const data = planSheetData(design.requirement, design.plan);
  const decks = design.plan.ranges.map((_, k) => ({
    href: `/api/designs/${design.id}/netlist?range=${k + 1}`,
    label: `Netlist, range ${k + 1}`,
    testId: `download-netlist-range-${k + 1}`,
  }));
  return (
    <section
      aria-labelledby="build-sheet-heading"
      data-testid="build-sheet-panel"
      className={`rounded-panel border bg-panel ${maker ? "border-copper shadow-sm" : "border-line"}`}
    >
      <BuildHeader design={design} maker={maker} extra={decks} />
      <div className="flex flex-col gap-5 p-4">
        <PartsTable parts={data.parts} />
        <div>
          <h3 className="mb-1.5 text-sm font-semibold">How to run the bench check</h3>
          <ul className="list-disc space-y-0.5 pl-5 text-xs text-ink-muted" data-testid="plan-bench-how-to">
            {data.benchHowTo.map((t) => (
              <li key={t}>{t}</li>
            ))}
          </ul>
        </div>
        <div>
          <h3 className="mb-1.5 text-sm font-semibold">Layout</h3>
          <ul className="list-disc space-y-0.5 pl-5 text-xs text-ink-muted">
            {data.layout.map((t) => (
              <li key={t}>{t}</li>
            ))}
          </ul>
        </div>
      </div>
    </section>
  );
}
