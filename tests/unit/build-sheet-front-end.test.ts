// The build sheet for issue 14's parts: a copper-trace shunt's geometry and Kelvin taps, the
// input filter's resistors and capacitors, IEC 60062 codes on every resistor, a 2-terminal
// shunt's pads, and a difference stage's four resistors. Read from the parts list and from
// the rendered PDF's text (unpdf).
import { extractText } from "unpdf";
import { describe, expect, it } from "vitest";
import { fixtureView, loggerRequirement, packMonitorRequirement } from "@/lib/build-sheet/fixtures";
import { partsList } from "@/lib/build-sheet/parts";
import { renderBuildSheet } from "@/lib/build-sheet/render";
import { sheetData } from "@/lib/build-sheet/sheet-data";
import { designExport, type DesignExport } from "@/lib/build-sheet/exports";
import { parseRequirement } from "@/lib/design/requirement";
import { traceResistance } from "@/lib/design/copper-trace";

const meta = { team: "Harbourline Labs", generatedAt: new Date("2026-12-01T09:30:00Z") };
const squash = (s: string) => s.normalize("NFKC").replace(/\s+/g, " ");

describe("pack monitor on a copper trace, with an input filter", () => {
  const view = fixtureView(packMonitorRequirement, { name: "Pack monitor, discharge" });
  const parts = partsList(view.requirement, view.choice);
  const lengthMm =
    Math.round(
      ((view.choice.shuntOhms * 10e-3 * 70e-6) / traceResistance({ width: 1, length: 1, thickness: 1 })) * 1e4,
    ) / 10;

  it("R1 is the trace, drawn by its dimensions: ρ·L/(w·t) gives back the chosen value", () => {
    const r1 = parts.find((p) => p.designator === "R1")!;
    expect(r1.part).toMatch(/Copper-trace shunt/);
    expect(r1.code).toBeNull();
    expect(r1.notes).toContain(`10 mm wide, ${lengthMm} mm between the Kelvin taps' centre lines, 70 µm copper`);
    expect(r1.rating).toMatch(/IPC-2221/);
  });

  it("lists the filter's two resistors and two capacitors, with their corner", () => {
    const rs = parts.filter((p) => p.part.startsWith("Input filter resistor"));
    expect(rs.map((p) => [p.designator, p.value, p.code])).toEqual([
      ["R2", "47 Ω", "47R"],
      ["R3", "47 Ω", "47R"],
    ]);
    const cs = parts.filter((p) => p.part.startsWith("Ceramic capacitor, C0G"));
    expect(cs.map((p) => p.designator)).toEqual(["C2", "C3"]);
    expect(cs[0]!.notes).toContain("103 Hz corner"); // 1/(2π·47 Ω·33 µF) = 102.6 Hz
  });

  it("the layout notes place the taps, and the requirement rows state the construction", () => {
    const d = sheetData(view);
    expect(d.layout[0]).toContain(`Tap A at 0 mm and tap B at ${lengthMm} mm along the trace`);
    expect(d.requirement.map((r) => r.label)).toEqual(
      expect.arrayContaining(["Shunt construction", "Input filter (each leg)"]),
    );
    expect(d.budget.map((b) => b.label)).toContain("Input filter: bias and offset current through its resistors");
  });

  it("the PDF carries the trace, the taps and the filter parts", async () => {
    const pdf = await renderBuildSheet(view, meta);
    const { text } = await extractText(new Uint8Array(pdf), { mergePages: true });
    const all = squash(text);
    expect(all).toContain("Copper-trace shunt");
    expect(all).toContain(`tap B at ${lengthMm} mm`);
    expect(all).toContain("Input filter resistor, + leg");
    expect(all).toContain("47R");
  });
});

describe("JSON export of the pack monitor", () => {
  it("carries the trace, the filter and their figures, and its requirement reads back unchanged", () => {
    const view = fixtureView(packMonitorRequirement, { name: "Pack monitor, discharge" });
    const file = JSON.parse(JSON.stringify(designExport(view, new Date("2026-12-01T09:30:00Z")))) as DesignExport;
    expect(file.requirement.shunt.kind).toBe("copper-trace");
    expect(file.requirement.shunt.trace?.width).toBe(0.01);
    expect(file.requirement.inputFilter).toEqual({ resistance: 47, capacitance: 33e-6, tolerance: 0.01 });
    if (!("traceLengthM" in file.metrics)) throw new Error("a single pair's export carries its figures");
    expect(file.metrics.traceLengthM).toBeCloseTo(0.02, 12);
    expect(file.metrics.inputFilterCornerHz).toBeCloseTo(1 / (2 * Math.PI * 47 * 33e-6), 9);
    const again = parseRequirement(file.requirement);
    expect(again.ok && again.requirement).toEqual(view.requirement);
  });
});

describe("IEC 60062 codes on every resistor", () => {
  it("a difference stage lists all four resistors, each with its code; a 2-terminal shunt names its pads", () => {
    const view = fixtureView(
      {
        ...loggerRequirement,
        amplifier: {
          topology: "difference",
          gains: { series: "E24", min: 10, max: 100 },
          commonMode: { min: "-0.1 V", max: "5 V" },
        },
        shunt: { terminals: 2 },
      },
      { name: "Logger, difference stage" },
    );
    const parts = partsList(view.requirement, view.choice);
    const resistors = parts.filter((p) => p.designator.startsWith("R"));
    expect(resistors.map((p) => p.designator)).toEqual(["R1", "R2", "R3", "R4", "R5"]);
    for (const r of resistors) expect(r.code, r.designator).toMatch(/^[0-9]*[RKMGT][0-9]*$/);
    expect(parts.find((p) => p.designator === "R1")!.notes).toMatch(/2-terminal part: the sense lines see its pads/);
  });
});
