// The printed sheet's blank readings log: a serial line and one column per bench-check test point
// (with its current and accept band, as the bench table words them), read back from the PDF.
import { spawnSync } from "node:child_process";
import { mkdirSync, writeFileSync } from "node:fs";
import { extractText } from "unpdf";
import { describe, expect, it } from "vitest";
import { fixtureView, pumpRequirement } from "@/lib/build-sheet/fixtures";
import { pdfPageCount, renderBuildSheet } from "@/lib/build-sheet/render";
import { sheetData } from "@/lib/build-sheet/sheet-data";

const squash = (s: string) => s.normalize("NFKC").replace(/\s+/g, " ");

describe("build sheet readings log", () => {
  it("prints a blank log with serial, date, every test point with its band, and the import header", async () => {
    const view = fixtureView(pumpRequirement, { name: "Pump controller, 6 A high side", status: "approved" });
    const pdf = await renderBuildSheet(view, {
      team: "Harbourline Labs",
      generatedAt: new Date("2026-12-01T09:30:00Z"),
    });
    const { text } = await extractText(new Uint8Array(pdf), { mergePages: false });
    const all = squash(text.join(" "));
    expect(all).toContain("Readings log");
    expect(all).toMatch(/Serial Date/);
    const bench = sheetData(view).bench;
    for (const b of bench) {
      expect(all).toContain(squash(`${b.label} (${b.current})`));
      expect(all).toContain(squash(b.band));
    }
    expect(all).toContain(squash(`serial,date,${bench.map((b) => b.label).join(",")}`));
    expect(pdfPageCount(pdf)).toBeLessThanOrEqual(4);
    if (spawnSync("pdftoppm", ["-v"]).status === 0) {
      mkdirSync("test-results/build-sheet", { recursive: true });
      writeFileSync("test-results/build-sheet/readings-log.pdf", pdf);
      spawnSync("pdftoppm", [
        "-png",
        "-r",
        "80",
        "test-results/build-sheet/readings-log.pdf",
        "test-results/build-sheet/readings-log",
      ]);
    }
  });
});
