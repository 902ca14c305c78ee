// A blank readings log for the printed sheet: one line per built unit (serial, date, the output at
// every bench-check test point, pass), laid out like the units import so it can be typed in later.
import { StyleSheet, Text, View } from "@react-pdf/renderer";
import type { BenchRow } from "../sheet-data";
import { colors } from "./theme";

const BLANK_ROWS = 8;
/** The page's text width in points: A4 (595 pt) less the sheet's 40 pt margins. */
const TABLE_WIDTH = 515;

const s = StyleSheet.create({
  h2: { fontSize: 10, fontWeight: 700, lineHeight: 1.25, color: colors.copper, marginTop: 10, marginBottom: 4 },
  note: { fontSize: 6.8, color: colors.muted, marginBottom: 4 },
  table: {
    width: TABLE_WIDTH,
    borderTopWidth: 0.6,
    borderTopColor: colors.faint,
    borderLeftWidth: 0.6,
    borderLeftColor: colors.faint,
  },
  row: { flexDirection: "row", borderBottomWidth: 0.6, borderBottomColor: colors.faint, minHeight: 17 },
  head: {
    flexDirection: "row",
    backgroundColor: colors.sunken,
    borderBottomWidth: 0.8,
    borderBottomColor: colors.faint,
  },
  cell: { borderRightWidth: 0.6, borderRightColor: colors.faint, paddingVertical: 2, paddingHorizontal: 3 },
  headText: { fontSize: 6.5, fontWeight: 700 },
  band: { fontSize: 6, color: colors.muted },
});

/** The last column takes what is left of the line, so the grid ends at the right margin. */
const cellWidth = (width: number, last: boolean) => (last ? { flexGrow: 1, flexBasis: width } : { width });

export function ReadingsLog({ bench, title = "Readings log" }: { bench: BenchRow[]; title?: string }) {
  const fixed = [
    { title: "Serial", width: 84 },
    { title: "Date", width: 54 },
  ];
  const tail = [
    { title: "Pass?", width: 32 },
    { title: "By", width: 28 },
  ];
  const used = [...fixed, ...tail].reduce((sum, c) => sum + c.width, 0);
  const pointWidth = Math.floor((TABLE_WIDTH - used) / Math.max(1, bench.length));
  const widths = [...fixed.map((c) => c.width), ...bench.map(() => pointWidth), ...tail.map((c) => c.width)];
  return (
    <View wrap={false}>
      <Text style={s.h2}>{title}</Text>
      <Text style={s.note}>
        {`One line per unit built. Write each output with its unit (e.g. 36.9 mV). A unit passes when every reading lies in its band. Type the lines in under "Built units" on the design page, or as a CSV with the header: serial,date,${bench.map((b) => b.label).join(",")}.`}
      </Text>
      <View style={s.table}>
        <View style={s.head}>
          {fixed.map((c) => (
            <View key={c.title} style={[s.cell, { width: c.width }]}>
              <Text style={s.headText}>{c.title}</Text>
            </View>
          ))}
          {bench.map((b) => (
            <View key={b.label} style={[s.cell, { width: pointWidth }]}>
              <Text style={s.headText}>{`${b.label} (${b.current})`}</Text>
              <Text style={s.band}>{b.band}</Text>
            </View>
          ))}
          {tail.map((c) => (
            <View key={c.title} style={[s.cell, cellWidth(c.width, c === tail.at(-1))]}>
              <Text style={s.headText}>{c.title}</Text>
            </View>
          ))}
        </View>
        {Array.from({ length: BLANK_ROWS }, (_, i) => (
          <View key={i} style={s.row}>
            {widths.map((w, k) => (
              <View key={k} style={[s.cell, cellWidth(w, k === widths.length - 1)]} />
            ))}
          </View>
        ))}
      </View>
    </View>
  );
}
