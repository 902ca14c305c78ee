// Issue 11: a requirement with no feasible pair comes back with a diagnosis in words; one click
// applies a suggestion and the wizard then finds the pairs it promised. Also the new fields.
import { expect, test, type Page } from "@playwright/test";
import { formatSI } from "../../lib/design/format";
import { signInPage } from "../fixtures/auth";

const shots = process.env.PW_OUTPUT_DIR ?? "test-results/diagnosis";

async function next(page: Page) {
  await page.getByRole("button", { name: /^Next: |^Check the whole requirement/ }).click();
}

/** The wizard for a new design, with no draft left from an earlier test. */
async function openBlankWizard(page: Page) {
  await signInPage(page, "designer");
  await page.goto("/designs/new");
  await page.evaluate(() => window.localStorage.clear());
  await page.reload();
}

/**
 * A 3.3 V sensor node, 1 % from 1 mA over −20…60 °C: the gain-type errors alone are 0.87 %. Its
 * converter's own error is not stated (typical figures, 0.24 % more: 1 % would be out of reach at
 * any band start), so it is calibrated at two points, which takes the 25 °C gain errors out.
 */
async function fillSensorNode(page: Page, minCurrent = "1 mA") {
  await openBlankWizard(page);
  await page.getByLabel("Minimum current", { exact: true }).fill(minCurrent);
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
  await page.getByLabel("Calibration before use").selectOption("two-point");
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
    const line = diagnosis
      .getByRole("listitem")
      .filter({ hasText: /1 % is reachable from .*A up \(\d+ feasible pairs?\)/ });
    const promised = Number(/\((\d+) feasible pairs?\)/.exec(await line.innerText())?.[1]);
    await line.getByRole("button", { name: /^Apply/ }).click();
    await expect(page.getByTestId("solve-status")).toContainText(new RegExp(`\\b${promised} feasible`), {
      timeout: 30_000,
    });
    await expect(page.getByTestId("diagnosis")).toHaveCount(0);
    await page.screenshot({ path: `${shots}/diagnosis-applied-${width}.png`, fullPage: true });
  });
}

for (const width of [1280, 390]) {
  test(`the issue's sensor node from 5 µA: no single pair, so the changes that work come with a range plan, and Apply gives it (${width} px)`, async ({
    page,
  }) => {
    test.setTimeout(120_000);
    await page.setViewportSize({ width, height: 1000 });
    await fillSensorNode(page, "5 uA");
    const diagnosis = page.getByTestId("diagnosis");
    await expect(diagnosis).toBeVisible({ timeout: 30_000 });
    const text = await diagnosis.innerText();
    // Both ways in the words: a looser target over the band, or the same 1 % from higher up.
    expect(text).toMatch(/\d+(\.\d+)? % is reachable from 1 mA up with a plan of 3 switched ranges/);
    expect(text).toMatch(/1 % is reachable from \d+(\.\d+)? mA up with a plan of 3 switched ranges/);
    expect(text).toContain("range plan");
    expect(text).not.toContain("No single change");
    await diagnosis.scrollIntoViewIfNeeded();
    await diagnosis.screenshot({ path: `${shots}/diagnosis-sensor-node-${width}.png` });
    await page.screenshot({ path: `${shots}/diagnosis-sensor-node-page-${width}.png`, fullPage: true });
    const overflow = await page.evaluate(
      () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
    );
    expect(overflow).toBeLessThanOrEqual(0);

    const line = diagnosis.getByRole("listitem").filter({ hasText: /% is reachable from 1 mA up with a plan/ });
    await line.getByRole("button", { name: /^Apply/ }).click();
    await expect(page.getByRole("heading", { name: /Range plan: 3 ranges/ })).toBeVisible({ timeout: 30_000 });
  });
}

test("a resistor-pair stage on the 48 V high side is refused for common mode, in words", async ({ page }) => {
  test.setTimeout(120_000);
  await page.setViewportSize({ width: 1440, height: 1000 });
  await openBlankWizard(page);
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

/** Constant-power load (quadratic in the load voltage): V_load = (V + √(V² − 4·P·R))/2, I = P/V_load. */
function constantPowerCurrent(vBus: number, iMax: number, r: number): number {
  const p = vBus * iMax;
  return p / ((vBus + Math.sqrt(vBus * vBus - 4 * p * r)) / 2);
}

for (const width of [1280, 390]) {
  test(`the selected candidate shows the current at full load, the worst-case output and the smallest step, in words (${width} px)`, async ({
    page,
  }) => {
    test.setTimeout(120_000);
    await page.setViewportSize({ width, height: 1000 });
    await openBlankWizard(page);
    await page.getByLabel("Minimum current", { exact: true }).fill("100 mA");
    await page.getByLabel("Maximum current", { exact: true }).fill("1 A");
    await page.getByLabel("Load behaviour", { exact: true }).selectOption("constant-power");
    await next(page);
    await page.getByLabel("Supply voltage", { exact: true }).fill("3.3 V");
    await page.getByLabel("Allowed drop", { exact: true }).fill("100 mV");
    // The converter's own error is not stated (its class's typical figures): zeroed once, pairs work.
    await next(page);
    await page.getByLabel("Calibration before use").selectOption("one-point");
    const detail = page.getByTestId("candidate-detail");
    await expect(detail).toBeVisible({ timeout: 30_000 });
    const text = await detail.innerText();
    const shunt = /Shunt\s+([\d.]+) (m|µ|k)?Ω/.exec(text);
    expect(shunt, text).not.toBeNull();
    const ohms = Number(shunt?.[1]) * ({ m: 1e-3, µ: 1e-6, k: 1e3 }[shunt?.[2] as "m"] ?? 1);
    // The current through the shunt at full load, by the constant-power formula above: above 1 A.
    const iOp = constantPowerCurrent(3.3, 1, ohms);
    expect(iOp).toBeGreaterThan(1);
    expect(text).toMatch(
      new RegExp(
        `Current at full load\\s+${formatSI(iOp, "A").replace(".", "\\.")}\\s*a constant-power load draws more`,
      ),
    );
    expect(text).toMatch(
      // 2.5 V less the typical converter's reference (0.1 % + 20 ppm/K × 45 K), gain (0.05 %) and
      // offset (2 × 2.5 V / 4096): 2.5 × 0.9976 − 1.22 mV = 2.49 V.
      /Output at full load, worst case\s+[\d.]+ (m)?V\s*with every error that can raise it; must stay within 2\.49 V/,
    );
    expect(text).toMatch(/Smallest step it can tell apart\s+[\d.]+ (m|µ|n)?A\s*(the RMS noise|one readout step)/);
    await detail.scrollIntoViewIfNeeded();
    await detail.screenshot({ path: `${shots}/candidate-panel-${width}.png` });
    const overflow = await page.evaluate(
      () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
    );
    expect(overflow).toBeLessThanOrEqual(0);
  });
}
