// The rest of the designer's loop, as a person sees it: messages in words, the trade-off chart
// under the pointer, compare across different requirements, the header on a phone, a role change,
// the library import's bad rows, the icon set, and library parts named on the design page.
import { expect, test } from "@playwright/test";
import { apiAs, signInPage } from "../fixtures/auth";
import { requirement } from "../integration/authz-helpers";
import { demoLoggerReadout } from "../../lib/design/test-helpers";
import { checkScreen, widths } from "./screen-check";

const shots = process.env.PW_OUTPUT_DIR ?? "test-results/loop-extras";

test("gains typed as text get a message in words; the chart survives the pointer", async ({ page }) => {
  test.setTimeout(120_000);
  const errors: string[] = [];
  page.on("pageerror", (e) => errors.push(e.message));
  await page.setViewportSize({ width: widths.desktop, height: 1000 });
  await signInPage(page, "designer");
  await page.goto("/designs/new");
  await page.evaluate(() => window.localStorage.clear());
  await page.reload();
  await page.getByText("Start from an example").click();
  await page.getByRole("button", { name: "Soil-moisture logger, 24-bit converter" }).click();
  await expect(page.getByTestId("solve-status")).toContainText("feasible", { timeout: 45_000 });

  // Pointer over the trade-off chart: a tooltip with a background, gone when the pointer leaves.
  const chart = page.getByTestId("trade-off-chart");
  const box = (await chart.boundingBox())!;
  for (let k = 1; k < 12; k++) await page.mouse.move(box.x + (box.width * k) / 12, box.y + box.height / 2);
  const tip = page.locator(".visx-tooltip").last();
  await expect(tip).toBeVisible();
  expect(await tip.evaluate((el) => getComputedStyle(el).backgroundColor)).not.toBe("rgba(0, 0, 0, 0)");
  await chart.screenshot({ path: `${shots}/trade-off-tooltip.png` });
  await page.mouse.move(box.x + box.width / 2, box.y + box.height + 200);
  await expect(page.locator(".visx-tooltip")).toHaveCount(0, { timeout: 3000 });
  expect(errors, "no errors thrown on pointer moves").toEqual([]);

  await page
    .getByRole("list", { name: "Steps" })
    .getByRole("button", { name: /Amplifier/ })
    .click();
  await page.getByLabel("Gains", { exact: true }).fill("10, abc");
  await page.getByLabel("Gains", { exact: true }).blur();
  await expect(page.locator("#f-amplifier-gains-error")).toContainText("“abc” is not a number");
  await expect(page.locator("body")).not.toContainText("Invalid input");
  await checkScreen(page, `${shots}/gains-in-words-desktop.png`);
});

test("compare marks best only where the figures mean the same; phone header folds", async ({ browser }) => {
  test.setTimeout(120_000);
  const designer = await apiAs("designer");
  const make = async (name: string, voltage: string) => {
    const res = await designer.post("/api/designs", {
      data: {
        name,
        requirement: { ...requirement, supply: { voltage, side: "low" } },
        choice: { shuntOhms: "274 mohm", gain: 50 },
      },
    });
    expect(res.status(), await res.text()).toBe(201);
    return ((await res.json()) as { id: string }).id;
  };
  const tag = Date.now().toString(36);
  const a = await make(`Three volt ${tag}`, "3 V");
  const b = await make(`Five volt ${tag}`, "5 V");
  for (const [w, width] of Object.entries(widths)) {
    const ctx = await browser.newContext({ viewport: { width, height: 900 } });
    const page = await ctx.newPage();
    await signInPage(page, "reviewer");
    await page.goto(`/compare?ids=${a},${b}`);
    const load = page.getByTestId("row-loadVoltageV");
    await expect(load.locator("[data-best]")).toHaveCount(0);
    await expect(load).toContainText("not ranked: taken at a different supply voltage");
    // Burden rests on the supply too (a resistive load's current depends on it): each against its own limit.
    await expect(page.getByTestId("row-burdenV").getByTestId("own-limit")).toHaveCount(2);
    await expect(page.getByTestId("row-burdenV")).toContainText("of 60 mV allowed");
    await checkScreen(page, `${shots}/compare-different-supplies-${w}.png`);
    if (w === "phone") {
      const menu = page.getByRole("button", { name: "Menu" });
      await expect(menu).toBeVisible();
      await expect(page.getByRole("navigation", { name: "Main" })).toBeHidden();
      await menu.click();
      await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Library" }).click();
      await expect(page).toHaveURL(/\/library$/);
      await checkScreen(page, `${shots}/library-${w}.png`);
    }
    await ctx.close();
  }
});

test("a role change asks first and says what it means; the timeline and log speak words", async ({ page }) => {
  await page.setViewportSize({ width: widths.phone, height: 844 });
  await signInPage(page, "owner");
  await page.goto("/team");
  const select = page.getByLabel("Role of Demo Maker");
  await select.selectOption("reviewer");
  await expect(page.getByTestId("role-confirm")).toContainText("Make Demo Maker a reviewer instead of a maker?");
  await checkScreen(page, `${shots}/role-confirm-phone.png`);
  await page.getByRole("button", { name: "Keep maker" }).click();
  await expect(select).toHaveValue("maker");
  await select.selectOption("reviewer");
  await page.getByRole("button", { name: "Change the role" }).click();
  await expect(page.getByTestId("role-notice")).toContainText("Demo Maker is now a reviewer");
  await expect(page.getByTestId("role-notice")).toContainText("they get an e-mail saying so");
  // The mail went out after the answer: the owner reads it in the built-in outbox.
  const roleMail = async () => {
    const box = (await (await page.request.get("/api/outbox")).json()) as {
      messages: { to: string; subject: string }[];
    };
    return box.messages.filter((m) => m.to === "maker@harbourline.example" && / is now reviewer$/.test(m.subject));
  };
  await expect.poll(async () => (await roleMail()).length, { timeout: 10_000 }).toBeGreaterThanOrEqual(1);
  // The page refreshes into the new role before the next change.
  await expect(select).toHaveValue("reviewer");
  await select.selectOption("maker");
  await page.getByRole("button", { name: "Change the role" }).click();
  await expect(page.getByTestId("role-notice")).toContainText("Demo Maker is now a maker");
  await expect(select).toHaveValue("maker");

  // A library import with many bad rows names each of them; the team log says it in words.
  await page.goto("/library");
  const head = "Name,Series,Min [mohm],Max (mohm),Tolerance,Tempco,Ratings,4-terminal";
  const bad = Array.from({ length: 60 }, (_, i) => `Bad ${i},E7,1,100,1 %,50 ppm/K,1 W,yes`);
  await page.getByLabel("The file holds").selectOption("shunts");
  await page.getByLabel("CSV file").setInputFiles({
    name: "bad.csv",
    mimeType: "text/csv",
    buffer: Buffer.from([head, ...bad].join("\n")),
  });
  await page.getByRole("button", { name: "Import" }).click();
  await expect(page.getByTestId("import-error")).toContainText("50 or more rows have problems");
  await expect(page.getByTestId("import-problems").locator("li")).toHaveCount(50);
  await page.getByLabel("CSV file").setInputFiles({
    name: "good.csv",
    mimeType: "text/csv",
    buffer: Buffer.from(`${head}\nImported strip ${Date.now().toString(36)},E24,1,100,1 %,50 ppm/K,0.5 W; 1 W,yes\n`),
  });
  await page.getByRole("button", { name: "Import" }).click();
  await page.goto("/team");
  await expect(page.locator("body")).toContainText("imported shunt families into the library");
  await expect(page.locator("body")).not.toContainText("library.import");
});

test("the app's icon set and manifest are served", async ({ request }) => {
  for (const path of ["/favicon.ico", "/icon.svg", "/icon-192.png", "/manifest.webmanifest"]) {
    const res = await request.get(path);
    expect(res.status(), path).toBe(200);
  }
  const manifest = (await (await request.get("/manifest.webmanifest")).json()) as { name: string };
  expect(manifest.name).toBe("Sensewright");
});

test("a design made from library parts names them on its page", async ({ page }) => {
  const designer = await apiAs("designer");
  const lib = (await (await designer.get("/api/library")).json()) as {
    amplifiers: { name: string; gainMode: string; gains: number[]; [k: string]: unknown }[];
  };
  const amp = lib.amplifiers.find((a) => a.gainMode === "fixed")!;
  const req = {
    current: { min: "10 mA", max: "1 A" },
    supply: { voltage: "5 V", side: "low" },
    drop: { max: "100 mV" },
    // The demo logger's converter, its own error stated and zeroed once (db/seed/designs.ts).
    ...demoLoggerReadout,
    amplifier: {
      gains: amp.gains,
      offset: amp.offsetV,
      offsetDrift: amp.offsetDriftVPerK,
      gainError: amp.gainErrorFraction,
      gainDrift: amp.gainDriftPerK,
      biasCurrent: amp.biasCurrentA,
      noiseDensity: amp.noiseDensityVPerRtHz,
      gbw: amp.gbwHz,
      supply: amp.supplyMaxV,
      swingLow: amp.swingLowV,
      swingHigh: amp.swingHighV,
      cmrrDb: amp.cmrrDb,
    },
  };
  // The best pair the solver finds with this part, saved as a designer would.
  const solved = (await (await designer.post("/api/solve", { data: req })).json()) as {
    candidates: { shuntOhms: number; gain: number; feasible: boolean }[];
  };
  const pick = solved.candidates.find((c) => c.feasible)!;
  const res = await designer.post("/api/designs", {
    data: {
      name: `Library pair ${Date.now().toString(36)}`,
      requirement: req,
      choice: { shuntOhms: pick.shuntOhms, gain: pick.gain },
    },
  });
  expect(res.status(), await res.text()).toBe(201);
  const { id } = (await res.json()) as { id: string };
  await page.setViewportSize({ width: widths.desktop, height: 1000 });
  await signInPage(page, "designer");
  await page.goto(`/designs/${id}`);
  await expect(page.getByTestId("build-sheet-panel")).toContainText(`${amp.name} (team library)`);
  await checkScreen(page, `${shots}/library-parts-design-desktop.png`);
});
