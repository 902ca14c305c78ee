// The build sheet as a react-pdf document: what a maker needs to build and bench-check the front
// end from paper alone. Every figure comes from sheetData (the engine, formatted with formatSI).
import { Document, Page, StyleSheet, View } from "@react-pdf/renderer";
import type { ReactNode } from "react";
import type { PairDesignView as DesignView } from "@/lib/design-view";
import type { SheetData } from "../sheet-data";
import { ErrorChart } from "./error-chart";
import { ReadingsLog } from "./readings-log";
import { Schematic } from "./schematic";
import { Text } from "./text";
import { colors } from "./theme";

export type SheetMeta = { team: string; generatedAt: Date };

export const sheetStyles = StyleSheet.create({
  // No lineHeight on the page itself: with one there, react-pdf drops the page-number text.
  page: { fontSize: 8, color: colors.ink, paddingTop: 62, paddingBottom: 40, paddingHorizontal: 40 },
  body: { fontSize: 8, lineHeight: 1.3 },
  header: {
    position: "absolute",
    top: 20,
    left: 40,
    right: 40,
    flexDirection: "row",
    justifyContent: "space-between",
    alignItems: "flex-end",
    borderBottomWidth: 1,
    borderBottomColor: colors.copper,
    paddingBottom: 4,
  },
  brand: { fontSize: 7, color: colors.copper, fontWeight: 700, letterSpacing: 1 },
  headerTitle: { fontSize: 9, fontWeight: 700, lineHeight: 1.3 },
  draftBand: {
    position: "absolute",
    top: 46,
    left: 40,
    right: 40,
    backgroundColor: colors.badSoft,
    borderWidth: 0.8,
    borderColor: colors.bad,
    paddingVertical: 2,
    paddingHorizontal: 6,
  },
  draftText: { color: colors.bad, fontWeight: 700, fontSize: 7.5, textAlign: "center" },
  watermark: {
    position: "absolute",
    top: 380,
    left: 60,
    width: 475,
    textAlign: "center",
    fontSize: 54,
    fontWeight: 700,
    color: colors.bad,
    opacity: 0.09,
    transform: "rotate(-32deg)",
  },
  footer: {
    position: "absolute",
    bottom: 18,
    left: 40,
    right: 40,
    flexDirection: "row",
    justifyContent: "space-between",
    fontSize: 6.5,
    color: colors.muted,
    borderTopWidth: 0.5,
    borderTopColor: colors.line,
    paddingTop: 3,
  },
  h1: { fontSize: 15, fontWeight: 700, lineHeight: 1.25, marginBottom: 4 },
  h2: { fontSize: 10, fontWeight: 700, lineHeight: 1.25, color: colors.copper, marginTop: 10, marginBottom: 4 },
  muted: { color: colors.muted },
  small: { fontSize: 6.8, color: colors.muted },
  table: { borderTopWidth: 0.6, borderTopColor: colors.line },
  row: { flexDirection: "row", borderBottomWidth: 0.6, borderBottomColor: colors.line },
  headRow: {
    flexDirection: "row",
    backgroundColor: colors.sunken,
    borderBottomWidth: 0.8,
    borderBottomColor: colors.faint,
  },
  cell: { paddingVertical: 2.2, paddingHorizontal: 3 },
  headCell: { paddingVertical: 2.2, paddingHorizontal: 3, fontWeight: 700, fontSize: 7 },
  bullet: { flexDirection: "row", marginBottom: 2.5 },
  bulletMark: { width: 10, color: colors.copper, fontWeight: 700 },
  bulletText: { flex: 1 },
  caution: { borderWidth: 1, borderColor: colors.bad, backgroundColor: "#fdf6f6", padding: 6, marginTop: 4 },
});

const s = sheetStyles;

export const statusWords: Record<DesignView["status"], string> = {
  draft: "draft",
  "in-review": "in review",
  approved: "approved",
  returned: "returned for changes",
};

/** The words every page of an unapproved sheet carries. */
export function notApprovedNotice(view: Pick<DesignView, "status" | "revision">): string {
  return `NOT APPROVED — draft for review, not for building (status: ${statusWords[view.status]}, revision ${view.revision})`;
}

/** Header and footer lines are one line high: long names are cut there (the title block has them whole). */
function clip(text: string, max: number): string {
  return text.length <= max ? text : `${text.slice(0, max - 1).trimEnd()}…`;
}

export function isoDate(d: Date): string {
  return d.toISOString().slice(0, 10);
}

export function isoMinute(iso: string): string {
  return `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`;
}

type Col<T> = { title: string; width: number | string; render: (row: T) => ReactNode; align?: "left" | "right" };

export function Table<T>({ cols, rows, zebra = false }: { cols: Col<T>[]; rows: T[]; zebra?: boolean }) {
  return (
    <View style={s.table}>
      <View style={s.headRow} wrap={false}>
        {cols.map((c, ci) => (
          <Text key={ci} style={[s.headCell, { width: c.width, textAlign: c.align ?? "left" }]}>
            {c.title}
          </Text>
        ))}
      </View>
      {rows.map((r, i) => (
        <View key={i} style={[s.row, zebra && i % 2 === 1 ? { backgroundColor: "#fbfaf7" } : {}]} wrap={false}>
          {cols.map((c, ci) => (
            <Text key={ci} style={[s.cell, { width: c.width, textAlign: c.align ?? "left" }]}>
              {c.render(r)}
            </Text>
          ))}
        </View>
      ))}
    </View>
  );
}

/** Label/value rows laid out in two side-by-side columns. */
export function KeyValues({
  rows,
  labelWidth = "42%",
}: {
  rows: { label: string; value: string }[];
  labelWidth?: string;
}) {
  const half = Math.ceil(rows.length / 2);
  const cols = [rows.slice(0, half), rows.slice(half)];
  return (
    <View style={{ flexDirection: "row", gap: 12 }}>
      {cols.map((col, ci) => (
        <View key={ci} style={[s.table, { flex: 1 }]}>
          {col.map((r) => (
            <View key={r.label} style={s.row} wrap={false}>
              <Text style={[s.cell, s.muted, { width: labelWidth }]}>{r.label}</Text>
              <Text style={[s.cell, { flex: 1 }]}>{r.value}</Text>
            </View>
          ))}
        </View>
      ))}
    </View>
  );
}

export function Bullets({ items }: { items: string[] }) {
  return (
    <View>
      {items.map((t, i) => (
        <View key={i} style={s.bullet} wrap={false}>
          <Text style={s.bulletMark}>{"•"}</Text>
          <Text style={s.bulletText}>{t}</Text>
        </View>
      ))}
    </View>
  );
}

const partCols: {
  title: string;
  width: string;
  key: "designator" | "part" | "value" | "tolerance" | "tempco" | "rating";
}[] = [
  { title: "Ref", width: "6%", key: "designator" },
  { title: "Part", width: "30%", key: "part" },
  { title: "Value (IEC 60062 code)", width: "13%", key: "value" },
  { title: "Tolerance", width: "17%", key: "tolerance" },
  { title: "Tempco", width: "19%", key: "tempco" },
  { title: "Rating", width: "15%", key: "rating" },
];

/** One row per part, its notes on a full-width line beneath. */
export function PartsTable({ parts }: { parts: SheetData["parts"] }) {
  return (
    <View style={s.table}>
      <View style={s.headRow} wrap={false}>
        {partCols.map((c) => (
          <Text key={c.key} style={[s.headCell, { width: c.width }]}>
            {c.title}
          </Text>
        ))}
      </View>
      {parts.map((p) => (
        <View key={p.designator} style={s.row} wrap={false}>
          <View style={{ width: "100%" }}>
            <View style={{ flexDirection: "row" }}>
              {partCols.map((c) => (
                <Text
                  key={c.key}
                  style={[
                    s.cell,
                    { width: c.width },
                    c.key === "designator" || c.key === "value" ? { fontWeight: 700 } : {},
                  ]}
                >
                  {p[c.key]}
                  {c.key === "value" && p.code ? `\n${p.code}` : ""}
                </Text>
              ))}
            </View>
            <Text style={[s.cell, s.small, { paddingLeft: "6%", paddingTop: 0 }]}>{p.notes}</Text>
          </View>
        </View>
      ))}
    </View>
  );
}

/** Expected readings with their acceptance bands. */
export function BenchTable({ rows }: { rows: SheetData["bench"] }) {
  return (
    <Table
      cols={[
        { title: "Test point", width: "30%", render: (r) => r.label },
        { title: "Test current", width: "18%", render: (r) => r.current, align: "right" },
        { title: "Expected output", width: "20%", render: (r) => r.expected, align: "right" },
        { title: "Accept between", width: "32%", render: (r) => r.band, align: "right" },
      ]}
      rows={rows}
    />
  );
}

/** The sheet's title and who made, approved and printed it. */
export function TitleBlock({
  view,
  meta,
}: {
  view: SheetHead & Pick<DesignView, "project" | "approval" | "authorName">;
  meta: SheetMeta;
}) {
  return (
    <>
      <Text style={s.h1}>{view.name}</Text>
      <KeyValues
        labelWidth="34%"
        rows={[
          { label: "Design", value: view.name },
          { label: "Project", value: view.project ?? "—" },
          { label: "Revision", value: String(view.revision) },
          { label: "Status", value: statusWords[view.status] },
          {
            label: "Approved",
            value: view.approval ? `by ${view.approval.byName}, ${isoMinute(view.approval.at)}` : "not approved",
          },
          { label: "Designed by", value: view.authorName },
          { label: "Team", value: meta.team },
          { label: "Sheet date", value: isoDate(meta.generatedAt) },
        ]}
      />
    </>
  );
}

/** The first page's content: title block, requirement, parts and cautions. */
export function FrontPage({
  view,
  meta,
  heading,
  data,
}: {
  view: Parameters<typeof TitleBlock>[0]["view"];
  meta: SheetMeta;
  heading: string;
  data: Pick<SheetData, "requirement" | "parts" | "cautions"> & { modelFails?: string | null };
}) {
  return (
    <>
      <TitleBlock view={view} meta={meta} />
      {data.modelFails ? (
        <View style={s.caution}>
          <Text style={{ fontWeight: 700, color: colors.bad }}>FAILS UNDER THE CURRENT MODEL: do not build</Text>
          <Text>{data.modelFails}</Text>
        </View>
      ) : null}
      <Text style={s.h2}>{heading}</Text>
      <KeyValues rows={data.requirement} />
      <Text style={s.h2}>Parts</Text>
      <PartsTable parts={data.parts} />
      <View wrap={false}>
        <Text style={s.h2}>Cautions</Text>
        <View style={s.caution}>
          <Bullets items={data.cautions} />
        </View>
      </View>
    </>
  );
}

/** How page numbers are written: known in advance (fast), or worked out by the layout. */
export type Numbering = { kind: "static"; total: number } | { kind: "dynamic" };

/** What a page's header and footer name: a single design or a range plan alike. */
export type SheetHead = Pick<DesignView, "name" | "revision" | "status">;

export function SheetPage({
  view,
  meta,
  fonts,
  number,
  numbering,
  children,
}: {
  view: SheetHead;
  meta: SheetMeta;
  fonts: string[];
  number: number;
  numbering: Numbering;
  children: ReactNode;
}) {
  const approved = view.status === "approved";
  return (
    <Page size="A4" style={[s.page, { fontFamily: fonts }, approved ? {} : { paddingTop: 74 }]}>
      <View style={s.header} fixed>
        <View>
          <Text style={s.brand}>SENSEWRIGHT BUILD SHEET</Text>
          <Text style={s.headerTitle}>{`${clip(view.name, 80)} — revision ${view.revision}`}</Text>
        </View>
        <Text style={{ fontSize: 8, fontWeight: 700, color: approved ? colors.good : colors.bad }}>
          {approved ? "APPROVED" : statusWords[view.status].toUpperCase()}
        </Text>
      </View>
      {approved ? null : (
        <>
          <View style={s.draftBand} fixed>
            <Text style={s.draftText}>{notApprovedNotice(view)}</Text>
          </View>
          <Text style={s.watermark} fixed>
            NOT APPROVED
          </Text>
        </>
      )}
      <View style={s.footer} fixed>
        <Text>{`${clip(meta.team, 40)} · generated ${isoDate(meta.generatedAt)} · ${clip(view.name, 60)}, revision ${view.revision}`}</Text>
        {numbering.kind === "static" ? (
          <Text>{`Page ${number} of ${numbering.total}`}</Text>
        ) : (
          <Text render={({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages}`} />
        )}
      </View>
      <View style={s.body}>{children}</View>
    </Page>
  );
}

/** The sheet's pages as planned; a page whose content overflows wraps onto another. */
export const PLANNED_PAGES = 4;

export function BuildSheetDocument({
  view,
  data,
  meta,
  fonts,
  numbering = { kind: "static", total: PLANNED_PAGES },
}: {
  view: DesignView;
  data: SheetData;
  meta: SheetMeta;
  /** Font families in fallback order (lib/build-sheet/fonts.ts). */
  fonts: string[];
  numbering?: Numbering;
}) {
  const req = view.requirement;
  const page = (n: number, children: ReactNode) => (
    <SheetPage view={view} meta={meta} fonts={fonts} number={n} numbering={numbering}>
      {children}
    </SheetPage>
  );
  return (
    <Document
      title={`${view.name}, revision ${view.revision}: build sheet`}
      author={meta.team}
      creator="Sensewright"
      producer="Sensewright"
      subject="Current-sense front end build sheet"
    >
      {page(1, <FrontPage view={view} meta={meta} heading="Requirement" data={data} />)}
      {page(
        2,
        <>
          <View wrap={false}>
            <Text style={s.h2}>Schematic</Text>
            <Schematic req={req} choice={view.choice} />
            <Text style={s.small}>
              Node names as in the SPICE netlist: bus (supply +), sp (shunt end the current enters), sn, out (U1
              output), 0 (ground). Sense lines (teal) leave R1 from its inner terminals.
            </Text>
          </View>
          <View wrap={false}>
            <Text style={s.h2}>Performance</Text>
            <KeyValues rows={data.performance} labelWidth="48%" />
          </View>
          <View wrap={false}>
            <Text style={s.h2}>Error versus current</Text>
            <ErrorChart req={req} curve={data.curve} />
          </View>
        </>,
      )}
      {page(
        3,
        <>
          <View wrap={false}>
            <Text style={s.h2}>Error budget by source</Text>
            <Table
              zebra
              cols={[
                { title: "Source", width: "36%", render: (r) => r.label },
                { title: "At minimum current", width: "16%", render: (r) => r.atMin, align: "right" },
                { title: "% of reading", width: "16%", render: (r) => r.atMinPercent, align: "right" },
                { title: "At maximum current", width: "16%", render: (r) => r.atMax, align: "right" },
                { title: "% of reading", width: "16%", render: (r) => r.atMaxPercent, align: "right" },
              ]}
              rows={[
                ...data.budget,
                {
                  label: "Worst case (sum)",
                  atMin: "",
                  atMinPercent: data.budgetTotals.atMinPercent,
                  atMax: "",
                  atMaxPercent: data.budgetTotals.atMaxPercent,
                },
                {
                  label: "Root-sum-square",
                  atMin: "",
                  atMinPercent: data.budgetTotals.rssMinPercent,
                  atMax: "",
                  atMaxPercent: data.budgetTotals.rssMaxPercent,
                },
              ]}
            />
          </View>
          <View wrap={false}>
            <Text style={s.h2}>Bench check</Text>
            <BenchTable rows={data.bench} />
            <View style={{ marginTop: 5 }}>
              <Bullets items={data.benchHowTo} />
            </View>
          </View>
          <View wrap={false}>
            <Text style={s.h2}>Layout</Text>
            <Bullets items={data.layout} />
          </View>
        </>,
      )}
      {page(4, <ReadingsLog bench={data.bench} />)}
    </Document>
  );
}
