// Reads a current recording from CSV: a time column and a current column, units in the header.
// walkCsv reads row by row and the first problem stops it; nothing partial is returned.
import {
  CsvRefusal,
  headerKey,
  plainNumber,
  readNumberCell,
  splitHeaderUnit,
  truncate,
  unitScale,
  walkCsv,
} from "./csv";

export type ProfileSeries = {
  /** Seconds, strictly increasing. */
  timesS: Float64Array;
  /** Amperes. */
  currentsA: Float64Array;
  /** The header's column names as written, for messages and the screen. */
  columns: { time: string; current: string };
};

export type ParseOutcome = { ok: true; series: ProfileSeries } | { ok: false; refusal: CsvRefusal };

const timeNames = new Set(["time", "t"]);
const currentNames = new Set(["current", "i"]);

export const PROFILE_HEADER_HELP =
  'The header must name a time column ("time" or "t") and a current column ("current" or "i"), ' +
  'each with an optional unit in parentheses or brackets, e.g. "Time (ms)" and "current [uA]"; without a unit, seconds and amperes.';

type Column = { index: number; label: string; scale: number };

/** Finds the two columns in the header row; refuses missing, unknown or doubled columns and bad units. */
export function readProfileHeader(cells: string[], line: number): { time: Column; current: Column } | CsvRefusal {
  let time: Column | null = null;
  let current: Column | null = null;
  for (const [index, cell] of cells.entries()) {
    const label = cell.trim().replace(/^\uFEFF/, "");
    const { name, unit } = splitHeaderUnit(label);
    const key = headerKey(name);
    const kind = timeNames.has(key) ? "time" : currentNames.has(key) ? "current" : null;
    if (!kind) {
      const shown =
        label === "" ? `column ${index + 1} has no name` : `"${truncate(label)}" is not a column this file may have`;
      return new CsvRefusal(`${shown}. ${PROFILE_HEADER_HELP}`, { line, column: label || `column ${index + 1}` });
    }
    if ((kind === "time" ? time : current) !== null) {
      return new CsvRefusal(`there is a second ${kind} column; keep exactly one`, { line, column: label });
    }
    let scale = 1;
    if (unit !== null) {
      const s = unitScale(unit, kind, { line, column: label });
      if (!s.ok) return s.refusal;
      scale = s.scale;
    }
    const col = { index, label, scale };
    if (kind === "time") time = col;
    else current = col;
  }
  if (!time) return new CsvRefusal(`the time column is missing. ${PROFILE_HEADER_HELP}`, { line, column: "time" });
  if (!current)
    return new CsvRefusal(`the current column is missing. ${PROFILE_HEADER_HELP}`, { line, column: "current" });
  return { time, current };
}

/** Grows a Float64Array as rows arrive, without boxing every number. */
class Float64Builder {
  private data = new Float64Array(4096);
  length = 0;
  push(v: number) {
    if (this.length === this.data.length) {
      const next = new Float64Array(this.data.length * 2);
      next.set(this.data);
      this.data = next;
    }
    this.data[this.length++] = v;
  }
  last(): number {
    return this.data[this.length - 1] ?? Number.NaN;
  }
  finish(): Float64Array {
    return this.data.slice(0, this.length);
  }
}

/** A cell's number, or why it is not one; a plain number skips the result object (a million rows). */
function numberIn(cell: string): number | string {
  const plain = plainNumber(cell);
  if (Number.isFinite(plain)) return plain;
  const read = readNumberCell(cell);
  return read.ok ? read.value : read.reason;
}

/** Whole-file limits: more rows than this is refused before memory runs out. */
export const MAX_PROFILE_ROWS = 5_000_000;

/**
 * Parses a profile CSV held in a string. Lines starting with "#" are comments; blank lines are
 * skipped; the delimiter (comma, semicolon, tab) is detected. Returns the series or the first refusal.
 */
export function parseProfileCsv(text: string): ParseOutcome {
  const times = new Float64Builder();
  const currents = new Float64Builder();
  let header = null as { time: Column; current: Column } | null;
  let width = 0;
  let charge = 0;

  /** Adds a row that passes every check; false (nothing added) when any check would refuse it. */
  const addPlain = (tS: number, iA: number): boolean => {
    if (!Number.isFinite(tS) || !Number.isFinite(iA)) return false;
    if (times.length > 0) {
      if (!(tS > times.last())) return false;
      const next = charge + ((currents.last() + iA) / 2) * (tS - times.last());
      if (!Number.isFinite(next)) return false;
      charge = next;
    }
    times.push(tS);
    currents.push(iA);
    return true;
  };

  const walk = walkCsv(text, {
    // The common row, two plain numbers, without splitting it into cells; anything else goes to row().
    plainRow(line, from, to, delimiter) {
      if (!header || width !== 2) return false;
      const cut = line.indexOf(delimiter, from);
      if (cut === -1 || cut >= to) return false;
      const second = line.indexOf(delimiter, cut + 1);
      if (second !== -1 && second < to) return false;
      const a = plainNumber(line.slice(from, cut));
      const b = plainNumber(line.slice(cut + 1, to));
      if (Number.isNaN(a) || Number.isNaN(b)) return false;
      const timeFirst = header.time.index === 0;
      return addPlain((timeFirst ? a : b) * header.time.scale, (timeFirst ? b : a) * header.current.scale);
    },
    header(cells, line) {
      const h = readProfileHeader(cells, line);
      if (h instanceof CsvRefusal) return h;
      header = h;
      width = cells.length;
    },
    row(cells, row, line) {
      if (!header) return;
      if (row > MAX_PROFILE_ROWS)
        return new CsvRefusal(`the file has more than ${MAX_PROFILE_ROWS} data rows`, { row, line });
      if (cells.length !== width) {
        return new CsvRefusal(
          `the row has ${cells.length} cell${cells.length === 1 ? "" : "s"} but the header has ${width} columns`,
          { row, line },
        );
      }
      const t = numberIn(cells[header.time.index] ?? "");
      if (typeof t === "string") return new CsvRefusal(t, { row, line, column: header.time.label });
      const i = numberIn(cells[header.current.index] ?? "");
      if (typeof i === "string") return new CsvRefusal(i, { row, line, column: header.current.label });
      const tS = t * header.time.scale;
      const iA = i * header.current.scale;
      if (!Number.isFinite(tS) || !Number.isFinite(iA)) {
        const column = Number.isFinite(tS) ? header.current.label : header.time.label;
        return new CsvRefusal("the value is too large to be a finite number in SI units", { row, line, column });
      }
      if (times.length > 0 && !(tS > times.last())) {
        const previous = Number((times.last() / header.time.scale).toPrecision(12));
        return new CsvRefusal(
          `time must increase from row to row, but ${t} is not after the previous row's ${previous}`,
          {
            row,
            line,
            column: header.time.label,
          },
        );
      }
      // The summary's charge is this trapezoid sum: refuse the row where it stops being finite.
      if (times.length > 0) {
        charge += ((currents.last() + iA) / 2) * (tS - times.last());
        if (!Number.isFinite(charge))
          return new CsvRefusal("the charge up to this row is too large to be a finite number of coulombs", {
            row,
            line,
            column: header.current.label,
          });
      }
      times.push(tS);
      currents.push(iA);
    },
  });

  if (walk.refusal) return { ok: false, refusal: walk.refusal };
  if (!header) return { ok: false, refusal: new CsvRefusal(`the file is empty. ${PROFILE_HEADER_HELP}`, { line: 1 }) };
  const h = header as { time: Column; current: Column };
  if (times.length < 2) {
    return {
      ok: false,
      refusal: new CsvRefusal(
        `the file has ${times.length} data row${times.length === 1 ? "" : "s"}; a profile needs at least two (a start and an end time)`,
        times.length === 1 ? { row: 1 } : {},
      ),
    };
  }
  return {
    ok: true,
    series: {
      timesS: times.finish(),
      currentsA: currents.finish(),
      columns: { time: h.time.label, current: h.current.label },
    },
  };
}

/**
 * The first figure of a summary that is not a finite number (a recording of 1e308 A gives an
 * infinite burden on a real shunt), or null when all are: such a profile is refused, not stored.
 */
export function nonFiniteFigure(summary: Record<string, unknown>): string | null {
  for (const [key, value] of Object.entries(summary)) {
    if (typeof value === "number" && !Number.isFinite(value)) return key;
    // A range plan's per-range figures (timeInRangeS, samplesInRange).
    if (Array.isArray(value) && value.some((v) => typeof v === "number" && !Number.isFinite(v))) return key;
  }
  return null;
}
