// A refused CSV: what is wrong and exactly where, so the user can fix the file.
// Rows are counted two ways and the message says which: the 1-based data row (after the header)
// and the line of the file (comments and blank lines included).
import Papa from "papaparse";
import { parseQuantity, type Dimension } from "@/lib/design";

export type CsvPlace = {
  /** 1-based data row after the header; absent for header problems and whole-file problems. */
  row?: number;
  /** 1-based line of the file. */
  line?: number;
  /** The column as written in the header (or the expected column's name when it is missing). */
  column?: string;
};

export class CsvRefusal extends Error {
  constructor(
    readonly reason: string,
    readonly place: CsvPlace = {},
  ) {
    super(describePlace(place) + reason);
    this.name = "CsvRefusal";
  }

  /** The body of the 422: the API's error shape plus where the problem is. */
  toJson() {
    const { row, line, column } = this.place;
    return {
      message: this.message,
      fieldErrors: { file: [this.message] },
      ...(row !== undefined ? { row } : {}),
      ...(line !== undefined ? { line } : {}),
      ...(column !== undefined ? { column } : {}),
    };
  }
}

function describePlace({ row, line, column }: CsvPlace): string {
  const parts: string[] = [];
  if (row !== undefined) parts.push(`Data row ${row}${line !== undefined ? ` (file line ${line})` : ""}`);
  else if (line !== undefined) parts.push(`File line ${line}`);
  if (column !== undefined) parts.push(`column "${column}"`);
  return parts.length ? `${parts.join(", ")}: ` : "";
}

// One way to match any text (no adjacent repeats that can trade characters), so linear time.
const numberText = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:e[+-]?\d+)?$/i;
const notFinite = /^[+-]?(?:nan|inf|infinity|∞)$/i;
const decimalComma = /^[+-]?\d+,\d+$/;

/** The longest number cell read (issue 10): far more digits than a double holds, and no regex sees more. */
export const MAX_NUMBER_CELL_CHARS = 64;
/** The longest header cell: a column name with its unit. */
export const MAX_HEADER_CELL_CHARS = 200;
/** The longest data cell of any kind (a list of ratings, a part name). */
export const MAX_DATA_CELL_CHARS = 1000;

const isDigit = (c: number) => c >= 48 && c <= 57;

/**
 * The cell as a number when it plainly is one, else NaN (and readNumberCell's patterns decide). A
 * cell that starts with a digit, sign or point, ends with a digit or point and is not 0x/0b/0o,
 * and that Number() reads as finite, is exactly a cell the numberText pattern accepts: after those
 * checks Number()'s grammar is [+-]? decimal digits with an optional point and exponent.
 */
export function plainNumber(raw: string): number {
  const n = raw.length;
  if (n === 0 || n > MAX_NUMBER_CELL_CHARS) return Number.NaN;
  const first = raw.charCodeAt(0);
  if (!(isDigit(first) || first === 43 || first === 45 || first === 46)) return Number.NaN;
  const last = raw.charCodeAt(n - 1);
  if (!(isDigit(last) || last === 46)) return Number.NaN;
  if (first === 48 && n > 1) {
    const radix = raw.charCodeAt(1) | 0x20; // lower case
    if (radix === 120 || radix === 98 || radix === 111) return Number.NaN; // x, b, o
  }
  return Number(raw);
}

/** A cell as a finite number, or the reason it is not one. */
export function readNumberCell(raw: string): { ok: true; value: number } | { ok: false; reason: string } {
  const plain = plainNumber(raw);
  if (Number.isFinite(plain)) return { ok: true, value: plain };
  if (raw.length > MAX_NUMBER_CELL_CHARS)
    return {
      ok: false,
      reason: `the cell has ${raw.length} characters; a number takes at most ${MAX_NUMBER_CELL_CHARS}`,
    };
  const text = raw.trim();
  if (text === "") return { ok: false, reason: "the cell is empty; expected a number" };
  if (notFinite.test(text))
    return { ok: false, reason: `"${text}" is not a finite number (NaN and infinity are refused)` };
  if (decimalComma.test(text))
    return { ok: false, reason: `"${text}" is not a number (write decimals with a point: ${text.replace(",", ".")})` };
  if (!numberText.test(text)) return { ok: false, reason: `"${truncate(text)}" is not a number` };
  const value = Number(text);
  if (!Number.isFinite(value)) return { ok: false, reason: `"${truncate(text)}" is too large to be a finite number` };
  return { ok: true, value };
}

export function truncate(text: string, max = 40): string {
  return text.length > max ? `${text.slice(0, max)}…` : text;
}

/** Tracks file line numbers from Papa's row-end cursor, counting newlines once. */
export class LineCounter {
  private pos = 0;
  private newlines = 0;
  constructor(private readonly text: string) {}

  /** The (last) line of the row that ends at `cursor`. */
  lineOfRowEndingAt(cursor: number): number {
    let end = cursor;
    if (end > 0 && this.text[end - 1] === "\n") end -= 1;
    while (this.pos < end) {
      const next = this.text.indexOf("\n", this.pos);
      if (next === -1 || next >= end) {
        this.pos = end;
        break;
      }
      this.newlines += 1;
      this.pos = next + 1;
    }
    return this.newlines + 1;
  }
}

/**
 * `Time (ms)` → { name: "Time", unit: "ms" }; `current [uA]` → { name: "current", unit: "uA" }.
 * Read by hand from the end (no regex), so a long header cannot cost more than one pass.
 */
export function splitHeaderUnit(cell: string): { name: string; unit: string | null } {
  const text = cell.trim().replace(/^\uFEFF/, "");
  const close = text.at(-1);
  const open = close === ")" ? "(" : close === "]" ? "[" : null;
  if (!open || !close) return { name: text, unit: null };
  const start = text.lastIndexOf(open, text.length - 2);
  const unit = start === -1 ? null : text.slice(start + 1, -1);
  // The unit holds no bracket of its own kind: "a (b (c))" is a name, not a unit.
  if (unit === null || unit.includes(close)) return { name: text, unit: null };
  return { name: text.slice(0, start).trim(), unit: unit.trim() };
}

/** How many SI base units one of `unit` is, through the engine's quantity parser. */
export function unitScale(
  unit: string,
  dim: Dimension,
  place: CsvPlace,
): { ok: true; scale: number } | { ok: false; refusal: CsvRefusal } {
  const example = exampleUnit[dim] ?? "an SI unit";
  if (unit === "")
    return {
      ok: false,
      refusal: new CsvRefusal(`the brackets hold no unit; write one (e.g. ${example}) or leave them out`, place),
    };
  const r = parseQuantity(`1 ${unit}`, dim);
  if (r.ok && r.value > 0) return { ok: true, scale: r.value };
  const head = `1 ${unit}`;
  const wrongDimension = !r.ok && r.message.startsWith(head) && r.message.includes(", not ");
  const reason = wrongDimension
    ? `unit "${unit}"${r.message.slice(head.length)}`
    : `unit "${unit}" is not a known unit of ${dim} (use e.g. ${example})`;
  return { ok: false, refusal: new CsvRefusal(reason, place) };
}

const exampleUnit: Partial<Record<Dimension, string>> = {
  current: "mA",
  voltage: "mV",
  time: "ms",
  resistance: "mohm",
  frequency: "kHz",
  power: "W",
};

/** Header names compared without case, spaces, dashes or underscores. */
export function headerKey(name: string): string {
  return name.toLowerCase().replace(/[\s_\-./]+/g, "");
}

const delimiters = [",", ";", "\t", "|"] as const;

/** The delimiter of the header line (the first line that is neither blank nor a "#" comment). */
export function detectDelimiter(text: string): string {
  let pos = 0;
  while (pos < text.length) {
    const end = text.indexOf("\n", pos);
    const line = text.slice(pos, end === -1 ? text.length : end).trim();
    pos = end === -1 ? text.length : end + 1;
    if (line === "" || line.startsWith("#")) continue;
    let best: string = ",";
    let bestCount = 0;
    for (const d of delimiters) {
      const count = line.split(d).length - 1;
      if (count > bestCount) [best, bestCount] = [d, count];
    }
    return best;
  }
  return ",";
}

export type RowVisitor = {
  /** The header row; return a refusal to stop. */
  header(cells: string[], line: number): CsvRefusal | void;
  /** A data row (1-based `row`); return a refusal to stop. */
  row(cells: string[], row: number, line: number): CsvRefusal | void;
  /**
   * Optional, for files of a million rows: a data row of an unquoted file as `text` from `from` to
   * `to`, before it is split into cells. Return true when it was taken whole; false sends the same
   * row to `row` (which then accepts it or says what is wrong), so no message depends on this path.
   */
  plainRow?(text: string, from: number, to: number, delimiter: string): boolean;
};

type Walked = { refusal: CsvRefusal | null; rows: number; sawHeader: boolean };

/** What both walkers do with one row's cells: the header once, then data rows; a refusal stops the walk. */
class RowSink {
  refusal = null as CsvRefusal | null;
  sawHeader = false;
  rows = 0;
  private header: string[] = [];
  constructor(private readonly visit: RowVisitor) {}

  /** Takes one row; false once the walk must stop. */
  take(cells: string[], line: number): boolean {
    if (cells.length === 0 || (cells.length === 1 && (cells[0] ?? "").trim() === "")) return true; // blank line
    if (!this.sawHeader) {
      this.sawHeader = true;
      this.header = cells;
      const long = cells.findIndex((c) => c.length > MAX_HEADER_CELL_CHARS);
      if (long !== -1)
        return this.stop(
          new CsvRefusal(
            `the header cell has ${cells[long]!.length} characters; a column name with its unit takes at most ${MAX_HEADER_CELL_CHARS}`,
            { line, column: `column ${long + 1}` },
          ),
        );
      return this.stop(this.visit.header(cells, line));
    }
    this.rows += 1;
    let long = -1;
    for (let k = 0; k < cells.length && long === -1; k++) if (cells[k]!.length > MAX_DATA_CELL_CHARS) long = k;
    if (long !== -1)
      return this.stop(
        new CsvRefusal(`the cell has ${cells[long]!.length} characters; at most ${MAX_DATA_CELL_CHARS} are read`, {
          row: this.rows,
          line,
          column: truncate((this.header[long] ?? "").trim()) || `column ${long + 1}`,
        }),
      );
    return this.stop(this.visit.row(cells, this.rows, line));
  }

  /** A data row of an unquoted file, offered whole to the visitor's plainRow before it is split. */
  takePlain(text: string, from: number, to: number, delimiter: string, line: number): boolean {
    if (this.sawHeader && this.visit.plainRow && to - from <= MAX_DATA_CELL_CHARS) {
      this.rows += 1;
      if (this.visit.plainRow(text, from, to, delimiter)) return true;
      this.rows -= 1;
    }
    return this.take(text.slice(from, to).split(delimiter), line);
  }

  stop(r: CsvRefusal | void): boolean {
    if (!r) return true;
    this.refusal = r;
    return false;
  }

  result(): Walked {
    return { refusal: this.refusal, rows: this.rows, sawHeader: this.sawHeader };
  }
}

const occurrences = (text: string, what: string) => {
  let n = 0;
  for (let at = text.indexOf(what); at !== -1; at = text.indexOf(what, at + what.length)) n += 1;
  return n;
};

/**
 * The newline of a file that needs no CSV quoting rules, or null when Papa must read it: a file
 * with a quote anywhere, or one whose carriage returns are not each the first half of a "\r\n"
 * ending every line (Papa would guess its line ends; decided before any row is read, because a
 * visitor cannot take rows back).
 */
function plainNewline(text: string): "\n" | "\r\n" | null {
  if (text.includes('"')) return null;
  if (!text.includes("\r")) return "\n";
  const pairs = occurrences(text, "\r\n");
  return pairs > 0 && pairs === occurrences(text, "\r") && pairs === occurrences(text, "\n") ? "\r\n" : null;
}

/**
 * A file without quotes, line by line with indexOf (Papa's general state machine costs 2–3× that on
 * a million rows): the same rows, cells and line numbers as Papa's walk, fed to the same sink.
 */
function walkPlainLines(text: string, newline: "\n" | "\r\n", visit: RowVisitor): Walked {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text; // Papa strips a byte-order mark too
  const delimiter = detectDelimiter(body);
  const ending = newline.length; // every line ends in it (plainNewline checked), but perhaps the last
  const sink = new RowSink(visit);
  let line = 0;
  for (let pos = 0; pos < body.length;) {
    const nl = body.indexOf("\n", pos);
    const end = nl === -1 ? body.length : nl + 1;
    const stop = nl === -1 ? end : end - ending;
    line += 1;
    const from = pos;
    pos = end;
    if (body.charCodeAt(from) === 35) continue; // "#": a comment line
    if (!sink.takePlain(body, from, stop, delimiter, line)) break;
  }
  return sink.result();
}

/**
 * Walks a CSV held in a string row by row, stopping at the first refusal. "#" lines are comments,
 * blank lines are skipped, the delimiter comes from the header line. A file without quotes is read
 * line by line; any other with Papa's step callback. Returns the first refusal, or null with the
 * number of data rows and whether a header was seen.
 */
export function walkCsv(text: string, visit: RowVisitor): Walked {
  const newline = plainNewline(text);
  if (newline) return walkPlainLines(text, newline, visit);
  // Quotes, or line ends Papa must guess: its parser, fed to the same sink.
  const lines = new LineCounter(text);
  const sink = new RowSink(visit);
  Papa.parse<string[]>(text, {
    comments: "#",
    delimiter: detectDelimiter(text),
    skipEmptyLines: false,
    step(result, parser) {
      const line = lines.lineOfRowEndingAt(result.meta.cursor);
      const bad = result.errors.find((e) => e.type !== "Delimiter");
      const ok = bad
        ? sink.stop(
            new CsvRefusal(
              `the file cannot be read as CSV here: ${bad.message}`,
              sink.sawHeader ? { row: sink.rows + 1, line } : { line },
            ),
          )
        : sink.take(result.data, line);
      if (!ok) parser.abort();
    },
  });
  return sink.result();
}
