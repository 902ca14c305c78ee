import { expect, test } from "@playwright/test";
import { apiAs, demoEmail, signInPage, type DemoRole } from "../fixtures/auth";

const roles: DemoRole[] = ["owner", "designer", "reviewer", "maker"];

for (const role of roles) {
  test(`the demo ${role} signs in and sees their role`, async ({ page }) => {
    await signInPage(page, role);
    await expect(page).toHaveURL(/\/designs$/);
    await expect(page.getByRole("navigation", { name: "Main" })).toBeVisible();
  });
}

test("a wrong password gets a clear message and no session", async ({ page }) => {
  await page.goto("/sign-in");
  await expect(page.getByRole("heading", { name: "Demo team: Harbourline Labs" })).toBeVisible();
  await page.getByLabel("E-mail").fill(demoEmail("designer"));
  await page.getByLabel("Password").fill("not-the-password");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByTestId("sign-in-error")).toHaveText("That e-mail and password do not match an account.");
  const session = await page.request.get("/api/auth/session");
  expect(await session.json()).toEqual({});
  await page.goto("/designs");
  await expect(page).toHaveURL(/\/sign-in/);
});

test("repeated wrong passwords are rate-limited with a clear message", async ({ page }) => {
  const email = "nobody-here@harbourline.example";
  await page.goto("/sign-in");
  for (let i = 0; i < 5; i++) {
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password").fill(`wrong-${i}`);
    await page.getByRole("button", { name: "Sign in" }).click();
    await expect(page.getByTestId("sign-in-error")).toContainText("do not match");
  }
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByTestId("sign-in-error")).toContainText("Too many failed sign-ins");
});

test("signing out ends the session", async ({ page }) => {
  await signInPage(page, "reviewer");
  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page).toHaveURL(/\/sign-in/);
  expect(await (await page.request.get("/api/auth/session")).json()).toEqual({});
});

test("the owner changes a role on the team page; a maker is refused by the server", async ({ page }) => {
  const maker = await apiAs("maker");
  const team = (await (await maker.get("/api/team")).json()) as {
    members: { userId: string; email: string; role: string }[];
  };
  const reviewer = team.members.find((m) => m.email === demoEmail("reviewer"))!;
  const refused = await maker.patch(`/api/team/members/${reviewer.userId}`, { data: { role: "owner" } });
  expect(refused.status()).toBe(403);
  expect((await refused.json()).message).toContain("Only owners");

  await signInPage(page, "owner");
  await page.goto("/team");
  const select = page.getByLabel("Role of Demo Reviewer");
  // A role change asks first, then says what the new role means.
  await select.selectOption("designer");
  await page.getByRole("button", { name: "Change the role" }).click();
  await expect(page.getByText("Demo Reviewer is now a designer:")).toBeVisible();
  await expect(select).toHaveValue("designer");
  await select.selectOption("reviewer");
  await page.getByRole("button", { name: "Change the role" }).click();
  await expect(page.getByText("Demo Reviewer is now a reviewer:")).toBeVisible();

  await page.goto("/team");
  const after = (await (await maker.get("/api/team")).json()) as typeof team;
  expect(after.members.find((m) => m.email === demoEmail("reviewer"))?.role).toBe("reviewer");
});

test("the maker sees the team read-only", async ({ page }) => {
  await signInPage(page, "maker");
  await page.goto("/team");
  await expect(page.getByText("Only owners change roles.")).toBeVisible();
  await expect(page.getByRole("combobox")).toHaveCount(0);
});
