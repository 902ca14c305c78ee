"use client";
// A range plan drawn as one instrument: each range's curve over its own stretch of current, the
// switch points (up: solid, down: dashed) and the hysteresis band between them shaded. Ranges
// differ by Okabe–Ito hue, by dash pattern and by a numbered label, never by colour alone.
import { scaleLinear, scaleLog } from "@visx/scale";
import { useId } from "react";
import type { PlanStretchPoint, PlanStretches } from "@/lib/design/plan-stretches";
import { formatPercent, formatSI } from "@/lib/design/format";
import { logDomain, logTicks } from "./axes";
import { budgetColours, usePalette } from "./palette";
import { SvgFrame } from "./svg-frame";
import { useWidth } from "./use-width";

/** Per range: an Okabe–Ito hue (blue, vermillion, bluish green) and a dash pattern. */
export const planRangeStyles = [
  { colour: budgetColours.light[0], dash: undefined, dashLabel: "solid" },
  { colour: budgetColours.light[4], dash: "7 4", dashLabel: "long dashes" },
  { colour: budgetColours.light[2], dash: "2 3", dashLabel: "dots" },
] as const;

export type PlanStretchKind = "error" | "burden" | "load";

const HEIGHT = 230;
const M = { top: 14, right: 14, bottom: 40, left: 70 };

const spec: Record<
  PlanStretchKind,
  { title: string; axis: string; value: (q: PlanStretchPoint) => number; log: boolean; tick: (v: number) => string }
> = {
  error: {
    title: "Worst-case error across the span",
    axis: "Error, % of reading",
    value: (q) => q.worstPercent,
    log: true,
    tick: (v) => formatPercent(v / 100, 2),
  },
  burden: {
    title: "Drop across the range in use (shunt and switch)",
    axis: "Drop",
    value: (q) => q.burdenV,
    log: true,
    tick: (v) => formatSI(v, "V", 2),
  },
  load: {
    title: "Voltage left at the load",
    axis: "Voltage at the load",
    value: (q) => q.loadVoltageV,
    log: false,
    tick: (v) => formatSI(v, "V", 3),
  },
};

export function PlanStretchChart({ curves, kind }: { curves: PlanStretches; kind: PlanStretchKind }) {
  const { ref, width } = useWidth<HTMLDivElement>();
  const p = usePalette();
  const clipId = `plan-clip-${useId().replace(/:/g, "")}`;
  const s = spec[kind];
  const all = curves.ranges.flatMap((r) => r.points);
  const xd = logDomain(
    all.map((q) => q.currentA),
    0.05,
  );
  // Error grows without bound toward zero current: the axis stops at 100 % (or 20× the target).
  const limitLine =
    kind === "error" ? curves.accuracyPercent : kind === "burden" ? curves.dropMaxV : (curves.loadMinV ?? null);
  const values = all.map(s.value).filter((v) => Number.isFinite(v));
  let yd: [number, number];
  if (kind === "error") {
    const ceiling = Math.max(100, 20 * curves.accuracyPercent);
    yd = logDomain([...values.map((v) => Math.min(v, ceiling)), curves.accuracyPercent]);
  } else if (kind === "burden") yd = logDomain([...values.filter((v) => v > 0), curves.dropMaxV]);
  else {
    const lo = Math.min(...values, curves.loadMinV ?? curves.supplyV);
    yd = [Math.max(0, lo - 0.04 * curves.supplyV), curves.supplyV * 1.01];
  }
  const w = Math.max(0, width - M.left - M.right);
  const h = HEIGHT - M.top - M.bottom;
  const sx = scaleLog({ domain: xd, range: [M.left, M.left + w] });
  const ys = (s.log ? scaleLog : scaleLinear)({ domain: yd, range: [M.top + h, M.top] });
  const sy = (v: number) => ys(v);
  const yTicks = s.log ? logTicks(yd[0], yd[1], 6) : scaleLinear({ domain: yd }).ticks(5);
  const xTicks = logTicks(xd[0], xd[1], width < 480 ? 4 : 8);
  const path = (pts: PlanStretchPoint[]) =>
    pts
      .filter((q) => Number.isFinite(s.value(q)) && (!s.log || s.value(q) > 0))
      .map((q, i) => `${i === 0 ? "M" : "L"}${sx(q.currentA).toFixed(1)},${sy(s.value(q)).toFixed(1)}`)
      .join(" ");
  const label = `${s.title}: ${curves.ranges.length} ranges, switch points at ${curves.switchPoints
    .map((sp) => `${formatSI(sp.upA, "A")} up, ${formatSI(sp.downA, "A")} down`)
    .join("; ")}`;
  return (
    <figure className="flex min-w-0 flex-col gap-1" data-testid={`plan-${kind}-chart`}>
      <figcaption className="text-2xs font-medium text-ink-muted">{s.title}</figcaption>
      <div ref={ref} style={{ height: HEIGHT }}>
        {width > 0 && (
          <svg width={width} height={HEIGHT} role="img" aria-label={label}>
            <defs>
              <clipPath id={clipId}>
                <rect x={M.left} y={M.top} width={w} height={h} />
              </clipPath>
            </defs>
            {curves.switchPoints.map((sp, k) => (
              <g key={k}>
                <rect
                  x={sx(sp.downA)}
                  y={M.top}
                  width={Math.max(1, sx(sp.upA) - sx(sp.downA))}
                  height={h}
                  fill={p.muted}
                  opacity={0.12}
                />
                <line x1={sx(sp.upA)} x2={sx(sp.upA)} y1={M.top} y2={M.top + h} stroke={p.ink} strokeWidth={1} />
                <line
                  x1={sx(sp.downA)}
                  x2={sx(sp.downA)}
                  y1={M.top}
                  y2={M.top + h}
                  stroke={p.ink}
                  strokeWidth={1}
                  strokeDasharray="3 3"
                />
                <text x={sx(sp.upA) + 2} y={M.top + 9} fontSize={9} fill={p.ink} className="num">
                  S{k + 1}
                </text>
              </g>
            ))}
            <SvgFrame
              frame={{ left: M.left, top: M.top, width: w, height: h, total: HEIGHT }}
              palette={p}
              xTicks={xTicks}
              yTicks={yTicks}
              sx={sx}
              sy={sy}
              yTick={s.tick}
              xTitle="Current"
              yTitle={s.axis}
            />
            {kind === "load" && (
              <line
                x1={M.left}
                x2={M.left + w}
                y1={sy(curves.supplyV)}
                y2={sy(curves.supplyV)}
                stroke={p.faint}
                strokeDasharray="2 3"
              />
            )}
            {limitLine !== null && (
              <line
                x1={kind === "error" ? Math.max(M.left, sx(curves.bandMinA)) : M.left}
                x2={kind === "error" ? Math.min(M.left + w, sx(curves.bandMaxA)) : M.left + w}
                y1={sy(limitLine)}
                y2={sy(limitLine)}
                stroke={p.bad}
                strokeWidth={1.5}
                strokeDasharray="8 3 2 3"
              />
            )}
            <g clipPath={`url(#${clipId})`}>
              {curves.ranges.map((r) => {
                const st = planRangeStyles[r.index % planRangeStyles.length]!;
                const mid = r.points[Math.floor(r.points.length / 2)];
                const v = mid ? s.value(mid) : Number.NaN;
                return (
                  <g key={r.index}>
                    <path d={path(r.points)} fill="none" stroke={st.colour} strokeWidth={2} strokeDasharray={st.dash} />
                    {mid && Number.isFinite(v) && (!s.log || v > 0) && (
                      <text
                        x={sx(mid.currentA)}
                        y={sy(v) - 5}
                        textAnchor="middle"
                        fontSize={10}
                        fontWeight={600}
                        fill={st.colour}
                      >
                        {r.index + 1}
                      </text>
                    )}
                  </g>
                );
              })}
            </g>
          </svg>
        )}
      </div>
    </figure>
  );
}

/** One legend for the three plan charts: ranges by hue, dash and number; switch points; limits. */
export function PlanStretchLegend({ curves }: { curves: PlanStretches }) {
  const p = usePalette();
  return (
    <ul className="flex flex-wrap gap-x-4 gap-y-1 text-2xs text-ink-muted" aria-label="Legend">
      {curves.ranges.map((r) => {
        const st = planRangeStyles[r.index % planRangeStyles.length]!;
        return (
          <li key={r.index} className="flex items-center gap-1">
            <svg width={22} height={8} aria-hidden>
              <line x1={0} x2={22} y1={4} y2={4} stroke={st.colour} strokeWidth={2} strokeDasharray={st.dash} />
            </svg>
            <span className="num">
              Range {r.index + 1} ({st.dashLabel}): {formatSI(r.shuntOhms, "Ω")} × {Number(r.gain.toPrecision(4))},{" "}
              {formatSI(r.minA, "A")} – {formatSI(r.maxA, "A")}
            </span>
          </li>
        );
      })}
      <li className="flex items-center gap-1">
        <span className="inline-block h-2.5 w-4" style={{ background: p.muted, opacity: 0.25 }} aria-hidden />
        {curves.switchPoints.map((_, k) => `S${k + 1}`).join(", ")}: switch up (solid line) and back down (dashed);
        shaded between, the hysteresis band where either range may be in use
      </li>
      <li className="flex items-center gap-1">
        <svg width={22} height={8} aria-hidden>
          <line x1={0} x2={22} y1={4} y2={4} stroke={p.bad} strokeWidth={1.5} strokeDasharray="8 3 2 3" />
        </svg>
        limits: accuracy target {formatPercent(curves.accuracyPercent / 100)} over its band, allowed drop{" "}
        {formatSI(curves.dropMaxV, "V")}
        {curves.loadMinV !== undefined ? `, load minimum ${formatSI(curves.loadMinV, "V")}` : ""}; supply{" "}
        {formatSI(curves.supplyV, "V")} dotted
      </li>
    </ul>
  );
}
