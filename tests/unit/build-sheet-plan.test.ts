// A range plan's build sheet, read back with pdftotext (poppler-utils, a PDF reader the project did
// not write): every range's shunt with its IEC 60062 code, its switch and amplifier, the protection,
// the switching rule, every range's bench rows (both sides of each switch point) and the cautions,
// each figure as the engine (evaluatePlan, planCautions) gives it. Also the plan's parts CSV and
// netlist. Pages are rendered to PNG into test-results/build-sheet/ for a person to look at.
import { execFileSync, spawnSync } from "node:child_process";
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { resistorCode } from "@/lib/design/resistor-code";
import {
  evaluatePlan,
  formatSI,
  planCautions,
  type PlanChoice,
  type PlanMetrics,
  type PlanRangeMetrics,
} from "@/lib/design";
import { loggerPlanRequirement, parsed, proposedPlan, pumpRequirement } from "@/lib/build-sheet/fixtures";
import * as f from "@/lib/build-sheet/format";
import { planPartsCsv } from "@/lib/build-sheet/plan-exports";
import { notApprovedNotice } from "@/lib/build-sheet/pdf/document";
import { renderPlanBuildSheet } from "@/lib/build-sheet/render";

const meta = { team: "Harbourline Labs", generatedAt: new Date("2026-12-01T09:30:00Z") };
const squash = (s: string) => s.normalize("NFKC").replace(/\s+/g, " ");
const has = (hay: string, needle: string) => expect(hay).toContain(squash(needle));

function pdfToText(pdf: Buffer): string[] {
  expect(spawnSync("pdftotext", ["-v"]).status, "pdftotext is not installed: apt-get install -y poppler-utils").toBe(0);
  const dir = mkdtempSync(path.join(tmpdir(), "sensewright-plan-sheet-"));
  try {
    const file = path.join(dir, "sheet.pdf");
    writeFileSync(file, pdf);
    const text = execFileSync("pdftotext", ["-raw", file, "-"], { encoding: "utf8" });
    return text.split("\f").map(squash);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

const view = (status: "draft" | "approved") => ({
  name: "Soil logger, whole span",
  project: "Soil-moisture logger",
  status,
  revision: 3,
  authorName: "Demo Designer",
  approval: status === "approved" ? { byName: "Demo Reviewer", at: "2026-11-30T15:42:00.000Z", revision: 3 } : null,
});

const cases = [
  ["the demo logger, low side", parsed(loggerPlanRequirement)],
  [
    "3 µA to 6 A, high side",
    parsed({
      ...pumpRequirement,
      current: { min: "3 uA", max: "6 A" },
      readout: { kind: "adc", bits: 16, fullScale: "2.5 V" },
    }),
  ],
] as const;

describe.each(cases)("build sheet of a range plan: %s", (name, req) => {
  let plan: PlanChoice;
  let ranges: PlanRangeMetrics[];
  let metrics: PlanMetrics;
  let pages: string[];
  let all: string;
  beforeAll(async () => {
    plan = proposedPlan(req);
    const ev = evaluatePlan(req, plan);
    if (!ev.ok) throw new Error(ev.message);
    ranges = ev.ranges;
    metrics = ev;
    const pdf = await renderPlanBuildSheet(view("draft"), req, plan, meta);
    pages = pdfToText(pdf).filter((p) => p.trim() !== "");
    all = pages.join(" ");
    const slug = name.startsWith("the demo") ? "plan-logger" : "plan-high-side";
    mkdirSync("test-results/build-sheet", { recursive: true });
    writeFileSync(`test-results/build-sheet/${slug}.pdf`, pdf);
    spawnSync("pdftoppm", [
      "-png",
      "-r",
      "80",
      `test-results/build-sheet/${slug}.pdf`,
      `test-results/build-sheet/${slug}`,
    ]);
  });

  it("lists every range's shunt with its resistor code, its switch and its amplifier", () => {
    // IEC 60062 codes written out by hand for the values the engine picks on these spans.
    const codes: Record<number, string> = {
      41.2: "41R2",
      1.07: "1R07",
      0.226: "R226",
      30.1: "30R1",
      0.464: "R464",
      0.00806: "R00806",
    };
    ranges.forEach((r, k) => {
      const code = codes[r.shuntOhms];
      expect(code, `a hand-written code for ${r.shuntOhms} Ω`).toBeDefined();
      has(all, `R${k + 1} Shunt resistor, range ${k + 1}`);
      has(all, `${f.ohms(r.shuntOhms)} (${code})`);
      has(all, `Range switch, range ${k + 1}`);
      has(all, `Current-sense amplifier for range ${k + 1}`);
      has(all, `Gain ${f.gain(r.gain)}`);
    });
    has(all, `on-resistance at most ${f.ohms(req.rangeSwitch.onResistance)}`);
    // The switch's voltage rating: twice the supply (common practice, no source); its current: the full span's top.
    has(all, `${f.volts(2 * req.supply.voltage)}, ${f.amps(req.current.max)}`);
    has(all, `Protection: comparator with latch`);
    has(all, `trips at ${f.volts(req.drop.max)}`);
  });

  it("states the switching rule with its hysteresis and the switch delay", () => {
    for (const p of plan.switchPoints) {
      has(all, `rises above ${f.amps(p.upA)}`);
      has(all, `falls below ${f.amps(p.downA)}`);
      has(all, `hysteresis ${formatSI(p.upA - p.downA, "A")}`);
    }
    has(all, `within ${f.seconds(req.rangeSwitch.delay)} of the current leaving a range`);
  });

  it("has a bench check per range with each switch point read from both sides", () => {
    ranges.forEach((r, k) => {
      has(all, `Bench check, range ${k + 1}`);
      for (const row of r.benchCheck) {
        has(all, `${f.amps(row.currentA)} ${f.volts(row.expectedV)} ${f.volts(row.minV)} to ${f.volts(row.maxV)}`);
      }
    });
    // Each switch point is a row on the range below and on the range above.
    plan.switchPoints.forEach((p, k) => {
      const below = ranges[k]!.benchCheck.find((b) => Math.abs(b.currentA - p.upA) < 1e-12 * p.upA);
      const above = ranges[k + 1]!.benchCheck.find((b) => Math.abs(b.currentA - p.upA) < 1e-12 * p.upA);
      expect(below && above).toBeTruthy();
      // The two ranges expect different outputs for the same current (their own R·G).
      expect(below!.expectedV).not.toBeCloseTo(above!.expectedV, 6);
    });
  });

  it("carries the engine's plan cautions, with the fault current and the protection named", () => {
    const cautions = planCautions(req, metrics);
    for (const c of cautions) has(all, c.title);
    has(all, formatSI(ranges[0]!.faultCurrentA, "A"));
    has(all, "Local codes decide");
  });

  it("says NOT APPROVED on every page of a draft, and draws the schematic of ranges and switch", () => {
    for (const p of pages) has(p, notApprovedNotice({ status: "draft", revision: 3 }));
    has(all, "U4 protection");
    ranges.forEach((_, k) => has(all, `gate G${k + 1}`));
  });

  it("the parts CSV names the same parts, one row each, with SI values", () => {
    const csv = planPartsCsv(req, plan);
    const lines = csv.trim().split("\r\n");
    expect(lines[0]).toBe("designator,part,value,tolerance,tempco,rating,notes,value_si,unit,code");
    ranges.forEach((r, k) => {
      const row = lines.find((l) => l.startsWith(`R${k + 1},`));
      // …, value_si, unit, and the IEC 60062 code (resistor-code.ts) last.
      expect(row).toMatch(new RegExp(`,${r.shuntOhms},ohm,${resistorCode(r.shuntOhms)}$`));
      expect(lines.some((l) => l.startsWith(`Q${k + 1},`))).toBe(true);
      expect(lines.some((l) => l.startsWith(`U${k + 1},`))).toBe(true);
    });
  });
});

describe("an approved plan's sheet", () => {
  it("says approved and carries no draft notice", async () => {
    const req = cases[0][1];
    const pages = pdfToText(await renderPlanBuildSheet(view("approved"), req, proposedPlan(req), meta));
    const all = pages.join(" ");
    has(all, "APPROVED");
    expect(all).not.toContain("NOT APPROVED");
  });
});
