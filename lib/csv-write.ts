// Every CSV the app writes goes through here, so no cell can run as a spreadsheet formula.
// A text cell starting with =, +, -, @, tab or carriage return is what a spreadsheet may read as a
// formula (or a formula hidden behind a control character); it gets a leading apostrophe, the
// usual neutralisation (common practice, no source), and is quoted. A cell written from a number
// stays a number, so a negative value in a numeric column still reads as a number.
import Papa from "papaparse";

/** The first characters that make a spreadsheet read a cell as a formula. */
export const FORMULA_START = /^[=+\-@\t\r]/;

export type CsvCell = string | number | boolean | null;

/** A header row and data rows as CSV text, with text cells neutralised; ends with a newline. */
export function writeCsv(fields: readonly string[], rows: readonly (readonly CsvCell[])[], newline = "\r\n"): string {
  return `${Papa.unparse(
    { fields: [...fields], data: rows.map((r) => r.map((c) => (c === null ? "" : c))) },
    { newline, escapeFormulae: FORMULA_START },
  )}${newline}`;
}

/** The inverse on import: "'=x" as written above reads back as "=x". */
export function unneutralise(text: string): string {
  return text.startsWith("'") && FORMULA_START.test(text.slice(1)) ? text.slice(1) : text;
}
