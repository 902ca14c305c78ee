// The designer's loop: a returned design is revised in the wizard, resubmitted and approved,
// without leaving the product; a stale revision is refused with the reload message.
import { expect, test } from "@playwright/test";
import { apiAs, signInPage } from "../fixtures/auth";
import { requirement } from "../integration/authz-helpers";
import { checkScreen, widths } from "./screen-check";

const shots = process.env.PW_OUTPUT_DIR ?? "test-results/revise";

async function makeSubmitted(name: string) {
  const designer = await apiAs("designer");
  const res = await designer.post("/api/designs", {
    data: { name, project: "Soil-moisture logger", requirement, choice: { shuntOhms: "274 mohm", gain: 50 } },
  });
  expect(res.status(), await res.text()).toBe(201);
  const { id } = (await res.json()) as { id: string };
  expect((await designer.post(`/api/designs/${id}/submit`, { data: {} })).status()).toBe(200);
  return { id, designer };
}

test("designer → returned → revise → resubmit → approve", async ({ browser }) => {
  const name = `Revise loop ${Date.now().toString(36)}`;
  const { id } = await makeSubmitted(name);
  const reviewer = await apiAs("reviewer");
  const back = await reviewer.post(`/api/designs/${id}/reviews`, {
    data: { verdict: "return", body: "Keep the drop under 50 mV", revision: 1 },
  });
  expect(back.status(), await back.text()).toBe(201);

  const ctx = await browser.newContext({ viewport: { width: widths.desktop, height: 900 } });
  const page = await ctx.newPage();
  await signInPage(page, "designer");
  await page.goto(`/designs/${id}`);
  await expect(page.getByTestId("design-status").first()).toHaveText("returned");
  await page.getByTestId("revise-link").click();
  await expect(page).toHaveURL(new RegExp(`/designs/${id}/revise(#\\w+)?$`));
  // The wizard opens on the saved requirement and pair.
  await expect(page.getByLabel("Minimum current", { exact: true })).toHaveValue("2 mA");
  await expect(page.getByTestId("pick-note")).toContainText("recommended pair");
  await page
    .getByRole("list", { name: "Steps" })
    .getByRole("button", { name: /Supply and drop/ })
    .click();
  await expect(page.getByLabel("Allowed drop", { exact: true })).toHaveValue("60 mV");
  await page.getByLabel("Allowed drop", { exact: true }).fill("50 mV");
  await expect(page.getByTestId("solve-status")).toContainText("feasible");
  // The saved pair (49.3 mV at 180 mA) still fits and stays picked.
  const save = page.getByRole("button", { name: /Save as revision 2 with 274 mΩ × 50/ });
  await expect(save).toBeEnabled();
  await checkScreen(page, `${shots}/revise-wizard-desktop.png`);
  await save.click();

  await expect(page).toHaveURL(new RegExp(`/designs/${id}$`));
  await expect(page.getByTestId("design-revision")).toHaveText("revision 2");
  await expect(page.getByTestId("design-status").first()).toHaveText("draft");
  await expect(page.getByTestId("revision-diff")).toContainText("Allowed drop");
  await expect(page.getByTestId("revision-diff")).toContainText("50 mV");
  // Another pair is worked out by the server on demand: from 2 back to 1, then the same one twice.
  const diff = page.getByTestId("revision-diff");
  await diff.getByLabel("From revision").selectOption("2");
  await expect(diff).toContainText("Pick two different revisions.");
  await diff.getByLabel("To revision").selectOption("1");
  await expect(diff.locator("thead")).toContainText("Revision 2");
  await expect(diff.locator("tbody")).toContainText("Allowed drop");
  await expect(diff.locator("tbody")).toContainText("60 mV");
  await diff.getByLabel("From revision").selectOption("1");
  await diff.getByLabel("To revision").selectOption("2");
  await expect(diff.locator("tbody")).toContainText("50 mV");
  await expect(page.getByTestId("audit-timeline")).toContainText("saved revision 2 (changed allowed drop");
  await page.getByRole("button", { name: "Submit revision 2 for review" }).click();
  await expect(page.getByTestId("design-status").first()).toHaveText("in-review");
  await checkScreen(page, `${shots}/revised-design-desktop.png`);
  await ctx.close();

  const rctx = await browser.newContext({ viewport: { width: widths.phone, height: 844 } });
  const rp = await rctx.newPage();
  await signInPage(rp, "reviewer");
  await rp.goto(`/designs/${id}`);
  await rp.getByRole("button", { name: "Approve revision 2" }).click();
  await expect(rp.getByText("Revision 2 approved")).toBeVisible();
  await expect(rp.getByTestId("design-status").first()).toHaveText("approved");
  await checkScreen(rp, `${shots}/approved-phone.png`);
  // On a phone the revisions table fits its panel (the author goes under the revision number).
  const history = rp.getByRole("table").filter({ has: rp.getByRole("columnheader", { name: "Approval" }) });
  await expect(history.getByRole("row", { name: /^2 / })).toContainText("approved");
  const sideways = await history.evaluate((t) => t.parentElement!.scrollWidth - t.parentElement!.clientWidth);
  expect(sideways, "the revisions table scrolls sideways at 390 px").toBeLessThanOrEqual(0);
  await rctx.close();
});

test("a stale revise is refused with the reload message and keeps the edit", async ({ browser }) => {
  const name = `Revise stale ${Date.now().toString(36)}`;
  const { id, designer } = await makeSubmitted(name);
  const ctx = await browser.newContext({ viewport: { width: widths.phone, height: 844 } });
  const page = await ctx.newPage();
  await signInPage(page, "designer");
  await page.goto(`/designs/${id}/revise`);
  await expect(page.getByLabel("Minimum current", { exact: true })).toHaveValue("2 mA");
  await page.getByLabel("Minimum current", { exact: true }).fill("3 mA");
  await expect(page.getByTestId("solve-status")).toContainText("feasible");
  // Someone else saves revision 2 meanwhile.
  const other = await designer.patch(`/api/designs/${id}`, { data: { revision: 1, name: `${name} (theirs)` } });
  expect(other.status(), await other.text()).toBe(200);
  await page.getByRole("button", { name: /Save as revision 2/ }).click();
  await expect(page.getByTestId("save-error")).toContainText("Someone else saved this design first");
  await expect(page.getByRole("link", { name: "Open the design as it is now" })).toBeVisible();
  await expect(page.getByLabel("Minimum current", { exact: true })).toHaveValue("3 mA");
  await checkScreen(page, `${shots}/revise-stale-phone.png`);
  await ctx.close();
});
