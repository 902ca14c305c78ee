// A range plan's schematic: the load, then one branch per range from the shared node sp (its
// shunt with sense taps to its own amplifier, then its switch), the switches joining to ground on
// the low side or to the load on the high side, and the protection beside the top range's switch.
// Node names match the plan's netlist decks (bus, sp, sn1…, ret or ld, out).
import { Circle, G, Line, Polygon, Rect, Svg } from "@react-pdf/renderer";
import { resistorCode, type PlanRangeMetrics, type Requirement } from "@/lib/design";
import * as f from "../format";
import { planDesignators } from "../plan-parts";
import { Label } from "./schematic";
import { colors } from "./theme";

export const PLAN_SCHEMATIC_W = 515;
export const PLAN_SCHEMATIC_H = 270;

const W = { stroke: colors.ink, strokeWidth: 1 };

function LoadBox({ x, y, text }: { x: number; y: number; text: string }) {
  return (
    <G>
      <Rect x={x - 20} y={y} width={40} height={26} fill="#ffffff" stroke={colors.ink} strokeWidth={1} />
      <Label x={x} y={y + 16} anchor="middle" bold>
        LOAD
      </Label>
      <Label x={x + 26} y={y + 16} size={6.5} color={colors.muted}>
        {text}
      </Label>
    </G>
  );
}

/** One range's branch: shunt from yTop, switch below it, down to yBottom; its amplifier to the right. */
function Branch({
  x,
  yTop,
  yBottom,
  k,
  r,
  n,
}: {
  x: number;
  yTop: number;
  yBottom: number;
  k: number;
  r: PlanRangeMetrics;
  n: number;
}) {
  const d = planDesignators(n);
  const sTop = yTop + 8;
  const sBottom = yTop + 58;
  const tapTop = sTop + 6;
  const tapBottom = sBottom - 6;
  const swTop = sBottom + 16;
  const swBottom = swTop + 22;
  const ampX = x + 36;
  const ampCy = (tapTop + tapBottom) / 2;
  return (
    <G>
      <Line x1={x} y1={yTop} x2={x} y2={sTop} {...W} />
      <Rect
        x={x - 8}
        y={sTop}
        width={16}
        height={sBottom - sTop}
        fill={colors.copperSoft}
        stroke={colors.copper}
        strokeWidth={1.2}
      />
      <Label x={x - 11} y={sTop + 14} anchor="end" bold>
        {d.shunt(k)}
      </Label>
      <Label x={x - 11} y={sTop + 23} anchor="end" size={6.5}>
        {f.ohms(r.shuntOhms)}
      </Label>
      <Label x={x - 11} y={sTop + 31} anchor="end" size={6.5} color={colors.muted}>
        {resistorCode(r.shuntOhms)}
      </Label>
      {/* Sense taps to this range's own amplifier. */}
      <Line x1={x + 8} y1={tapTop} x2={ampX} y2={tapTop} stroke={colors.signal} strokeWidth={1} />
      <Line x1={x + 8} y1={tapBottom} x2={ampX} y2={tapBottom} stroke={colors.signal} strokeWidth={1} />
      <Circle cx={x + 8} cy={tapTop} r={1.5} fill={colors.signal} />
      <Circle cx={x + 8} cy={tapBottom} r={1.5} fill={colors.signal} />
      <Polygon
        points={`${ampX},${ampCy - 20} ${ampX},${ampCy + 20} ${ampX + 30},${ampCy}`}
        fill="#ffffff"
        stroke={colors.ink}
        strokeWidth={1.1}
      />
      <Label x={ampX + 3} y={ampCy + 3} size={7} bold>
        {d.amplifier(k)}
      </Label>
      <Line x1={ampX + 30} y1={ampCy} x2={ampX + 40} y2={ampCy} {...W} />
      <Label x={ampX + 32} y={ampCy - 4} size={6.5} color={colors.muted}>
        {`OUT${k + 1}`}
      </Label>
      <Label x={ampX} y={ampCy + 31} size={6.5}>
        {`gain ${f.gain(r.gain)}`}
      </Label>
      {/* The range switch: an open contact drawn as a lever, its gate from the switching logic. */}
      <Line x1={x} y1={sBottom} x2={x} y2={swTop} {...W} />
      <Circle cx={x} cy={swTop} r={1.8} fill={colors.ink} />
      <Line x1={x} y1={swTop} x2={x + 9} y2={swBottom - 3} {...W} />
      <Circle cx={x} cy={swBottom} r={1.8} fill={colors.ink} />
      <Line x1={x} y1={swBottom} x2={x} y2={yBottom} {...W} />
      <Label x={x - 6} y={swTop + 10} anchor="end" bold>
        {d.switch(k)}
      </Label>
      <Label x={x - 6} y={swTop + 19} anchor="end" size={6.5} color={colors.muted}>
        {`≤ ${f.ohms(r.switchOhms)}`}
      </Label>
      <Label x={x - 6} y={swTop + 28} anchor="end" size={6.5} color={colors.muted}>
        {`gate G${k + 1}`}
      </Label>
      <Label x={x + 3} y={yTop + 6} size={6} color={colors.muted}>
        sp
      </Label>
      <Label x={x + 3} y={sBottom + 9} size={6} color={colors.muted}>
        {`sn${k + 1}`}
      </Label>
    </G>
  );
}

export function PlanSchematic({ req, ranges }: { req: Requirement; ranges: PlanRangeMetrics[] }) {
  const n = ranges.length;
  const d = planDesignators(n);
  const high = req.supply.side === "high";
  const bx = 40;
  const yBus = 18;
  const yGnd = 252;
  const loadX = 100;
  const first = 140;
  const step = n === 2 ? 170 : 130;
  const xs = ranges.map((_, k) => first + k * step);
  const lastX = xs[n - 1]!;
  // Low side: bus → load → sp rail → branches → ground. High side: bus → sp rail → branches → ld rail → load → ground.
  const yLoadTop = high ? 196 : 34;
  const ySp = high ? 40 : 84;
  const yJoin = high ? 176 : 226;
  const loadText = `up to ${f.amps(req.current.max)}`;
  // Right of the top range's switch, under its amplifier.
  const protX = lastX + 18;
  const protY = ySp + 84;
  return (
    <Svg width={PLAN_SCHEMATIC_W} height={PLAN_SCHEMATIC_H} viewBox={`0 0 ${PLAN_SCHEMATIC_W} ${PLAN_SCHEMATIC_H}`}>
      {/* Supply */}
      <Line x1={bx} y1={yBus} x2={loadX} y2={yBus} {...W} />
      <Line x1={bx} y1={yBus} x2={bx} y2={126} {...W} />
      <Line x1={bx} y1={136} x2={bx} y2={yGnd} {...W} />
      <Line x1={bx - 12} y1={126} x2={bx + 12} y2={126} stroke={colors.ink} strokeWidth={1.6} />
      <Line x1={bx - 6} y1={136} x2={bx + 6} y2={136} stroke={colors.ink} strokeWidth={3} />
      <Label x={bx - 15} y={129} anchor="end" bold>
        Supply
      </Label>
      <Label x={bx - 15} y={139} anchor="end">
        {f.volts(req.supply.voltage)}
      </Label>
      <Label x={bx + 4} y={yBus - 4} size={6.5} color={colors.muted}>
        bus
      </Label>
      <Line x1={bx} y1={yGnd} x2={high ? loadX : lastX} y2={yGnd} {...W} />
      <Label x={bx + 4} y={yGnd + 10} size={6.5} color={colors.muted}>
        0 (ground)
      </Label>
      {/* Load and the shared node */}
      <Line x1={loadX} y1={yBus} x2={loadX} y2={high ? ySp : yLoadTop} {...W} />
      {high ? (
        <G>
          <Line x1={loadX} y1={yJoin} x2={loadX} y2={yLoadTop} {...W} />
          <LoadBox x={loadX} y={yLoadTop} text={loadText} />
          <Line x1={loadX} y1={yLoadTop + 26} x2={loadX} y2={yGnd} {...W} />
        </G>
      ) : (
        <G>
          <LoadBox x={loadX} y={yLoadTop} text={loadText} />
          <Line x1={loadX} y1={yLoadTop + 26} x2={loadX} y2={ySp} {...W} />
        </G>
      )}
      <Line x1={loadX} y1={ySp} x2={lastX} y2={ySp} {...W} />
      <Line x1={high ? loadX : xs[0]!} y1={yJoin} x2={lastX} y2={yJoin} {...W} />
      {high ? null : <Line x1={lastX} y1={yJoin} x2={lastX} y2={yGnd} {...W} />}
      <Label x={lastX + 4} y={yJoin + 9} size={6} color={colors.muted}>
        {high ? "ld" : "ret"}
      </Label>
      {ranges.map((r, k) => (
        <Branch key={k} x={xs[k]!} yTop={ySp} yBottom={yJoin} k={k} r={r} n={n} />
      ))}
      {/* Protection beside the top range's switch */}
      <Rect x={protX} y={protY - 10} width={82} height={26} fill={colors.badSoft} stroke={colors.bad} strokeWidth={1} />
      <Label x={protX + 40} y={protY} anchor="middle" size={7} bold color={colors.bad}>
        {`${d.protection} protection`}
      </Label>
      <Label x={protX + 40} y={protY + 10} anchor="middle" size={6.5}>
        {`closes ${d.switch(n - 1)} at ${f.volts(req.drop.max)}`}
      </Label>
      <Line
        x1={protX}
        y1={protY + 4}
        x2={lastX + 6}
        y2={protY + 4}
        stroke={colors.bad}
        strokeWidth={0.8}
        strokeDasharray="3 2"
      />
      <Label x={PLAN_SCHEMATIC_W - 2} y={PLAN_SCHEMATIC_H - 2} anchor="end" size={6.5} color={colors.muted}>
        {high
          ? "High side: one switched shunt per range between the supply and the load"
          : "Low side: one switched shunt per range between the load and ground"}
      </Label>
    </Svg>
  );
}
