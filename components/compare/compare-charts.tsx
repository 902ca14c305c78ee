"use client";
// Overlaid curves of the compared designs: worst-case error and burden against current, log–log.
// The series are computed by the engine on the server; this only draws them.
import { scaleLog } from "@visx/scale";
import { LineSeries, XYChart, buildChartTheme } from "@visx/xychart";
import { formatPercent, formatSI } from "@/lib/design/format";
import { ChartAxes } from "@/components/charts/chart-axes";
import { useWidth } from "@/components/charts/use-width";
import { seriesColours } from "./colours";

export type CurveSeries = { key: string; label: string; points: { x: number; y: number }[] };

const theme = buildChartTheme({
  backgroundColor: "transparent",
  colors: seriesColours,
  gridColor: "rgb(219 218 211)",
  gridColorDark: "rgb(128 132 138)",
  tickLength: 4,
  svgLabelSmall: { fill: "rgb(82 86 92)", fontSize: 11 },
  svgLabelBig: { fill: "rgb(82 86 92)", fontSize: 12 },
});

/** A log domain over the positive values, a little wider than they reach, widened to whole decades. */
function logDomain(values: number[]): [number, number] {
  const v = values.filter((x) => Number.isFinite(x) && x > 0);
  if (v.length === 0) return [1e-6, 1];
  // A little room above and below, so a curve never runs along the frame.
  const [a, b] = scaleLog({ domain: [Math.min(...v) / 1.25, Math.max(...v) * 1.25], nice: true }).domain() as [
    number,
    number,
  ];
  return [a, b > a ? b : a * 10];
}

const margin = { top: 12, right: 16, bottom: 40, left: 76 };

export function CurveChart({
  title,
  series,
  yUnit,
  yLabel,
  width,
  height,
  testId,
}: {
  title: string;
  series: CurveSeries[];
  yUnit: string;
  yLabel: string;
  width: number;
  height: number;
  testId: string;
}) {
  // Up to `width`, narrower when the frame is (a phone): never wider than what holds it. Until the
  // frame is measured a blank of the chart's height holds its place, so no width is guessed.
  const { ref, width: room } = useWidth<HTMLElement>();
  const drawn = room > 0 ? Math.min(width, Math.max(280, room)) : 0;
  const xd = logDomain(series.flatMap((s) => s.points.map((p) => p.x)));
  const yd = logDomain(series.flatMap((s) => s.points.map((p) => p.y)));
  const fmtY = (v: number) => (yUnit === "%" ? formatPercent(v / 100) : formatSI(v, yUnit));
  return (
    <figure ref={ref} className="flex min-w-0 flex-col gap-1" data-testid={testId}>
      <figcaption className="text-xs font-semibold text-ink-muted">{title}</figcaption>
      {drawn === 0 && <div style={{ height }} aria-hidden />}
      {drawn > 0 && (
        <XYChart
          width={drawn}
          height={height}
          margin={margin}
          theme={theme}
          xScale={{ type: "log", domain: xd }}
          yScale={{ type: "log", domain: yd }}
          accessibilityLabel={title}
        >
          <ChartAxes
            x={{ label: "Current", tick: (v) => formatSI(v, "A"), logDomain: xd }}
            y={{ label: yLabel, tick: fmtY, logDomain: yd }}
          />
          {series.map((s, i) => (
            <LineSeries
              key={s.key}
              dataKey={s.label}
              data={s.points.filter((p) => Number.isFinite(p.x) && Number.isFinite(p.y) && p.x > 0 && p.y > 0)}
              xAccessor={(d: { x: number; y: number }) => d.x}
              yAccessor={(d: { x: number; y: number }) => d.y}
              stroke={seriesColours[i % seriesColours.length]}
              strokeWidth={2}
            />
          ))}
        </XYChart>
      )}
      <ul className="flex flex-wrap gap-3 text-xs">
        {series.map((s, i) => (
          <li key={s.key} className="flex items-center gap-1.5">
            <span
              aria-hidden
              className="inline-block h-0.5 w-4"
              style={{ background: seriesColours[i % seriesColours.length] }}
            />
            {s.label}
          </li>
        ))}
      </ul>
    </figure>
  );
}
