// A pair saved when an unstated readout counted as ideal, printed today: the sheet says on its
// front page that the choice fails under the current model and why, and still renders.
import { spawnSync } from "node:child_process";
import { mkdirSync, writeFileSync } from "node:fs";
import { extractText } from "unpdf";
import { describe, expect, it } from "vitest";
import { fixtureView } from "@/lib/build-sheet/fixtures";
import { renderBuildSheet } from "@/lib/build-sheet/render";
import { sheetData } from "@/lib/build-sheet/sheet-data";
import { solve } from "@/lib/design/solve";
import { idealLoggerAdc, loggerBurstInput, req } from "@/lib/design/test-helpers";

const burst = loggerBurstInput;
// The pair an ideal converter made feasible (the zeros stated: what the old rule assumed).
const idealAdc = idealLoggerAdc;
const c = solve(req({ ...burst, readout: idealAdc })).candidates.find((x) => x.feasible)!;
const choice = { shuntOhms: c.shuntOhms, gain: c.gain };

describe("build sheet of a saved pair that fails under the current model", () => {
  it("has no statement while the pair passes", () => {
    expect(sheetData(fixtureView({ ...burst, readout: idealAdc }, { choice })).modelFails).toBeNull();
  });
  it("prints the statement first, naming the constraint and the readout figures read in", async () => {
    const view = fixtureView({ ...burst, readout: { kind: "adc", bits: 12, fullScale: "2.5 V" } }, { choice });
    expect(sheetData(view).modelFails).toMatch(/accuracy target missed/);
    const pdf = await renderBuildSheet(view, {
      team: "Harbourline Labs",
      generatedAt: new Date("2026-12-01T09:30:00Z"),
    });
    const { text } = await extractText(new Uint8Array(pdf), { mergePages: false });
    const first = (text[0] ?? "").replace(/\s+/g, " ");
    expect(first).toContain("FAILS UNDER THE CURRENT MODEL: do not build");
    expect(first).toContain(
      "Under the current model this saved choice fails: accuracy target missed in the accuracy band.",
    );
    expect(first).toContain("typical of a general-purpose converter with a series reference, not stated");
    mkdirSync("test-results/build-sheet", { recursive: true });
    writeFileSync("test-results/build-sheet/model-fails.pdf", pdf);
    spawnSync("pdftoppm", [
      "-png",
      "-r",
      "80",
      "-f",
      "1",
      "-l",
      "1",
      "test-results/build-sheet/model-fails.pdf",
      "test-results/build-sheet/model-fails",
    ]);
  });
});
