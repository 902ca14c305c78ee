"use client";
// The grid and the two titled axes of an XYChart, in one place for every chart that draws on a
// log current (or burden) axis: a log axis is ticked at decades (and 2, 5 within them on a short
// span, axes.ts logTicks) over its domain, a linear one at round values. Rendered inside
// <XYChart>, whose scales it reads.
import { Axis, Grid } from "@visx/xychart";
import { bottomLabelOffset, leftLabelOffset, logTicks } from "./axes";

export type AxisSpec = {
  label: string;
  tick: (v: number) => string;
  /** A log axis: its domain, for the ticks. Left out: a linear axis. */
  logDomain?: readonly [number, number];
  /** A linear axis: about how many ticks (5 when left out). */
  numTicks?: number;
};

const ticks = (a: AxisSpec) =>
  a.logDomain ? { tickValues: logTicks(a.logDomain[0], a.logDomain[1]) } : { numTicks: a.numTicks ?? 5 };

export function ChartAxes({
  x,
  y,
  gridStroke,
  gridTicks = 6,
}: {
  x: AxisSpec;
  y: AxisSpec;
  /** The grid's colour (the palette's line colour); left out, the chart theme's. */
  gridStroke?: string;
  gridTicks?: number;
}) {
  return (
    <>
      <Grid
        columns
        rows
        numTicks={gridTicks}
        lineStyle={gridStroke ? { stroke: gridStroke, strokeWidth: 0.5 } : { strokeWidth: 0.5 }}
      />
      <Axis
        orientation="bottom"
        labelOffset={bottomLabelOffset}
        label={x.label}
        {...ticks(x)}
        tickFormat={(v: number) => x.tick(v)}
      />
      <Axis
        orientation="left"
        labelOffset={leftLabelOffset}
        label={y.label}
        {...ticks(y)}
        tickFormat={(v: number) => y.tick(v)}
      />
    </>
  );
}
