// A range plan from the wizard: the engine proposes it for the logger that sleeps at microamps and
// bursts to 180 mA; the designer moves a switch point, picks another pair for one range, and saves.
import { expect, test, type Page } from "@playwright/test";
import { signInPage } from "../fixtures/auth";
import { checkScreen, shownText, widths } from "./screen-check";

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

  await page.getByLabel("Design name").fill(`Logger plan ${Date.now().toString(36)}`);
  const save = page.getByRole("button", { name: "Save the 3-range plan" });
  await expect(save).toBeEnabled();
  await save.click();
  await expect(page).toHaveURL(/\/designs\/[0-9a-f-]{36}$/);
  await ctx.close();
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
