// What a person sees on a screen: no sideways scroll of the page, and no quantity whose case the
// CSS changes (an upper-cased "mΩ" reads as "MΩ", a thousand million times larger).
import { expect, type Page } from "@playwright/test";

export const widths = { desktop: 1440, phone: 390 } as const;
export type WidthName = keyof typeof widths;

/** Elements whose own text holds a number followed by a unit, and whose case CSS transforms. */
export async function transformedQuantities(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    // A digit or a unit sign in text whose case is changed is enough to fail.
    const quantity = /\d|Ω|µ|°/;
    const out: string[] = [];
    for (const el of Array.from(document.body.querySelectorAll("*"))) {
      const own = Array.from(el.childNodes)
        .filter((n) => n.nodeType === Node.TEXT_NODE)
        .map((n) => n.textContent ?? "")
        .join("");
      // Text inherits the transform, so check each element that holds text itself.
      if (!quantity.test(own)) continue;
      const s = getComputedStyle(el);
      if (s.textTransform !== "none" || (s.fontVariantCaps && s.fontVariantCaps !== "normal")) {
        out.push(`${el.tagName.toLowerCase()}: "${own.trim().slice(0, 60)}" (${s.textTransform})`);
      }
    }
    return out;
  });
}

/** Fails on a page wider than the window; then checks quantities and takes the screenshot. */
export async function checkScreen(page: Page, file: string) {
  await page.waitForLoadState("networkidle").catch(() => undefined);
  const { scrollWidth, clientWidth } = await page.evaluate(() => ({
    scrollWidth: document.documentElement.scrollWidth,
    clientWidth: document.documentElement.clientWidth,
  }));
  await page.screenshot({ path: file, fullPage: true });
  expect(
    scrollWidth,
    `${file}: the page scrolls sideways (${scrollWidth} px in a ${clientWidth} px window)`,
  ).toBeLessThanOrEqual(clientWidth);
  expect(await transformedQuantities(page), `${file}: quantities whose case CSS changes`).toEqual([]);
}

/** The page's rendered text (after CSS), for prefix checks. */
export const shownText = (page: Page) => page.evaluate(() => document.body.innerText);
