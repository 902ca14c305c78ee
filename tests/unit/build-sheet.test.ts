// The build sheet PDF, read back with a PDF text library (unpdf): the design, its parts and
// the engine's bench-check figures are on it, formatted as the engine formats them; an
// unapproved design says so on every page; it fits on one to four pages; every character it
// uses is one its embedded typeface can draw. Pages are also rendered to PNG (pdftoppm) into
// test-results/build-sheet/ for a person to look at.
import { spawnSync } from "node:child_process";
import { mkdirSync, writeFileSync } from "node:fs";
import { extractText } from "unpdf";
import { beforeAll, describe, expect, it } from "vitest";
import { benchCheck, evaluateCandidate, formatSI, type RequirementInput } from "@/lib/design";
import type { DesignView } from "@/lib/design-view";
import { coveredCodePoints } from "@/lib/build-sheet/font";
import { fixtureView, loggerRequirement, pumpRequirement } from "@/lib/build-sheet/fixtures";
import * as f from "@/lib/build-sheet/format";
import { notApprovedNotice } from "@/lib/build-sheet/pdf/document";
import { pdfPageCount, renderBuildSheet, renderSheet } from "@/lib/build-sheet/render";
import { sheetData } from "@/lib/build-sheet/sheet-data";

const meta = { team: "Harbourline Labs", generatedAt: new Date("2026-12-01T09:30:00Z") };
// PDF text extraction returns compatibility forms (the micro sign comes back as Greek mu):
// compare both sides in NFKC.
const squash = (s: string) => s.normalize("NFKC").replace(/\s+/g, " ");
const expectText = (haystack: string, needle: string) => expect(haystack).toContain(needle.normalize("NFKC"));

type Rendered = { pdf: Buffer; pages: string[]; all: string };

async function render(view: DesignView, pngName?: string): Promise<Rendered> {
  const pdf = await renderBuildSheet(view, meta);
  const { text } = await extractText(new Uint8Array(pdf), { mergePages: false });
  const pages = text.map(squash);
  if (pngName) {
    // Never skipped quietly: `npm test` installs poppler-utils (scripts/system-tools.mjs).
    expect(spawnSync("pdftoppm", ["-v"]).status, "pdftoppm is not installed: apt-get install -y poppler-utils").toBe(0);
    mkdirSync("test-results/build-sheet", { recursive: true });
    writeFileSync(`test-results/build-sheet/${pngName}.pdf`, pdf);
    spawnSync("pdftoppm", [
      "-png",
      "-r",
      "80",
      `test-results/build-sheet/${pngName}.pdf`,
      `test-results/build-sheet/${pngName}`,
    ]);
  }
  return { pdf, pages, all: pages.join(" ") };
}

const highVoltage: RequirementInput = {
  current: { min: "100 mA", max: "5 A" },
  supply: { voltage: "120 V", side: "high" },
  drop: { max: "200 mV" },
  readout: { kind: "adc", bits: 12, fullScale: "3.3 V" },
  resolution: { countsAtMin: 10 },
  accuracy: { percent: 3 },
  // 120 V is beyond the default current-sense part's common-mode range: name a high-voltage one.
  amplifier: { commonMode: { min: "0 V", max: "150 V" } },
};

const resistorSet: RequirementInput = {
  ...loggerRequirement,
  amplifier: { gains: { series: "E24", min: 20, max: 60 } },
};

describe("build sheet of a draft (soil logger, low side)", () => {
  const view = fixtureView(loggerRequirement, { name: "Soil logger, radio range", status: "draft", revision: 3 });
  let r: Rendered;
  beforeAll(async () => {
    r = await render(view, "logger-draft");
  });

  it("is a PDF of one to four pages", () => {
    expect(r.pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    expect(r.pages.length).toBeGreaterThanOrEqual(1);
    expect(r.pages.length).toBeLessThanOrEqual(4);
  });

  it("says it is not approved on every page, and numbers every page", () => {
    const notice = notApprovedNotice(view);
    expect(notice).toContain("NOT APPROVED");
    r.pages.forEach((page, i) => {
      expect(page, `page ${i + 1}`).toContain(notice);
      expect(page, `page ${i + 1}`).toContain(`Page ${i + 1} of ${r.pages.length}`);
    });
  });

  it("names the design, its revision, status and team", () => {
    expectText(r.pages[0] ?? "", "Soil logger, radio range");
    expectText(r.all, "revision 3");
    expectText(r.pages[0] ?? "", "Harbourline Labs");
    expectText(r.pages[0] ?? "", "not approved");
  });

  it("lists the shunt in milliohms and the gain, with designators", () => {
    // The solver's pick for this requirement is a few hundred milliohms at gain 50.
    expect(view.choice.shuntOhms).toBeLessThan(1);
    expect(view.choice.shuntOhms).toBeGreaterThanOrEqual(1e-3);
    const shunt = formatSI(view.choice.shuntOhms, "Ω");
    expect(shunt).toMatch(/^\d+(\.\d+)? mΩ$/);
    expectText(r.all, `R1 Shunt resistor`);
    expectText(r.all, shunt);
    expectText(r.all, `Gain ${formatSI(view.choice.gain, "V/V", 4)}`);
    expectText(r.all, "U1 Current-sense amplifier");
    expect(r.all).toMatch(/Kelvin/);
  });

  it("carries the engine's bench-check rows, formatted as the engine formats them", () => {
    const rows = benchCheck(view.requirement, view.choice);
    expect(rows.map((x) => x.label)).toEqual([
      "Minimum current",
      "Typical current",
      "10 % of maximum current",
      "50 % of maximum current",
      "Maximum current",
    ]);
    for (const row of rows) {
      const line = `${row.label} ${formatSI(row.currentA, "A")} ${formatSI(row.expectedV, "V")} ${formatSI(row.minV, "V")} to ${formatSI(row.maxV, "V")}`;
      expectText(r.all, line);
    }
    expect(r.all).toMatch(/calibrated current source/);
    expect(r.all).toMatch(/known resistor from a stable supply/);
  });

  it("shows the performance figures from the engine", () => {
    const m = evaluateCandidate(view.requirement, view.choice);
    expectText(r.all, formatSI(m.burdenV, "V"));
    expectText(r.all, `${formatSI(m.transimpedanceVPerA, "V/A")}: ${f.decadeScale(m.transimpedanceVPerA)}`);
    expectText(r.all, formatSI(m.lsbA, "A"));
    expectText(r.all, f.percent(m.errorAtMinPercent));
    expectText(r.all, f.percent(m.errorAtMaxPercent));
    expectText(r.all, formatSI(m.bandwidthHz, "Hz"));
    expectText(r.all, formatSI(m.dissipationW, "W"));
    expectText(r.all, "Error budget by source");
    expectText(r.all, "Error versus current");
  });

  it("gives the cautions and defers to local codes and licensed practice", () => {
    for (const words of [
      "Hot parts",
      "Fuse the measured path",
      "measurement category",
      "Never open a live inductive circuit",
      "local electrical codes",
      "licensed",
    ]) {
      expectText(r.all, words);
    }
  });

  it("uses only characters its embedded typeface has (µ and Ω included)", async () => {
    const covered = coveredCodePoints();
    const raw = (await extractText(new Uint8Array(r.pdf), { mergePages: true })).text;
    // Undo only the extraction's mu substitution; anything else must be drawable as is.
    const missing = [
      ...new Set(
        [...raw.replace(/\u03bc/g, "\u00b5")].filter((ch) => !/\s/.test(ch) && !covered.has(ch.codePointAt(0)!)),
      ),
    ];
    expect(missing).toEqual([]);
    expect(raw).toMatch(/[µμ]A/);
    expect(raw).toContain("Ω");
  });
});

describe("build sheet of an approved design (pump controller, high side)", () => {
  const view = fixtureView(pumpRequirement, {
    name: "Pump controller, 6 A high side",
    project: "Pump controller",
    status: "approved",
    revision: 1,
  });
  let r: Rendered;
  beforeAll(async () => {
    r = await render(view, "pump-approved");
  });

  it("has no not-approved notice and names who approved it and when", () => {
    expect(r.all).not.toContain("NOT APPROVED");
    expectText(r.pages[0] ?? "", "by Demo Reviewer, 2026-11-30 15:42 UTC");
    expect(r.pages.length).toBeLessThanOrEqual(4);
  });

  it("asks for a 4-terminal shunt below 10 mΩ and draws the high side", () => {
    expect(view.choice.shuntOhms).toBeLessThan(0.01);
    expectText(r.all, formatSI(view.choice.shuntOhms, "Ω"));
    expectText(r.all, "4-terminal (Kelvin) shunt required");
    expectText(r.all, "High side: shunt between supply and load");
    expectText(r.all, "input common-mode range must include 24 V");
  });
});

describe("build sheet cautions and parts that depend on the design", () => {
  it("leads with isolation and measurement category at a high common-mode voltage", async () => {
    const r = await render(fixtureView(highVoltage, { name: "Heater feed, 120 V high side" }), "high-voltage");
    expectText(r.all, "the sense lines sit at 120 V");
    expectText(r.all, "isolated amplifier");
    expectText(r.all, "measurement category");
  });

  it("lists the gain-setting resistors of a resistor-set gain", async () => {
    const view = fixtureView(resistorSet, { name: "Logger, resistor-set gain", status: "in-review" });
    const r = await render(view, "resistor-set");
    expectText(r.all, "R2 Feedback resistor");
    expectText(r.all, "R3 Gain resistor");
    expectText(r.all, "status: in review");
    r.pages.forEach((p) => expect(p).toContain("NOT APPROVED"));
  });
});

describe("build sheet of a design with very long text", () => {
  it("still numbers every page consistently and keeps to four pages", async () => {
    const long =
      "Bench adapter for the field logger's radio burst range, second build with the wider copper pour and the relocated amplifier "
        .repeat(2)
        .slice(0, 200);
    const gains = Array.from({ length: 40 }, (_, i) => 2 + i * 5);
    const view = fixtureView({ ...loggerRequirement, amplifier: { gains } }, { name: long, project: long });
    const r = await render(view, "long-text");
    expect(r.pages.length).toBeGreaterThanOrEqual(1);
    expect(r.pages.length).toBeLessThanOrEqual(4);
    r.pages.forEach((page, i) => {
      expect(page).toContain(`Page ${i + 1} of ${r.pages.length}`);
      expect(page).toContain("NOT APPROVED");
    });
    expectText(r.all, "40 gains from 2 V/V to 197 V/V");
    expectText(r.all, "Never open a live inductive circuit");
  });
});

describe("page numbers when a page overflows its plan", () => {
  it("lays the sheet out again so every page says its true number and the true total", async () => {
    const view = fixtureView(loggerRequirement, { name: "Overflow check" });
    const data = sheetData(view);
    const oversized = { ...data, layout: [...data.layout, ...data.layout, ...data.layout, ...data.layout] };
    const pdf = await renderSheet(view, oversized, meta);
    const { text } = await extractText(new Uint8Array(pdf), { mergePages: false });
    expect(pdfPageCount(pdf)).toBe(text.length);
    expect(text.length).toBeGreaterThan(3);
    text.map(squash).forEach((page, i) => expect(page).toContain(`Page ${i + 1} of ${text.length}`));
  });
});
