"use client";
// Worst-case error (% of reading) against current across the span, log–log, for the selected
// candidate and pinned ones, with the accuracy target drawn over its band.
import { LineSeries, XYChart } from "@visx/xychart";
import { useId, useMemo } from "react";
import type { ErrorCurvePoint } from "@/lib/design/error-budget";
import { formatPercent, formatSI } from "@/lib/design/format";
import { ChartTooltip } from "./chart-tooltip";
import { SeriesTip } from "./series-tip";
import { chartMargin, logDomain, percentTick, siTick } from "./axes";
import { ChartAxes } from "./chart-axes";
import { chartTheme, usePalette } from "./palette";
import { useWidth } from "./use-width";
import { LimitLine } from "@/components/charts/limit-line";

export type ErrorSeries = { key: string; label: string; points: ErrorCurvePoint[]; primary: boolean };

const HEIGHT = 240;
type Pt = { currentA: number; v: number; label: string };

export function ErrorCurveChart({
  series,
  targetPercent,
  bandMinA,
  bandMaxA,
  negative = false,
}: {
  series: ErrorSeries[];
  targetPercent: number;
  bandMinA: number;
  bandMaxA: number;
  /** A signed span's negative direction, drawn by magnitude on the same log axis and labelled with its sign. */
  negative?: boolean;
}) {
  const { ref, node, width } = useWidth<HTMLDivElement>();
  const p = usePalette();
  const theme = useMemo(() => chartTheme(p), [p]);
  const colours = [p.copper, p.signal, p.good, p.warn];
  const all = series.flatMap((s) => s.points);
  const ampTick = siTick("A");
  const xTick = negative ? (v: number) => `−${ampTick(v)}` : ampTick;
  const xd = logDomain(
    all.map((q) => q.currentA),
    0.02,
  );
  // Near zero current the error grows without bound; the axis stops at 100 % of reading (or well
  // above the target) and the curves leave through the top of the plot, clipped to it.
  const ceiling = Math.max(100, 20 * targetPercent);
  const yd = logDomain(
    [...all.map((q) => q.worstPercent), ...all.map((q) => q.rssPercent), targetPercent].map((v) =>
      Math.min(v, ceiling),
    ),
  );
  const clipId = `err-clip-${useId().replace(/:/g, "")}`;
  const clip = `url(#${clipId})`;
  const yClamp = (v: number) => (Number.isFinite(v) && v > 0 ? v : Number.NaN);
  return (
    <div>
      <div ref={ref} style={{ height: HEIGHT }} data-testid="error-curve-chart">
        {width > 0 && all.length > 0 && (
          <XYChart
            width={width}
            height={HEIGHT}
            margin={chartMargin}
            theme={theme}
            xScale={{ type: "log", domain: xd }}
            yScale={{ type: "log", domain: yd }}
            accessibilityLabel="Worst-case error against current"
          >
            <defs>
              <clipPath id={clipId}>
                <rect
                  x={chartMargin.left}
                  y={chartMargin.top}
                  width={Math.max(0, width - chartMargin.left - chartMargin.right)}
                  height={Math.max(0, HEIGHT - chartMargin.top - chartMargin.bottom)}
                />
              </clipPath>
            </defs>
            <ChartAxes
              gridStroke={p.line}
              x={{ label: negative ? "Current, I < 0" : "Current", tick: xTick, logDomain: xd }}
              y={{ label: "Error, % of reading", tick: percentTick, logDomain: yd }}
            />
            <LimitLine name="Accuracy target" at={targetPercent} span={[bandMinA, bandMaxA]} stroke={p.bad} />
            {series.map((s, i) => (
              <LineSeries
                key={s.key}
                dataKey={`${s.label} (worst case)`}
                data={s.points.map((q) => ({ currentA: q.currentA, v: yClamp(q.worstPercent), label: s.label }))}
                xAccessor={(d) => d?.currentA ?? Number.NaN}
                yAccessor={(d) => d?.v ?? Number.NaN}
                clipPath={clip}
                stroke={colours[i % colours.length]}
                strokeWidth={s.primary ? 2 : 1.2}
              />
            ))}
            {series[0]?.primary && (
              <LineSeries
                dataKey={`${series[0].label} (RSS)`}
                data={series[0].points.map((q) => ({
                  currentA: q.currentA,
                  v: yClamp(q.rssPercent),
                  label: `${series[0]!.label} RSS`,
                }))}
                xAccessor={(d) => d?.currentA ?? Number.NaN}
                yAccessor={(d) => d?.v ?? Number.NaN}
                clipPath={clip}
                stroke={colours[0]}
                strokeWidth={1}
                strokeDasharray="2 2"
              />
            )}
            <ChartTooltip
              palette={p}
              frame={node}
              snapTooltipToDatumX
              showVerticalCrosshair
              showSeriesGlyphs
              renderTooltip={({ tooltipData }) => {
                const near = tooltipData?.nearestDatum?.datum as Pt | undefined;
                if (!near) return null;
                return (
                  <SeriesTip
                    title={`at ${formatSI(negative ? -near.currentA : near.currentA, "A")}`}
                    byKey={(tooltipData?.datumByKey ?? {}) as Record<string, { datum: Pt }>}
                    skip={["Accuracy target"]}
                    value={(d) => (Number.isFinite(d.v) ? formatPercent(d.v / 100) : "off the chart")}
                  />
                );
              }}
            />
          </XYChart>
        )}
      </div>
      <ul className="mt-1 flex flex-wrap gap-x-3 gap-y-1 text-2xs text-ink-muted" aria-label="Legend">
        {series.map((s, i) => (
          <li key={s.key} className="flex items-center gap-1">
            <span className="inline-block h-0.5 w-4" style={{ background: colours[i % colours.length] }} aria-hidden />
            <span className="num">{s.label}</span>
          </li>
        ))}
        {series[0]?.primary && <li className="flex items-center gap-1">dotted: RSS of the selected</li>}
        <li className="flex items-center gap-1">
          <span className="inline-block h-0 w-4 border-t-2 border-dashed" style={{ borderColor: p.bad }} aria-hidden />{" "}
          target {formatPercent(targetPercent / 100)} over its band
        </li>
      </ul>
    </div>
  );
}
