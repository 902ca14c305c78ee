// Issue 10, item 1: the CSV readers refuse over-long cells by row and column, and every regex on a
// cell runs in linear time (checked as ratios of timings taken side by side, never as a time).
import { describe, expect, it } from "vitest";
import { libraryToCsv, parseLibraryCsv } from "@/lib/library/csv";
import { FORMULA_START, writeCsv } from "@/lib/csv-write";
import { readNumberCell, splitHeaderUnit } from "./csv";
import { parseProfileCsv } from "./parse";
import { parseCapacityC } from "./capacity";

function fastest(fn: () => unknown, reps = 10, runs = 5): number {
  let best = Infinity;
  for (let r = 0; r < runs; r++) {
    const start = performance.now();
    for (let k = 0; k < reps; k++) fn();
    best = Math.min(best, performance.now() - start);
  }
  return Math.max(best, 1e-3);
}

describe("number cells", () => {
  it("refuse more than 64 characters, whatever they are", () => {
    const r = readNumberCell("1".repeat(40_000) + "x");
    expect(r).toEqual({ ok: false, reason: "the cell has 40001 characters; a number takes at most 64" });
    expect(readNumberCell("1".repeat(64)).ok).toBe(true);
  });

  it("cost the same for 40,000 digits and an x as for a short refusal", () => {
    const ratio = fastest(() => readNumberCell("1".repeat(40_000) + "x")) / fastest(() => readNumberCell("1x"));
    expect(ratio).toBeLessThan(20);
  });

  it('refuse "1e999" as not finite', () => {
    expect(readNumberCell("1e999")).toMatchObject({ ok: false });
  });
});

describe("header cells", () => {
  it.each([
    ["Time (ms)", { name: "Time", unit: "ms" }],
    ["current [uA]", { name: "current", unit: "uA" }],
    ["  t ( s )  ", { name: "t", unit: "s" }],
    ["\uFEFFtime", { name: "time", unit: null }],
    ["time ()", { name: "time", unit: "" }],
    ["a (b (c))", { name: "a (b (c))", unit: null }],
    ["a [b] (c)", { name: "a [b]", unit: "c" }],
    ["current", { name: "current", unit: null }],
    [")", { name: ")", unit: null }],
  ])("%j splits as before", (cell, expected) => {
    expect(splitHeaderUnit(cell)).toEqual(expected);
  });

  it("split in linear time: an 8× longer spaced-out header costs about 8× (quadratic would be 64×)", () => {
    // 8× rather than 2×, so noise on a shared machine cannot carry a linear cost past the bound.
    const header = (n: number) => `time${" ".repeat(n)}x)`;
    const ratio = fastest(() => splitHeaderUnit(header(320_000))) / fastest(() => splitHeaderUnit(header(40_000)));
    expect(ratio).toBeLessThan(24);
  });

  it("over 200 characters are refused naming the line and column", () => {
    const r = parseProfileCsv(`time,current${" ".repeat(300)}(A)\n0,1\n1,2\n`);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.refusal.toJson()).toMatchObject({ line: 1, column: "column 2" });
  });
});

describe("profile rows", () => {
  it("a 40,000-digit current is refused at its row and column", () => {
    const r = parseProfileCsv(`time (s),current (A)\n0,0.01\n0.001,${"1".repeat(40_000)}x\n`);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.refusal.toJson()).toMatchObject({ row: 2, line: 3, column: "current (A)" });
  });

  it("a recording whose charge is not finite is refused where it overflows (item 9)", () => {
    const r = parseProfileCsv("time (s),current (A)\n0,1e308\n1,1e308\n2,1e308\n");
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.refusal.toJson()).toMatchObject({ row: 2, column: "current (A)" });
  });
});

describe("CSV written by the app (item 10)", () => {
  it("neutralises text that a spreadsheet would run, keeps numbers as numbers", () => {
    const csv = writeCsv(
      ["a", "b"],
      [
        ["=1+1", -5],
        ["+x", "-5"],
        ["@y", "\tz"],
        ["\rw", "plain"],
      ],
      "\n",
    );
    expect(csv).toBe(`a,b\n"'=1+1",-5\n"'+x","'-5"\n"'@y","'\tz"\n"'\rw",plain\n`);
    expect(FORMULA_START.test("=a\nb")).toBe(true);
  });

  it("the library export writes '= and imports back the name as it was", () => {
    const part = {
      name: "=cmd|' /C calc'!A0",
      series: "E24",
      minOhms: 0.001,
      maxOhms: 0.1,
      toleranceFraction: 0.01,
      tempcoPerK: 5e-5,
      ratingsW: [0.5, 1],
      fourTerminal: false,
    };
    const csv = libraryToCsv("shunts", [part]);
    expect(csv.split("\n")[1]!.startsWith(`"'=cmd|`)).toBe(true);
    const back = parseLibraryCsv("shunts", csv);
    expect(back.ok).toBe(true);
    if (back.ok) expect(back.parts.rows[0]!.name).toBe(part.name);
  });

  it("a library quantity cell over 64 characters is refused at its row and column", () => {
    const header = "name,series,minOhms,maxOhms,toleranceFraction,tempcoPerK,ratingsW,fourTerminal";
    const r = parseLibraryCsv("shunts", `${header}\nA,E24,${"9".repeat(70)} mohm,0.1,0.01,0.00005,1,no\n`);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.refusal.toJson()).toMatchObject({ row: 1, column: "minOhms" });
  });
});

describe("battery capacity text", () => {
  it("reads what it read before (1 mAh = 3.6 C) and refuses long text at once", () => {
    expect(parseCapacityC(" 220 mAh ")).toBeCloseTo(792, 9);
    expect(parseCapacityC("2.4Ah")).toBeCloseTo(8640, 9);
    expect(parseCapacityC("800   C")).toBe(800);
    expect(parseCapacityC("220")).toBeCloseTo(792, 9);
    expect(parseCapacityC("1" + " ".repeat(40_000) + "x")).toBeNull();
    const ratio = fastest(() => parseCapacityC("1" + " ".repeat(40_000) + "x")) / fastest(() => parseCapacityC("1 x"));
    expect(ratio).toBeLessThan(200); // trimming 40,000 characters is linear; the regex never sees them
  });
});
