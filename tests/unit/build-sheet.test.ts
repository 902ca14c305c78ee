// The build sheet PDF, read back with a PDF text library (unpdf): the design, its parts and
// the engine's bench-check figures are on it, formatted as the engine formats them; an
// unapproved design says so on every page; it fits on one to four pages; every character it
// uses is one its embedded typeface can draw. Pages are also rendered to PNG (pdftoppm) into
// test-results/build-sheet/ for a person to look at.
import { spawnSync } from "node:child_process";
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { pdftotext } from "../fixtures/pdftotext";
import { extractText } from "unpdf";
import { beforeAll, describe, expect, it } from "vitest";
import {
  benchCheck,
  decadeScale,
  designCautions,
  evaluateCandidate,
  formatSI,
  type RequirementInput,
} from "@/lib/design";
import type { PairDesignView as DesignView } from "@/lib/design-view";
import { Font } from "@react-pdf/renderer";
import { sheetFonts } from "@/lib/build-sheet/fonts";
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
    expectText(r.all, `${formatSI(m.transimpedanceVPerA, "V/A")}: ${decadeScale(m.transimpedanceVPerA)}`);
    expectText(r.all, formatSI(m.lsbA, "A"));
    expectText(r.all, f.percent(m.errorAtMinPercent));
    expectText(r.all, f.percent(m.errorAtMaxPercent));
    expectText(r.all, formatSI(m.bandwidthHz, "Hz"));
    expectText(r.all, formatSI(m.dissipationW, "W"));
    expectText(r.all, "Error budget by source");
    expectText(r.all, "Error versus current");
    // v2 figures: the worst-case output the output check uses, the step the counts check uses.
    expectText(r.all, `Output at full load, worst case ${formatSI(m.outputAtMaxWorstV, "V")}`);
    expectText(r.all, `Smallest step it can tell apart ${formatSI(m.resolvableStepA, "A")}`);
  });

  it("prints the engine's cautions, the list the candidate study shows", () => {
    const m = evaluateCandidate(view.requirement, view.choice);
    const lines = designCautions(view.requirement, m).map((c) => `${c.title}: ${c.text}`);
    expect(sheetData(view).cautions).toEqual(lines);
    for (const line of lines) expectText(r.all, line.slice(0, 40));
  });

  it("gives the cautions and defers to local codes and licensed practice", () => {
    for (const words of [
      "Fuse the measured path",
      "measurement category",
      "Never open a live inductive circuit",
      "local electrical codes",
      "licensed",
    ]) {
      expectText(r.all, words);
    }
  });

  it("draws every character it prints with a typeface that has it (µ and Ω included)", async () => {
    const raw = (await extractText(new Uint8Array(r.pdf), { mergePages: true })).text;
    // Undo only the extraction's mu substitution; anything else must be drawable as is.
    const missing = [...new Set([...raw.replace(/\u03bc/g, "\u00b5")].filter((ch) => !/\s/.test(ch)))].filter(
      (ch) => !drawable(ch, raw),
    );
    expect(missing).toEqual([]);
    expect(raw).toMatch(/[µμ]A/);
    expect(raw).toContain("Ω");
  });
});

/** Whether one of the families a sheet with this text is set in has a glyph for `ch` (react-pdf's own font objects). */
function drawable(ch: string, text: string): boolean {
  const cp = ch.codePointAt(0) ?? 0;
  return sheetFonts(text).some((fontFamily) => {
    const data: unknown = Font.getFont({ fontFamily, fontWeight: 400 })?.data;
    return typeof data === "object" && data !== null && "hasGlyphForCodePoint" in data
      ? (data as { hasGlyphForCodePoint(c: number): boolean }).hasGlyphForCodePoint(cp)
      : false;
  });
}

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

  it("gives the current a constant-power load really draws through the shunt", () => {
    // Constant power P = V·Imax; load voltage (V + √(V² − 4PR))/2 and I = P/V_load (the quadratic
    // of a constant-power load behind a series resistance, solved by hand): 3.3 W through 0.1 Ω gives
    // √(10.89 − 1.32) = 3.0935, a load voltage of 3.1968 V and 1.0323 A.
    const cp = sheetData(
      fixtureView(
        {
          current: { min: "100 mA", max: "1 A" },
          supply: { voltage: "3.3 V" },
          drop: { max: "200 mV" },
          load: { model: "constant-power" },
        },
        { name: "Constant-power load", choice: { shuntOhms: 0.1, gain: 20 } },
      ),
    );
    const iOp = 3.3 / ((3.3 + Math.sqrt(3.3 * 3.3 - 4 * 3.3 * 0.1)) / 2);
    expect(iOp).toBeCloseTo(1.0323, 4);
    const row = cp.performance.find((x) => x.label.startsWith("Current through the shunt at full load"));
    expect(row?.label).toContain("constant-power load");
    expect(row?.value).toBe(f.amps(iOp));
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

type Word = { page: number; text: string; xMin: number; xMax: number; yMin: number; yMax: number };

/** Every word on every page with its box, in PDF points from the top-left corner. */
function words(pdf: Buffer): Word[] {
  const html = pdftotext(pdf, ["-bbox"]);
  const out: Word[] = [];
  let page = 0;
  for (const m of html.matchAll(
    /<page [^>]*>|<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">([^<]*)<\/word>/g,
  )) {
    if (m[0].startsWith("<page")) {
      page += 1;
      continue;
    }
    out.push({ page, text: m[5] ?? "", xMin: +m[1]!, yMin: +m[2]!, xMax: +m[3]!, yMax: +m[4]! });
  }
  return out;
}

/** Page 1's title block: the words of the Design value, and those to the right of its column. */
function designCell(all: Word[]) {
  const p1 = all.filter((w) => w.page === 1);
  const label = (t: string) => p1.find((w) => w.text === t && w.xMin < 60);
  const design = label("Design");
  const project = label("Project");
  expect(design && project).toBeTruthy();
  // The title block's left column: half the 515 pt text width less half the 12 pt gap.
  const columnRight = 40 + (515.28 - 12) / 2;
  const row = p1.filter((w) => w.yMin >= design!.yMin - 1 && w.yMax <= project!.yMin + 1);
  const value = row.filter((w) => w.xMin > design!.xMax && w.xMin < columnRight);
  return { value, right: row.filter((w) => w.xMin >= columnRight), columnRight };
}

describe("names in any script", () => {
  // Latin with «», Greek (µ is the micro sign, Ω the ohm letter), Cyrillic and Chinese.
  const name = "Shunt «µΩ» Проверка тока 测试电流 Δ-Messung";
  let pdf: Buffer;
  beforeAll(async () => {
    const view = fixtureView(loggerRequirement, { name, project: "Проект 电源 «Nord»", status: "approved" });
    pdf = (await render(view, "scripts")).pdf;
  });

  it("come back from the PDF's text layer exactly, character for character", () => {
    const text = pdftotext(pdf, []);
    expect(text).toContain(name);
    expect(text).toContain("Проект 电源 «Nord»");
  });

  it("are drawn from typefaces that have their glyphs (Inter, then Noto Sans SC for the Chinese)", () => {
    for (const ch of new Set(name.replace(/\s/g, ""))) expect(drawable(ch, name), ch).toBe(true);
    const dir = mkdtempSync(path.join(tmpdir(), "sheet-fonts-"));
    writeFileSync(path.join(dir, "sheet.pdf"), pdf);
    const fonts = spawnSync("pdffonts", [path.join(dir, "sheet.pdf")], { encoding: "utf8" }).stdout;
    rmSync(dir, { recursive: true, force: true });
    expect(fonts).toMatch(/Inter/);
    expect(fonts).toMatch(/NotoSansSC/);
  });
});

describe("a long name that changes script inside its words", () => {
  // No spaces where the script changes, so the line must break inside a word: between Chinese
  // characters, where Latin meets Cyrillic, in a long run. Each break must add nothing.
  const name =
    "Shunt«µΩ»Проверкатокаизмерение测试电流测量装置ΔMessungStromsensorЛабораторнаяпроверка测试ΩµLatin 电源监控 Проект";
  let all: Word[];
  beforeAll(async () => {
    all = words((await render(fixtureView(loggerRequirement, { name, status: "approved" }), "name-scripts")).pdf);
  });

  it("comes back from pdftotext exactly, with no hyphen or box where a line breaks", () => {
    const { value, columnRight } = designCell(all);
    expect(new Set(value.map((w) => w.yMin)).size, "wrapped over lines").toBeGreaterThan(2);
    // pdftotext gives each line's words; the name's one space separates two of them.
    expect(
      value
        .map((w) => w.text)
        .join("")
        .normalize("NFKC"),
    ).toBe(name.replace(/ /g, "").normalize("NFKC"));
    for (const w of value) {
      expect(w.text, "a hyphen at a break").not.toMatch(/-/);
      expect(w.xMax, w.text).toBeLessThanOrEqual(columnRight + 0.5);
    }
  });

  it("is set from typefaces that hold every character (no missing-glyph box)", () => {
    for (const ch of new Set(name.replace(/\s/g, ""))) expect(drawable(ch, name), ch).toBe(true);
  });
});

describe("a 300-character name", () => {
  // Typed without a single space: the worst case for a line breaker.
  const name = "FieldLoggerBenchAdapterSecondBuild".repeat(9).slice(0, 300);
  let all: Word[];
  beforeAll(async () => {
    expect([...name]).toHaveLength(300);
    all = words((await render(fixtureView(loggerRequirement, { name, status: "draft" }), "name-300")).pdf);
  });

  it("stays inside the page's margins on every page (A4, 40 pt each side)", () => {
    const pageWidth = 595.28;
    for (const w of all) {
      expect(w.xMin, `${w.text} on page ${w.page}`).toBeGreaterThanOrEqual(40 - 0.5);
      expect(w.xMax, `${w.text} on page ${w.page}`).toBeLessThanOrEqual(pageWidth - 40 + 0.5);
    }
  });

  it("wraps inside its column of the title block, reads back whole, and leaves the next column clear", () => {
    const { value, right, columnRight } = designCell(all);
    expect(value.length).toBeGreaterThan(3); // the name, wrapped over several lines
    // Broken where it must be, with nothing added: no hyphen, no missing-glyph box.
    expect(value.map((w) => w.text).join("")).toBe(name);
    for (const w of value) expect(w.xMax, w.text).toBeLessThanOrEqual(columnRight + 0.5);
    // Nothing of the name reaches the right-hand column (Status, Approved, ...).
    expect(right.map((w) => w.text)).toContain("Approved");
    expect(right.map((w) => w.text).join(" ")).not.toMatch(/FieldLogger/);
  });
});
