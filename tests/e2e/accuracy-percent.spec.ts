// The wizard's accuracy box refuses a bare target below 0.1 with both readings as it is typed
// (issue 11 item 9), and takes the same value with its sign; desktop and phone widths.
import { expect, test, type Page } from "@playwright/test";
import { signInPage } from "../fixtures/auth";
import { checkScreen, shownText, widths } from "./screen-check";

const shots = process.env.PW_OUTPUT_DIR ?? "test-results/accuracy-percent";
const field = (page: Page, label: string) => page.getByLabel(label, { exact: true });

for (const [w, width] of Object.entries(widths)) {
  test(`a bare 0.02 accuracy target is refused with both readings at ${width} px`, async ({ browser }) => {
    const ctx = await browser.newContext({ viewport: { width, height: 900 } });
    const page = await ctx.newPage();
    await signInPage(page, "designer");
    await page.goto("/designs/new");
    await page.evaluate(() => window.localStorage.clear());
    await page.reload();
    await field(page, "Minimum current").fill("3 uA");
    await field(page, "Maximum current").fill("180 mA");
    await page.getByRole("button", { name: /^Next: / }).click();
    await field(page, "Supply voltage").fill("3 V");
    await field(page, "Allowed drop").fill("60 mV");
    await page.getByRole("button", { name: /^Next: / }).click();
    await expect(page.getByRole("heading", { name: /Readout/ })).toBeVisible();

    const error = page.locator("#f-accuracy-percent-error");
    await field(page, "Accuracy target").fill("0.02");
    await field(page, "Accuracy target").blur();
    const message =
      'Accuracy target (accuracy.percent): 0.02 reads as 0.02 %; if you meant 2 %, type 2 or "2 %"; for 0.02 %, type "0.02 %"';
    await expect(error).toHaveText(message);
    await error.scrollIntoViewIfNeeded();
    await checkScreen(page, `${shots}/accuracy-ambiguous-${w}.png`);
    expect(await shownText(page)).toContain(message);
    // The field and its message up close, as the full page is long.
    // The full-page check scrolls; bring the message back into the viewport the clip is taken from.
    await error.scrollIntoViewIfNeeded();
    const box = (await error.boundingBox())!;
    const top = Math.min(Math.max(0, box.y - 160), 900 - 420);
    await page.screenshot({ path: `${shots}/accuracy-field-${w}.png`, clip: { x: 0, y: top, width, height: 420 } });

    await field(page, "Accuracy target").fill("0.02 %");
    await expect(error).toHaveText("");
    await field(page, "Accuracy target").fill("0.5");
    await expect(error).toHaveText("");
    await ctx.close();
  });
}
