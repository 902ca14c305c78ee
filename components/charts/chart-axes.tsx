"use client";
// The grid and the two titled axes of an XYChart, in one place for every chart that draws on a
// log current (or burden) axis: a log axis is ticked at decades (and 2, 5 within them on a short
// span, axes.ts logTicks) over its domain, a linear one at round values. Rendered inside
// <XYChart>, whose scales it reads.
import { Axis, DataContext, Grid } from "@visx/xychart";
import { useContext } from "react";
import { bottomLabelOffset, leftLabelOffset, logTicks, thinTicks } from "./axes";

export type AxisSpec = {
  label: string;
  tick: (v: number) => string;
  /** A log axis: its domain, for the ticks. Left out: a linear axis. */
  logDomain?: readonly [number, number];
  /** A linear axis: about how many ticks (5 when left out). */
  numTicks?: number;
};

/** Room one tick label needs along its axis, px ("500 µV" across, a line of text up). */
const LABEL_ACROSS_PX = 58;
const LABEL_UP_PX = 24;

const ticks = (a: AxisSpec, room: number) => {
  const max = Math.max(2, Math.floor(room) + 1);
  return a.logDomain
    ? { tickValues: thinTicks(logTicks(a.logDomain[0], a.logDomain[1]), max) }
    : { numTicks: Math.min(a.numTicks ?? 5, max) };
};

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
  // The plotting area's size, from the chart the axes sit in (0 before it is measured).
  const { innerWidth = 0, innerHeight = 0 } = useContext(DataContext);
  const across = innerWidth > 0 ? innerWidth / LABEL_ACROSS_PX : Infinity;
  const up = innerHeight > 0 ? innerHeight / LABEL_UP_PX : Infinity;
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
        {...ticks(x, across)}
        tickFormat={(v: number) => x.tick(v)}
      />
      <Axis
        orientation="left"
        labelOffset={leftLabelOffset}
        label={y.label}
        {...ticks(y, up)}
        tickFormat={(v: number) => y.tick(v)}
      />
    </>
  );
}
