// Units CSV in (all or nothing, refusals naming row and column) and calibration coefficients out
// (read back with papaparse, formula-like cells neutralised).
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import type { BenchCheckRow } from "@/lib/design";
import { calibrationCsv, calibrationJson, parseUnitsCsv, unitsCsvTemplate } from "./csv";
import type { UnitView } from "./judge";

const bench: BenchCheckRow[] = [
  { label: "Minimum current", currentA: 0.1, expectedV: 0.03675, minV: 0.034, maxV: 0.0395 },
  { label: "Maximum current", currentA: 6, expectedV: 2.205, maxV: 2.229, minV: 2.181 },
];

describe("parseUnitsCsv", () => {
  it("reads columns named by test point or by current, quantities or numbers with a unit in the header", () => {
    const text = "serial,date,Minimum current,6 A [mV]\nA-1,2026-11-20,36.9 mV,2206\nA-2,,0.0371,2204.5\n";
    const r = parseUnitsCsv(text, bench, "2026-12-01");
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.units.map((u) => [u.serial, u.builtOn, u.readings.map((x) => x.outputV)])).toEqual([
      ["A-1", "2026-11-20", [0.0369, 2.206]],
      ["A-2", "2026-12-01", [0.0371, 2.2045]],
    ]);
  });
  it("names the row and column of a reading with the wrong dimension", () => {
    const r = parseUnitsCsv("serial,Minimum current,Maximum current\nA-1,36.9 mV,2.2 V\nA-2,37 mA,2.2 V\n", bench);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.refusal.place).toMatchObject({ row: 2, column: "Minimum current" });
    expect(r.refusal.message).toMatch(/37 mA is a current, not a voltage/);
  });
  it("refuses a serial twice in the file, a missing test point, an unknown column and an empty cell", () => {
    const dup = parseUnitsCsv("serial,Minimum current,Maximum current\nA-1,1,2\na-1,1,2\n", bench);
    expect(!dup.ok && dup.refusal.message).toMatch(/Data row 2 .*column "serial": serial "a-1" is also on data row 1/);
    const missing = parseUnitsCsv("serial,Minimum current\nA-1,1\n", bench);
    expect(!missing.ok && missing.refusal.message).toMatch(/no column for "Maximum current" \(6 A\)/);
    const unknown = parseUnitsCsv("serial,Minimum current,Maximum current,3 A\nA-1,1,2,3\n", bench);
    expect(!unknown.ok && unknown.refusal.place.column).toBe("3 A");
    const empty = parseUnitsCsv("serial,Minimum current,Maximum current\nA-1,,2\n", bench);
    expect(!empty.ok && empty.refusal.place).toMatchObject({ row: 1, column: "Minimum current" });
    const none = parseUnitsCsv("serial,Minimum current,Maximum current\n", bench);
    expect(!none.ok && none.refusal.message).toMatch(/no units/);
  });
  it("writes a template the import reads back", () => {
    const t = unitsCsvTemplate(bench);
    expect(t).toBe("serial,date,Minimum current,Maximum current\r\n");
    expect(parseUnitsCsv(`${t}X-9,,1 mV,2 V\r\n`, bench).ok).toBe(true);
  });
});

const unit = (serial: string, gain: number, offsetV: number, by = "Demo Maker"): UnitView => ({
  id: serial,
  revision: 2,
  serial,
  builtOn: "2026-11-23",
  recordedBy: "u",
  recordedByName: by,
  createdAt: "",
  updatedAt: "",
  pass: true,
  readings: [],
  cause: null,
  causeKind: null,
  calibration: { gain, offsetV, residualPercent: 0.01, method: "least-squares", points: 4 },
  outsideSpread: false,
});

describe("calibration exports", () => {
  it("writes one row per serial with gain and offset that read back exactly", () => {
    const csv = calibrationCsv([unit("PC-1", 0.98, -0.00031), unit("PC-2", 1.0001, 0.0002)]);
    const rows = Papa.parse<Record<string, string>>(csv.trim(), { header: true }).data;
    expect(rows.map((r) => [r.serial, Number(r.gain), Number(r.offset_v)])).toEqual([
      ["PC-1", 0.98, -0.00031],
      ["PC-2", 1.0001, 0.0002],
    ]);
    expect(csv.endsWith("\r\n")).toBe(true);
  });
  it("puts an apostrophe before cells a spreadsheet would run as a formula, but not before plain numbers", () => {
    const csv = calibrationCsv([unit("=HYPERLINK(1)", 1, -0.5, "@mallory"), unit("-12", 1, 0, "+x")]);
    const rows = Papa.parse<Record<string, string>>(csv.trim(), { header: true }).data;
    expect(rows[0]).toMatchObject({ serial: "'=HYPERLINK(1)", offset_v: "-0.5", recorded_by: "'@mallory" });
    expect(rows[1]).toMatchObject({ serial: "-12", recorded_by: "'+x" });
  });
  it("says the formula in the JSON", () => {
    const j = calibrationJson({ id: "d", name: "Pump" }, [unit("PC-1", 0.98, 0.001)], new Date("2026-12-01T00:00:00Z"));
    expect(j).toMatchObject({ format: "sensewright-calibration", version: 1, generatedAt: "2026-12-01T00:00:00.000Z" });
    expect(j.formula).toMatch(/corrected = gain \* raw \+ offsetV/);
    expect(j.units).toEqual([expect.objectContaining({ serial: "PC-1", gain: 0.98, offsetV: 0.001 })]);
  });
});
