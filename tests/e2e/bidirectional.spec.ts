// Issue 14 on screen: a bidirectional pack read by an ADC whose own error is stated, calibrated at
// zero; the wizard's fields for the readout's error and the zero-current level, and the error chart
// in two panels over the signed span, at desktop and phone width.
import { expect, test, type Page } from "@playwright/test";
import { signInPage } from "../fixtures/auth";
import { checkScreen, shownText, widths } from "./screen-check";

const shots = process.env.PW_OUTPUT_DIR ?? "test-results/bidirectional";
const field = (page: Page, label: string) => page.getByLabel(label, { exact: true });
const somePairFeasible = /: [1-9][\d,]* feasible/;

async function next(page: Page, heading: RegExp) {
  await page.getByRole("button", { name: /^Next: / }).click();
  await expect(page.getByRole("heading", { name: heading })).toBeVisible();
}

for (const [w, width] of Object.entries(widths)) {
  test(`a bidirectional pack with the readout's own error at ${width} px`, async ({ browser }) => {
    const ctx = await browser.newContext({ viewport: { width, height: 1000 } });
    const page = await ctx.newPage();
    await signInPage(page, "designer");
    await page.goto("/designs/new");
    await page.evaluate(() => window.localStorage.clear());
    await page.reload();

    await field(page, "Minimum current").fill("-10 A");
    await field(page, "Maximum current").fill("10 A");
    await next(page, /Supply and drop/);
    await field(page, "Supply voltage").fill("48 V");
    await field(page, "Allowed drop").fill("50 mV");

    await next(page, /Readout/);
    await field(page, "ADC resolution (bits)").fill("16");
    const box = page.getByTestId("readout-error");
    await expect(box).toContainText(
      "A blank box is read with the figure shown in it, typical of a general-purpose converter with a series reference (from memory)",
    );
    await box.getByRole("button", { name: "Fill typical figures" }).click();
    await expect(field(page, "Reference tolerance").first()).toHaveValue("0.1 %");
    await expect(field(page, "Offset error")).toHaveValue("2");
    await page.getByLabel("Calibration before use").selectOption("one-point");
    await field(page, "Accuracy band from (optional)").fill("2 A");
    await checkScreen(page, `${shots}/readout-fields-${w}.png`);

    await next(page, /Shunt/);
    await next(page, /Amplifier/);
    const zero = page.getByTestId("zero-level");
    await zero.getByLabel("Reference voltage", { exact: true }).fill("1.25 V");
    await expect(page.getByTestId("solve-status")).toContainText(somePairFeasible, { timeout: 60_000 });
    await zero.scrollIntoViewIfNeeded();
    await checkScreen(page, `${shots}/zero-level-${w}.png`);

    // The chart over the signed span: two panels, the negative one labelled with its sign.
    const chart = page.getByTestId("signed-error-chart");
    await chart.scrollIntoViewIfNeeded();
    await expect(chart).toContainText("Negative direction (I < 0), by magnitude");
    await expect(chart).toContainText("Positive direction (I > 0)");
    await expect(chart).toContainText("Current, I < 0");
    await expect(chart).toContainText("−");
    const text = await shownText(page);
    expect(text).toContain("ADC reference (tolerance and tempco)");
    // Filled in from the class figures, the figures are now the request's own: stated.
    expect(text).toContain("(reference ±0.1 %, reference drift 20 ppm/K, stated)");
    await chart.screenshot({ path: `${shots}/signed-chart-${w}.png` });
    await checkScreen(page, `${shots}/signed-page-${w}.png`);
    await ctx.close();
  });
}
