"use client";
// The predicted distribution of the output at each bench-check test point (the engine's Monte
// Carlo, as a histogram) with the accept band and the recorded units' readings over it: one small
// chart per test point, each on its own voltage axis.
import { AreaSeries, Axis, GlyphSeries, LineSeries, XYChart } from "@visx/xychart";
import { useMemo } from "react";
import { chartTheme, usePalette } from "@/components/charts/palette";
import { useWidth } from "@/components/charts/use-width";
import { formatSI } from "@/lib/design/format";
import type { PredictedPoint } from "@/lib/design/unit-prediction";
import { LimitLine } from "@/components/charts/limit-line";

export type PlottedReading = { serial: string; outputV: number; inBand: boolean; selected: boolean };

const HEIGHT = 150;
const margin = { top: 8, right: 10, bottom: 34, left: 10 };

type Xy = { x: number; y: number };
type Dot = Xy & { serial: string; inBand: boolean; selected: boolean; clipped: "low" | "high" | null; v: number };

function PointChart({ point, readings }: { point: PredictedPoint; readings: PlottedReading[] }) {
  const { ref, width } = useWidth<HTMLDivElement>();
  const p = usePalette();
  const theme = useMemo(() => chartTheme(p), [p]);
  const span = point.maxV - point.minV;
  // The accept band with a margin either side: a reading far outside is pinned to the edge and marked.
  const lo = Math.min(point.minV, point.histogram[0]?.fromV ?? point.minV) - 0.3 * span;
  const hi = Math.max(point.maxV, point.histogram.at(-1)?.toV ?? point.maxV) + 0.3 * span;
  const top = Math.max(...point.histogram.map((b) => b.share), 1e-9) * 1.15;
  const steps: Xy[] = [{ x: point.histogram[0]?.fromV ?? lo, y: 0 }];
  for (const b of point.histogram) steps.push({ x: b.fromV, y: b.share }, { x: b.toV, y: b.share });
  steps.push({ x: point.histogram.at(-1)?.toV ?? hi, y: 0 });
  const dots: Dot[] = readings.map((r, i) => {
    const clipped = r.outputV < lo ? "low" : r.outputV > hi ? "high" : null;
    const x = clipped === "low" ? lo : clipped === "high" ? hi : r.outputV;
    // Readings stacked a little above the baseline so that several at one value stay visible.
    return {
      x,
      y: top * (0.06 + 0.07 * (i % 5)),
      serial: r.serial,
      inBand: r.inBand,
      selected: r.selected,
      clipped,
      v: r.outputV,
    };
  });
  const offScale = dots.filter((d) => d.clipped);
  return (
    <figure className="min-w-0" data-testid="spread-point">
      <figcaption className="text-xs font-medium">
        {point.label} <span className="num font-normal text-ink-muted">({formatSI(point.currentA, "A")})</span>
      </figcaption>
      <div ref={ref} style={{ height: HEIGHT }}>
        {width > 0 && (
          <XYChart
            width={width}
            height={HEIGHT}
            margin={margin}
            theme={theme}
            xScale={{ type: "linear", domain: [lo, hi], nice: false, zero: false }}
            yScale={{ type: "linear", domain: [0, top] }}
            accessibilityLabel={`Predicted output at ${point.label} with recorded readings`}
          >
            <Axis orientation="bottom" numTicks={3} tickFormat={(v: number) => formatSI(v, "V", 3)} />
            <AreaSeries
              dataKey="predicted"
              data={steps}
              xAccessor={(d) => d.x}
              yAccessor={(d) => d.y}
              fillOpacity={0.35}
              fill={p.signal}
              lineProps={{ stroke: p.signal, strokeWidth: 1 }}
              enableEvents={false}
            />
            {[point.minV, point.maxV].map((v, i) => (
              <LimitLine
                key={i}
                name={`band-${i}`}
                direction="vertical"
                at={v}
                span={[0, top]}
                stroke={p.bad}
                dash="4 3"
                strokeWidth={1.2}
              />
            ))}
            <LimitLine
              name="expected"
              direction="vertical"
              at={point.expectedV}
              span={[0, top]}
              stroke={p.ink}
              dash="1 3"
              strokeWidth={1}
            />
            <GlyphSeries
              dataKey="readings"
              data={dots}
              xAccessor={(d) => d.x}
              yAccessor={(d) => d.y}
              enableEvents={false}
              renderGlyph={({ x, y, datum }) => {
                const colour = datum.inBand ? p.good : p.bad;
                const r = datum.selected ? 5 : 3.5;
                if (datum.clipped) {
                  const dir = datum.clipped === "high" ? 1 : -1;
                  return (
                    <path
                      d={`M${x + dir * r * 1.4},${y}L${x - dir * r * 0.6},${y - r}L${x - dir * r * 0.6},${y + r}Z`}
                      fill={colour}
                    >
                      <title>{`${datum.serial}: ${formatSI(datum.v, "V", 4)} (off the scale)`}</title>
                    </path>
                  );
                }
                return (
                  <circle
                    cx={x}
                    cy={y}
                    r={r}
                    fill={colour}
                    fillOpacity={datum.selected ? 1 : 0.75}
                    stroke={datum.selected ? p.ink : "none"}
                  >
                    <title>{`${datum.serial}: ${formatSI(datum.v, "V", 4)}`}</title>
                  </circle>
                );
              }}
            />
          </XYChart>
        )}
      </div>
      <p className="num text-2xs text-ink-muted">
        predicted {formatSI(point.p1V, "V", 4)} to {formatSI(point.p99V, "V", 4)} (1st–99th percentile)
        {offScale.length > 0 && (
          <>; off the scale: {offScale.map((d) => `${d.serial} ${formatSI(d.v, "V", 4)}`).join(", ")}</>
        )}
      </p>
    </figure>
  );
}

/** One chart per test point, in a grid that wraps on a phone. */
export function SpreadChart({
  points,
  readingsAt,
}: {
  points: PredictedPoint[];
  readingsAt: (point: PredictedPoint) => PlottedReading[];
}) {
  const p = usePalette();
  return (
    <div data-testid="spread-chart">
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2 xl:grid-cols-4">
        {points.map((pt) => (
          <PointChart key={pt.label} point={pt} readings={readingsAt(pt)} />
        ))}
      </div>
      <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-2xs text-ink-muted" aria-label="Legend">
        <li className="flex items-center gap-1">
          <span className="inline-block h-2.5 w-4 opacity-50" style={{ background: p.signal }} aria-hidden /> predicted
          spread (2000 simulated units at 25 °C)
        </li>
        <li className="flex items-center gap-1">
          <span className="inline-block h-0 w-4 border-t-2 border-dashed" style={{ borderColor: p.bad }} aria-hidden />{" "}
          accept band
        </li>
        <li className="flex items-center gap-1">
          <span className="inline-block h-2 w-2 rounded-full" style={{ background: p.good }} aria-hidden /> reading in
          band
        </li>
        <li className="flex items-center gap-1">
          <span className="inline-block h-2 w-2 rounded-full" style={{ background: p.bad }} aria-hidden /> out of band
          (a triangle: off the scale)
        </li>
      </ul>
    </div>
  );
}
