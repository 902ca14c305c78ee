// A signed span's build sheet gives the worst-case output at both ends (issue 14, item 1): the
// +Imax end against the ceiling and the −|Imin| end against the floor, each the engine's figure
// (signedOutputEnds, checked against hand calculations in lib/design/signed-output.test.ts), in
// the sheet's data and in the PDF's text layer as Poppler's pdftotext reads it.
import { describe, expect, it } from "vitest";
import { fixtureView } from "@/lib/build-sheet/fixtures";
import { renderBuildSheet } from "@/lib/build-sheet/render";
import { sheetData } from "@/lib/build-sheet/sheet-data";
import { formatSI, signedOutputEnds, type RequirementInput } from "@/lib/design";
import { flatPdfText } from "../fixtures/pdftotext";

// An invented forklift pack's monitor: 30 A of discharge, 10 A of regenerative charge, low side.
const forklift: RequirementInput = {
  current: { min: "-30 A", max: "10 A" },
  supply: { voltage: "24 V", side: "low" },
  drop: { max: "60 mV" },
  readout: { kind: "adc", bits: 14, fullScale: "2.5 V" },
  accuracy: { percent: 5 },
  amplifier: { gains: [20, 50, 100], reference: { voltage: "1.8 V" } },
  // Its converter's own error is left to the class's typical figures; the pack is zeroed at
  // production test, without which 5 % from 3 A is out of reach.
  calibration: "one-point",
};

describe("a signed span's build sheet", () => {
  const view = fixtureView(forklift, { name: "Forklift pack, both ways" });
  const ends = signedOutputEnds(view.requirement, view.choice)!;
  const rows = Object.fromEntries(sheetData(view).performance.map((r) => [r.label, r.value]));

  it("gives the worst-case output at both ends, each against its side of the window", () => {
    expect(ends.lowCurrentA).toBe(-30);
    expect(ends.highCurrentA).toBe(10);
    // Every error moves each end away from the zero level: above the nominal at +10 A, below at −30 A.
    expect(ends.highWorstV).toBeGreaterThan(ends.highNominalV);
    expect(ends.lowWorstV).toBeLessThan(ends.lowNominalV);
    // The solver's pick fits both ways: room at the floor and the ceiling.
    expect(ends.lowMarginV).toBeGreaterThan(0);
    expect(ends.highMarginV).toBeGreaterThan(0);
    const V = (v: number) => formatSI(v, "V");
    expect(rows["Output at full load (10 A), worst case"]).toBe(
      `${V(ends.highWorstV)} with every error that raises it; ceiling ${V(ends.ceilV)} (${V(ends.highMarginV)} to spare)`,
    );
    expect(rows[`Output at full reverse load (${formatSI(-30, "A")}), worst case`]).toBe(
      `${V(ends.lowWorstV)} with every error that lowers it; floor ${V(ends.floorV)} (${V(ends.lowMarginV)} to spare)`,
    );
    // The one-way row is gone: it gave only the positive end.
    expect(rows["Output at full load, worst case"]).toBeUndefined();
  });

  it("says how far an end clips when a hand-picked pair does not fit", () => {
    // Gain 100 on the same shunt doubles the swing: −30 A runs the output below the floor.
    const clip = fixtureView(forklift, { choice: { shuntOhms: view.choice.shuntOhms, gain: 100 } });
    const e = signedOutputEnds(clip.requirement, clip.choice)!;
    expect(view.choice.gain).toBeLessThan(100);
    expect(e.lowMarginV).toBeLessThan(0);
    const r = Object.fromEntries(sheetData(clip).performance.map((x) => [x.label, x.value]));
    expect(r[`Output at full reverse load (${formatSI(-30, "A")}), worst case`]).toContain(
      `(clips: ${formatSI(-e.lowMarginV, "V")} short)`,
    );
  });

  it("keeps one row for a one-way span", () => {
    const oneWay = fixtureView({ ...forklift, current: { min: "1 A", max: "30 A" }, amplifier: { gains: [20, 50] } });
    const r = Object.fromEntries(sheetData(oneWay).performance.map((x) => [x.label, x.value]));
    expect(r["Output at full load, worst case"]).toMatch(/ with every error that raises it$/);
    expect(Object.keys(r).some((k) => k.startsWith("Output at full reverse load"))).toBe(false);
  });

  it("the PDF carries both ends", async () => {
    const text = flatPdfText(await renderBuildSheet(view, { team: "Harbourline Labs", generatedAt: new Date(0) }));
    const V = (v: number) => formatSI(v, "V").normalize("NFKC");
    // The table's label and value columns wrap side by side, so pdftotext interleaves their lines:
    // each phrase is checked on its own.
    for (const phrase of [
      "Output at full load (10 A), worst",
      `${V(ends.highWorstV)} with every error that raises`,
      `ceiling ${V(ends.ceilV)} (${V(ends.highMarginV)} to spare)`,
      "Output at full reverse load (-30",
      `${V(ends.lowWorstV)} with every error that`,
      `lowers it; floor ${V(ends.floorV)} (${V(ends.lowMarginV)} to spare)`,
    ])
      expect(text).toContain(phrase);
  });
});
