// Library CSV, in and out. Export writes the API's field names (SI, unit in the name) so an exported
// file imports back unchanged; import also takes plain names with a unit in the header
// ("offset [uV]") or in the cell ("10 uV"). The same refusals as profiles: row, line and column named.
import type { z } from "zod";
import { unneutralise, writeCsv, type CsvCell } from "@/lib/csv-write";
import { parseQuantity, type Dimension } from "@/lib/design";
import {
  CsvRefusal,
  headerKey,
  readNumberCell,
  splitHeaderUnit,
  truncate,
  unitScale,
  walkCsv,
} from "@/lib/profile/csv";
import { adcInput, amplifierInput, meterInput, shuntInput, type ImportedParts, type PartKind } from "./schema";

type Cell = "text" | "number" | "list" | "quantityList" | "bool" | Dimension;

type ColumnSpec = {
  /** The API's field name; a dotted one (`reference.tolerance`) is a field of a nested object. */
  key: string;
  /** Other header names that mean this column (compared without case, spaces or dashes). */
  aliases: string[];
  cell: Cell;
  /** For a list of quantities, the dimension of each. */
  dim?: Dimension;
  label: string;
  /** A column a file may leave out (added after the first files were written); an empty cell means unset. */
  optional?: boolean;
};

export const amplifierColumns: ColumnSpec[] = [
  { key: "name", aliases: [], cell: "text", label: "Name" },
  { key: "gainMode", aliases: ["mode"], cell: "text", label: "Gain mode" },
  { key: "gains", aliases: ["gain"], cell: "list", label: "Gains" },
  { key: "offsetV", aliases: ["offset", "inputoffset", "vos"], cell: "voltage", label: "Input offset" },
  { key: "offsetDriftVPerK", aliases: ["offsetdrift", "drift"], cell: "voltageDrift", label: "Offset drift" },
  { key: "gainErrorFraction", aliases: ["gainerror"], cell: "fraction", label: "Gain error" },
  { key: "gainDriftPerK", aliases: ["gaindrift"], cell: "tempco", label: "Gain drift" },
  { key: "biasCurrentA", aliases: ["biascurrent", "bias", "ib"], cell: "current", label: "Input bias current" },
  {
    key: "noiseDensityVPerRtHz",
    aliases: ["noisedensity", "noise", "en"],
    cell: "noiseDensity",
    label: "Input noise density",
  },
  { key: "gbwHz", aliases: ["gbw", "gainbandwidth"], cell: "frequency", label: "Gain-bandwidth" },
  { key: "swingLowV", aliases: ["swinglow", "outputlow"], cell: "voltage", label: "Lowest output above ground" },
  {
    key: "swingHighV",
    aliases: ["swinghigh", "outputheadroom", "headroom"],
    cell: "voltage",
    label: "Output headroom below the supply",
  },
  { key: "cmrrDb", aliases: ["cmrr"], cell: "number", label: "CMRR (dB)" },
  { key: "supplyMinV", aliases: ["supplymin", "minsupply"], cell: "voltage", label: "Lowest supply" },
  { key: "supplyMaxV", aliases: ["supplymax", "maxsupply"], cell: "voltage", label: "Highest supply" },
  { key: "topology", aliases: [], cell: "text", label: "Topology", optional: true },
  {
    key: "commonModeMinV",
    aliases: ["commonmodemin", "cmmin"],
    cell: "voltage",
    label: "Lowest input common-mode voltage",
    optional: true,
  },
  {
    key: "commonModeMaxV",
    aliases: ["commonmodemax", "cmmax"],
    cell: "voltage",
    label: "Highest input common-mode voltage",
    optional: true,
  },
];

export const shuntColumns: ColumnSpec[] = [
  { key: "name", aliases: [], cell: "text", label: "Name" },
  { key: "series", aliases: ["eseries"], cell: "text", label: "Series" },
  { key: "minOhms", aliases: ["min", "minvalue", "smallest"], cell: "resistance", label: "Smallest value" },
  { key: "maxOhms", aliases: ["max", "maxvalue", "largest"], cell: "resistance", label: "Largest value" },
  { key: "toleranceFraction", aliases: ["tolerance"], cell: "fraction", label: "Tolerance" },
  { key: "tempcoPerK", aliases: ["tempco", "tcr"], cell: "tempco", label: "Tempco" },
  {
    key: "ratingsW",
    aliases: ["ratings", "rating", "power"],
    cell: "quantityList",
    dim: "power",
    label: "Power ratings",
  },
  { key: "fourTerminal", aliases: ["4terminal", "kelvin"], cell: "bool", label: "4-terminal" },
];

// Readouts keep the requirement's readout names (API.md v2), so their full scale is volts without
// a unit in the name, and offset, INL and digits are counts of the converter's or meter's own steps.
export const adcColumns: ColumnSpec[] = [
  { key: "name", aliases: [], cell: "text", label: "Name" },
  { key: "bits", aliases: ["resolution"], cell: "number", label: "Resolution (bits)" },
  { key: "fullScale", aliases: ["fullscalev", "range"], cell: "voltage", label: "Full scale" },
  { key: "sampleRateHz", aliases: ["samplerate", "rate"], cell: "frequency", label: "Highest sample rate" },
  {
    key: "reference.tolerance",
    aliases: ["reftolerance"],
    cell: "fraction",
    label: "Reference tolerance",
  },
  { key: "reference.tempco", aliases: ["reftempco"], cell: "tempco", label: "Reference tempco" },
  { key: "offsetLsb", aliases: ["offset"], cell: "number", label: "Offset error (LSB)" },
  { key: "gainError", aliases: [], cell: "fraction", label: "Gain error" },
  { key: "inlLsb", aliases: ["inl"], cell: "number", label: "INL (LSB)" },
];

export const meterColumns: ColumnSpec[] = [
  { key: "name", aliases: [], cell: "text", label: "Name" },
  { key: "fullScale", aliases: ["fullscalev", "range"], cell: "voltage", label: "Range full scale" },
  { key: "counts", aliases: [], cell: "number", label: "Counts" },
  {
    key: "accuracy.percentOfReading",
    aliases: ["percentofreading", "ofreading"],
    cell: "fraction",
    label: "Accuracy, % of reading",
  },
  { key: "accuracy.digits", aliases: ["digits"], cell: "number", label: "Accuracy, digits" },
];

export const columnsOf: Record<PartKind, ColumnSpec[]> = {
  amplifiers: amplifierColumns,
  shunts: shuntColumns,
  adcs: adcColumns,
  meters: meterColumns,
};

const kindWords: Record<PartKind, string> = {
  amplifiers: "amplifier",
  shunts: "shunt",
  adcs: "ADC",
  meters: "meter range",
};

const schemaOf: Record<PartKind, z.ZodType> = {
  amplifiers: amplifierInput,
  shunts: shuntInput,
  adcs: adcInput,
  meters: meterInput,
};

/** Sets `values[a][b]` for the key "a.b" (one level, as the readouts nest). */
function setField(values: Record<string, unknown>, key: string, value: unknown) {
  const [outer, inner] = key.split(".") as [string, string | undefined];
  if (inner === undefined) values[outer] = value;
  else values[outer] = { ...((values[outer] as Record<string, unknown> | undefined) ?? {}), [inner]: value };
}

function getField(part: Readonly<Record<string, unknown>>, key: string): unknown {
  const [outer, inner] = key.split(".") as [string, string | undefined];
  const v = part[outer];
  return inner === undefined ? v : (v as Record<string, unknown> | undefined)?.[inner];
}

type HeaderColumn = { spec: ColumnSpec; index: number; label: string; scale: number | null };

function readHeader(kind: PartKind, cells: string[], line: number): HeaderColumn[] | CsvRefusal {
  const specs = columnsOf[kind];
  const byName = new Map<string, ColumnSpec>();
  for (const s of specs) for (const n of [s.key, ...s.aliases]) byName.set(headerKey(n), s);
  const found: HeaderColumn[] = [];
  for (const [index, raw] of cells.entries()) {
    const label = raw.trim().replace(/^\uFEFF/, "");
    const { name, unit } = splitHeaderUnit(label);
    const spec = byName.get(headerKey(name));
    if (!spec) {
      return new CsvRefusal(
        `${label ? `"${truncate(label)}" is not a column of the ${kindWords[kind]} list` : `column ${index + 1} has no name`}; the columns are ${specs.map((s) => s.key).join(", ")}`,
        { line, column: label || `column ${index + 1}` },
      );
    }
    if (found.some((f) => f.spec === spec))
      return new CsvRefusal(`the column "${spec.key}" appears twice`, { line, column: label });
    let scale: number | null = null;
    if (unit !== null) {
      const dim = spec.cell === "quantityList" ? spec.dim : isDimension(spec.cell) ? spec.cell : null;
      if (!dim) return new CsvRefusal(`this column takes no unit`, { line, column: label });
      const s = unitScale(unit, dim, { line, column: label });
      if (!s.ok) return s.refusal;
      scale = s.scale;
    }
    found.push({ spec, index, label, scale });
  }
  const missing = specs.filter((s) => !s.optional && !found.some((f) => f.spec === s));
  if (missing.length) {
    return new CsvRefusal(
      `the column${missing.length > 1 ? "s" : ""} ${missing.map((m) => `"${m.key}"`).join(", ")} ${missing.length > 1 ? "are" : "is"} missing`,
      {
        line,
        column: missing[0]!.key,
      },
    );
  }
  return found;
}

function isDimension(c: Cell): c is Dimension {
  return !["text", "number", "list", "quantityList", "bool"].includes(c);
}

type CellResult = { ok: true; value: unknown } | { ok: false; reason: string };

function readQuantityCell(raw: string, dim: Dimension, scale: number | null): CellResult {
  const text = raw.trim();
  if (scale !== null) {
    const n = readNumberCell(text);
    return n.ok ? { ok: true, value: n.value * scale } : n;
  }
  const n = readNumberCell(text);
  if (n.ok) return n;
  if (/^[+-]?(nan|inf|infinity|∞)$/i.test(text) || text === "") return n;
  const q = parseQuantity(text, dim);
  return q.ok ? { ok: true, value: q.value } : { ok: false, reason: q.message };
}

function splitList(raw: string): string[] {
  const text = raw.trim();
  if (text === "") return [];
  const parts = text.split(/[;|]/).map((p) => p.trim());
  if (parts.length === 1 && /\s/.test(text) && text.split(/\s+/).every((p) => readNumberCell(p).ok))
    return text.split(/\s+/);
  return parts;
}

function readCell(col: HeaderColumn, raw: string): CellResult {
  const { cell } = col.spec;
  switch (cell) {
    case "text":
      return { ok: true, value: unneutralise(raw.trim()) };
    case "number":
      return readNumberCell(raw);
    case "bool": {
      const v = raw.trim().toLowerCase();
      if (["yes", "true", "1", "y"].includes(v)) return { ok: true, value: true };
      if (["no", "false", "0", "n", ""].includes(v)) return { ok: true, value: false };
      return { ok: false, reason: `"${truncate(raw.trim())}" is not yes or no` };
    }
    case "list":
    case "quantityList": {
      const values: number[] = [];
      for (const part of splitList(raw)) {
        const r = cell === "list" ? readNumberCell(part) : readQuantityCell(part, col.spec.dim!, col.scale);
        if (!r.ok) return { ok: false, reason: `in the list "${truncate(raw.trim())}": ${r.reason}` };
        values.push(r.value as number);
      }
      if (values.length === 0)
        return { ok: false, reason: "the list is empty; separate values with ; (e.g. 10;20;50)" };
      return { ok: true, value: values };
    }
    default:
      return readQuantityCell(raw, cell, col.scale);
  }
}

/** The most bad rows one refused import reports. */
export const MAX_ROW_PROBLEMS = 50;

/** Parses a whole library CSV; any problem refuses the file (nothing is imported), every bad row named. */
export function parseLibraryCsv(
  kind: PartKind,
  text: string,
): { ok: true; parts: ImportedParts } | { ok: false; refusal: CsvRefusal; problems?: CsvRefusal[]; stopped?: boolean } {
  const schema = schemaOf[kind];
  let header = null as HeaderColumn[] | null;
  const rows: unknown[] = [];
  const names = new Map<string, number>();
  const problems: CsvRefusal[] = [];

  const walk = walkCsv(text, {
    header(cells, line) {
      const h = readHeader(kind, cells, line);
      if (h instanceof CsvRefusal) return h;
      header = h;
    },
    row(cells, row, line) {
      // Every bad row is reported (up to MAX_ROW_PROBLEMS), not just the first; nothing is imported.
      const problem = checkRow(cells, row, line);
      if (!problem) return;
      problems.push(problem);
      if (problems.length >= MAX_ROW_PROBLEMS)
        return new CsvRefusal(`${MAX_ROW_PROBLEMS} rows have problems; reading stopped there`, { row, line });
    },
  });

  function checkRow(cells: string[], row: number, line: number): CsvRefusal | undefined {
    if (!header) return;
    if (row > 10_000) return new CsvRefusal("the file has more than 10000 parts", { row, line });
    if (cells.length !== header.length)
      return new CsvRefusal(`the row has ${cells.length} cells but the header has ${header.length} columns`, {
        row,
        line,
      });
    const values: Record<string, unknown> = {};
    for (const col of header) {
      const raw = cells[col.index] ?? "";
      if (col.spec.optional && raw.trim() === "") continue;
      const r = readCell(col, raw);
      if (!r.ok) return new CsvRefusal(r.reason, { row, line, column: col.label });
      setField(values, col.spec.key, r.value);
    }
    const parsed = schema.safeParse(values);
    const nameColumn = header.find((c) => c.spec.key === "name")!.label;
    if (!parsed.success) {
      const issue = parsed.error.issues[0]!;
      const key = issue.path.length ? issue.path.map(String).join(".") : "name";
      return new CsvRefusal(issue.message, {
        row,
        line,
        column: header.find((c) => c.spec.key === key)?.label ?? key,
      });
    }
    const name = String(values.name).toLowerCase();
    const seen = names.get(name);
    if (seen !== undefined) {
      return new CsvRefusal(
        `the name "${truncate(String(values.name))}" is already used by data row ${seen}; each part needs its own name`,
        { row, line, column: nameColumn },
      );
    }
    names.set(name, row);
    rows.push(parsed.data);
  }
  const stopped = walk.refusal;
  if (problems.length > 0) return { ok: false, refusal: problems[0]!, problems, stopped: !!stopped };
  const refusal = walk.refusal;
  if (refusal) return { ok: false, refusal };
  if (!header)
    return {
      ok: false,
      refusal: new CsvRefusal(
        `the file is empty; the first line must name the columns ${columnsOf[kind].map((c) => c.key).join(", ")}`,
        { line: 1 },
      ),
    };
  if (rows.length === 0) return { ok: false, refusal: new CsvRefusal("the file has a header but no parts") };
  // The rows passed the kind's own schema above.
  return { ok: true, parts: { kind, rows } as ImportedParts };
}

function cellValue(value: unknown): CsvCell {
  if (Array.isArray(value)) return value.map((v) => String(v)).join(";");
  if (typeof value === "boolean") return value ? "yes" : "no";
  if (typeof value === "number") return value;
  return value === undefined || value === null ? "" : String(value);
}

/**
 * CSV of the parts with the API's field names as the header (SI, unit in the name). Text cells
 * that a spreadsheet would run as a formula get a leading apostrophe (writeCsv); import drops it.
 */
export function libraryToCsv(kind: PartKind, parts: readonly Record<string, unknown>[]): string {
  const columns = columnsOf[kind].map((c) => c.key);
  return writeCsv(
    columns,
    parts.map((p) => columns.map((k) => cellValue(getField(p, k)))),
    "\n",
  );
}
