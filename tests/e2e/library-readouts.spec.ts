// Issue 14: the team library holds ADCs and meter ranges as it holds amplifiers, at 1280 px and
// 390 px. A designer reads the demo ones, adds an ADC (a bad figure refused beside its field,
// nothing saved), edits and removes it; the wizard's readout step fills the readout, its own error
// included, from a library meter and ADC. Screenshots go to PW_OUTPUT_DIR for a person to look at.
import { expect, test, type Page } from "@playwright/test";
import { signInPage } from "../fixtures/auth";
import { checkScreen, shownText } from "./screen-check";

const shots = process.env.PW_OUTPUT_DIR ?? "test-results/library-readouts";
const field = (page: Page, label: string) => page.getByLabel(label, { exact: true });
/** A readout box by its form name: the zero level's boxes share some labels with the ADC's reference. */
const readout = (page: Page, name: string) => page.locator(`[name="readout.${name}"]`);

async function next(page: Page) {
  await page.getByRole("button", { name: /^Next: |^Check the whole requirement/ }).click();
}

for (const width of [1280, 390]) {
  test(`library ADCs and meter ranges, and the wizard's readout fill, at ${width} px`, async ({ browser }) => {
    test.setTimeout(150_000);
    const ctx = await browser.newContext({ viewport: { width, height: 900 } });
    const page = await ctx.newPage();
    page.on("dialog", (d) => void d.accept());
    await signInPage(page, "designer");
    await page.goto("/library");

    // The demo readouts, figures with prefixes and units.
    const adcs = page.getByRole("table", { name: "ADCs" });
    const adcRow = adcs.getByRole("row", { name: /SW-ADC12/ });
    await expect(adcRow).toContainText("12 bit");
    await expect(adcRow).toContainText("2.5 V");
    await expect(adcRow).toContainText("10 kHz");
    await expect(adcRow).toContainText("0.1 %");
    await expect(adcRow).toContainText("20 ppm/K");
    await expect(adcRow).toContainText("2 LSB");
    const meterRow = page.getByRole("table", { name: "Meter ranges" }).getByRole("row", { name: /SW-DM20/ });
    await expect(meterRow).toContainText("200 mV");
    await expect(meterRow).toContainText("±(0.5 % + 2 digits)");

    // Add an ADC: a 30 % reference is refused beside its field and nothing is saved.
    const name = `Bench ADC ${width} ${Date.now().toString(36)}`;
    await page.getByRole("button", { name: "Add ADC" }).click();
    const form = page.getByRole("form", { name: "Add ADC" });
    await form.getByLabel("Name", { exact: true }).fill(name);
    await form.getByLabel("Resolution (bits)").fill("14");
    await form.getByLabel("Full scale").fill("3 V");
    await form.getByLabel("Highest sample rate").fill("5 kHz");
    await form.getByLabel("Reference tolerance").fill("30 %");
    await form.getByLabel("Reference tempco").fill("10 ppm/K");
    await form.getByLabel("Offset error (LSB)").fill("3");
    await form.getByLabel("Gain error (reference excluded)").fill("0.1 %");
    await form.getByLabel("Integral nonlinearity, INL (LSB)").fill("1.5");
    await form.getByRole("button", { name: "Add ADC" }).click();
    await expect(form).toContainText("Reference tolerance must be between 0 and 20 %");
    await expect(form).toContainText("Nothing was saved: correct the marked fields.");
    await expect(adcs.getByRole("row", { name: new RegExp(name) })).toHaveCount(0);
    await checkScreen(page, `${shots}/library-add-refused-${width}.png`);
    await form.screenshot({ path: `${shots}/library-add-form-${width}.png` });
    await form.getByLabel("Reference tolerance").fill("0.2 %");
    await form.getByRole("button", { name: "Add ADC" }).click();
    await expect(page.getByRole("status").first()).toHaveText(`Added ${name} to the library.`);
    const added = adcs.getByRole("row", { name: new RegExp(name) });
    await expect(added).toContainText("14 bit");
    await expect(added).toContainText("0.2 %");
    await expect(added).toContainText("1.5 LSB");

    // Edit it: the form opens with the stored figures as text.
    await page.getByRole("button", { name: `Edit ${name}` }).click();
    const edit = page.getByRole("form", { name: "Edit ADC" });
    await expect(edit.getByLabel("Reference tempco")).toHaveValue("10 ppm/K");
    await edit.getByLabel("Integral nonlinearity, INL (LSB)").fill("2");
    await edit.getByRole("button", { name: "Save changes" }).click();
    await expect(page.getByRole("status").first()).toHaveText(`Saved ${name}.`);
    await expect(adcs.getByRole("row", { name: new RegExp(name) })).toContainText("2 LSB");
    await checkScreen(page, `${shots}/library-${width}.png`);
    await page
      .locator("section")
      .filter({ has: adcs })
      .screenshot({ path: `${shots}/library-adcs-${width}.png` });
    await page.getByRole("button", { name: `Remove ${name}` }).click();
    await expect(page.getByRole("status").first()).toHaveText(`Removed ${name}.`);
    await expect(adcs.getByRole("row", { name: new RegExp(name) })).toHaveCount(0);

    // The wizard's readout step fills from the library: a meter range, then an ADC.
    await page.goto("/designs/new");
    await page.evaluate(() => window.localStorage.clear());
    await page.reload();
    await field(page, "Minimum current").fill("2 uA");
    await field(page, "Maximum current").fill("180 uA");
    await next(page);
    await field(page, "Supply voltage").fill("3.3 V");
    await field(page, "Allowed drop").fill("20 mV");
    await next(page);
    const picker = page.locator("#f-library-readout");
    await picker.selectOption({ label: "Meter: SW-DM20 handheld, 200 mV range" });
    await expect(field(page, "Meter range (full scale)")).toHaveValue("200 mV");
    await expect(field(page, "Meter counts")).toHaveValue("2000");
    await expect(readout(page, "accuracy.percentOfReading")).toHaveValue("0.5 %");
    await expect(readout(page, "accuracy.digits")).toHaveValue("2");
    await expect(page.getByText('Filled from "SW-DM20 handheld, 200 mV range"')).toBeVisible();
    await checkScreen(page, `${shots}/wizard-meter-${width}.png`);
    await page
      .getByRole("form", { name: "Requirement" })
      .screenshot({ path: `${shots}/wizard-meter-form-${width}.png` });
    await picker.selectOption({ label: "ADC: SW-ADC16 precision converter, 4.096 V" });
    await expect(field(page, "ADC full scale")).toHaveValue("4.096 V");
    await expect(field(page, "ADC resolution (bits)")).toHaveValue("16");
    await expect(field(page, "ADC sample rate")).toHaveValue("1 kHz");
    await expect(readout(page, "reference.tolerance")).toHaveValue("0.05 %");
    await expect(readout(page, "reference.tempco")).toHaveValue("5 ppm/K");
    await expect(readout(page, "offsetLsb")).toHaveValue("4");
    await expect(readout(page, "gainError")).toHaveValue("0.02 %");
    await expect(readout(page, "inlLsb")).toHaveValue("2");
    expect(await shownText(page)).not.toMatch(/NaN|undefined/);
    await checkScreen(page, `${shots}/wizard-adc-${width}.png`);
    await page.getByRole("form", { name: "Requirement" }).screenshot({ path: `${shots}/wizard-adc-form-${width}.png` });

    // The draft keeps the picker's choice: after a reload the readout step still names the library
    // part its figures came from, with the figures as filled.
    await expect
      .poll(() => page.evaluate(() => window.localStorage.getItem("sensewright.wizard.draft") ?? ""))
      .toContain("SW-ADC16 precision converter, 4.096 V");
    await page.reload();
    await expect(page.getByRole("heading", { name: /Readout/ })).toBeVisible();
    await expect(picker.locator("option:checked")).toHaveText("ADC: SW-ADC16 precision converter, 4.096 V");
    await expect(page.getByText('Filled from "SW-ADC16 precision converter, 4.096 V"')).toBeVisible();
    await expect(field(page, "ADC full scale")).toHaveValue("4.096 V");
    await expect(readout(page, "offsetLsb")).toHaveValue("4");
    // Back to typing by hand: the choice is cleared, and stays cleared after a reload.
    await picker.selectOption({ label: "— Type the readout below —" });
    await expect(
      page.getByText("A library part also fills the readout's own error from its data sheet."),
    ).toBeVisible();
    await expect
      .poll(() => page.evaluate(() => window.localStorage.getItem("sensewright.wizard.draft") ?? ""))
      .not.toContain("SW-ADC16");
    await page.reload();
    await expect(picker).toHaveValue("");
    await expect(
      page.getByText("A library part also fills the readout's own error from its data sheet."),
    ).toBeVisible();
    await ctx.close();
  });
}
