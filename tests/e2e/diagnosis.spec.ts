// Issue 11: a requirement with no feasible pair comes back with a diagnosis in words; one click
// applies a suggestion and the wizard then finds the pairs it promised. Also the new fields.
import { expect, test, type Page } from "@playwright/test";
import { signInPage } from "../fixtures/auth";

const shots = process.env.PW_OUTPUT_DIR ?? "test-results/diagnosis";

async function next(page: Page) {
  await page.getByRole("button", { name: /^Next: |^Check the whole requirement/ }).click();
}

/** A 3.3 V sensor node, 1 mA–250 mA, 1 % from 1 mA over −20…60 °C: the gain-type errors alone are 0.87 %. */
async function fillSensorNode(page: Page) {
  await signInPage(page, "designer");
  await page.goto("/designs/new");
  await page.evaluate(() => window.localStorage.clear());
  await page.reload();
  await page.getByLabel("Minimum current", { exact: true }).fill("1 mA");
  await page.getByLabel("Maximum current", { exact: true }).fill("250 mA");
  await next(page);
  await page.getByLabel("Supply voltage", { exact: true }).fill("3.3 V");
  await page.getByLabel("Allowed drop", { exact: true }).fill("50 mV");
  await next(page);
  await page.getByLabel("ADC full scale", { exact: true }).fill("3.3 V");
  await page.getByLabel("ADC resolution (bits)", { exact: true }).fill("12");
  await expect(page.getByLabel("ADC sample rate", { exact: true })).toHaveValue("1 kHz");
  await page.getByLabel("Accuracy target", { exact: true }).fill("1");
  await page.getByLabel("Accuracy band from (optional)", { exact: true }).fill("1 mA");
  await next(page);
  await expect(page.getByLabel("Full power up to (ambient)", { exact: true })).toHaveValue("70 °C");
  await expect(page.getByLabel("Shunt maximum temperature", { exact: true })).toHaveValue("155 °C");
  await next(page);
  await expect(page.getByLabel("Amplifier topology", { exact: true })).toBeVisible();
  await expect(page.getByLabel("Output filter corner (optional)", { exact: true })).toHaveValue("");
  await next(page);
  await page.getByLabel("Lowest ambient temperature", { exact: true }).fill("-20 °C");
  await page.getByLabel("Highest ambient temperature", { exact: true }).fill("60 °C");
  await next(page);
}

for (const width of [1440, 390]) {
  test(`nothing feasible: the diagnosis says what would work, and Apply makes it so (${width} px)`, async ({
    page,
  }) => {
    test.setTimeout(120_000);
    await page.setViewportSize({ width, height: 1000 });
    await fillSensorNode(page);
    const diagnosis = page.getByTestId("diagnosis");
    await expect(diagnosis).toBeVisible({ timeout: 30_000 });
    await expect(page.getByTestId("no-feasible")).toBeVisible();
    await expect(diagnosis).toContainText(/1 % is reachable from .*A up \(\d+ feasible pairs?\)/);
    await expect(diagnosis).toContainText(/% is reachable over the whole span/);
    await expect(diagnosis).toContainText("What fails");
    await expect(diagnosis).toContainText("Closest pairs");
    await diagnosis.scrollIntoViewIfNeeded();
    await page.screenshot({ path: `${shots}/diagnosis-${width}.png`, fullPage: true });
    await diagnosis.screenshot({ path: `${shots}/diagnosis-panel-${width}.png` });

    // Apply the band's start: the same count of feasible pairs comes back.
    const line = diagnosis.getByRole("listitem").filter({ hasText: /1 % is reachable from/ });
    const promised = Number(/\((\d+) feasible pairs?\)/.exec(await line.innerText())?.[1]);
    await line.getByRole("button", { name: /^Apply/ }).click();
    await expect(page.getByTestId("solve-status")).toContainText(new RegExp(`\\b${promised} feasible`), {
      timeout: 30_000,
    });
    await expect(page.getByTestId("diagnosis")).toHaveCount(0);
    await page.screenshot({ path: `${shots}/diagnosis-applied-${width}.png`, fullPage: true });
  });
}

test("a resistor-pair stage on the 48 V high side is refused for common mode, in words", async ({ page }) => {
  test.setTimeout(120_000);
  await page.setViewportSize({ width: 1440, height: 1000 });
  await signInPage(page, "designer");
  await page.goto("/designs/new");
  await page.evaluate(() => window.localStorage.clear());
  await page.reload();
  await page.getByLabel("Minimum current", { exact: true }).fill("0.5 A");
  await page.getByLabel("Maximum current", { exact: true }).fill("5 A");
  await next(page);
  await page.getByLabel("Supply voltage", { exact: true }).fill("48 V");
  await page.getByText("High side (supply)").click();
  await page.getByLabel("Allowed drop", { exact: true }).fill("1 V");
  await next(page);
  await next(page);
  await next(page);
  await page.getByText("1 + Rf/Rg from a resistor series").click();
  await expect(page.getByLabel("Gain resistor tolerance", { exact: true })).toHaveValue("0.1 %");
  const rejections = page.getByTestId("rejections");
  await expect(rejections).toContainText("Amplifier inputs outside their common-mode range", { timeout: 30_000 });
  await expect(rejections).toContainText("at the supply on the high side");
  await rejections.screenshot({ path: `${shots}/common-mode-refusals.png` });
});
