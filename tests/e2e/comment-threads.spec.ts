// A design with a long review history opens its comments on the latest threads: the five newest
// revisions with comments (the current one always among them), and a button for the earlier ones.
import { expect, test } from "@playwright/test";
import { apiAs, signInPage } from "../fixtures/auth";
import { choice, requirement, unique } from "../integration/authz-helpers";

test("comments on the five latest revisions show; earlier threads open on request", async ({ page }) => {
  test.setTimeout(120_000);
  const designer = await apiAs("designer");
  const created = await designer.post("/api/designs", {
    data: { name: `Long history ${unique()}`, requirement, choice },
  });
  expect(created.status(), await created.text()).toBe(201);
  const { id } = (await created.json()) as { id: string };
  // Seven revisions, a comment on each.
  for (let rev = 1; rev <= 7; rev++) {
    if (rev > 1) {
      const saved = await designer.patch(`/api/designs/${id}`, {
        data: { revision: rev - 1, name: `Long history, take ${rev}` },
      });
      expect(saved.status(), await saved.text()).toBe(200);
    }
    const c = await designer.post(`/api/designs/${id}/reviews`, {
      data: { verdict: "comment", body: `Checked the drop on take ${rev}.`, revision: rev },
    });
    expect(c.status(), await c.text()).toBe(201);
  }

  await signInPage(page, "designer");
  await page.goto(`/designs/${id}`);
  const threads = page.getByRole("region", { name: /^Comments on revision \d+$/ });
  await expect(threads).toHaveCount(5);
  await expect(threads.first()).toHaveAccessibleName("Comments on revision 7");
  await expect(page.getByText("Checked the drop on take 3.")).toBeVisible();
  await expect(page.getByText("Checked the drop on take 2.")).toHaveCount(0);
  await page.getByRole("button", { name: "Show comments on 2 earlier revisions" }).click();
  await expect(threads).toHaveCount(7);
  await expect(page.getByText("Checked the drop on take 1.")).toBeVisible();
  await page.getByRole("button", { name: "Show the 5 latest threads only" }).click();
  await expect(threads).toHaveCount(5);
});
