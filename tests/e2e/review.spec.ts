// Three people, three roles: a designer submits, a reviewer compares two designs and approves one
// on screen, the designer sees it approved, the owner finds the mail in the outbox.
import { expect, test } from "@playwright/test";
import { apiAs, signInPage } from "../fixtures/auth";
import { requirement } from "../integration/authz-helpers";

const shots = process.env.PW_OUTPUT_DIR ?? "test-results/review";

test("designer submits, reviewer compares and approves, designer sees it, owner reads the mail", async ({
  browser,
}) => {
  const tag = Date.now().toString(36);
  const designer = await apiAs("designer");
  const make = async (name: string, shuntOhms: string) => {
    const res = await designer.post("/api/designs", {
      data: { name, project: "Soil-moisture logger", requirement, choice: { shuntOhms, gain: 50 } },
    });
    expect(res.status(), await res.text()).toBe(201);
    return ((await res.json()) as { id: string }).id;
  };
  const a = await make(`Burst range A ${tag}`, "274 mohm");
  const b = await make(`Burst range B ${tag}`, "255 mohm");
  expect((await designer.post(`/api/designs/${a}/submit`, { data: {} })).status()).toBe(200);

  // The reviewer reaches the comparison from the design page's "Compare with…" picker.
  const reviewerCtx = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const page = await reviewerCtx.newPage();
  await signInPage(page, "reviewer");
  await page.goto(`/designs/${a}`);
  await expect(page.getByTestId("design-status").first()).toHaveText("in-review");
  await page.screenshot({ path: `${shots}/design-page-in-review.png`, fullPage: true });
  await page.getByText("Compare with…").click();
  await page.getByLabel(`Burst range B ${tag}`).check();
  await page.getByRole("link", { name: "Compare 2 designs" }).click();
  await expect(page).toHaveURL(new RegExp(`/compare\\?ids=${a},${b}`));
  await expect(page.getByTestId("compare-column")).toHaveCount(2);
  await expect(page.getByTestId("compare-error-chart").locator("path[stroke]")).not.toHaveCount(0);
  await expect(page.getByTestId("compare-burden-chart")).toBeVisible();
  // Lower burden is the smaller shunt's: B (255 mΩ) is marked best on that row.
  await expect(page.getByTestId("row-burdenV").locator("td").nth(1)).toHaveAttribute("data-best", "true");
  await page.screenshot({ path: `${shots}/compare.png`, fullPage: true });
  await page.getByRole("button", { name: `Approve Burst range A ${tag}` }).click();
  await expect(page.getByText(`Burst range A ${tag} approved.`)).toBeVisible();
  await expect(page.getByTestId("compare-column").first().getByTestId("design-status")).toHaveText("approved");
  await reviewerCtx.close();

  const designerCtx = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const dp = await designerCtx.newPage();
  await signInPage(dp, "designer");
  await dp.goto(`/designs/${a}`);
  await expect(dp.getByTestId("design-status").first()).toHaveText("approved");
  await expect(dp.getByText("Approved by Demo Reviewer").first()).toBeVisible();
  await dp.screenshot({ path: `${shots}/design-page-approved.png`, fullPage: true });
  await designerCtx.close();

  const ownerCtx = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const op = await ownerCtx.newPage();
  await signInPage(op, "owner");
  await op.goto("/team");
  await op.getByRole("link", { name: "outbox" }).click();
  await expect(op).toHaveURL(/\/outbox$/);
  await expect(op.getByText(`Review requested: Burst range A ${tag} (revision 1)`)).toBeVisible();
  await expect(op.getByText(`Burst range A ${tag} approved (revision 1)`)).toBeVisible();
  await op.screenshot({ path: `${shots}/outbox.png`, fullPage: true });
  await ownerCtx.close();
});

test("a stale edit on screen says someone else changed it and offers to reload", async ({ page }) => {
  const designer = await apiAs("designer");
  const res = await designer.post("/api/designs", {
    data: { name: `Stale on screen ${Date.now()}`, requirement, choice: { shuntOhms: 0.274, gain: 50 } },
  });
  const { id } = (await res.json()) as { id: string };
  await signInPage(page, "designer");
  await page.goto(`/designs/${id}`);
  // Meanwhile someone else saves revision 2.
  expect(
    (await designer.patch(`/api/designs/${id}`, { data: { revision: 1, name: "Changed elsewhere" } })).status(),
  ).toBe(200);
  await page.getByText("Rename or move to another project").click();
  await page.getByLabel("Design name").fill("My late rename");
  await page.getByRole("button", { name: "Save revision 2" }).click();
  await expect(page.getByText("Someone else changed this design.")).toBeVisible();
  await page.getByRole("button", { name: "Reload the design" }).click();
  await expect(page.getByTestId("design-name")).toHaveText("Changed elsewhere");
  await expect(page.getByTestId("design-revision")).toHaveText("revision 2");
});

test("an invitee joins through the link, and the owner sees it on the team page", async ({ browser }) => {
  const owner = await apiAs("owner");
  const email = `e2e-joiner-${Date.now().toString(36)}@invitee.example`;
  const res = await owner.post("/api/invitations", { data: { email, role: "maker" } });
  const { link } = (await res.json()) as { link: string };
  const ctx = await browser.newContext();
  const page = await ctx.newPage();
  await page.goto(new URL(link).pathname);
  await expect(page.getByRole("heading", { name: "Join Harbourline Labs" })).toBeVisible();
  await page.getByLabel("Your name").fill("Bench Joiner");
  await page.getByLabel("Choose a password").fill("bench-joiner-pw");
  await page.getByLabel("Password again").fill("bench-joiner-pw");
  await page.getByRole("button", { name: "Join the team" }).click();
  await expect(page.getByTestId("current-role")).toHaveText("maker");
  await page.goto(new URL(link).pathname);
  await expect(page.getByTestId("invitation-state")).toContainText("used already");
  await ctx.close();
});
