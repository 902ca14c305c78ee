"use client";
// What the shunt does to the load across the span: burden (log–log) and the voltage left at
// the load (log current, linear volts) with the load's minimum.
import { LineSeries, Tooltip, XYChart } from "@visx/xychart";
import { useMemo } from "react";
import type { LoadCurvePoint } from "@/lib/design/error-budget";
import { formatSI } from "@/lib/design/format";
import { chartMargin, logDomain, siTick } from "./axes";
import { ChartAxes } from "./chart-axes";
import { chartTheme, usePalette } from "./palette";
import { useWidth } from "./use-width";
import { LimitLine } from "@/components/charts/limit-line";

const HEIGHT = 240;
type Pt = { currentA: number; v: number };

export function LoadChart({
  points,
  supplyV,
  loadMinV,
  dropMaxV,
}: {
  points: LoadCurvePoint[];
  supplyV: number;
  loadMinV?: number;
  dropMaxV: number;
}) {
  const { ref, width } = useWidth<HTMLDivElement>();
  const p = usePalette();
  const theme = useMemo(() => chartTheme(p), [p]);
  const ok = points.filter((q) => Number.isFinite(q.burdenV) && q.burdenV > 0);
  const xd = logDomain(
    points.map((q) => q.currentA),
    0.02,
  );
  const lo = Math.min(loadMinV ?? supplyV, ...ok.map((q) => q.loadVoltageV));
  const yd: [number, number] = [Math.max(0, lo - 0.08 * supplyV), supplyV * 1.02];
  const yb = logDomain([...ok.map((q) => q.burdenV), dropMaxV]);
  const currentAxis = { label: "Current", tick: siTick("A"), logDomain: xd };
  const half = width > 640 ? Math.floor((width - 16) / 2) : width;
  const tip = (unit: string) => (
    <Tooltip<Pt>
      snapTooltipToDatumX
      showVerticalCrosshair
      renderTooltip={({ tooltipData }) => {
        const d = tooltipData?.nearestDatum?.datum;
        return d ? (
          <p className="num text-2xs">
            {formatSI(d.currentA, "A")}: {formatSI(d.v, unit)}
          </p>
        ) : null;
      }}
    />
  );
  return (
    <div ref={ref} data-testid="load-chart" className="flex flex-wrap gap-4">
      {width === 0 && <div className="w-full" style={{ height: HEIGHT }} aria-hidden />}
      {width > 0 && ok.length > 0 && (
        <>
          <XYChart
            width={half}
            height={HEIGHT}
            margin={chartMargin}
            theme={theme}
            xScale={{ type: "log", domain: xd }}
            yScale={{ type: "linear", domain: yd, zero: false }}
            accessibilityLabel="Voltage left at the load against current"
          >
            <ChartAxes
              gridStroke={p.line}
              gridTicks={5}
              x={currentAxis}
              y={{ label: "Voltage at the load", tick: siTick("V", 3) }}
            />
            <LimitLine name="Supply" at={supplyV} span={xd} stroke={p.faint} dash="3 3" strokeWidth={1} />
            {loadMinV !== undefined && <LimitLine name="Load minimum" at={loadMinV} span={xd} stroke={p.bad} />}
            <LineSeries
              dataKey="Load voltage"
              data={ok.map((q) => ({ currentA: q.currentA, v: q.loadVoltageV }))}
              xAccessor={(d) => d.currentA}
              yAccessor={(d) => d.v}
              stroke={p.signal}
              strokeWidth={2}
            />
            {tip("V")}
          </XYChart>
          <XYChart
            width={half}
            height={HEIGHT}
            margin={chartMargin}
            theme={theme}
            xScale={{ type: "log", domain: xd }}
            yScale={{ type: "log", domain: yb }}
            accessibilityLabel="Burden voltage against current"
          >
            <ChartAxes
              gridStroke={p.line}
              gridTicks={5}
              x={currentAxis}
              y={{ label: "Burden (drop across the shunt)", tick: siTick("V"), logDomain: yb }}
            />
            <LimitLine name="Allowed drop" at={dropMaxV} span={xd} stroke={p.warn} />
            <LineSeries
              dataKey="Burden"
              data={ok.map((q) => ({ currentA: q.currentA, v: q.burdenV }))}
              xAccessor={(d) => d.currentA}
              yAccessor={(d) => d.v}
              stroke={p.copper}
              strokeWidth={2}
            />
            {tip("V")}
          </XYChart>
        </>
      )}
      <ul className="flex w-full flex-wrap gap-x-3 text-2xs text-ink-muted" aria-label="Legend">
        <li>
          <span className="mr-1 inline-block h-0.5 w-4 align-middle" style={{ background: p.signal }} aria-hidden />
          voltage at the load (supply {formatSI(supplyV, "V")} dotted)
        </li>
        {loadMinV !== undefined && (
          <li>
            <span
              className="mr-1 inline-block w-4 border-t-2 border-dashed align-middle"
              style={{ borderColor: p.bad }}
              aria-hidden
            />
            load minimum {formatSI(loadMinV, "V")}
          </li>
        )}
        <li>
          <span className="mr-1 inline-block h-0.5 w-4 align-middle" style={{ background: p.copper }} aria-hidden />
          burden
        </li>
        <li>
          <span
            className="mr-1 inline-block w-4 border-t-2 border-dashed align-middle"
            style={{ borderColor: p.warn }}
            aria-hidden
          />
          allowed drop {formatSI(dropMaxV, "V")}
        </li>
      </ul>
    </div>
  );
}
