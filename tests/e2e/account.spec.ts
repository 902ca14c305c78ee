// The account page in a browser: create a token, see its secret once, use it, revoke it.
import { expect, request as playwrightRequest, test } from "@playwright/test";
import { baseURL } from "../../playwright.config";
import { signInPage } from "../fixtures/auth";

const shots = process.env.PW_OUTPUT_DIR ?? "test-results/playwright";

test("create a token on /account, see it once, revoke it", async ({ page }) => {
  await signInPage(page, "designer");
  await page.goto("/account");
  await expect(page.getByRole("heading", { name: "Account" })).toBeVisible();
  const name = `bench rig ${Date.now().toString(36)}`;
  await page.getByLabel("Token name").fill(name);
  await page.getByLabel("Access").selectOption("write");
  await page.getByRole("button", { name: "Create token" }).click();

  const secretBox = page.getByLabel("New token secret");
  await expect(secretBox).toBeVisible();
  const secret = await secretBox.inputValue();
  expect(secret).toMatch(/^swt_/);
  await expect(page.getByTestId(`token-${name}`)).toContainText("write");
  await page.screenshot({ path: `${shots}/account-1440.png`, fullPage: true });

  const script = await playwrightRequest.newContext({
    baseURL,
    extraHTTPHeaders: { authorization: `Bearer ${secret}` },
  });
  expect((await script.get("/api/designs")).status()).toBe(200);

  // Shown once: after leaving the page the secret is nowhere on it, only its first characters.
  await page.reload();
  await expect(page.getByLabel("New token secret")).toHaveCount(0);
  await expect(page.locator("body")).not.toContainText(secret);
  await expect(page.getByTestId(`token-${name}`)).toContainText(secret.slice(0, 8));
  await expect(page.getByTestId(`token-${name}`)).not.toContainText("not yet");

  await page.setViewportSize({ width: 390, height: 844 });
  await page.screenshot({ path: `${shots}/account-390.png`, fullPage: true });
  await page.setViewportSize({ width: 1440, height: 900 });

  page.once("dialog", (d) => void d.accept());
  await page.getByRole("button", { name: `Revoke ${name}` }).click();
  await expect(page.getByTestId(`token-${name}`)).toHaveCount(0);
  expect((await script.get("/api/designs")).status()).toBe(401);
  await script.dispose();
});

test("the name form saves, and a refused name is shown beside the field", async ({ page }) => {
  await signInPage(page, "reviewer");
  await page.goto("/account");
  const field = page.getByLabel("Display name");
  const before = await field.inputValue();
  await field.fill(" ");
  await page.getByRole("button", { name: "Save name and mail choices" }).click();
  await expect(page.locator("#account-name-error")).toContainText("Give your name");
  await field.fill(before);
  await page.getByLabel("A design is submitted for review").uncheck();
  await page.getByRole("button", { name: "Save name and mail choices" }).click();
  await expect(page.getByText("Saved.")).toBeVisible();
  await page.reload();
  await expect(page.getByLabel("A design is submitted for review")).not.toBeChecked();
  await page.getByLabel("A design is submitted for review").check();
  await page.getByRole("button", { name: "Save name and mail choices" }).click();
  await expect(page.getByText("Saved.")).toBeVisible();
});

test("a person in two teams switches team from the header", async ({ page }) => {
  const { apiAs } = await import("../fixtures/auth");
  const { makeTwoTeamMember } = await import("../integration/authz-helpers");
  const owner = await apiAs("owner");
  const two = await makeTwoTeamMember(owner);
  await two.ctx.dispose();
  await owner.dispose();

  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(two.email);
  await page.getByLabel("Password").fill(two.password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByTestId("current-role")).toHaveText("maker");
  const switcher = page.getByLabel("Team");
  await expect(switcher).toHaveValue(two.harbourlineId);
  await page.setViewportSize({ width: 390, height: 844 });
  await page.screenshot({ path: `${shots}/team-switcher-390.png` });
  await page.setViewportSize({ width: 1440, height: 900 });

  await switcher.selectOption(two.ownTeamId);
  await expect(page.getByTestId("current-role")).toHaveText("owner");
  await expect(page).toHaveURL(/\/designs$/);
  await expect(page.getByRole("link", { name: "New design" })).toBeVisible();
  await page.screenshot({ path: `${shots}/team-switcher-1440.png` });
  await page.getByLabel("Team").selectOption(two.harbourlineId);
  await expect(page.getByTestId("current-role")).toHaveText("maker");
  await expect(page.getByRole("link", { name: "New design" })).toHaveCount(0);
});
