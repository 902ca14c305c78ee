// A saved range plan: the requirement, each range's figures on its own sub-span, the switch points
// with their hysteresis, the protection in words, each range's bench rows and the cautions. Every
// figure is the engine's, saved with the revision (lib/design/plan-evaluation.ts).
import type { ReactNode } from "react";
import { Cautions } from "@/components/candidates/cautions";
import { Panel } from "@/components/ui/panel";
import { RequirementSummary } from "@/components/wizard/requirement-summary";
import { formatPercent, formatSI } from "@/lib/design/format";
import { planCautions } from "@/lib/design/plan-cautions";
import type { PlanRangeMetrics } from "@/lib/design/plan-evaluation";
import type { Requirement } from "@/lib/design/requirement";
import type { PlanDesignView } from "@/lib/design-view";

type FigureRow = { label: string; note?: string; value: (r: PlanRangeMetrics, k: number) => string };

const pct = (v: number | null) => (v === null ? "—" : formatPercent(v / 100));
const plain = (v: number) => String(Number(v.toPrecision(3)));

/** Whether the range reaches into the accuracy band at all (outside it nothing is asked of accuracy). */
const inBand = (req: Requirement, r: PlanRangeMetrics) =>
  Math.max(req.accuracy.bandMin, r.minA) <= Math.min(req.accuracy.bandMax, r.maxA);

function figureRows(req: Requirement, last: number): { title: string; rows: FigureRow[] }[] {
  return [
    {
      title: "Pair",
      rows: [
        { label: "Span", value: (r) => `${formatSI(r.minA, "A")} to ${formatSI(r.maxA, "A")}` },
        { label: "Shunt", value: (r) => formatSI(r.shuntOhms, "Ω") },
        { label: "Gain", value: (r) => plain(r.gain) },
        { label: "Transimpedance R·G", value: (r) => formatSI(r.transimpedanceVPerA, "V/A") },
        { label: "Range switch on-resistance", value: (r) => formatSI(r.switchOhms, "Ω") },
      ],
    },
    {
      title: "On the load, at the range's top",
      rows: [
        { label: "Drop across the shunt", value: (r) => formatSI(r.burdenV, "V") },
        {
          label: "Worst drop, switch included",
          note: `allowed ${formatSI(req.drop.max, "V")}`,
          value: (r) => formatSI(r.worstBurdenV, "V"),
        },
        { label: "Load voltage", value: (r) => formatSI(r.loadVoltageV, "V") },
        { label: "Shunt dissipation", value: (r) => formatSI(r.dissipationW, "W") },
        {
          label: "Most current the shunt carries",
          note: "a lower range: until its protection closes",
          // The top range carries the full current itself.
          value: (r, k) => (k === last ? "the full current" : formatSI(r.faultCurrentA, "A")),
        },
        {
          label: "Power rating chosen",
          note: `used at most ${formatPercent(req.shunt.derating)} of rating`,
          value: (r) => formatSI(r.ratingW, "W"),
        },
      ],
    },
    {
      title: "Signal",
      rows: [
        {
          label: "Output at the range's top",
          note: `full scale ${formatSI(req.readout.fullScale, "V")}`,
          value: (r) => formatSI(r.outputAtMaxV, "V"),
        },
        { label: "Readout step (LSB)", value: (r) => formatSI(r.lsbA, "A") },
        {
          label: "Steps at the range's bottom",
          note: `wanted ${req.resolution.countsAtMin}`,
          value: (r) => plain(r.countsAtBottom),
        },
        { label: "Dead zone", note: "reads zero below this", value: (r) => formatSI(r.deadZoneA, "A") },
        { label: "Bandwidth", value: (r) => formatSI(r.bandwidthHz, "Hz") },
        {
          label: "Settling after a switch",
          note: "to half a readout step",
          value: (r) => formatSI(r.settlingS, "s"),
        },
      ],
    },
    {
      title: "Error, % of reading",
      rows: [
        { label: "At the range's bottom, worst case", value: (r) => pct(r.errorAtMinPercent) },
        { label: "At the range's top, worst case", value: (r) => pct(r.errorAtMaxPercent) },
        {
          label: "Worst in the accuracy band",
          note: `target ${formatPercent(req.accuracy.percent / 100)}`,
          value: (r) => (inBand(req, r) ? pct(r.accuracyBandPercent) : "outside the band"),
        },
      ],
    },
  ];
}

function RangeFigures({ design }: { design: PlanDesignView }) {
  const { ranges } = design.metrics;
  const groups = figureRows(design.requirement, ranges.length - 1);
  return (
    <>
      {/* A phone: one block per range, so no range hides past the edge. */}
      <div className="flex flex-col gap-3 sm:hidden" data-testid="plan-figures-stacked">
        {ranges.map((r, k) => (
          <section key={k} className="rounded border border-line px-3 py-2" aria-label={`Range ${k + 1}`}>
            <h3 className="text-xs font-semibold">
              Range {k + 1}: {formatSI(r.minA, "A")} to {formatSI(r.maxA, "A")}
            </h3>
            {groups.map((g) => (
              <div key={g.title} className="mt-1 text-xs num">
                <p className="pt-1 text-2xs font-semibold tracking-wide text-ink-faint">{g.title}</p>
                <dl>
                  {g.rows
                    .filter((row) => row.label !== "Span")
                    .map((row) => (
                      <div
                        key={row.label}
                        className="flex justify-between gap-3 border-b border-line py-0.5 last:border-0"
                      >
                        <dt className="text-ink-muted">
                          {row.label}
                          {row.note && <span className="block text-2xs text-ink-faint">{row.note}</span>}
                        </dt>
                        <dd className="whitespace-nowrap text-right">{row.value(r, k)}</dd>
                      </div>
                    ))}
                </dl>
              </div>
            ))}
          </section>
        ))}
      </div>
      <div className="hidden overflow-x-auto sm:block">
        <table className="w-full text-left text-xs num" data-testid="plan-figures">
          <thead className="text-ink-muted">
            <tr className="border-b border-line">
              <th className="py-1 pr-2 font-medium">Figure</th>
              {ranges.map((_r, k) => (
                <th key={k} className="py-1 pl-2 text-right font-medium">
                  Range {k + 1}
                </th>
              ))}
            </tr>
          </thead>
          {groups.map((g) => (
            <tbody key={g.title}>
              <tr>
                <th
                  colSpan={ranges.length + 1}
                  className="pb-1 pt-3 text-left text-2xs font-semibold tracking-wide text-ink-faint"
                >
                  {g.title}
                </th>
              </tr>
              {g.rows.map((row) => (
                <tr key={row.label} className="border-b border-line last:border-0">
                  <td className="py-1 pr-2">
                    {row.label}
                    {row.note && <span className="block text-2xs text-ink-faint">{row.note}</span>}
                  </td>
                  {ranges.map((r, k) => (
                    <td key={k} className="whitespace-nowrap py-1 pl-2 text-right">
                      {row.value(r, k)}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          ))}
        </table>
      </div>
    </>
  );
}

function SwitchPoints({ design }: { design: PlanDesignView }) {
  return (
    <div className="flex flex-col gap-2">
      <div className="overflow-x-auto">
        <table className="w-full text-left text-xs num" data-testid="plan-switch-points">
          <thead className="text-ink-muted">
            <tr className="border-b border-line">
              <th className="py-1 pr-2 font-medium">Between</th>
              <th className="py-1 pl-2 text-right font-medium">Switch up above</th>
              <th className="py-1 pl-2 text-right font-medium">Switch down below</th>
              <th className="py-1 pl-2 text-right font-medium">Hysteresis</th>
            </tr>
          </thead>
          <tbody>
            {design.plan.switchPoints.map((s, k) => (
              <tr key={k} className="border-b border-line last:border-0">
                <td className="py-1 pr-2">
                  Ranges {k + 1} and {k + 2}
                </td>
                <td className="whitespace-nowrap py-1 pl-2 text-right">{formatSI(s.upA, "A")}</td>
                <td className="whitespace-nowrap py-1 pl-2 text-right">{formatSI(s.downA, "A")}</td>
                <td className="whitespace-nowrap py-1 pl-2 text-right">{formatSI(s.upA - s.downA, "A")}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-xs text-ink-muted" data-testid="plan-switch-rule">
        {design.metrics.switchRule}
      </p>
    </div>
  );
}

function BenchRows({ design }: { design: PlanDesignView }) {
  return (
    <div className="flex flex-col gap-3">
      {design.metrics.ranges.map((r, k) => (
        <div key={k} className="overflow-x-auto">
          <table className="w-full text-left text-xs num" data-testid={`plan-bench-${k + 1}`}>
            <caption className="pb-1 text-left text-2xs font-semibold tracking-wide text-ink-faint">
              Range {k + 1}: {formatSI(r.shuntOhms, "Ω")} at gain {plain(r.gain)}
            </caption>
            <thead className="text-ink-muted">
              <tr className="border-b border-line">
                <th className="py-1 pr-2 font-medium">Check at</th>
                <th className="py-1 pl-2 text-right font-medium">Current</th>
                <th className="py-1 pl-2 text-right font-medium">Expected output</th>
                <th className="py-1 pl-2 text-right font-medium">Accept from … to</th>
              </tr>
            </thead>
            <tbody>
              {r.benchCheck.map((row) => (
                <tr key={row.label} className="border-b border-line last:border-0">
                  <td className="py-1 pr-2">{row.label}</td>
                  <td className="whitespace-nowrap py-1 pl-2 text-right">{formatSI(row.currentA, "A")}</td>
                  <td className="whitespace-nowrap py-1 pl-2 text-right">{formatSI(row.expectedV, "V")}</td>
                  <td className="whitespace-nowrap py-1 pl-2 text-right">
                    {formatSI(row.minV, "V")} … {formatSI(row.maxV, "V")}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ))}
    </div>
  );
}

function Section({ title, children, testId }: { title: string; children: ReactNode; testId?: string }) {
  return (
    <Panel title={title}>
      <div data-testid={testId}>{children}</div>
    </Panel>
  );
}

export function PlanFigures({ design }: { design: PlanDesignView }) {
  const n = design.plan.ranges.length;
  return (
    <div className="flex flex-col gap-4" data-testid="design-figures">
      <Panel title={`Requirement (revision ${design.revision})`}>
        <RequirementSummary requirement={design.requirement} />
      </Panel>
      <Section title={`Range plan: ${n} ranges, each on its own span`} testId="plan-ranges">
        <RangeFigures design={design} />
      </Section>
      <Section title="Switching between ranges" testId="plan-switching">
        <SwitchPoints design={design} />
      </Section>
      <Section title="Protection at the span's full current" testId="plan-protection">
        <p className="text-xs text-ink">{design.metrics.protection}</p>
      </Section>
      <Section title="Bench check, per range" testId="plan-bench">
        <BenchRows design={design} />
      </Section>
      <Section title="Cautions" testId="plan-cautions">
        <Cautions cautions={planCautions(design.requirement, design.metrics)} />
      </Section>
    </div>
  );
}
