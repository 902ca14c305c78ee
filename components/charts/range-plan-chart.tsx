"use client";
// A multi-range plan drawn on the current axis: each range a bar from its bottom to its top
// current, overlaps visible, the required span marked.
import { scaleLog } from "@visx/scale";
import type { PlanRangeChoice } from "@/lib/design/plan-choice";
import { formatSI } from "@/lib/design/format";
import { logTicks } from "./axes";
import { usePalette } from "./palette";
import { useWidth } from "./use-width";

export function RangePlanChart({
  plan,
  minA,
  maxA,
}: {
  plan: { ranges: PlanRangeChoice[] };
  minA: number;
  maxA: number;
}) {
  const { ref, width } = useWidth<HTMLDivElement>();
  const p = usePalette();
  const rows = plan.ranges.length;
  const rowH = 30;
  const top = 8;
  const left = 96;
  const right = 16;
  const height = top + rows * rowH + 34;
  const lo = minA / 2;
  const hi = maxA * 2;
  const sx = scaleLog({ domain: [lo, hi], range: [left, width - right] });
  const ticks = logTicks(lo, hi, 8);
  return (
    <div ref={ref} data-testid="range-plan-chart" style={{ minHeight: height }}>
      {width > 0 && (
        <svg
          width={width}
          height={height}
          role="img"
          aria-label={`Range plan: ${rows} ranges covering ${formatSI(minA, "A")} to ${formatSI(maxA, "A")}`}
        >
          <rect
            x={sx(minA)}
            y={top - 4}
            width={sx(maxA) - sx(minA)}
            height={rows * rowH + 4}
            fill={p.signal}
            opacity={0.06}
          />
          {ticks.map((t) => (
            <g key={t}>
              <line x1={sx(t)} x2={sx(t)} y1={top - 4} y2={top + rows * rowH} stroke={p.line} strokeWidth={0.5} />
              <text
                x={sx(t)}
                y={top + rows * rowH + 14}
                textAnchor="middle"
                fontSize={10}
                fill={p.muted}
                className="num"
              >
                {formatSI(t, "A", 2)}
              </text>
            </g>
          ))}
          {plan.ranges.map((r, i) => {
            const y = top + i * rowH;
            return (
              <g key={i}>
                <text x={left - 8} y={y + rowH / 2 + 3} textAnchor="end" fontSize={11} fill={p.ink} className="num">
                  {formatSI(r.shuntOhms, "Ω")} × {Number(r.gain.toPrecision(4))}
                </text>
                <rect
                  x={sx(r.minA)}
                  y={y + 5}
                  width={Math.max(2, sx(r.maxA) - sx(r.minA))}
                  height={rowH - 10}
                  rx={2}
                  fill={i % 2 ? p.signal : p.copper}
                  opacity={0.8}
                />
                <text
                  x={sx(Math.sqrt(r.minA * r.maxA))}
                  y={y + rowH / 2 + 3}
                  textAnchor="middle"
                  fontSize={10}
                  fill={p.panel}
                  className="num"
                >
                  {formatSI(r.minA, "A")} – {formatSI(r.maxA, "A")}
                </text>
              </g>
            );
          })}
          <text x={left} y={height - 4} fontSize={10} fill={p.faint}>
            Shaded: the required span {formatSI(minA, "A")} to {formatSI(maxA, "A")}
          </text>
        </svg>
      )}
    </div>
  );
}
