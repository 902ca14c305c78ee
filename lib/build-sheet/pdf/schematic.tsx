// The front end's schematic in react-pdf's SVG primitives: supply, shunt (with its sense taps on
// the inner terminals), load, amplifier and readout, in the order the requirement's side asks.
// Node names match the netlist (bus, sp, sn, out, 0).
import { Circle, G, Line, Path, Polygon, Rect, Svg, Text } from "@react-pdf/renderer";
import type { Choice, Requirement } from "@/lib/design";
import * as f from "../format";
import { traceLengthOf } from "@/lib/design/front-end";
import { gainResistors, kelvinAdvice, partsList, readoutText } from "../parts";
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
/** `trace`: a copper-trace shunt's width and sensed length (m), drawn as a bare copper run. */
function Shunt({
  x,
  y0,
  y1,
  ohms,
  trace,
}: {
  x: number;
  y0: number;
  y1: number;
  ohms: number;
  trace: { width: number; length: number } | null;
}) {
  const top = y0 + 8;
  const bottom = y1 - 8;
  const tapTop = top + 7;
  const tapBottom = bottom - 7;
  const edge = trace ? 4 : 9;
  return (
    <G>
      <Line x1={x} y1={y0} x2={x} y2={top} {...W} />
      <Line x1={x} y1={bottom} x2={x} y2={y1} {...W} />
      {trace ? (
        // A copper run, not a part: a narrow solid bar the width of the wire's copper.
        <Rect x={x - 4} y={top} width={8} height={bottom - top} fill={colors.copper} stroke={colors.copper} />
      ) : (
        <Rect
          x={x - 9}
          y={top}
          width={18}
          height={bottom - top}
          fill={colors.copperSoft}
          stroke={colors.copper}
          strokeWidth={1.2}
        />
      )}
      {/* Sense taps from the inner terminals, drawn apart from the current leads. */}
      <Line x1={x + edge} y1={tapTop} x2={x + 40} y2={tapTop} stroke={colors.signal} strokeWidth={1} />
      <Line x1={x + edge} y1={tapBottom} x2={x + 40} y2={tapBottom} stroke={colors.signal} strokeWidth={1} />
      <Circle cx={x + edge} cy={tapTop} r={1.6} fill={colors.signal} />
      <Circle cx={x + edge} cy={tapBottom} r={1.6} fill={colors.signal} />
      {trace ? (
        <G>
          <Label x={x + edge + 3} y={tapTop + 8} size={6} color={colors.signal}>
            Kelvin tap A
          </Label>
          <Label x={x + edge + 3} y={tapBottom - 3} size={6} color={colors.signal}>
            Kelvin tap B
          </Label>
        </G>
      ) : null}
      <Label x={x - 14} y={(top + bottom) / 2 - 3} anchor="end" bold>
        R1
      </Label>
      <Label x={x - 14} y={(top + bottom) / 2 + 6} anchor="end">
        {f.ohms(ohms)}
      </Label>
      <Label x={x - 14} y={(top + bottom) / 2 + 15} anchor="end" size={6.5} color={colors.muted}>
        {trace ? "copper trace" : kelvinAdvice(ohms) === "part" ? "4-terminal" : "Kelvin pads"}
      </Label>
      {trace ? (
        <G>
          <Label x={x - 14} y={(top + bottom) / 2 + 23} anchor="end" size={6.5} color={colors.muted}>
            {`${f.formatLength(trace.width)} wide,`}
          </Label>
          <Label x={x - 14} y={(top + bottom) / 2 + 31} anchor="end" size={6.5} color={colors.muted}>
            {`taps ${f.formatLength(trace.length)} apart`}
          </Label>
        </G>
      ) : null}
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

type FilterLegs = { r: [string, string]; c: [string, string]; ohms: number; farads: number };

/** The filter's designators as the parts list numbers them, so the drawing and the list agree. */
function filterDesignators(req: Requirement, choice: Choice): FilterLegs | null {
  const flt = req.inputFilter;
  if (!flt) return null;
  const parts = partsList(req, choice);
  const rs = parts.filter((p) => p.part.startsWith("Input filter resistor")).map((p) => p.designator);
  const cs = parts.filter((p) => p.part.startsWith("Ceramic capacitor, C0G")).map((p) => p.designator);
  if (rs.length !== 2 || cs.length !== 2) return null;
  return { r: [rs[0]!, rs[1]!], c: [cs[0]!, cs[1]!], ohms: flt.resistance, farads: flt.capacitance };
}

/** Each sense leg's series R and its C to ground, drawn on the leg between the taps and U1. */
function InputFilterLegs({ x0, yP, yN, filter }: { x0: number; yP: number; yN: number; filter: FilterLegs }) {
  const rW = 16;
  const cX = x0 + rW + 8;
  const leg = (y: number, k: 0 | 1, dir: -1 | 1) => {
    const plate = y + dir * 9;
    const gnd = y + dir * 16;
    return (
      <G key={k}>
        <Rect x={x0} y={y - 3} width={rW} height={6} fill="#ffffff" stroke={colors.ink} strokeWidth={0.9} />
        <Label x={x0 + rW / 2} y={y + (dir < 0 ? 9 : -5)} anchor="middle" size={6}>
          {filter.r[k]}
        </Label>
        <Circle cx={cX} cy={y} r={1.3} fill={colors.signal} />
        <Line x1={cX} y1={y} x2={cX} y2={plate} {...W} />
        <Line x1={cX - 5} y1={plate} x2={cX + 5} y2={plate} stroke={colors.ink} strokeWidth={1.2} />
        <Line x1={cX - 5} y1={plate + dir * 3} x2={cX + 5} y2={plate + dir * 3} stroke={colors.ink} strokeWidth={1.2} />
        <Line x1={cX} y1={plate + dir * 3} x2={cX} y2={gnd} {...W} />
        <Line x1={cX - 4} y1={gnd} x2={cX + 4} y2={gnd} {...W} />
        <Label x={cX + 7} y={plate + dir * 1.5 + 2} size={6}>
          {filter.c[k]}
        </Label>
      </G>
    );
  };
  return (
    <G>
      {leg(yP, 0, -1)}
      {leg(yN, 1, 1)}
      <Label x={x0 + rW / 2} y={yP + 18} anchor="middle" size={6} color={colors.muted}>
        {`${f.ohms(filter.ohms)}, ${f.farads(filter.farads)}`}
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
  const traceLength = traceLengthOf(req, choice.shuntOhms);
  const trace = req.shunt.trace && traceLength !== null ? { width: req.shunt.trace.width, length: traceLength } : null;
  const filter = filterDesignators(req, choice);
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
      <Shunt x={cx} y0={shuntAt.y0} y1={shuntAt.y1} ohms={choice.shuntOhms} trace={trace} />
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
      {/* With a filter on the legs, the leg names move in towards R1 to clear its resistors. */}
      <Label x={cx + (filter ? 20 : 50)} y={tapTop - 3} size={6.5} color={colors.signal}>
        sense +
      </Label>
      <Label x={cx + (filter ? 20 : 50)} y={tapBottom + 9} size={6.5} color={colors.signal}>
        sense −
      </Label>
      {filter ? <InputFilterLegs x0={cx + 56} yP={tapTop} yN={tapBottom} filter={filter} /> : null}
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
      {req.amplifier.reference.voltage > 0 ? (
        // A signed span's zero-current level, from U2 (the parts list's zero reference).
        <G>
          <Line x1={ampX + 40} y1={ampCy + 11} x2={ampX + 40} y2={ampCy + 24} {...W} />
          <Label x={ampX + 44} y={ampCy + 30} size={6.5} color={colors.muted}>
            {`ref: U2, ${f.volts(req.amplifier.reference.voltage)}`}
          </Label>
        </G>
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
