// A range plan from the wizard: the engine proposes it for the logger that sleeps at microamps and
// bursts to 180 mA; the designer moves a switch point, picks another pair for one range, and saves.
import { expect, test, type Page } from "@playwright/test";
import { apiAs, signInPage } from "../fixtures/auth";
import { execFileSync } from "node:child_process";
import { readFile } from "node:fs/promises";
import { formatSI } from "@/lib/design/format";
import { resistorCode } from "@/lib/design/resistor-code";
import { checkScreen, shownText, widths } from "./screen-check";

const squash = (s: string) => s.normalize("NFKC").replace(/\s+/g, " ");

const shots = process.env.PW_OUTPUT_DIR ?? "test-results/plan-wizard";

async function openLoggerPlan(page: Page) {
  await page.goto("/designs/new");
  await page.evaluate(() => window.localStorage.clear());
  await page.reload();
  await page.getByText("Start from an example").click();
  await page.getByRole("button", { name: "Soil-moisture logger, 12-bit converter" }).click();
  await expect(page.getByRole("heading", { name: /Range plan: 3 ranges/ })).toBeVisible();
  await expect(page.getByTestId("plan-verdict")).toContainText("The engine accepts this plan");
}

test("designer adjusts the proposed plan and saves it", async ({ browser }) => {
  test.setTimeout(120_000);
  const ctx = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const page = await ctx.newPage();
  await signInPage(page, "designer");
  await openLoggerPlan(page);
  const editor = page.getByTestId("plan-editor");
  // Each range over its own stretch on the three charts, with the switch points marked.
  for (const kind of ["error", "burden", "load"])
    await expect(page.getByTestId(`plan-${kind}-chart`).locator("svg path").first()).toBeVisible();
  await expect(page.getByTestId("plan-error-chart").getByRole("img")).toHaveAttribute("aria-label", /switch points at/);
  await expect(editor).toContainText("hysteresis band");

  // Move switch point 1 up to 300 µA: range 2 now reads down from 240 µA (80 %).
  const up = page.getByLabel("Switch point 1: up to range 2 above");
  await up.fill("300 uA");
  await up.press("Enter");
  await expect(page.getByRole("heading", { name: /Range plan: 3 ranges \(adjusted\)/ })).toBeVisible();
  await expect(page.getByTestId("switch-1")).toContainText("back down to range 1 below 240 µA");
  await expect(page.getByTestId("plan-range-2")).toContainText("240 µA – ");
  // Range 1's pair (tens of ohms at a gain of 500) now overdrives the readout at 300 µA: refused,
  // and the reason is given beside Save.
  await expect(page.getByTestId("plan-refusal")).toContainText("Range 1");
  await expect(page.getByRole("button", { name: /Save the 3-range plan/ })).toBeDisabled();
  // Bad input names the field and changes nothing.
  await up.fill("3 parsecs");
  await up.press("Enter");
  await expect(page.getByTestId("switch-1")).toContainText("Switch point 1:");
  await expect(page.getByTestId("switch-1")).toContainText("back down to range 1 below 240 µA");

  // Range 1 takes the best pair of its own new stretch: the engine accepts the plan again.
  await page.getByRole("button", { name: "Other pairs for range 1" }).click();
  const first = page.getByRole("radio", { name: /for range 1$/ }).first();
  const firstLabel = (await first.getAttribute("aria-label"))!.replace(/ for range 1$/, "");
  await first.click();
  await expect(page.getByTestId("plan-range-1-pair")).toHaveText(firstLabel);
  await expect(page.getByTestId("plan-verdict")).toContainText("The engine accepts this plan");

  // Another pair for range 2, from its own candidates.
  const before = await page.getByTestId("plan-range-2-pair").innerText();
  await page.getByRole("button", { name: "Other pairs for range 2" }).click();
  const options = page.getByRole("radio", { name: /for range 2$/ });
  expect(await options.count()).toBeGreaterThan(1);
  const second = options.nth(1);
  const label = (await second.getAttribute("aria-label"))!.replace(/ for range 2$/, "");
  await second.click();
  await expect(page.getByTestId("plan-range-2-pair")).toHaveText(label);
  expect(label).not.toBe(before);
  await expect(page.getByTestId("plan-verdict")).toContainText("The engine accepts this plan");
  expect(await shownText(page)).toContain("Range 2 (long dashes)");
  await checkScreen(page, `${shots}/plan-editor-1280.png`);
  await page.getByTestId("plan-editor").screenshot({ path: `${shots}/plan-editor-panel-1280.png` });

  const name = `Logger plan ${Date.now().toString(36)}`;
  await page.getByLabel("Design name").fill(name);
  const save = page.getByRole("button", { name: "Save the 3-range plan" });
  await expect(save).toBeEnabled();
  await save.click();
  await expect(page).toHaveURL(/\/designs\/[0-9a-f-]{36}$/);
  const id = page.url().split("/").pop()!;
  // The server re-derived the plan as adjusted: the moved switch point and both picked pairs.
  await expect(page.getByTestId("design-revision")).toHaveText("revision 1");
  await expect(page.getByTestId("plan-switch-points")).toContainText("300 µA");
  await expect(page.getByTestId("plan-figures")).toContainText(firstLabel.split(" × ")[0]!);
  await expect(page.getByTestId("plan-figures")).toContainText(label.split(" × ")[0]!);
  const designer = await apiAs("designer");
  const saved = (await (await designer.get(`/api/designs/${id}`)).json()) as {
    plan: { ranges: { shuntOhms: number; gain: number }[]; switchPoints: { upA: number; downA: number }[] };
  };
  expect(saved.plan.switchPoints[0]!.upA).toBeCloseTo(300e-6, 12);
  expect(saved.plan.switchPoints[0]!.downA).toBeCloseTo(240e-6, 12);

  // Revise opens the wizard on the saved plan; moving switch point 2 and saving makes revision 2.
  await page.goto(`/designs/${id}/revise`);
  await expect(page.getByRole("heading", { name: /Range plan: 3 ranges \(adjusted\)/ })).toBeVisible();
  await expect(page.getByLabel("Switch point 1: up to range 2 above")).toHaveValue("300 µA");
  await expect(page.getByTestId("plan-verdict")).toContainText("The engine accepts this plan");
  const up2 = page.getByLabel("Switch point 2: up to range 3 above");
  await up2.fill("4 mA");
  await up2.press("Enter");
  await expect(page.getByTestId("switch-2")).toContainText("back down to range 2 below 3.2 mA");
  await expect(page.getByTestId("plan-verdict")).toContainText("The engine accepts this plan");
  await page.getByRole("button", { name: "Save as revision 2 the 3-range plan" }).click();
  await expect(page).toHaveURL(new RegExp(`/designs/${id}$`));
  await expect(page.getByTestId("design-revision")).toHaveText("revision 2");
  await expect(page.getByTestId("plan-switch-points")).toContainText("4 mA");
  await page.getByRole("button", { name: "Submit revision 2 for review" }).click();
  await expect(page.getByTestId("design-status").first()).toHaveText("in-review");
  await ctx.close();

  // A reviewer approves it.
  const rctx = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const rp = await rctx.newPage();
  await signInPage(rp, "reviewer");
  await rp.goto(`/designs/${id}`);
  await rp.getByRole("button", { name: "Approve revision 2" }).click();
  await expect(rp.getByTestId("design-status").first()).toHaveText("approved");
  await rctx.close();

  // A maker opens the approved plan and builds from its sheet.
  const mctx = await browser.newContext({ viewport: { width: 1280, height: 900 }, acceptDownloads: true });
  const mp = await mctx.newPage();
  await signInPage(mp, "maker");
  await mp.goto(`/designs/${id}`);
  await expect(mp.getByTestId("design-status").first()).toHaveText("approved");
  await expect(mp.getByTestId("plan-bench-1")).toBeVisible();
  await expect(mp.getByTestId("plan-bench-3")).toBeVisible();
  // From the design page to the meter view of the same plan.
  await mp.getByTestId("plan-meter-link").click();
  await expect(mp).toHaveURL(new RegExp(`/meter\\?design=${id}$`));
  await expect(mp.getByTestId("plan-beside-meter")).toContainText(name);
  await mp.goBack();
  // The maker downloads the sheet from the page and reads it back (pdftotext, poppler-utils):
  // every range's parts and bench rows, the figures from GET /api/designs/[id] (the engine's).
  const download = mp.waitForEvent("download");
  await mp.getByTestId("download-build-sheet").click();
  const pdf = await readFile(await (await download).path());
  const text = squash(execFileSync("pdftotext", ["-raw", "-", "-"], { input: pdf, encoding: "utf8" }));
  expect(text).not.toContain("NOT APPROVED");
  const makerApi = await apiAs("maker");
  const view = (await (await makerApi.get(`/api/designs/${id}`)).json()) as {
    metrics: {
      ranges: {
        shuntOhms: number;
        benchCheck: { currentA: number; expectedV: number; minV: number; maxV: number }[];
      }[];
    };
    plan: { switchPoints: { upA: number; downA: number }[] };
  };
  expect(view.metrics.ranges).toHaveLength(3);
  view.metrics.ranges.forEach((r, k) => {
    expect(text).toContain(squash(`${formatSI(r.shuntOhms, "Ω")} (${resistorCode(r.shuntOhms)})`));
    expect(text).toContain(`Range switch, range ${k + 1}`);
    expect(text).toContain(`Bench check, range ${k + 1}`);
    expect(r.benchCheck.length).toBeGreaterThan(0);
    for (const row of r.benchCheck)
      expect(text).toContain(
        squash(
          `${formatSI(row.currentA, "A")} ${formatSI(row.expectedV, "V")} ${formatSI(row.minV, "V")} to ${formatSI(row.maxV, "V")}`,
        ),
      );
  });
  // The adjusted switch points (300 µA, then 4 mA in revision 2) are the sheet's switching rule.
  expect(text).toContain(squash(`rises above ${formatSI(300e-6, "A")}`));
  expect(text).toContain(squash(`rises above ${formatSI(4e-3, "A")}`));
  await mctx.close();
});

test("the meter view: a bench meter's three ranges beside the designed plan", async ({ browser }) => {
  for (const [width, tag] of [
    [1280, "1280"],
    [widths.phone, "390"],
  ] as const) {
    const ctx = await browser.newContext({ viewport: { width, height: 900 } });
    const page = await ctx.newPage();
    await signInPage(page, "designer");
    await page.goto("/meter");
    const panel = page.getByTestId("plan-beside-meter");
    await expect(panel.getByLabel("Range plan", { exact: true })).toBeVisible();
    await expect(page.getByTestId("meter-plan-chart").locator("svg path")).toHaveCount(4);
    for (const key of ["amps", "milliamps", "microamps", "plan"])
      await expect(page.getByTestId(`meter-vs-${key}-full`)).not.toBeEmpty();
    // Every plan in this run is the demo logger's (3.0 V, 180 mA, constant current): the milliamp range leaves
    // 3.0 − 0.18 × 1.9 = 2.658 V (Ohm's law); the microamp range's 100 Ω cannot carry 180 mA.
    await expect(panel).toContainText("3 µA to 180 mA from 3 V");
    await expect(page.getByTestId("meter-vs-milliamps-full")).toHaveText("2.66 V");
    await expect(page.getByTestId("meter-vs-microamps-full")).toHaveText("cannot power the load");
    await checkScreen(page, `${shots}/meter-plan-${tag}.png`);
    await panel.screenshot({ path: `${shots}/meter-plan-panel-${tag}.png` });
    await ctx.close();
  }
});

test("the plan editor on a phone", async ({ browser }) => {
  const ctx = await browser.newContext({ viewport: { width: widths.phone, height: 844 } });
  const page = await ctx.newPage();
  await signInPage(page, "designer");
  await openLoggerPlan(page);
  await page.getByRole("button", { name: "Other pairs for range 1" }).click();
  await checkScreen(page, `${shots}/plan-editor-390.png`);
  await page.getByTestId("plan-editor").screenshot({ path: `${shots}/plan-editor-panel-390.png` });
  await page.getByTestId("plan-range-1").screenshot({ path: `${shots}/plan-range-1-390.png` });
  await page.getByTestId("plan-error-chart").screenshot({ path: `${shots}/plan-error-chart-390.png` });
  await ctx.close();
});
