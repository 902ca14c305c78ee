// The plain-file exports: the parts CSV reads back (with a general-purpose CSV parser) into the
// same parts list; the design JSON goes through the import schema and the design service back
// to the same requirement, choice and figures; a bad file is refused naming the field.
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { evaluateCandidate, parseRequirement } from "@/lib/design";
import { csvColumns, designExport, designImportSchema, exportFileName, partsCsv } from "@/lib/build-sheet/exports";
import { fixtureView, loggerRequirement, pumpRequirement } from "@/lib/build-sheet/fixtures";
import { partsList } from "@/lib/build-sheet/parts";
import { evaluateDesign, evaluatePicked, pickedOf } from "@/lib/saved-designs/service";
import { HttpError } from "@/lib/http";

const logger = fixtureView(loggerRequirement, { name: "Soil logger, radio range", revision: 4 });
const gainSet = fixtureView(
  { ...loggerRequirement, amplifier: { gains: { series: "E24", min: 20, max: 60 } } },
  { name: 'Logger "gain set", R2/R3' },
);

describe("parts CSV", () => {
  it.each([
    ["fixed gain", logger],
    ["resistor-set gain (quotes and commas in the text)", gainSet],
  ])("%s: header row, one row per part, and it parses back to the same list", (_n, view) => {
    const csv = partsCsv(view);
    expect(csv.split("\r\n")[0]).toBe("designator,part,value,tolerance,tempco,rating,notes,value_si,unit");
    const parsed = Papa.parse<Record<string, string>>(csv, { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.meta.fields).toEqual([...csvColumns]);
    const parts = partsList(view.requirement, view.choice);
    expect(parsed.data).toHaveLength(parts.length);
    parsed.data.forEach((row, i) => {
      const p = parts[i]!;
      expect(row).toEqual({
        designator: p.designator,
        part: p.part,
        value: p.value,
        tolerance: p.tolerance,
        tempco: p.tempco,
        rating: p.rating,
        notes: p.notes,
        value_si: p.valueSI === null ? "" : String(p.valueSI),
        unit: p.unit ?? "",
      });
    });
    const r1 = parsed.data.find((r) => r.designator === "R1")!;
    expect(Number(r1.value_si)).toBe(view.choice.shuntOhms);
    expect(Number(parsed.data.find((r) => r.designator === "U1")!.value_si)).toBe(view.choice.gain);
  });

  it("lists R2 and R3 whose ratio gives the gain (G = 1 + R2/R3)", () => {
    const parts = partsList(gainSet.requirement, gainSet.choice);
    const rf = parts.find((p) => p.designator === "R2")!.valueSI!;
    const rg = parts.find((p) => p.designator === "R3")!.valueSI!;
    expect(1 + rf / rg).toBeCloseTo(gainSet.choice.gain, 9);
  });

  it("names files after the design and its revision", () => {
    expect(exportFileName(logger, "pdf")).toBe("soil-logger-radio-range-rev4.pdf");
    expect(exportFileName({ name: "Ünïcode / ... ", revision: 1 }, "csv")).toBe("unicode-rev1.csv");
    expect(exportFileName({ name: "???", revision: 2 }, "pdf")).toBe("design-rev2.pdf");
  });
});

describe("design JSON export and import", () => {
  it.each([
    ["low side", logger],
    ["high side", fixtureView(pumpRequirement, { name: "Pump controller", status: "approved" })],
    ["resistor-set gain", gainSet],
  ])("%s: round-trips to the same requirement, choice and figures", (_n, view) => {
    const file = JSON.parse(JSON.stringify(designExport(view, new Date("2026-12-01T00:00:00Z"))));
    expect(file).toMatchObject({ format: "sensewright-design", version: 1, name: view.name, project: view.project });
    const body = designImportSchema.parse(file);
    const evaluated = evaluatePicked(body.requirement, pickedOf(body));
    expect(evaluated.requirement).toEqual(view.requirement);
    expect(evaluated.choice).toEqual(view.choice);
    expect(evaluated.metrics).toEqual(evaluateCandidate(view.requirement, view.choice));
    // The normalized requirement parses to itself (so a second export equals the first).
    const again = parseRequirement(view.requirement);
    expect(again.ok && again.requirement).toEqual(view.requirement);
  });

  const refused = (input: unknown) => {
    const r = designImportSchema.safeParse(input);
    expect(r.success).toBe(false);
    return r.error!.issues.map((i) => i.path.join("."));
  };

  it("refuses a file that is not ours, naming the field", () => {
    const good = designExport(logger, new Date());
    expect(refused({ ...good, format: "something-else" })).toContain("format");
    expect(refused({ ...good, version: 2 })).toContain("version");
    expect(refused({ ...good, name: "  " })).toContain("name");
    expect(refused({ ...good, choice: { shuntOhms: "a lot", gain: 50 } })).toContain("choice.shuntOhms");
    expect(refused({ ...good, requirement: "no" })).toContain("requirement");
    expect(refused([1, 2])).toEqual([""]);
  });

  it("refuses a requirement the engine refuses, with the dotted path under requirement", () => {
    const good = designExport(logger, new Date());
    const body = designImportSchema.parse({
      ...good,
      requirement: { ...good.requirement, current: { min: 0.001, max: "5 V" } },
    });
    try {
      evaluateDesign(body.requirement, pickedOf(body).choice ?? { shuntOhms: NaN, gain: NaN });
      expect.unreachable("the service accepted a voltage as a current");
    } catch (e) {
      expect(e).toBeInstanceOf(HttpError);
      expect((e as HttpError).status).toBe(422);
      expect(Object.keys((e as HttpError).fieldErrors ?? {})).toContain("requirement.current.max");
    }
  });
});
