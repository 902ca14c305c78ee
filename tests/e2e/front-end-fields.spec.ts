// Issue 14's wizard fields as a person uses them, at 1280 px and 390 px: a copper-trace shunt
// by its geometry (a wrong unit refused on its field), Kelvin or 2-terminal sensing, thermal EMF,
// and the input filter offered with a suggested corner; the budget of a chosen candidate shows
// the filter's own row. Screenshots go to PW_OUTPUT_DIR for a person to look at.
import { expect, test, type Page } from "@playwright/test";
import { signInPage } from "../fixtures/auth";
import { checkScreen } from "./screen-check";

const shots = process.env.PW_OUTPUT_DIR ?? "test-results/front-end-fields";
const field = (page: Page, label: string) => page.getByLabel(label, { exact: true });
/** The whole page, and the form alone (at phone width the page is too long to read in one image). */
async function look(page: Page, name: string) {
  await checkScreen(page, `${shots}/${name}.png`);
  await page.getByRole("form", { name: "Requirement" }).screenshot({ path: `${shots}/${name}-form.png` });
}

async function next(page: Page) {
  await page.getByRole("button", { name: /^Next: |^Check the whole requirement/ }).click();
}

for (const width of [1280, 390]) {
  test(`shunt construction and input filter at ${width} px`, async ({ browser }) => {
    test.setTimeout(120_000);
    const ctx = await browser.newContext({ viewport: { width, height: 900 } });
    const page = await ctx.newPage();
    await signInPage(page, "designer");
    await page.goto("/designs/new");
    await page.evaluate(() => window.localStorage.clear());
    await page.reload();

    // A 48 V pack's discharge current, 1 A to 30 A.
    await field(page, "Minimum current").fill("1 A");
    await field(page, "Maximum current").fill("30 A");
    await next(page);
    await field(page, "Supply voltage").fill("48 V");
    await field(page, "Allowed drop").fill("50 mV");
    await next(page);
    await field(page, "ADC full scale").fill("2.5 V");
    await field(page, "ADC resolution (bits)").fill("16");
    await field(page, "Accuracy target").fill("30");
    await next(page);

    // The shunt: a copper trace. A current typed into the width is refused on that field.
    await expect(page.getByRole("heading", { name: /Shunt/ })).toBeVisible();
    await page.getByText("A copper trace on the board").click();
    await expect(field(page, "E-series (IEC 60063)")).toHaveCount(0);
    await field(page, "Trace width").fill("10 mA");
    await field(page, "Trace width").blur();
    await expect(page.locator("#f-shunt-trace-width-error")).toContainText(
      "Trace width: 10 mA is a current, not a length",
    );
    await field(page, "Trace width").fill("10 mm");
    await expect(page.locator("#f-shunt-trace-width-error")).toHaveText("");
    await field(page, "Longest trace the board allows").fill("40 mm");
    await field(page, "Copper thickness").fill("70 µm");
    await field(page, "Thermal EMF of the shunt's joints").fill("2 µV/K");
    await field(page, "Temperature difference between its ends").fill("1 K");
    await look(page, `shunt-copper-${width}`);

    // Back to a resistor: Kelvin by default; two terminals ask for the pads.
    await page.getByText("A resistor", { exact: true }).click();
    await expect(field(page, "Shunt tolerance")).toHaveValue("0.5 %");
    await expect(field(page, "Candidates listed")).toHaveValue("200");
    await expect(field(page, "Pad and solder resistance")).toHaveCount(0);
    await page.getByText("2 terminals, across the pads").click();
    await expect(field(page, "Pad and solder resistance")).toHaveValue("0.5 mΩ");
    await look(page, `shunt-two-terminal-${width}`);
    await page.getByText("A copper trace on the board").click();
    await expect(field(page, "Trace width")).toHaveValue("10 mm");
    await expect(field(page, "Copper thickness")).toHaveValue("70 µm");
    await next(page);

    // The input filter: ticking it fills a suggestion for a 1 kHz ADC and states its corner.
    await expect(page.getByRole("heading", { name: /Amplifier/ })).toBeVisible();
    await page.getByLabel(/RC filter at the amplifier's inputs/).check();
    await expect(field(page, "Resistor, each leg")).toHaveValue("47 Ω");
    await expect(field(page, "Capacitor, each leg to ground")).toHaveValue("47 µF");
    await expect(page.getByTestId("filter-corner")).toContainText("Corner 72 Hz");
    await field(page, "Capacitor, each leg to ground").fill("33 µF");
    await expect(page.getByTestId("filter-corner")).toContainText("Corner 103 Hz");
    await look(page, `amplifier-filter-${width}`);
    await next(page);
    await field(page, "Lowest ambient temperature").fill("0 °C");
    await field(page, "Highest ambient temperature").fill("40 °C");
    await next(page);
    await expect(page.getByText("Every step checks out.")).toBeVisible();

    // A candidate's budget carries the filter and the thermal EMF as rows of their own.
    await expect(page.getByTestId("candidate-row").first()).toBeVisible({ timeout: 30_000 });
    await page.getByTestId("candidate-row").first().click();
    const detail = page.getByTestId("candidate-detail");
    await expect(detail).toBeVisible();
    const budget = page.getByRole("img", { name: /^Error budget at / }).locator("xpath=ancestor::figure[1]");
    await expect(budget).toContainText("Input filter: bias and offset current through its resistors");
    await expect(budget).toContainText("Thermal EMF at the shunt's joints");
    await checkScreen(page, `${shots}/results-budget-${width}.png`);
    await budget.screenshot({ path: `${shots}/results-budget-${width}-detail.png` });
    await ctx.close();
  });
}
