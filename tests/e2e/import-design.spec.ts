import { expect, test } from "@playwright/test";
import { apiAs, signInPage } from "../fixtures/auth";

test("a designer imports an exported design file from the designs list and lands on the copy", async ({ page }) => {
  const designer = await apiAs("designer");
  const list = (await (await designer.get("/api/designs")).json()) as { designs: { id: string; name: string }[] };
  const source = list.designs[0]!;
  const exported = await designer.get(`/api/designs/${source.id}/export`);
  expect(exported.status()).toBe(200);
  const file = await exported.body();

  await signInPage(page, "designer");
  await page.goto("/designs");
  await page
    .getByLabel("Import design")
    .setInputFiles({ name: "copy.json", mimeType: "application/json", buffer: file });
  // The name is already in the team: the page says so and offers a free one.
  await expect(page.getByTestId("import-error")).toContainText(`already has a design named “${source.name}”`);
  await expect(page.getByLabel("Import as")).toHaveValue(`${source.name} (2)`);
  await page.getByRole("button", { name: "Import under this name" }).click();
  await expect(page).toHaveURL(/\/designs\/[0-9a-f-]{36}$/);
  expect(page.url()).not.toContain(source.id);
  await expect(page.getByTestId("design-name")).toHaveText(`${source.name} (2)`);

  await page.goto("/designs");
  await page
    .getByLabel("Import design")
    .setInputFiles({ name: "bad.json", mimeType: "application/json", buffer: Buffer.from('{"format":"other"}') });
  await expect(page.getByTestId("import-error")).toContainText("format");
});
