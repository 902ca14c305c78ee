"use client";
// The grid, tick labels and axis titles of a plain-SVG chart with current on a log x axis; the
// chart draws its own curves inside. Shared by the plan's charts and the meter comparison.
import { formatSI } from "@/lib/design/format";
import type { Palette } from "./palette";

export type Frame = { left: number; top: number; width: number; height: number; total: number };

export function SvgFrame({
  frame: f,
  palette: p,
  xTicks,
  yTicks,
  sx,
  sy,
  yTick,
  xTitle,
  yTitle,
}: {
  frame: Frame;
  palette: Palette;
  xTicks: number[];
  yTicks: number[];
  sx: (a: number) => number;
  sy: (v: number) => number;
  yTick: (v: number) => string;
  xTitle: string;
  yTitle: string;
}) {
  return (
    <>
      {xTicks.map((t) => (
        <g key={`x${t}`}>
          <line x1={sx(t)} x2={sx(t)} y1={f.top} y2={f.top + f.height} stroke={p.line} strokeWidth={0.5} />
          <text x={sx(t)} y={f.top + f.height + 13} textAnchor="middle" fontSize={10} fill={p.muted} className="num">
            {formatSI(t, "A", 2)}
          </text>
        </g>
      ))}
      {yTicks.map((t) => (
        <g key={`y${t}`}>
          <line x1={f.left} x2={f.left + f.width} y1={sy(t)} y2={sy(t)} stroke={p.line} strokeWidth={0.5} />
          <text x={f.left - 4} y={sy(t) + 3} textAnchor="end" fontSize={10} fill={p.muted} className="num">
            {yTick(t)}
          </text>
        </g>
      ))}
      <text x={f.left + f.width / 2} y={f.total - 4} textAnchor="middle" fontSize={10} fill={p.muted}>
        {xTitle}
      </text>
      <text
        transform={`translate(12 ${f.top + f.height / 2}) rotate(-90)`}
        textAnchor="middle"
        fontSize={10}
        fill={p.muted}
      >
        {yTitle}
      </text>
    </>
  );
}
