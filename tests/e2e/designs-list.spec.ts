// The designs list in the browser at desktop and phone width: paging through the server (the URL
// follows), search and status filter, the import button kept, priority columns on a phone, a long
// unbroken name that never pushes the status and date out, and no sideways scroll of the page.
import { expect, test, type Page } from "@playwright/test";
import { apiAs, signInPage } from "../fixtures/auth";
import { choice, requirement, unique } from "../integration/authz-helpers";

const shots = process.env.PW_OUTPUT_DIR ?? "test-results/designs-list";
const tag = `List ${unique()}`;
const longName = `Bus${"monitor".repeat(12)}`;

test.describe.configure({ mode: "serial" });

test.beforeAll(async () => {
  test.setTimeout(180_000);
  const designer = await apiAs("designer");
  // 51 designs in one project: one more than a page. The long-named one is saved last, so it leads.
  for (let k = 0; k < 51; k++) {
    const name = k === 50 ? longName : `Paged list ${String(k).padStart(2, "0")}`;
    const res = await designer.post("/api/designs", { data: { name, project: tag, requirement, choice } });
    expect(res.status(), await res.text()).toBe(201);
  }
});

/**
 * Nothing of the page's own content reaches past the window's right edge, and the list does not
 * scroll sideways inside its frame either. (The site header is the layout's, checked with it.)
 */
async function noSidewaysScroll(page: Page) {
  const { widest, width, frame } = await page.evaluate(() => {
    const main = document.querySelector("main");
    const list = document.querySelector<HTMLElement>("[data-testid=designs-list]");
    let widest = 0;
    for (const el of main ? Array.from(main.querySelectorAll("*")) : [])
      widest = Math.max(widest, el.getBoundingClientRect().right + window.scrollX);
    return {
      widest,
      width: window.innerWidth,
      frame: list ? list.scrollWidth - list.clientWidth : 0,
    };
  });
  expect(widest, "the list page reaches past the window's edge").toBeLessThanOrEqual(width);
  expect(frame, "the list scrolls sideways inside its frame").toBeLessThanOrEqual(0);
}

for (const viewport of [
  { width: 1440, height: 1000 },
  { width: 390, height: 844 },
]) {
  test(`pages, searches and filters at ${viewport.width} px`, async ({ page }) => {
    await page.setViewportSize(viewport);
    await signInPage(page, "designer");
    await page.goto("/designs");
    await expect(page.getByTestId("import-design")).toContainText("Import design");
    const table = page.getByRole("table", { name: "Designs" });
    await expect(table.getByRole("row")).toHaveCount(51); // the header and a page of 50
    await noSidewaysScroll(page);

    // Search: the URL follows, and the first page of matches is 50 of the 51.
    await page.getByLabel("Search designs", { exact: true }).fill(tag);
    await expect(page).toHaveURL(new RegExp(`[?&]q=${encodeURIComponent(tag).replace(/%20/g, "(\\+|%20)")}`));
    await expect(table.getByRole("row")).toHaveCount(51);
    const firstRow = table.getByRole("row").nth(1);
    await expect(firstRow.getByRole("link")).toHaveText(longName);

    // The long name wraps inside its cell: its status and date stay on screen.
    for (const cell of [firstRow.getByTestId("design-status"), firstRow.getByRole("cell").last()]) {
      const box = await cell.boundingBox();
      expect(box, "cell rendered").not.toBeNull();
      expect(box!.x + box!.width).toBeLessThanOrEqual(viewport.width);
    }
    const columns = await table
      .locator("thead th")
      .evaluateAll((ths) =>
        ths.filter((th) => getComputedStyle(th).display !== "none").map((th) => th.textContent?.trim() ?? ""),
      );
    if (viewport.width < 768) expect(columns).toEqual(["Pick to compare", "Name", "Status", "Updated (UTC)"]);
    else expect(columns).toContain("Choice");
    await noSidewaysScroll(page);
    await page.screenshot({ path: `${shots}/designs-list-${viewport.width}-search.png`, fullPage: true });

    // Next page: the one left, and the URL carries the cursor; reload keeps the page.
    await page.getByRole("button", { name: "Next page" }).click();
    await expect(page).toHaveURL(/[?&]cursor=/);
    await expect(table.getByRole("row")).toHaveCount(2);
    await expect(table.getByRole("row").nth(1).getByRole("link")).toHaveText("Paged list 00");
    await expect(page.getByTestId("designs-page")).toContainText("Page 2");
    await expect(page.getByRole("button", { name: "Next page" })).toBeDisabled();
    await noSidewaysScroll(page);
    await page.screenshot({ path: `${shots}/designs-list-${viewport.width}-page2.png`, fullPage: true });
    await page.reload();
    await expect(table.getByRole("row")).toHaveCount(2);
    await page.getByRole("button", { name: "First page" }).click();
    await expect(table.getByRole("row")).toHaveCount(51);
    await expect(page).not.toHaveURL(/cursor=/);

    // The status filter goes through the API too: none of these is approved.
    await page.getByLabel("Status", { exact: true }).selectOption("approved");
    await expect(page).toHaveURL(/[?&]status=approved/);
    await expect(table).toContainText("No design matches the search and filter.");
    await noSidewaysScroll(page);
  });
}

test("picks made on one page stay picked on the next and open the comparison", async ({ page }) => {
  await page.setViewportSize({ width: 1440, height: 1000 });
  await signInPage(page, "designer");
  await page.goto(`/designs?q=${encodeURIComponent(tag)}`);
  await page.getByRole("checkbox", { name: `Pick ${longName} to compare` }).check();
  await page.getByRole("button", { name: "Next page" }).click();
  await page.getByRole("checkbox", { name: "Pick Paged list 00 to compare" }).check();
  await expect(page.getByText("2 picked")).toBeVisible();
  await page.getByRole("button", { name: "Compare" }).click();
  await expect(page).toHaveURL(/\/compare\?ids=[0-9a-f-]{36},[0-9a-f-]{36}$/);
});
