import type { Metadata } from "next";
import Link from "next/link";
import { CurveChart, type CurveSeries } from "@/components/compare/compare-charts";
import { CompareTable } from "@/components/compare/compare-table";
import { EmptyState } from "@/components/ui/panel";
import { getDesignViews } from "@/db/queries/designs";
import { requirePageCaller } from "@/lib/auth/gate";
import { can } from "@/lib/auth/policy";
import { designViewerFor, type DesignView } from "@/lib/design-view";
import { builtYieldsOf } from "@/lib/built-units/record";
import { compareQuery } from "@/lib/saved-designs/compare";
import { compareCurves } from "@/lib/saved-designs/compare-curves";
import { savedVerdictOf } from "@/lib/saved-designs/saved-figures";

export const metadata: Metadata = { title: "Compare designs" };

export default async function ComparePage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const sp = await searchParams;
  const raw = Array.isArray(sp.ids) ? sp.ids.join(",") : (sp.ids ?? "");
  const caller = await requirePageCaller(`/compare?ids=${encodeURIComponent(raw)}`);
  const parsed = compareQuery.safeParse({ ids: raw });
  if (!parsed.success) {
    return (
      <EmptyState title="Pick two to four designs to compare">
        Open a design and use “Compare with…”, or give <code className="font-mono">?ids=</code> two to four design ids
        separated by commas.{" "}
        <Link href="/designs" className="text-copper underline">
          Go to the designs
        </Link>
      </EmptyState>
    );
  }
  const found = await getDesignViews(parsed.data.ids, caller.teamId);
  const designs = found.filter((d): d is DesignView => !!d && can(caller, "design.read", d));
  const missing = found.length - designs.length;
  if (designs.length < 2) {
    return (
      <EmptyState title="Not enough designs to compare">
        {missing} of the designs asked for {missing === 1 ? "was" : "were"} not found in your team
        {can(caller, "design.read-unapproved") ? "" : " among the approved ones"}.{" "}
        <Link href="/designs" className="text-copper underline">
          Go to the designs
        </Link>
      </EmptyState>
    );
  }
  // Only drawn: at the digits a chart can show (compareCurves keeps them so).
  const curves = designs.map(compareCurves);
  const errorSeries: CurveSeries[] = designs.map((d, k) => ({ key: d.id, label: d.name, points: curves[k]!.error }));
  const burdenSeries: CurveSeries[] = designs.map((d, k) => ({ key: d.id, label: d.name, points: curves[k]!.burden }));
  // A bidirectional design is drawn by magnitude: its error and drop are the same at −I and +I.
  const either = designs.some((d) => d.requirement.current.min < 0) ? " (magnitude, either direction)" : "";
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-lg font-semibold">Compare {designs.length} designs</h1>
        <p className="text-ink-muted">
          Each design is evaluated at its own requirement. A figure row marks the best value only where every design
          takes that figure at the same points (the same span, supply and readout it rests on); otherwise each value is
          shown against its own design&apos;s limit. A design whose saved figures fail under today&apos;s model says so
          under its name and is not ranked. Rows whose values differ are in full ink. A range plan shows, among the
          whole-span figures, only those it takes at the same points as a single pair (the drop and load voltage at the
          maximum current, the error and steps at the minimum); its per-range figures follow, unranked. A bidirectional
          design&apos;s figures at its positive end are in the figure rows, those at its negative end in their own rows
          below them.
          {missing > 0 &&
            ` ${missing} of the designs asked for ${missing === 1 ? "was" : "were"} not found and ${missing === 1 ? "is" : "are"} left out.`}
        </p>
      </div>
      <div
        className="grid grid-cols-1 gap-4 overflow-x-auto rounded-panel border border-line bg-panel p-4 xl:grid-cols-2"
        data-testid="compare-charts"
      >
        <CurveChart
          title={`Worst-case error against current${either}`}
          series={errorSeries}
          yUnit="%"
          yLabel="Error, % of reading"
          width={580}
          height={280}
          testId="compare-error-chart"
        />
        <CurveChart
          title={`Burden voltage against current${either}`}
          series={burdenSeries}
          yUnit="V"
          yLabel="Burden"
          width={580}
          height={280}
          testId="compare-burden-chart"
        />
      </div>
      <CompareTable
        designs={designs}
        viewers={Object.fromEntries(designs.map((d) => [d.id, designViewerFor(caller, d)]))}
        built={await builtYieldsOf(designs.map((d) => d.id))}
        verdicts={designs.map(savedVerdictOf)}
      />
    </div>
  );
}
