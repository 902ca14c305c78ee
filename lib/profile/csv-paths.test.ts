// A file without quotes is read line by line (walkPlainLines, and the profile's plainRow for its
// two-number rows); any other file by Papa. Both must give the same series and the same refusal,
// row, line and column. A quote in a trailing comment line sends the same rows down Papa's path.
import { describe, expect, it } from "vitest";
import { parseLibraryCsv } from "@/lib/library/csv";
import { parseProfileCsv } from "./parse";

/** The same file with a comment line holding quotes, in the file's own line ends (Papa guesses them). */
function throughPapa(text: string): string {
  const nl = text.includes("\r\n") ? "\r\n" : "\n";
  return `${text}${text.endsWith("\n") || text === "" ? "" : nl}# a "quoted" note${nl}`;
}

function outcome(text: string) {
  const r = parseProfileCsv(text);
  if (!r.ok) return { refusal: r.refusal.toJson() };
  return { times: [...r.series.timesS], currents: [...r.series.currentsA], columns: r.series.columns };
}

const cases: Record<string, string> = {
  plain: "time (s),current (A)\n0,0.001\n0.001,0.002\n0.002,0.0015\n",
  "no final newline": "t,i\n0,1\n1,2",
  crlf: "time (ms),current (mA)\r\n0,1.5\r\n1,2.5\r\n2,3\r\n",
  "byte-order mark": "\uFEFFtime,current\n0,1\n1,2\n",
  semicolons: "# logger export\n\ntime (s);current (uA)\n0;5\n\n1e-3;7.5\n",
  tabs: "current [mA]\ttime [ms]\n4\t0\n5\t1\n",
  "signs, points and exponents": "t,i\n.5,+1e-3\n5.,-2E+2\n6,-0\n7, 8 \n",
  "a word": "t,i\n0,1\n1,abc\n",
  hexadecimal: "t,i\n0,1\n1,0x10\n",
  binary: "t,i\n0,1\n1,0b11\n",
  "decimal comma": "t;i\n0;1\n1;1,5\n",
  "empty cell": "t,i\n0,1\n1,\n",
  "not a number": "t,i\n0,1\n1,NaN\n",
  infinite: "t,i\n0,1\n1,1e400\n",
  "infinite after scaling": "t (s),i (A)\n0,1\n1,1.7e308\n2,1.7e308\n",
  "time standing still": "t,i\n0,1\n0,2\n",
  "too many cells": "t,i\n0,1\n1,2,3\n",
  "too few cells": "t,i\n0,1\n1\n",
  "a long cell": `t,i\n0,1\n1,${"1".repeat(1200)}\n`,
  "a long number": `t,i\n0,1\n1,${"1".repeat(70)}\n`,
  "one row": "t,i\n0,1\n",
  "header only": "t,i\n",
  "unknown column": "t,volts\n0,1\n",
  "whitespace line": "t,i\n0,1\n   \n1,2\n",
  "bare carriage return midway": "t,i\r\n0,1\r\n1,2\n2,3\r\n",
};

describe("the line-by-line reader and Papa agree", () => {
  for (const [name, text] of Object.entries(cases)) {
    it(name, () => {
      expect(outcome(text)).toEqual(outcome(throughPapa(text)));
    });
  }

  it("the cases cover refusals and accepted files alike", () => {
    const results = Object.values(cases).map((t) => "refusal" in outcome(t));
    expect(results.filter(Boolean).length).toBeGreaterThan(10);
    expect(results.filter((r) => !r).length).toBeGreaterThan(5);
  });

  it("a refusal names the row, file line and column", () => {
    const r = parseProfileCsv("# note\ntime (s),current (A)\n0,1\n\n1,abc\n");
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.refusal.toJson()).toMatchObject({ row: 2, line: 5, column: "current (A)" });
  });

  it("other readers on the same walker keep their answers (library import)", () => {
    for (const text of ["name,ohms\nR1,0.01\n", "name,ohms,tolerance\nR1,0.01\nR2,x,1 %\n"]) {
      const read = (t: string) => JSON.stringify(parseLibraryCsv("shunts", t), (_k, v: unknown) => v);
      expect(read(text)).toBe(read(throughPapa(text)));
    }
  });
});
