// Built units as files: readings in from a CSV (one row per unit, a column per test point, all or
// nothing, refusals naming row and column), calibration coefficients out as CSV and JSON.
import Papa from "papaparse";
import { formatSI, parseQuantity, TEST_POINT_MATCH, type BenchCheckRow } from "@/lib/design";
import {
  CsvRefusal,
  headerKey,
  readNumberCell,
  splitHeaderUnit,
  truncate,
  unitScale,
  walkCsv,
} from "@/lib/profile/csv";
import type { UnitView } from "./judge";
import { builtOnSchema, serialSchema, todayIso } from "./schemas";

export const MAX_UNITS_CSV_BYTES = 1_000_000;
export const MAX_UNITS_PER_IMPORT = 2000;

export type ImportedUnit = {
  serial: string;
  builtOn: string;
  /** One per test point, in the sheet's order. */
  readings: { currentA: number; outputV: number }[];
  row: number;
};

type Column =
  | { kind: "serial"; index: number; label: string }
  | { kind: "date"; index: number; label: string }
  | { kind: "point"; index: number; label: string; point: number; scale: number | null };

const serialNames = new Set(["serial", "serialnumber", "sn", "unit", "unitserial"]);
const dateNames = new Set(["date", "builton", "built", "datebuilt"]);

/** The test point a header names: by its label ("Maximum current") or its current ("6 A"). */
function pointOf(bench: BenchCheckRow[], name: string): number {
  const key = headerKey(name);
  const byLabel = bench.findIndex((b) => headerKey(b.label) === key);
  if (byLabel >= 0) return byLabel;
  const q = parseQuantity(name.replace(/^(at|i\s*=)\s*/i, ""), "current");
  if (!q.ok) return -1;
  return bench.findIndex((b) => Math.abs(q.value - b.currentA) <= TEST_POINT_MATCH * b.currentA);
}

function readHeader(bench: BenchCheckRow[], cells: string[], line: number): Column[] | CsvRefusal {
  const cols: Column[] = [];
  for (const [index, raw] of cells.entries()) {
    const label = raw.trim().replace(/^\uFEFF/, "");
    if (label === "") return new CsvRefusal("a header cell is empty; name every column", { line });
    const { name, unit } = splitHeaderUnit(label);
    const key = headerKey(name);
    const place = { line, column: label };
    if (serialNames.has(key) || dateNames.has(key)) {
      const kind = serialNames.has(key) ? "serial" : "date";
      if (cols.some((c) => c.kind === kind)) return new CsvRefusal(`a second ${kind} column`, place);
      cols.push({ kind, index, label });
      continue;
    }
    const point = pointOf(bench, name);
    if (point < 0) {
      const list = bench.map((b) => `"${b.label}" (${formatSI(b.currentA, "A")})`).join(", ");
      return new CsvRefusal(
        `"${truncate(name)}" names no test point of this design's bench check; use serial, date and one column per test point: ${list}`,
        place,
      );
    }
    if (cols.some((c) => c.kind === "point" && c.point === point))
      return new CsvRefusal(`a second column for ${bench[point]!.label.toLowerCase()}`, place);
    let scale: number | null = null;
    if (unit !== null) {
      const s = unitScale(unit, "voltage", place);
      if (!s.ok) return s.refusal;
      scale = s.scale;
    }
    cols.push({ kind: "point", index, label, point, scale });
  }
  if (!cols.some((c) => c.kind === "serial"))
    return new CsvRefusal('the "serial" column is missing', { line, column: "serial" });
  const missing = bench.filter((_, k) => !cols.some((c) => c.kind === "point" && c.point === k));
  if (missing.length)
    return new CsvRefusal(
      `no column for ${missing.map((b) => `"${b.label}" (${formatSI(b.currentA, "A")})`).join(", ")}; the sheet asks for a reading at every test point`,
      { line, column: missing[0]!.label },
    );
  return cols;
}

function readVoltage(raw: string, scale: number | null): { ok: true; value: number } | { ok: false; reason: string } {
  const text = raw.trim();
  if (text === "") return { ok: false, reason: "the cell is empty; every test point needs a reading" };
  const n = readNumberCell(text);
  if (n.ok) return { ok: true, value: n.value * (scale ?? 1) };
  if (scale !== null) return n;
  const q = parseQuantity(text, "voltage", "Output reading");
  return q.ok ? q : { ok: false, reason: q.message };
}

/** Reads a units CSV against a bench check; the first refusal stops it and nothing is kept. */
export function parseUnitsCsv(
  text: string,
  bench: BenchCheckRow[],
  today = todayIso(),
): { ok: true; units: ImportedUnit[] } | { ok: false; refusal: CsvRefusal } {
  let cols: Column[] = [];
  const units: ImportedUnit[] = [];
  const seen = new Map<string, number>();
  const walked = walkCsv(text, {
    header(cells, line) {
      const h = readHeader(bench, cells, line);
      if (h instanceof CsvRefusal) return h;
      cols = h;
    },
    row(cells, row, line) {
      if (row > MAX_UNITS_PER_IMPORT)
        return new CsvRefusal(`more than ${MAX_UNITS_PER_IMPORT} units in one file; split it`, { row, line });
      const readings: { currentA: number; outputV: number }[] = bench.map((b) => ({
        currentA: b.currentA,
        outputV: NaN,
      }));
      let serial = "";
      let builtOn = today;
      for (const c of cols) {
        const raw = cells[c.index] ?? "";
        const place = { row, line, column: c.label };
        if (c.kind === "serial") {
          const s = serialSchema.safeParse(raw);
          if (!s.success) return new CsvRefusal(s.error.issues[0]?.message ?? "not a serial", place);
          const key = s.data.toLowerCase();
          const first = seen.get(key);
          if (first !== undefined) return new CsvRefusal(`serial "${s.data}" is also on data row ${first}`, place);
          seen.set(key, row);
          serial = s.data;
        } else if (c.kind === "date") {
          if (raw.trim() === "") continue;
          const d = builtOnSchema.safeParse(raw.trim());
          if (!d.success) return new CsvRefusal(`"${truncate(raw.trim())}" is not a date as YYYY-MM-DD`, place);
          builtOn = d.data;
        } else {
          const v = readVoltage(raw, c.scale);
          if (!v.ok) return new CsvRefusal(v.reason, place);
          readings[c.point]!.outputV = v.value;
        }
      }
      if (cells.length > cols.length && cells.slice(cols.length).some((x) => x.trim() !== ""))
        return new CsvRefusal(`the row has ${cells.length} cells but the header names ${cols.length} columns`, {
          row,
          line,
        });
      units.push({ serial, builtOn, readings, row });
    },
  });
  if (walked.refusal) return { ok: false, refusal: walked.refusal };
  if (!walked.sawHeader)
    return { ok: false, refusal: new CsvRefusal("the file is empty; it needs a header row and one row per unit") };
  if (units.length === 0)
    return { ok: false, refusal: new CsvRefusal("the file has a header but no units; add one row per unit") };
  return { ok: true, units };
}

/** A blank import file for a bench check: the header the import reads. */
export function unitsCsvTemplate(bench: BenchCheckRow[]): string {
  return Papa.unparse([["serial", "date", ...bench.map((b) => b.label)]], { newline: "\r\n" }) + "\r\n";
}

// Cells a spreadsheet would run as a formula get a leading apostrophe; plain numbers ("-0.25") stay numbers.
const formulaLike = /^(?![+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?$)[=+\-@\t\r]/i;

export const calibrationColumns = [
  "serial",
  "revision",
  "built_on",
  "pass",
  "gain",
  "offset_v",
  "residual_percent",
  "method",
  "points",
  "recorded_by",
] as const;

/** corrected = gain · raw + offset_v, one row per unit; RFC 4180 with CRLF. */
export function calibrationCsv(units: UnitView[]): string {
  const rows = units.map((u) => [
    u.serial,
    u.revision,
    u.builtOn,
    u.pass ? "yes" : "no",
    u.calibration.gain,
    u.calibration.offsetV,
    Number.isFinite(u.calibration.residualPercent) ? u.calibration.residualPercent : "",
    u.calibration.method,
    u.calibration.points,
    u.recordedByName,
  ]);
  return (
    Papa.unparse({ fields: [...calibrationColumns], data: rows }, { newline: "\r\n", escapeFormulae: formulaLike }) +
    "\r\n"
  );
}

export const CALIBRATION_FORMAT = "sensewright-calibration";

export function calibrationJson(
  design: { id: string; name: string },
  units: UnitView[],
  generatedAt: Date,
): Record<string, unknown> {
  return {
    format: CALIBRATION_FORMAT,
    version: 1,
    design,
    generatedAt: generatedAt.toISOString(),
    formula: "corrected = gain * raw + offsetV (volts at the amplifier output)",
    units: units.map((u) => ({
      serial: u.serial,
      revision: u.revision,
      builtOn: u.builtOn,
      pass: u.pass,
      gain: u.calibration.gain,
      offsetV: u.calibration.offsetV,
      residualPercent: Number.isFinite(u.calibration.residualPercent) ? u.calibration.residualPercent : null,
      method: u.calibration.method,
      points: u.calibration.points,
    })),
  };
}
