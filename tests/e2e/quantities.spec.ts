// Every quantity reads as it should after CSS: a 274 mΩ shunt never shows as "274 MΩ", on any
// screen, at desktop and phone widths (innerText is what a person sees, case transforms applied).
import { expect, test } from "@playwright/test";
import { apiAs, signInPage } from "../fixtures/auth";
import { requirement } from "../integration/authz-helpers";
import { checkScreen, shownText, widths } from "./screen-check";

const shots = process.env.PW_OUTPUT_DIR ?? "test-results/quantities";

test("SI prefixes stay intact on every screen the designer sees", async ({ browser }) => {
  test.setTimeout(240_000);
  const designer = await apiAs("designer");
  const tag = Date.now().toString(36);
  const make = async (name: string, shuntOhms: string) => {
    const res = await designer.post("/api/designs", {
      data: { name, requirement, choice: { shuntOhms, gain: 50 } },
    });
    expect(res.status(), await res.text()).toBe(201);
    return ((await res.json()) as { id: string }).id;
  };
  const a = await make(`Milliohm check ${tag}`, "274 mohm");
  const b = await make(`Milliohm check B ${tag}`, "255 mohm");

  for (const [w, width] of Object.entries(widths)) {
    const ctx = await browser.newContext({ viewport: { width, height: 900 } });
    const page = await ctx.newPage();
    await signInPage(page, "designer");

    await page.goto(`/designs/${a}`);
    await expect(page.getByTestId("design-name")).toHaveText(`Milliohm check ${tag}`);
    await checkScreen(page, `${shots}/design-${w}.png`);
    const design = await shownText(page);
    expect(design).toContain("274 mΩ");
    expect(design).not.toMatch(/\d\s?MΩ/);
    // The study panel's title names the pair; before the fix CSS made it "CHOSEN PAIR: 274 MΩ × 50".
    expect(design).not.toMatch(/CHOSEN PAIR/);

    await page.goto(`/compare?ids=${a},${b}`);
    await expect(page.getByTestId("compare-column")).toHaveCount(2);
    await checkScreen(page, `${shots}/compare-${w}.png`);
    const compare = await shownText(page);
    expect(compare).toContain("274 mΩ");
    expect(compare).toContain("255 mΩ");
    expect(compare).not.toMatch(/\d\s?MΩ/);

    await page.goto("/designs/new");
    await expect(page.getByRole("heading", { name: "New design" })).toBeVisible();
    await checkScreen(page, `${shots}/new-${w}.png`);
    // The designs list at phone width belongs to the list's own rework (server paging, columns).
    for (const path of w === "phone" ? ["/library", "/meter", "/team"] : ["/designs", "/library", "/meter", "/team"]) {
      await page.goto(path);
      await checkScreen(page, `${shots}/screen${path.replace("/", "-")}-${w}.png`);
      expect(await shownText(page)).not.toMatch(/\d\s?MΩ/);
    }
    await ctx.close();
  }
});
