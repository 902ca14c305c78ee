"use client";
// A straight reference line across a chart: a limit the design must respect (the allowed drop, the
// load's minimum voltage, the accuracy target, a unit's accept band) or a marker (the supply, the
// present operating point). Drawn as a two-point series so it uses the chart's own scales; it
// takes no pointer events, so tooltips keep to the data.
import { LineSeries } from "@visx/xychart";

type Point = { x: number; y: number };

export type LimitLineProps = {
  /** The series key, unique in its chart (also what a screen reader is told). */
  name: string;
  /** "horizontal": y = at, from x = span[0] to span[1]; "vertical": x = at, over y = span. */
  direction?: "horizontal" | "vertical";
  at: number;
  span: readonly [number, number];
  stroke: string;
  /** SVG dash pattern; a limit is dashed, a marker dotted. */
  dash?: string;
  strokeWidth?: number;
};

const x = (d: Point) => d.x;
const y = (d: Point) => d.y;

export function LimitLine({
  name,
  direction = "horizontal",
  at,
  span,
  stroke,
  dash = "5 3",
  strokeWidth = 2,
}: LimitLineProps) {
  const data: Point[] =
    direction === "horizontal"
      ? [
          { x: span[0], y: at },
          { x: span[1], y: at },
        ]
      : [
          { x: at, y: span[0] },
          { x: at, y: span[1] },
        ];
  return (
    <LineSeries
      dataKey={name}
      data={data}
      xAccessor={x}
      yAccessor={y}
      stroke={stroke}
      strokeDasharray={dash}
      strokeWidth={strokeWidth}
      enableEvents={false}
    />
  );
}
