"use client";
// Burden at Imax against worst-case error at Imin, both log: every listed feasible candidate,
// the Pareto front as a line, gains told apart by shape and shade; click a point to select it.
import { GlyphSeries, LineSeries, XYChart } from "@visx/xychart";
import { useMemo } from "react";
import type { Candidate } from "@/lib/design/types";
import { formatPercent, formatSI } from "@/lib/design/format";
import { candidateKey } from "@/lib/wizard/candidate-key";
import { gainGroups } from "@/lib/wizard/gain-groups";
import { chartMargin, logDomain, percentTick, siTick } from "./axes";
import { ChartAxes } from "./chart-axes";
import { ChartTooltip } from "./chart-tooltip";
import { Shape, ShapeIcon, shapeNames } from "./glyphs";
import { chartTheme, shade, usePalette } from "./palette";
import { useWidth } from "./use-width";
import { LimitLine } from "@/components/charts/limit-line";

const HEIGHT = 300;
// visx may ask for a datum that has just left the data (pointer moves while the list changes):
// an accessor must not throw on it.
const x = (c: Candidate | undefined) => c?.burdenV ?? Number.NaN;
const y = (c: Candidate | undefined) => c?.errorAtMinPercent ?? Number.NaN;
const isCandidate = (d: unknown): d is Candidate => !!d && typeof d === "object" && "shuntOhms" in d;

export function TradeOffChart({
  candidates,
  selected,
  pinned,
  onSelect,
  dropMaxV,
}: {
  candidates: Candidate[];
  selected: string | null;
  pinned: string[];
  onSelect: (key: string) => void;
  dropMaxV: number;
}) {
  const { ref, node, width } = useWidth<HTMLDivElement>();
  const p = usePalette();
  const theme = useMemo(() => chartTheme(p), [p]);
  const feasible = useMemo(
    () => candidates.filter((c) => c.feasible && c.burdenV > 0 && c.errorAtMinPercent > 0),
    [candidates],
  );
  const groups = useMemo(() => gainGroups(feasible.map((c) => c.gain)), [feasible]);
  const front = useMemo(
    () =>
      feasible
        .filter((c) => c.pareto)
        .sort((a, b) => a.burdenV - b.burdenV || b.errorAtMinPercent - a.errorAtMinPercent),
    [feasible],
  );
  const xd = logDomain([...feasible.map(x), dropMaxV]);
  const yd = logDomain(feasible.map(y));
  const marked = feasible.filter((c) => candidateKey(c) === selected || pinned.includes(candidateKey(c)));

  return (
    <div>
      {/* Its own layout and paint boundary (fixed height; the tooltip is in a portal): moving the
          points on a new solve lays out and paints the chart alone. */}
      <div ref={ref} className="w-full [contain:strict]" style={{ height: HEIGHT }} data-testid="trade-off-chart">
        {width > 0 && feasible.length > 0 && (
          <XYChart
            width={width}
            height={HEIGHT}
            margin={chartMargin}
            theme={theme}
            xScale={{ type: "log", domain: xd }}
            yScale={{ type: "log", domain: yd }}
            accessibilityLabel="Trade-off: burden voltage at the maximum current against worst-case error at the minimum current"
            onPointerUp={({ datum }) => {
              if (isCandidate(datum)) onSelect(candidateKey(datum));
            }}
            pointerEventsDataKey="nearest"
          >
            <ChartAxes
              gridStroke={p.line}
              x={{ label: "Burden at maximum current", tick: siTick("V"), logDomain: xd }}
              y={{ label: "Error at minimum current", tick: percentTick, logDomain: yd }}
            />
            <LimitLine
              name="Allowed drop"
              direction="vertical"
              at={dropMaxV}
              span={yd}
              stroke={p.warn}
              dash="4 3"
              strokeWidth={1}
            />
            {front.length > 1 && (
              <LineSeries
                dataKey="Pareto front"
                data={front}
                xAccessor={x}
                yAccessor={y}
                stroke={p.copper}
                strokeWidth={1.5}
                enableEvents={false}
              />
            )}
            {groups.map((g, i) => {
              const data = feasible.filter((c) => g.test(c.gain));
              if (data.length === 0) return null;
              const fill = shade(p, g.t);
              const shape = shapeNames[i % shapeNames.length]!;
              return (
                <GlyphSeries
                  key={g.key}
                  dataKey={g.label}
                  data={data}
                  xAccessor={x}
                  yAccessor={y}
                  renderGlyph={({ x: gx, y: gy, datum }) => (
                    <Shape
                      shape={shape}
                      x={gx}
                      y={gy}
                      r={datum.pareto ? 4.5 : 3.5}
                      fill={fill}
                      stroke={datum.pareto ? p.copperStrong : p.panel}
                      strokeWidth={datum.pareto ? 1.2 : 0.6}
                    />
                  )}
                />
              );
            })}
            {marked.length > 0 && (
              <GlyphSeries
                dataKey="Selected and pinned"
                data={marked}
                xAccessor={x}
                yAccessor={y}
                enableEvents={false}
                renderGlyph={({ x: gx, y: gy, datum }) => (
                  <circle
                    cx={gx}
                    cy={gy}
                    r={8}
                    fill="none"
                    stroke={candidateKey(datum) === selected ? p.copper : p.muted}
                    strokeWidth={candidateKey(datum) === selected ? 2 : 1.2}
                    strokeDasharray={candidateKey(datum) === selected ? undefined : "2 2"}
                  />
                )}
              />
            )}
            <ChartTooltip
              palette={p}
              frame={node}
              snapTooltipToDatumX
              snapTooltipToDatumY
              showDatumGlyph={false}
              renderTooltip={({ tooltipData }) => {
                const d = tooltipData?.nearestDatum?.datum;
                return isCandidate(d) ? <CandidateTip c={d} /> : null;
              }}
            />
          </XYChart>
        )}
      </div>
      {feasible.length > 0 && (
        <ul className="mt-1 flex flex-wrap items-center gap-x-3 gap-y-1 text-2xs text-ink-muted" aria-label="Legend">
          {groups.map((g, i) => (
            <li key={g.key} className="flex items-center gap-1">
              <ShapeIcon shape={shapeNames[i % shapeNames.length]!} fill={shade(p, g.t)} />
              <span className="num">{g.label}</span>
            </li>
          ))}
          <li className="flex items-center gap-1">
            <span className="inline-block h-0.5 w-4" style={{ background: p.copper }} aria-hidden /> Pareto front
            (outlined points)
          </li>
          <li className="flex items-center gap-1">
            <span className="inline-block h-0 w-4 border-t border-dashed" style={{ borderColor: p.warn }} aria-hidden />{" "}
            allowed drop
          </li>
        </ul>
      )}
    </div>
  );
}

function CandidateTip({ c }: { c: Candidate }) {
  return (
    <div className="num text-2xs leading-4">
      <p className="font-semibold">
        {formatSI(c.shuntOhms, "Ω")} × {Number(c.gain.toPrecision(4))}
        {c.pareto ? " · on the front" : ""}
      </p>
      <p>Burden {formatSI(c.burdenV, "V")}</p>
      <p>Error at Imin {formatPercent(c.errorAtMinPercent / 100)}</p>
      <p>Step {formatSI(c.lsbA, "A")}</p>
      <p>
        Dissipation {formatSI(c.dissipationW, "W")} (rated {formatSI(c.ratingW, "W")})
      </p>
      <p className="text-ink-faint">Click to select</p>
    </div>
  );
}
