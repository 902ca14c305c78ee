// The wizard's form behaviour: cross-field messages clear with their cause, the drop converts
// between volts and share, absurd values get a plain range message, engineers' spellings are read,
// bare numbers show their unit, steps carry names and the browser's Back moves between them.
import { expect, test, type Page } from "@playwright/test";
import { signInPage } from "../fixtures/auth";
import { checkScreen, widths } from "./screen-check";

const shots = process.env.PW_OUTPUT_DIR ?? "test-results/wizard-form";
const field = (page: Page, label: string) => page.getByLabel(label, { exact: true });
const steps = (page: Page) => page.getByRole("list", { name: "Steps" });

for (const [w, width] of Object.entries(widths)) {
  test(`form behaviour at ${width} px`, async ({ browser }) => {
    const ctx = await browser.newContext({ viewport: { width, height: 900 } });
    const page = await ctx.newPage();
    await signInPage(page, "designer");
    await page.goto("/designs/new");
    await page.evaluate(() => window.localStorage.clear());
    await page.reload();

    // Step tabs name their steps.
    for (const name of ["Current span", "Supply and drop", "Readout", "Shunt", "Amplifier", "Temperature"])
      await expect(steps(page)).toContainText(name);

    // Engineers' spellings; a bare number shows the unit it is read in.
    await field(page, "Minimum current").fill("5ua");
    await field(page, "Maximum current").fill("2");
    await expect(page.getByTestId("f-current-max-unit")).toHaveText("A");
    await field(page, "Maximum current").fill("1e30 A");
    await field(page, "Maximum current").blur();
    await expect(page.locator("#f-current-max-error")).toContainText(
      "Maximum current: 1 × 10^30 A is outside the range this workbench designs for (1 pA to 100 kA)",
    );
    await field(page, "Maximum current").fill("180 mA");
    await expect(page.locator("#f-current-max-error")).toHaveText("");
    await expect(page.locator("#f-current-min-error")).toHaveText("");
    await page.getByRole("button", { name: /^Next: / }).click();

    // A cross-field message clears as soon as its cause is fixed.
    await expect(page.getByRole("heading", { name: /Supply and drop/ })).toBeVisible();
    await field(page, "Supply voltage").fill("40 mV");
    await field(page, "Allowed drop").fill("60 mV");
    await field(page, "Allowed drop").blur();
    await expect(page.locator("#f-drop-max-error")).toContainText("Allowed drop must be below the supply voltage");
    await field(page, "Supply voltage").fill("3 V");
    await expect(page.locator("#f-drop-max-error")).toHaveText("");

    // Switching the drop to a share converts it: 60 mV of 3 V is 2 %, and back.
    await page.getByText("Share of supply").click();
    await expect(field(page, "Allowed drop (share of supply)")).toHaveValue("2 %");
    await page.getByText("Volts", { exact: true }).click();
    await expect(field(page, "Allowed drop")).toHaveValue("60 mV");
    await page.getByRole("button", { name: /^Next: / }).click();
    await expect(page.getByRole("heading", { name: /Readout/ })).toBeVisible();

    // The browser's Back returns to the previous step, Forward comes back.
    await page.goBack();
    await expect(page.getByRole("heading", { name: /Supply and drop/ })).toBeVisible();
    await expect(field(page, "Supply voltage")).toHaveValue("3 V");
    await page.goForward();
    await expect(page.getByRole("heading", { name: /Readout/ })).toBeVisible();

    // Temperatures read "0 °C"; a real minus sign and "C" or "degC" are understood.
    await page.getByRole("button", { name: /^Next: / }).click();
    await page.getByRole("button", { name: /^Next: / }).click();
    await page.getByRole("button", { name: /^Next: / }).click();
    await expect(page.getByRole("heading", { name: /Temperature/ })).toBeVisible();
    await expect(field(page, "Lowest ambient temperature")).toHaveValue("0 °C");
    for (const t of ["−20 °C", "-20 C", "20degC"]) {
      await field(page, "Lowest ambient temperature").fill(t);
      await field(page, "Lowest ambient temperature").blur();
      await expect(page.locator("#f-temperature-min-error"), t).toHaveText("");
    }
    await field(page, "Lowest ambient temperature").fill("−20 °C");
    await expect(page.getByTestId("solve-status")).toContainText("feasible");
    await checkScreen(page, `${shots}/wizard-temperature-${w}.png`);
    await ctx.close();
  });
}
