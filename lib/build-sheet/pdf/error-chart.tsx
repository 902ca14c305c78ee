// Error versus current on log–log axes, from the engine's errorCurve: worst case and RSS, with
// the accuracy target over its band. Offset-type terms rise to the left, gain-type terms set the floor.
import { G, Line, Path, Rect, Svg, Text } from "@react-pdf/renderer";
import { formatSI, type ErrorCurvePoint, type Requirement } from "@/lib/design";
import * as f from "../format";
import { colors, LABEL_FONTS } from "./theme";

export const CHART_W = 515;
export const CHART_H = 170;
const M = { left: 44, right: 110, top: 10, bottom: 26 };

function decades(lo: number, hi: number): number[] {
  const out: number[] = [];
  for (let e = Math.floor(Math.log10(lo)); e <= Math.ceil(Math.log10(hi)); e++) {
    const v = 10 ** e;
    if (v >= lo * (1 - 1e-9) && v <= hi * (1 + 1e-9)) out.push(v);
  }
  return out;
}

function T({
  x,
  y,
  anchor = "start",
  color = colors.muted,
  size = 6.5,
  children,
}: {
  x: number;
  y: number;
  anchor?: "start" | "middle" | "end";
  color?: string;
  size?: number;
  children: string;
}) {
  const style = { fontFamily: LABEL_FONTS, fontSize: size };
  return (
    <Text x={x} y={y} fill={color} textAnchor={anchor} style={style}>
      {children}
    </Text>
  );
}

export function ErrorChart({ req, curve }: { req: Requirement; curve: ErrorCurvePoint[] }) {
  const pts = curve.filter((p) => Number.isFinite(p.worstPercent) && p.worstPercent > 0 && p.rssPercent > 0);
  if (pts.length < 2) return null;
  // A signed span arrives folded by magnitude (curveByMagnitude): its axis runs over |I|, since log
  // axes cannot show a sign; a one-way span keeps its own ends.
  const signed = req.current.min < 0;
  const xLo = signed ? pts[0]!.currentA : req.current.min;
  const xHi = signed ? pts.at(-1)!.currentA : req.current.max;
  const target = req.accuracy.percent;
  const yVals = pts.flatMap((p) => [p.worstPercent, p.rssPercent]).concat(target);
  // Whole decades on the y axis so the grid reads at a glance.
  const yLo = 10 ** Math.floor(Math.log10(Math.min(...yVals)));
  const yHi = 10 ** Math.ceil(Math.log10(Math.max(...yVals)));
  const w = CHART_W - M.left - M.right;
  const h = CHART_H - M.top - M.bottom;
  const sx = (v: number) =>
    M.left + (xHi === xLo ? 0 : ((Math.log10(v) - Math.log10(xLo)) / (Math.log10(xHi) - Math.log10(xLo))) * w);
  const sy = (v: number) => M.top + h - ((Math.log10(v) - Math.log10(yLo)) / (Math.log10(yHi) - Math.log10(yLo))) * h;
  const line = (key: "worstPercent" | "rssPercent") =>
    pts.map((p, i) => `${i === 0 ? "M" : "L"} ${sx(p.currentA).toFixed(2)} ${sy(p[key]).toFixed(2)}`).join(" ");
  const xTicks = decades(xLo, xHi);
  const yTicks = decades(yLo, yHi);
  const legendX = M.left + w + 12;
  return (
    <Svg width={CHART_W} height={CHART_H} viewBox={`0 0 ${CHART_W} ${CHART_H}`}>
      <Rect x={M.left} y={M.top} width={w} height={h} fill="#ffffff" stroke={colors.line} strokeWidth={0.8} />
      {yTicks.map((v) => (
        <G key={`y${v}`}>
          <Line x1={M.left} y1={sy(v)} x2={M.left + w} y2={sy(v)} stroke={colors.line} strokeWidth={0.5} />
          <T x={M.left - 4} y={sy(v) + 2.5} anchor="end">
            {f.percent(v)}
          </T>
        </G>
      ))}
      {xTicks.map((v) => (
        <G key={`x${v}`}>
          <Line x1={sx(v)} y1={M.top} x2={sx(v)} y2={M.top + h} stroke={colors.line} strokeWidth={0.5} />
          <T x={sx(v)} y={M.top + h + 10} anchor="middle">
            {formatSI(v, "A")}
          </T>
        </G>
      ))}
      <T x={M.left} y={M.top + h + 10} anchor="middle" color={colors.ink}>
        {xTicks[0] && Math.abs(sx(xTicks[0]) - M.left) < 18 ? "" : f.amps(xLo)}
      </T>
      <T x={M.left + w} y={M.top + h + 10} anchor="middle" color={colors.ink}>
        {xTicks.at(-1) && Math.abs(sx(xTicks.at(-1)!) - (M.left + w)) < 18 ? "" : f.amps(xHi)}
      </T>
      <T x={M.left + w / 2} y={CHART_H - 3} anchor="middle" color={colors.ink}>
        {signed ? "Current, either direction (log scale)" : "Current (log scale)"}
      </T>
      {/* The accuracy target over its band */}
      <Line
        x1={sx(Math.max(xLo, req.accuracy.bandMin))}
        y1={sy(target)}
        x2={sx(Math.min(xHi, req.accuracy.bandMax))}
        y2={sy(target)}
        stroke={colors.bad}
        strokeWidth={1}
        strokeDasharray="4 3"
      />
      <Path d={line("rssPercent")} stroke={colors.signal} strokeWidth={1.2} strokeDasharray="3 2" fill="none" />
      <Path d={line("worstPercent")} stroke={colors.copper} strokeWidth={1.6} fill="none" />
      <Line x1={legendX} y1={M.top + 8} x2={legendX + 16} y2={M.top + 8} stroke={colors.copper} strokeWidth={1.6} />
      <T x={legendX + 20} y={M.top + 10.5} color={colors.ink}>
        Worst case
      </T>
      <Line
        x1={legendX}
        y1={M.top + 22}
        x2={legendX + 16}
        y2={M.top + 22}
        stroke={colors.signal}
        strokeWidth={1.2}
        strokeDasharray="3 2"
      />
      <T x={legendX + 20} y={M.top + 24.5} color={colors.ink}>
        RSS
      </T>
      <Line
        x1={legendX}
        y1={M.top + 36}
        x2={legendX + 16}
        y2={M.top + 36}
        stroke={colors.bad}
        strokeWidth={1}
        strokeDasharray="4 3"
      />
      <T x={legendX + 20} y={M.top + 38.5} color={colors.ink}>
        {`Target ${f.percent(target)}`}
      </T>
      <T x={legendX} y={M.top + 56}>
        % of reading,
      </T>
      <T x={legendX} y={M.top + 65}>
        log scale
      </T>
    </Svg>
  );
}
