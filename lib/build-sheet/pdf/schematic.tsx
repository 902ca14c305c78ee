// The front end's schematic in react-pdf's SVG primitives: supply, shunt (with its sense taps on
// the inner terminals), load, amplifier and readout, in the order the requirement's side asks.
// Node names match the netlist (bus, sp, sn, out, 0).
import { Circle, G, Line, Path, Polygon, Rect, Svg, Text } from "@react-pdf/renderer";
import type { Choice, Requirement } from "@/lib/design";
import * as f from "../format";
import { gainResistors, kelvinAdvice, readoutText } from "../parts";
import { colors, LABEL_FONTS } from "./theme";

export const SCHEMATIC_W = 515;
export const SCHEMATIC_H = 232;

type Txt = {
  x: number;
  y: number;
  size?: number;
  anchor?: "start" | "middle" | "end";
  color?: string;
  bold?: boolean;
  children: string;
};

export function Label({ x, y, size = 7.5, anchor = "start", color = colors.ink, bold = false, children }: Txt) {
  // react-pdf's SVG text takes font settings in style (types/react-pdf-svg-text.d.ts).
  const style = { fontFamily: LABEL_FONTS, fontSize: size, fontWeight: bold ? 700 : 400 };
  return (
    <Text x={x} y={y} fill={color} textAnchor={anchor} style={style}>
      {children}
    </Text>
  );
}

const W = { stroke: colors.ink, strokeWidth: 1 };

/** A chain element between y0 and y1 at column x: a shunt or a load. */
function Shunt({ x, y0, y1, ohms }: { x: number; y0: number; y1: number; ohms: number }) {
  const top = y0 + 8;
  const bottom = y1 - 8;
  const tapTop = top + 7;
  const tapBottom = bottom - 7;
  return (
    <G>
      <Line x1={x} y1={y0} x2={x} y2={top} {...W} />
      <Line x1={x} y1={bottom} x2={x} y2={y1} {...W} />
      <Rect
        x={x - 9}
        y={top}
        width={18}
        height={bottom - top}
        fill={colors.copperSoft}
        stroke={colors.copper}
        strokeWidth={1.2}
      />
      {/* Sense taps from the inner terminals, drawn apart from the current leads. */}
      <Line x1={x + 9} y1={tapTop} x2={x + 40} y2={tapTop} stroke={colors.signal} strokeWidth={1} />
      <Line x1={x + 9} y1={tapBottom} x2={x + 40} y2={tapBottom} stroke={colors.signal} strokeWidth={1} />
      <Circle cx={x + 9} cy={tapTop} r={1.6} fill={colors.signal} />
      <Circle cx={x + 9} cy={tapBottom} r={1.6} fill={colors.signal} />
      <Label x={x - 14} y={(top + bottom) / 2 - 3} anchor="end" bold>
        R1
      </Label>
      <Label x={x - 14} y={(top + bottom) / 2 + 6} anchor="end">
        {f.ohms(ohms)}
      </Label>
      <Label x={x - 14} y={(top + bottom) / 2 + 15} anchor="end" size={6.5} color={colors.muted}>
        {kelvinAdvice(ohms) === "part" ? "4-terminal" : "Kelvin pads"}
      </Label>
      <Label x={x + 4} y={y0 + 6} size={6.5} color={colors.muted}>
        sp
      </Label>
      <Label x={x + 4} y={y1 - 1} size={6.5} color={colors.muted}>
        sn
      </Label>
    </G>
  );
}

function Load({ x, y0, y1, label }: { x: number; y0: number; y1: number; label: [string, string] }) {
  const top = y0 + 8;
  const bottom = y1 - 8;
  return (
    <G>
      <Line x1={x} y1={y0} x2={x} y2={top} {...W} />
      <Line x1={x} y1={bottom} x2={x} y2={y1} {...W} />
      <Rect x={x - 20} y={top} width={40} height={bottom - top} fill="#ffffff" stroke={colors.ink} strokeWidth={1} />
      <Label x={x} y={(top + bottom) / 2 + 2} anchor="middle" bold>
        LOAD
      </Label>
      <Label x={x + 26} y={(top + bottom) / 2 - 2} size={6.5} color={colors.muted}>
        {label[0]}
      </Label>
      <Label x={x + 26} y={(top + bottom) / 2 + 7} size={6.5} color={colors.muted}>
        {label[1]}
      </Label>
    </G>
  );
}

export function Schematic({ req, choice }: { req: Requirement; choice: Choice }) {
  const high = req.supply.side === "high";
  const bx = 62; // the supply's column
  const gx = 92; // the ground symbol
  const cx = 150; // the series chain's column
  const yBus = 22;
  const yGnd = 214;
  const yMid = (yBus + yGnd) / 2;
  const a = { y0: yBus + 8, y1: yMid - 4 };
  const b = { y0: yMid + 4, y1: yGnd - 8 };
  const shuntAt = high ? a : b;
  const loadAt = high ? b : a;
  const tapTop = shuntAt.y0 + 15;
  const tapBottom = shuntAt.y1 - 15;
  const ampX = 272;
  const ampCy = (tapTop + tapBottom) / 2;
  const inP = ampCy - 12;
  const inN = ampCy + 12;
  const outX = ampX + 62;
  const readX = 392;
  const pair = gainResistors(req, choice);
  const loadText: [string, string] = [`${req.load.model.replace("-", " ")} load`, `up to ${f.amps(req.current.max)}`];
  return (
    <Svg width={SCHEMATIC_W} height={SCHEMATIC_H} viewBox={`0 0 ${SCHEMATIC_W} ${SCHEMATIC_H}`}>
      {/* Supply and its wires */}
      <Line x1={bx} y1={yBus} x2={cx} y2={yBus} {...W} />
      <Line x1={bx} y1={yGnd} x2={cx} y2={yGnd} {...W} />
      <Line x1={bx} y1={yBus} x2={bx} y2={yMid - 5} {...W} />
      <Line x1={bx} y1={yMid + 5} x2={bx} y2={yGnd} {...W} />
      <Line x1={bx - 14} y1={yMid - 5} x2={bx + 14} y2={yMid - 5} stroke={colors.ink} strokeWidth={1.6} />
      <Line x1={bx - 7} y1={yMid + 5} x2={bx + 7} y2={yMid + 5} stroke={colors.ink} strokeWidth={3} />
      <Label x={bx + 17} y={yMid - 6} size={7}>
        +
      </Label>
      <Label x={bx - 18} y={yMid - 2} anchor="end" bold>
        Supply
      </Label>
      <Label x={bx - 18} y={yMid + 8} anchor="end">
        {f.volts(req.supply.voltage)}
      </Label>
      <Label x={bx + 4} y={yBus - 5} size={6.5} color={colors.muted}>
        bus
      </Label>
      {/* Current direction on the bus wire */}
      <Polygon points={`${bx + 42},${yBus - 3} ${bx + 42},${yBus + 3} ${bx + 48},${yBus}`} fill={colors.ink} />
      <Label x={bx + 52} y={yBus - 5} size={6.5} color={colors.muted}>
        current
      </Label>
      {/* Ground */}
      <Line x1={gx} y1={yGnd} x2={gx} y2={yGnd + 6} {...W} />
      <Line x1={gx - 8} y1={yGnd + 6} x2={gx + 8} y2={yGnd + 6} {...W} />
      <Line x1={gx - 5} y1={yGnd + 9} x2={gx + 5} y2={yGnd + 9} {...W} />
      <Line x1={gx - 2} y1={yGnd + 12} x2={gx + 2} y2={yGnd + 12} {...W} />
      <Label x={gx + 12} y={yGnd + 11} size={6.5} color={colors.muted}>
        0 (ground)
      </Label>
      {/* The series chain */}
      <Line x1={cx} y1={yBus} x2={cx} y2={a.y0} {...W} />
      <Line x1={cx} y1={a.y1} x2={cx} y2={b.y0} {...W} />
      <Line x1={cx} y1={b.y1} x2={cx} y2={yGnd} {...W} />
      <Shunt x={cx} y0={shuntAt.y0} y1={shuntAt.y1} ohms={choice.shuntOhms} />
      <Load x={cx} y0={loadAt.y0} y1={loadAt.y1} label={loadText} />
      {/* Sense pair to the amplifier */}
      <Path
        d={`M ${cx + 49} ${tapTop} L ${ampX - 24} ${tapTop} L ${ampX - 24} ${inP} L ${ampX} ${inP}`}
        stroke={colors.signal}
        strokeWidth={1}
        fill="none"
      />
      <Path
        d={`M ${cx + 49} ${tapBottom} L ${ampX - 16} ${tapBottom} L ${ampX - 16} ${inN} L ${ampX} ${inN}`}
        stroke={colors.signal}
        strokeWidth={1}
        fill="none"
      />
      <Line x1={cx + 40} y1={tapTop} x2={cx + 49} y2={tapTop} stroke={colors.signal} strokeWidth={1} />
      <Line x1={cx + 40} y1={tapBottom} x2={cx + 49} y2={tapBottom} stroke={colors.signal} strokeWidth={1} />
      <Label x={cx + 50} y={tapTop - 3} size={6.5} color={colors.signal}>
        sense +
      </Label>
      <Label x={cx + 50} y={tapBottom + 9} size={6.5} color={colors.signal}>
        sense −
      </Label>
      {/* Amplifier */}
      <Polygon
        points={`${ampX},${ampCy - 30} ${ampX},${ampCy + 30} ${outX},${ampCy}`}
        fill="#ffffff"
        stroke={colors.ink}
        strokeWidth={1.2}
      />
      <Label x={ampX + 4} y={inP + 3} size={8}>
        +
      </Label>
      <Label x={ampX + 4} y={inN + 3} size={8}>
        −
      </Label>
      <Label x={ampX + 14} y={ampCy + 3} bold>
        U1
      </Label>
      <Label x={ampX} y={ampCy + 42} size={7}>
        {`gain ${f.gain(choice.gain)}`}
      </Label>
      {pair ? (
        <Label x={ampX} y={ampCy + 51} size={6.5} color={colors.muted}>
          {`set by R2 ${f.ohms(pair.rfOhms)} / R3 ${f.ohms(pair.rgOhms)}`}
        </Label>
      ) : null}
      <Line x1={ampX + 28} y1={ampCy - 17} x2={ampX + 28} y2={ampCy - 38} {...W} />
      <Label x={ampX + 32} y={ampCy - 33} size={6.5} color={colors.muted}>
        {`${f.volts(req.amplifier.supply)}, C1 to ground`}
      </Label>
      {/* Output to the readout */}
      <Line x1={outX} y1={ampCy} x2={readX} y2={ampCy} {...W} />
      <Circle cx={outX + 20} cy={ampCy} r={1.8} fill={colors.ink} />
      <Label x={outX + 8} y={ampCy - 4} size={6.5} color={colors.muted}>
        out
      </Label>
      <Label x={outX + 26} y={ampCy - 4} size={6.5} color={colors.muted}>
        J1
      </Label>
      <Rect x={readX} y={ampCy - 24} width={120} height={48} fill={colors.sunken} stroke={colors.ink} strokeWidth={1} />
      <Label x={readX + 60} y={ampCy - 8} anchor="middle" bold>
        Readout
      </Label>
      <Label x={readX + 60} y={ampCy + 3} anchor="middle" size={6.5}>
        {readoutText(req).split(", ").slice(0, 2).join(", ")}
      </Label>
      <Label x={readX + 60} y={ampCy + 12} anchor="middle" size={6.5}>
        {readoutText(req).split(", ").slice(2).join(", ")}
      </Label>
      <Label x={SCHEMATIC_W - 2} y={SCHEMATIC_H - 4} anchor="end" size={6.5} color={colors.muted}>
        {high ? "High side: shunt between supply and load" : "Low side: shunt between load and ground"}
      </Label>
    </Svg>
  );
}
