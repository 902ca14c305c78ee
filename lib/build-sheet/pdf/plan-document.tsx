// A range plan's build sheet: parts for every range, the switching rule, a schematic of the ranges
// and the switch, per-range figures and bench checks (with both sides of each switch point), the
// cautions, and a readings log. Every figure comes from planSheetData (the engine, formatted).
import { Document, View } from "@react-pdf/renderer";
import type { ReactNode } from "react";
import type { DesignView } from "@/lib/design-view";
import type { Requirement } from "@/lib/design";
import type { PlanSheetData } from "../plan-sheet-data";
import {
  BenchTable,
  Bullets,
  FrontPage,
  KeyValues,
  SheetPage,
  sheetStyles as s,
  type Numbering,
  type SheetHead,
  type SheetMeta,
} from "./document";
import { PlanSchematic } from "./plan-schematic";
import { ReadingsLog } from "./readings-log";
import { Text } from "./text";

export type PlanSheetView = SheetHead & Pick<DesignView, "project" | "approval" | "authorName">;

export function PlanBuildSheetDocument({
  view,
  req,
  data,
  meta,
  fonts,
}: {
  view: PlanSheetView;
  req: Requirement;
  data: PlanSheetData;
  meta: SheetMeta;
  fonts: string[];
}) {
  // A plan's sheet runs to a length that depends on its ranges: let the layout number the pages.
  const numbering: Numbering = { kind: "dynamic" };
  const page = (n: number, children: ReactNode) => (
    <SheetPage key={n} view={view} meta={meta} fonts={fonts} number={n} numbering={numbering}>
      {children}
    </SheetPage>
  );
  const n = data.ranges.length;
  // Pages as planned: title and parts; schematic and switching; ranges, bench and layout; readings logs.
  return (
    <Document
      title={`${view.name}, revision ${view.revision}: build sheet (${n}-range plan)`}
      author={meta.team}
      creator="Sensewright"
      producer="Sensewright"
      subject="Multi-range current-sense front end build sheet"
    >
      {page(1, <FrontPage view={view} meta={meta} heading={`Requirement (a ${n}-range plan)`} data={data} />)}
      {page(
        2,
        <>
          <View wrap={false}>
            <Text style={s.h2}>Schematic</Text>
            <PlanSchematic req={req} ranges={data.metrics} />
            <Text style={s.small}>
              {`Node names as in the netlist decks: bus (supply +), sp (where the current enters every shunt), sn1 to sn${n} (the far end of each shunt), ${req.supply.side === "high" ? "ld (where the switches join the load)" : "ret (where the switches join the return)"}, 0 (ground). Sense lines (teal) leave each shunt from its inner terminals. Only the range in use has its switch closed.`}
            </Text>
          </View>
          <View wrap={false}>
            <Text style={s.h2}>Switching rule</Text>
            <Bullets items={data.switching} />
          </View>
        </>,
      )}
      {page(
        3,
        <>
          {data.ranges.map((r, k) => (
            <View key={k}>
              <View wrap={false}>
                <Text style={s.h2}>{r.title}</Text>
                <KeyValues rows={r.performance} labelWidth="48%" />
              </View>
              <View wrap={false}>
                <Text style={s.h2}>{`Bench check, range ${k + 1}`}</Text>
                <BenchTable rows={r.bench} />
              </View>
            </View>
          ))}
          <View wrap={false}>
            <Text style={s.h2}>How to run the bench check</Text>
            <Bullets items={data.benchHowTo} />
          </View>
          <View wrap={false}>
            <Text style={s.h2}>Layout</Text>
            <Bullets items={data.layout} />
          </View>
        </>,
      )}
      {page(
        4,
        <>
          {data.ranges.map((r, k) => (
            <ReadingsLog key={k} bench={r.bench} title={`Readings log, range ${k + 1}`} />
          ))}
        </>,
      )}
    </Document>
  );
}
