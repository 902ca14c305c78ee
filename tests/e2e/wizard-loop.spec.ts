// The wizard's loop: a new design starts from the defaults, an example loads on request, the
// recommended pair leads and is followed after edits unless the designer picks one, the summary
// lists every value that differs from the defaults, and a double-clicked Save sends one request.
import { expect, test, type Page } from "@playwright/test";
import { signInPage } from "../fixtures/auth";
import { checkScreen, widths } from "./screen-check";

const shots = process.env.PW_OUTPUT_DIR ?? "test-results/wizard-loop";
// "0 feasible" also contains "feasible": the status must count at least one feasible pair.
const somePairFeasible = /: [1-9][\d,]* feasible/;

async function freshWizard(page: Page) {
  await signInPage(page, "designer");
  await page.goto("/designs/new");
  await page.evaluate(() => window.localStorage.clear());
  await page.reload();
}

async function stepTo(page: Page, name: RegExp) {
  await page.getByRole("list", { name: "Steps" }).getByRole("button", { name }).click();
}

test.use({ viewport: { width: widths.desktop, height: 1000 } });

test("new designs start from the defaults; an example loads only on request", async ({ page }) => {
  await freshWizard(page);
  await expect(page.getByLabel("Minimum current", { exact: true })).toHaveValue("");
  await expect(page.getByLabel("Maximum current", { exact: true })).toHaveValue("");
  await expect(page.getByTestId("solve-status")).toContainText("Waiting for a complete requirement");
  await page.getByLabel("Minimum current", { exact: true }).fill("1 A");
  await page.getByLabel("Maximum current", { exact: true }).fill("6 A");
  await page.getByRole("button", { name: /^Next: / }).click();
  await page.getByLabel("Supply voltage", { exact: true }).fill("48 V");
  await page.getByRole("button", { name: /^Next: / }).click();
  await expect(page.getByLabel("ADC resolution (bits)", { exact: true })).toHaveValue("12");
  await expect(page.getByTestId("defaults-summary")).toContainText("1 A to 6 A from a 48 V supply");
  await expect(page.getByTestId("defaults-summary")).toContainText("every other value is the documented default");
  await checkScreen(page, `${shots}/defaults-desktop.png`);

  page.once("dialog", (d) => void d.accept());
  await page.getByText("Start from an example").click();
  await page.getByRole("button", { name: "Soil-moisture logger, 24-bit converter" }).click();
  await expect(page.getByLabel("Minimum current", { exact: true })).toHaveValue("100 uA");
  await expect(page.getByTestId("solve-status")).toContainText(somePairFeasible);
  // The example's values on steps never opened are listed before saving.
  const summary = page.getByTestId("defaults-summary");
  await expect(summary).toContainText("ADC resolution");
  await expect(summary).toContainText("24 bits");
  await expect(summary).toContainText("Lowest output (above ground)");
  await expect(summary).toContainText("(default 10 mV)");
  await expect(summary).toContainText("Amplifier");
});

test("the recommended pair leads; a picked pair stays and says when it stops fitting", async ({ page }) => {
  await freshWizard(page);
  await page.getByText("Start from an example").click();
  await page.getByRole("button", { name: "Soil-moisture logger, 24-bit converter" }).click();
  await expect(page.getByTestId("solve-status")).toContainText(somePairFeasible);
  const rec = page.getByTestId("recommended");
  await expect(rec).toContainText("Recommended pair");
  await expect(rec).toContainText("It uses the least of the three limits");
  await expect(rec).toContainText("(selected)");
  const rows = page.getByTestId("candidate-row");
  await expect(rows.first()).toContainText("recommended");
  await expect(rows.first()).toHaveAttribute("aria-selected", "true");
  await expect(page.getByTestId("pick-note")).toContainText("Following the ranking");

  // An edit moves the top of the ranking; the selection follows it.
  await stepTo(page, /Supply and drop/);
  await page.getByLabel("Allowed drop", { exact: true }).fill("30 mV");
  await expect(page.getByTestId("solve-status")).toContainText(somePairFeasible);
  await expect(rec).toContainText("(selected)");
  await expect(rows.first()).toHaveAttribute("aria-selected", "true");

  // A pair the designer picks stays picked through edits, and the note beside Save says so.
  const third = rows.nth(2);
  const pickedShunt = (await third.locator("td").nth(1).innerText()).trim();
  await third.click();
  await expect(page.getByTestId("pick-note")).toContainText(`Your pick, ${pickedShunt}`);
  await page.getByLabel("Allowed drop", { exact: true }).fill("1 mV");
  await expect(page.getByTestId("pick-note")).toContainText("no longer meets the requirement");
  await expect(page.getByRole("button", { name: /^Save/ })).toBeDisabled();
  await checkScreen(page, `${shots}/pick-infeasible-desktop.png`);
  await page.getByLabel("Allowed drop", { exact: true }).fill("30 mV");
  await expect(page.getByTestId("pick-note")).toContainText(`Your pick, ${pickedShunt}`);
  await page.getByRole("button", { name: /^Follow the ranking/ }).click();
  await expect(page.getByTestId("pick-note")).toContainText("Following the ranking");
  await expect(rows.first()).toHaveAttribute("aria-selected", "true");
});

test("a double-clicked Save sends one request with an Idempotency-Key and makes one design", async ({ page }) => {
  await freshWizard(page);
  await page.getByText("Start from an example").click();
  await page.getByRole("button", { name: "Soil-moisture logger, 24-bit converter" }).click();
  await expect(page.getByTestId("solve-status")).toContainText(somePairFeasible);
  const posts: (string | null)[] = [];
  page.on("request", (r) => {
    if (r.method() === "POST" && new URL(r.url()).pathname === "/api/designs")
      posts.push(r.headers()["idempotency-key"] ?? null);
  });
  await page.getByLabel("Design name", { exact: true }).fill(`Double click ${Date.now().toString(36)}`);
  await page.getByRole("button", { name: /^Save with/ }).dblclick();
  await expect(page).toHaveURL(/\/designs\/[0-9a-f-]{36}$/);
  expect(posts).toHaveLength(1);
  expect(posts[0]).toMatch(/^[0-9a-f-]{36}$/);
});
