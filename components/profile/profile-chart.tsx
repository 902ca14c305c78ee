"use client";

import { scaleLinear, scaleLog } from "@visx/scale";
import { useWidth } from "@/components/charts/use-width";
import { useRef, useState } from "react";
import { formatSI } from "@/lib/design/format";
import { burdenV, loadVoltageV } from "@/lib/design/profile";
import type { DecimatedSeries } from "@/lib/profile/decimate";
import type { PlanSeriesOverlay } from "@/lib/profile/plan-series";
import { RangeBands, RangePatterns } from "./range-bands";

export type ChartDesign = { shuntOhms: number; supplyV: number; lsbA: number; clipCurrentA: number; loadMinV?: number };

/** A range plan's recording: the stretches read on each range and the load voltage at each point. */
export type ChartSeries = DecimatedSeries & { plan?: Omit<PlanSeriesOverlay, "clipped" | "belowStep"> };

const M = { left: 64, right: 64, top: 12, gap: 34, bottom: 30 };
const CURRENT_H = 230;
const VOLTAGE_H = 120;

/**
 * Follows the parent's width (explicit height), so the server pixels asked for match the drawing:
 * 0 until the parent is measured (nothing is drawn or asked for at a guessed width), then at least
 * 320 px (narrower, the frame scrolls).
 */
export function useProfileWidth() {
  const { ref, width } = useWidth<HTMLDivElement>();
  return { ref, width: width > 0 ? Math.max(320, width) : 0 };
}

/** The chart's whole height, for the place it holds while loading. */
export const PROFILE_CHART_HEIGHT = M.top + CURRENT_H + M.gap + VOLTAGE_H + M.bottom;

/** A linear scale's round ticks (1, 2, 5 × 10^n). */
const linearTicks = (lo: number, hi: number, count: number) => scaleLinear({ domain: [lo, hi] }).ticks(count);

/**
 * Current against time (top) and the load voltage it leaves, with the burden on the right axis
 * (bottom). Shaded: stretches that clip the readout and stretches below one readout step.
 * Drag across either plot to zoom to that stretch.
 */
export function ProfileChart({
  series,
  design,
  width,
  log,
  onZoom,
}: {
  series: ChartSeries;
  design: ChartDesign;
  width: number;
  log: boolean;
  onZoom: (fromS: number, toS: number) => void;
}) {
  const plotW = Math.max(10, width - M.left - M.right);
  const height = PROFILE_CHART_HEIGHT;
  const { fromS, toS } = series;
  const span = toS - fromS || 1;
  const xScale = scaleLinear({ domain: [fromS, fromS + span], range: [M.left, M.left + plotW] });
  const x = (t: number) => xScale(t);
  const tOf = (px: number) => xScale.invert(px);

  // Current axis: linear from 0, or log over the positive samples.
  const values = series.currentA;
  let peak = 0;
  let lowPositive = Infinity;
  let low = 0;
  for (const v of values) {
    if (v > peak) peak = v;
    if (v > 0 && v < lowPositive) lowPositive = v;
    if (v < low) low = v;
  }
  if (!(peak > 0)) peak = 1e-9;
  const yTop = M.top;
  let yCurrent: (i: number) => number;
  let currentTicks: number[];
  if (log) {
    const lo = Math.min(lowPositive === Infinity ? peak / 10 : lowPositive, design.lsbA) / 2;
    const hi = Math.max(peak, design.lsbA) * 1.5;
    const y = scaleLog({ domain: [lo, hi], range: [yTop + CURRENT_H, yTop], clamp: true });
    yCurrent = (i) => y(Math.max(i, lo));
    // Decades only: the scale's ticks that are powers of ten.
    currentTicks = y.ticks().filter((t) => Math.abs(Math.log10(t) - Math.round(Math.log10(t))) < 1e-9);
  } else {
    const hi = peak * 1.1;
    const lo = Math.min(0, low * 1.1);
    const y = scaleLinear({ domain: [lo, hi], range: [yTop + CURRENT_H, yTop] });
    yCurrent = (i) => y(i);
    currentTicks = y.ticks(5);
  }

  // Load voltage = supply − I·R; the burden I·R reads on the right axis of the same curve.
  const vTop = M.top + CURRENT_H + M.gap;
  const supply = design.supplyV;
  // A plan's load voltage comes with the series (through the path in use, from the engine).
  const plan = series.plan;
  const loadAt = (i: number, k: number) => (plan ? plan.loadV[k]! : loadVoltageV(i, design));
  const maxBurden = Math.max(
    plan ? plan.loadV.reduce((m, v) => Math.max(m, supply - v), 0) : burdenV(peak, design.shuntOhms),
    1e-12,
  );
  // The required minimum load voltage is drawn when it is near enough not to flatten the curve.
  const loadMin =
    design.loadMinV !== undefined && design.loadMinV >= supply - 4 * maxBurden ? design.loadMinV : undefined;
  const vLo = Math.min(supply - maxBurden * 1.15, loadMin !== undefined ? loadMin - maxBurden * 0.1 : Infinity);
  const vHi = supply + maxBurden * 0.1;
  const yVolt = scaleLinear({ domain: [vLo, vHi], range: [vTop + VOLTAGE_H, vTop] });
  const burdenTicks = linearTicks(Math.max(0, supply - vHi), supply - vLo, 3).filter((b) => b >= 0);

  const currentPath = pathOf(series.tS, values, x, yCurrent);
  const loadPath = pathOf(
    series.tS,
    values.map((i, k) => loadAt(i, k)),
    x,
    yVolt,
  );
  const timeTicks = linearTicks(fromS, toS, Math.max(2, Math.floor(plotW / 110)));

  // Drag-select to zoom; without a drag, the pointer reads the nearest point.
  const [drag, setDrag] = useState<{ a: number; b: number } | null>(null);
  const [hover, setHover] = useState<number | null>(null);
  const svgRef = useRef<SVGSVGElement>(null);
  const localX = (e: React.PointerEvent) => {
    const r = svgRef.current!.getBoundingClientRect();
    return Math.min(M.left + plotW, Math.max(M.left, e.clientX - r.left));
  };

  const clipY = yCurrent(design.clipCurrentA);
  const lsbY = yCurrent(design.lsbA);
  const showClip = design.clipCurrentA <= peak * 1.1;

  return (
    <svg
      ref={svgRef}
      width={width}
      height={height}
      role="img"
      aria-label="Current profile: current against time, and the load voltage and burden it gives"
      data-testid="profile-chart"
      className="touch-none select-none"
      onPointerDown={(e) => {
        const px = localX(e);
        setDrag({ a: px, b: px });
        (e.target as Element).setPointerCapture?.(e.pointerId);
      }}
      onPointerMove={(e) => {
        const px = localX(e);
        if (drag) setDrag({ ...drag, b: px });
        else setHover(nearestIndex(series.tS, tOf(px)));
      }}
      onPointerLeave={() => setHover(null)}
      onPointerUp={() => {
        if (drag && Math.abs(drag.b - drag.a) > 4) {
          const [p, q] = drag.a < drag.b ? [drag.a, drag.b] : [drag.b, drag.a];
          onZoom(tOf(p), tOf(q));
        }
        setDrag(null);
      }}
      onPointerCancel={() => setDrag(null)}
    >
      <defs>
        <clipPath id="profile-clip-top">
          <rect x={M.left} y={yTop} width={plotW} height={CURRENT_H} />
        </clipPath>
        <clipPath id="profile-clip-bottom">
          <rect x={M.left} y={vTop} width={plotW} height={VOLTAGE_H} />
        </clipPath>
        {plan && <RangePatterns />}
      </defs>
      {plan && <RangeBands stretches={plan.ranges} x={x} top={yTop} height={CURRENT_H} />}

      {/* Shaded stretches, over both plots. */}
      {series.belowStep.map(([a, b], k) => (
        <g key={`b${k}`} className="fill-warn/15">
          <rect x={x(a)} y={yTop} width={Math.max(1, x(b) - x(a))} height={CURRENT_H} />
        </g>
      ))}
      {series.clipped.map(([a, b], k) => (
        <g key={`c${k}`} className="fill-bad/20">
          <rect x={x(a)} y={yTop} width={Math.max(1, x(b) - x(a))} height={CURRENT_H} />
          <rect x={x(a)} y={vTop} width={Math.max(1, x(b) - x(a))} height={VOLTAGE_H} />
        </g>
      ))}

      {/* Current plot. */}
      <rect x={M.left} y={yTop} width={plotW} height={CURRENT_H} className="fill-none stroke-line" />
      {currentTicks.map((v) => (
        <g key={`ct${v}`}>
          <line
            x1={M.left}
            x2={M.left + plotW}
            y1={yCurrent(v)}
            y2={yCurrent(v)}
            className="stroke-line/60"
            strokeDasharray="2 3"
          />
          <text x={M.left - 6} y={yCurrent(v) + 3} textAnchor="end" className="fill-ink-muted text-[10px]">
            {formatSI(v, "A")}
          </text>
        </g>
      ))}
      <text
        x={12}
        y={yTop + CURRENT_H / 2}
        transform={`rotate(-90 12 ${yTop + CURRENT_H / 2})`}
        textAnchor="middle"
        className="fill-ink-muted text-[11px]"
      >
        Current
      </text>
      <g clipPath="url(#profile-clip-top)">
        {showClip && (
          <line x1={M.left} x2={M.left + plotW} y1={clipY} y2={clipY} className="stroke-bad" strokeDasharray="6 3" />
        )}
        <line x1={M.left} x2={M.left + plotW} y1={lsbY} y2={lsbY} className="stroke-warn" strokeDasharray="6 3" />
        <path d={currentPath} className="fill-none stroke-signal" strokeWidth={1.25} strokeLinejoin="round" />
      </g>
      {showClip && (
        <text x={M.left + plotW + 4} y={clipY + 3} className="fill-bad text-[10px]">
          full scale
        </text>
      )}
      <text x={M.left + plotW + 4} y={lsbY + 3} className="fill-warn text-[10px]">
        1 step
      </text>

      {/* Load voltage plot, burden on the right axis. */}
      <rect x={M.left} y={vTop} width={plotW} height={VOLTAGE_H} className="fill-none stroke-line" />
      {linearTicks(vLo, vHi, 3).map((v) => (
        <text key={`vt${v}`} x={M.left - 6} y={yVolt(v) + 3} textAnchor="end" className="fill-ink-muted text-[10px]">
          {formatSI(v, "V", 4)}
        </text>
      ))}
      {burdenTicks.map((b) => (
        <g key={`bt${b}`}>
          <line
            x1={M.left}
            x2={M.left + plotW}
            y1={yVolt(supply - b)}
            y2={yVolt(supply - b)}
            className="stroke-line/60"
            strokeDasharray="2 3"
          />
          <text x={M.left + plotW + 6} y={yVolt(supply - b) + 3} className="fill-ink-muted text-[10px]">
            {formatSI(b, "V")}
          </text>
        </g>
      ))}
      <text
        x={12}
        y={vTop + VOLTAGE_H / 2}
        transform={`rotate(-90 12 ${vTop + VOLTAGE_H / 2})`}
        textAnchor="middle"
        className="fill-ink-muted text-[11px]"
      >
        Load voltage
      </text>
      <text
        x={width - 8}
        y={vTop + VOLTAGE_H / 2}
        transform={`rotate(90 ${width - 8} ${vTop + VOLTAGE_H / 2})`}
        textAnchor="middle"
        className="fill-ink-muted text-[11px]"
      >
        Burden
      </text>
      <g clipPath="url(#profile-clip-bottom)">
        {loadMin !== undefined && (
          <line
            x1={M.left}
            x2={M.left + plotW}
            y1={yVolt(loadMin)}
            y2={yVolt(loadMin)}
            className="stroke-bad"
            strokeDasharray="6 3"
          />
        )}
        <line
          x1={M.left}
          x2={M.left + plotW}
          y1={yVolt(supply)}
          y2={yVolt(supply)}
          className="stroke-ink-faint"
          strokeDasharray="4 3"
        />
        <path d={loadPath} className="fill-none stroke-copper" strokeWidth={1.25} strokeLinejoin="round" />
      </g>

      {/* Time axis. */}
      {timeTicks.map((t) => (
        <g key={`tt${t}`}>
          <line x1={x(t)} x2={x(t)} y1={vTop + VOLTAGE_H} y2={vTop + VOLTAGE_H + 4} className="stroke-ink-faint" />
          <line x1={x(t)} x2={x(t)} y1={yTop + CURRENT_H} y2={yTop + CURRENT_H + 4} className="stroke-ink-faint" />
          <text x={x(t)} y={vTop + VOLTAGE_H + 16} textAnchor="middle" className="fill-ink-muted text-[10px]">
            {formatSI(t, "s", 4)}
          </text>
        </g>
      ))}
      <text x={M.left + plotW / 2} y={height - 2} textAnchor="middle" className="fill-ink-muted text-[11px]">
        Time
      </text>

      {drag && Math.abs(drag.b - drag.a) > 1 && (
        <rect
          x={Math.min(drag.a, drag.b)}
          y={yTop}
          width={Math.abs(drag.b - drag.a)}
          height={vTop + VOLTAGE_H - yTop}
          className="fill-signal/15 stroke-signal"
          data-testid="zoom-selection"
        />
      )}
      {hover !== null && !drag && series.tS[hover] !== undefined && (
        <HoverReadout
          x={x(series.tS[hover]!)}
          top={yTop}
          bottom={vTop + VOLTAGE_H}
          right={M.left + plotW}
          t={series.tS[hover]!}
          i={series.currentA[hover]!}
          loadV={loadAt(series.currentA[hover]!, hover)}
          range={plan ? plan.rangeAt[hover] : undefined}
        />
      )}
      {/* Catches the pointer over the plots. */}
      <rect
        x={M.left}
        y={yTop}
        width={plotW}
        height={vTop + VOLTAGE_H - yTop}
        fill="transparent"
        className="cursor-crosshair"
      />
    </svg>
  );
}

function HoverReadout({
  x,
  top,
  bottom,
  right,
  t,
  i,
  loadV,
  range,
}: {
  x: number;
  top: number;
  bottom: number;
  right: number;
  t: number;
  i: number;
  loadV: number;
  /** A plan: the range the sample was read on (0-based). */
  range?: number;
}) {
  const text =
    `${formatSI(t, "s", 5)} · ${formatSI(i, "A")} · load ${formatSI(loadV, "V", 4)}` +
    (range !== undefined ? ` · range ${range + 1}` : "");
  const w = text.length * 6 + 12;
  const left = x + 8 + w > right ? x - 8 - w : x + 8;
  return (
    <g pointerEvents="none" data-testid="chart-readout">
      <line x1={x} x2={x} y1={top} y2={bottom} className="stroke-ink-faint" strokeDasharray="2 2" />
      <rect x={left} y={top + 4} width={w} height={18} rx={3} className="fill-panel stroke-line" />
      <text x={left + 6} y={top + 17} className="fill-ink text-[11px]">
        {text}
      </text>
    </g>
  );
}

/** Index of the point nearest in time (points are in time order). */
function nearestIndex(ts: number[], t: number): number | null {
  if (ts.length === 0) return null;
  let lo = 0;
  let hi = ts.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (ts[mid]! < t) lo = mid;
    else hi = mid;
  }
  return Math.abs(ts[lo]! - t) <= Math.abs(ts[hi]! - t) ? lo : hi;
}

function pathOf(ts: number[], vs: number[], x: (t: number) => number, y: (v: number) => number): string {
  let d = "";
  for (let k = 0; k < ts.length; k++) d += `${k === 0 ? "M" : "L"}${x(ts[k]!).toFixed(1)},${y(vs[k]!).toFixed(1)}`;
  return d;
}
