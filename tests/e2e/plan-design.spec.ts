// The demo logger's range plan in the browser at desktop and phone width: the list marks it as a
// range plan; its page shows each range's figures, the switch points with their hysteresis, the
// protection in words, each range's bench rows and the cautions, as a person reads them (text
// after CSS), with no sideways scroll of the page; a revision's diff of a moved switch point reads in words.
import { expect, test, type Page } from "@playwright/test";
import { apiAs, signInPage } from "../fixtures/auth";

const shots = process.env.PW_OUTPUT_DIR ?? "test-results/plan-design";
const planName = "Logger, sleep to radio burst";

/** Nothing of the page's own content reaches past the window's right edge. */
async function noSidewaysScroll(page: Page) {
  const widest = () =>
    page.evaluate(() => {
      const main = document.querySelector("main");
      let widest = 0;
      for (const el of main ? Array.from(main.querySelectorAll("*")) : []) {
        // Tables scroll inside their own frame: what is clipped there does not widen the page.
        if (el.closest(".overflow-x-auto") && !el.classList.contains("overflow-x-auto")) continue;
        widest = Math.max(widest, el.getBoundingClientRect().right + window.scrollX);
      }
      return widest - window.innerWidth;
    });
  // Charts take their container's width once it is measured: wait for that, not for a fixed time.
  await expect.poll(widest).toBeLessThanOrEqual(1);
}

for (const viewport of [
  { width: 1280, height: 900 },
  { width: 390, height: 844 },
]) {
  test(`the logger's range plan reads as a person sees it at ${viewport.width} px`, async ({ page }) => {
    await page.setViewportSize(viewport);
    await signInPage(page, "reviewer");
    await page.goto(`/designs?q=${encodeURIComponent(planName)}`);
    const row = page.getByRole("row").filter({ hasText: planName });
    await expect(row.getByTestId("range-plan-badge")).toHaveText(/range plan · 3 ranges/);
    await row.getByRole("link", { name: planName }).click();
    await expect(page.getByTestId("design-name")).toHaveText(planName);
    await expect(page.getByTestId("design-headline")).toContainText("3 ranges");
    await expect(page.getByTestId("design-headline")).toContainText("3 µA to 180 mA");

    if (viewport.width >= 640) {
      const figures = page.getByTestId("plan-figures");
      await expect(figures.locator("thead th")).toHaveText(["Figure", "Range 1", "Range 2", "Range 3"]);
      const worst = figures.getByRole("row").filter({ hasText: "Worst drop, switch included" });
      // Each range's worst drop, in SI with its unit, within the allowed 60 mV.
      const drops = await worst.locator("td").allInnerTexts();
      expect(drops.slice(1).every((t) => /^\d+(\.\d+)? mV$/.test(t.trim()))).toBe(true);
      await expect(figures.getByRole("row").filter({ hasText: "Most current the shunt carries" })).toContainText(
        "the full current",
      );
    } else {
      // A phone: one block per range, none hidden past the edge.
      const stacked = page.getByTestId("plan-figures-stacked");
      await expect(stacked.locator("h3")).toHaveText([/^Range 1: 3 µA to /, /^Range 2: /, /^Range 3: .* to 180 mA$/]);
      const drops = await stacked.locator("div:has(> dt:text-is('Worst drop, switch included')) > dd").allInnerTexts();
      expect(drops).toHaveLength(3);
      expect(drops.every((t) => /^\d+(\.\d+)? mV$/.test(t.trim()))).toBe(true);
    }
    const switching = page.getByTestId("plan-switch-points");
    await expect(switching.getByRole("row")).toHaveCount(3); // header and two boundaries
    await expect(switching.getByRole("row").nth(1)).toContainText("Ranges 1 and 2");
    await expect(page.getByTestId("plan-switch-rule")).toContainText("hysteresis");
    await expect(page.getByTestId("plan-protection")).toContainText("comparator");
    await expect(page.getByTestId("plan-bench-1")).toContainText("Switch point 1, switching down");
    await expect(page.getByTestId("plan-bench-2")).toContainText("Switch point 2, switching up");
    await expect(page.getByTestId("caution-range-switch")).toContainText("make-before-break");
    await expect(page.getByTestId("caution-codes")).toBeVisible();
    await expect(page.getByTestId("build-sheet-panel")).toContainText("Range switch, range 1");
    // Rendered text, not the source: the panel titles as CSS shows them.
    const titles = await page.locator("section h2").allInnerTexts();
    expect(titles.join(" | ")).toMatch(/Range plan: 3 ranges, each on its own span/i);
    await noSidewaysScroll(page);
    await page.screenshot({ path: `${shots}/plan-design-${viewport.width}.png`, fullPage: true });
  });
}

test("a moved switch point shows in the revision diff in words", async ({ page }) => {
  const designer = await apiAs("designer");
  // A copy of the demo plan (its design file, imported), so the demo design itself stays approved.
  const list = (await (await designer.get(`/api/designs?q=${encodeURIComponent(planName)}`)).json()) as {
    designs: { id: string }[];
  };
  const file = (await (await designer.get(`/api/designs/${list.designs[0]!.id}/export`)).json()) as {
    plan: { ranges: { minA: number }[]; switchPoints: { upA: number; downA: number }[] };
  };
  const imported = await designer.post("/api/designs/import", {
    data: { ...file, name: `Plan diff ${Date.now().toString(36)}` },
  });
  expect(imported.status(), await imported.text()).toBe(201);
  const id = ((await imported.json()) as { id: string }).id;
  const plan = structuredClone(file.plan);
  plan.switchPoints[0]!.downA = (plan.ranges[1]!.minA + plan.switchPoints[0]!.upA) / 2;
  const res = await designer.patch(`/api/designs/${id}`, { data: { revision: 1, plan } });
  expect(res.status(), await res.text()).toBe(200);
  await designer.dispose();
  await page.setViewportSize({ width: 1280, height: 900 });
  await signInPage(page, "designer");
  await page.goto(`/designs/${id}`);
  const diff = page.getByTestId("revision-diff");
  await expect(diff).toContainText("Range plan");
  await expect(diff).toContainText("Switch point 1, switching down below");
  await diff.scrollIntoViewIfNeeded();
  await page.screenshot({ path: `${shots}/plan-design-diff.png`, fullPage: true });
});

test("a plan compares beside a single pair: per-range rows, and no 'best' on figures it does not share", async ({
  page,
}) => {
  const reviewer = await apiAs("reviewer");
  const find = async (q: string) =>
    ((await (await reviewer.get(`/api/designs?q=${encodeURIComponent(q)}`)).json()) as { designs: { id: string }[] })
      .designs[0]!.id;
  const planId = await find(planName);
  const pairId = await find("Logger radio-burst range");
  await reviewer.dispose();
  for (const viewport of [
    { width: 1280, height: 900 },
    { width: 390, height: 844 },
  ]) {
    await page.setViewportSize(viewport);
    if (viewport.width === 1280) await signInPage(page, "reviewer");
    await page.goto(`/compare?ids=${planId},${pairId}`);
    await expect(page.getByTestId("compare-column")).toHaveCount(2);
    await expect(page.getByTestId("row-plan.rangeCount").locator("td")).toHaveText(["3", "1"]);
    await expect(page.getByTestId("row-plan.ranges.0").locator("td").first()).toContainText("3 µA to");
    // Figures the plan does not take at the pair's points stay unranked ("—" for the plan).
    await expect(page.getByTestId("row-dissipationW").locator("td").first()).toHaveText("—");
    await expect(page.getByTestId("row-dissipationW").locator("[data-best]")).toHaveCount(0);
    // The two designs have different spans: the drop at the maximum current is read against each one's limit.
    await expect(page.getByTestId("compare-error-chart").locator("path[stroke]")).not.toHaveCount(0);
    await page.screenshot({ path: `${shots}/plan-compare-${viewport.width}.png`, fullPage: true });
  }
});
