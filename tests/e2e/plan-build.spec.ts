// A range plan on its design page, as a person sees it: the build panel with the plan's downloads
// and parts, and a recording uploaded through the form, its summary with the switching figures and
// the chart marking each stretch with its range (colour, pattern and label). Desktop and phone.
import { expect, test, type Page } from "@playwright/test";
import { apiAs, signInPage } from "../fixtures/auth";
import { checkScreen, shownText, widths } from "./screen-check";
import { demoLoggerReadout } from "../../lib/design/test-helpers";

const shots = process.env.SHOTS_DIR ?? "test-results/screens";

const requirement = {
  current: { min: "3 uA", max: "180 mA" },
  supply: { voltage: "3.0 V", side: "low" },
  drop: { max: "60 mV" },
  ...demoLoggerReadout, // its converter's own error stated and zeroed once (db/seed/designs.ts)
  resolution: { countsAtMin: 10 },
};

/** Asleep at 5 µA, a wake-up at 2 mA, a radio burst at 150 mA, asleep again: 1 ms samples. */
function burstCsv(): string {
  const lines = ["Time (ms),Current [uA]"];
  for (let k = 0; k < 3000; k++) {
    const uA = k >= 1000 && k < 1400 ? 2000 : k >= 1400 && k < 1600 ? 150_000 : 5 + Math.sin(k / 20);
    lines.push(`${k},${uA.toFixed(3)}`);
  }
  return `${lines.join("\n")}\n`;
}

async function settled(page: Page) {
  await page.evaluate(async () => {
    await document.fonts.ready;
    await new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(resolve)));
  });
}

test("a designer uploads a recording to a plan design and reads the ranges on the chart", async ({ page }) => {
  const api = await apiAs("designer");
  const solved = (await (await api.post("/api/solve", { data: requirement })).json()) as {
    rangePlan: { ranges: { minA: number; maxA: number; shuntOhms: number; gain: number }[]; switchPoints: unknown[] };
  };
  const created = await api.post("/api/designs", {
    data: {
      name: `Logger plan page ${Date.now()}`,
      requirement,
      plan: {
        ranges: solved.rangePlan.ranges.map(({ minA, maxA, shuntOhms, gain }) => ({ minA, maxA, shuntOhms, gain })),
        switchPoints: solved.rangePlan.switchPoints,
      },
    },
  });
  expect(created.status()).toBe(201);
  const { id } = (await created.json()) as { id: string };
  await api.dispose();

  await signInPage(page, "designer");
  await page.setViewportSize({ width: widths.desktop, height: 1000 });
  await page.goto(`/designs/${id}`);
  const panel = page.getByTestId("build-sheet-panel");
  await expect(panel).toBeVisible();
  await expect(panel.getByTestId("download-build-sheet")).toHaveAttribute("href", `/api/designs/${id}/build-sheet`);
  await expect(panel.getByTestId("download-netlist-range-3")).toBeVisible();
  await expect(panel.getByTestId("parts-table")).toContainText("Range switch, range 1");

  await page
    .getByLabel("Current recording (CSV)")
    .setInputFiles({ name: "wake-and-send.csv", mimeType: "text/csv", buffer: Buffer.from(burstCsv()) });
  await expect(page.getByText("Stored wake-and-send.csv: 3,000 samples.")).toBeVisible();
  const planSummary = page.getByTestId("plan-profile-summary");
  await expect(planSummary).toBeVisible();
  // Hand count: 5 µA → 2 mA (range 2) → 150 mA (range 3) → 5 µA (range 1): three switches.
  await expect(planSummary).toContainText("Range switches3");
  await expect(planSummary).toContainText("Time on range 3");
  const bands = page.getByTestId("range-bands");
  await expect(bands).toBeVisible();
  await expect(bands.locator("text")).toContainText(["R1", "R2", "R3"]);
  for (const k of [1, 2, 3]) await expect(page.getByTestId(`range-key-${k}`)).toBeVisible();
  const text = await shownText(page);
  expect(text).toMatch(/R1: read on range 1 \(3 µA to 117 µA, 41\.2 Ω\)/);
  await settled(page);
  await checkScreen(page, `${shots}/plan-design-desktop.png`);

  await page.setViewportSize({ width: widths.phone, height: 900 });
  await page.reload();
  await expect(page.getByTestId("plan-profile-summary")).toBeVisible();
  await expect(page.getByTestId("range-bands")).toBeVisible();
  await settled(page);
  await checkScreen(page, `${shots}/plan-design-phone.png`);
});
