// A sweep near the engine's largest (2,000,000 pairs): the wizard shows its progress, the page keeps
// running while the worker sweeps, and a newer edit stops the stale sweep's worker and solves the
// edit on a fresh one instead of waiting for it (lib/wizard/use-solver.ts).
import { expect, test, type Worker } from "@playwright/test";
import { demoLoggerReadout } from "@/lib/design/demo-converters";
import { signInPage } from "../fixtures/auth";

/** The seconds the progress line says the sweep has taken so far. */
const secondsSoFar = (text: string) => {
  const m = /([\d.]+)\s*(m?)s so far/.exec(text);
  return m ? Number(m[1]) / (m[2] ? 1000 : 1) : NaN;
};

test("a near-largest sweep shows progress, the page keeps running, and a newer edit replaces it", async ({ page }) => {
  test.setTimeout(120_000);
  const live = new Set<Worker>();
  // The page runs three workers (solver, checker, plan check); the solver names itself.
  const solverWorkers = async () => {
    const out: Worker[] = [];
    for (const w of live) if ((await w.evaluate(() => self.name).catch(() => "")) === "sensewright-solver") out.push(w);
    return out;
  };
  page.on("worker", (w) => {
    live.add(w);
    w.once("close", () => live.delete(w));
  });
  await signInPage(page, "designer");
  await page.goto("/designs/new");
  await page.evaluate(() => window.localStorage.clear());
  await page.reload();
  const f = (label: string) => page.getByLabel(label, { exact: true });
  await f("Minimum current").fill("2 mA");
  await f("Maximum current").fill("180 mA");
  await page.getByRole("button", { name: /^Next: / }).click();
  await f("Supply voltage").fill("3 V");
  await page.getByRole("button", { name: /^Next: Readout/ }).click();
  const own = page.getByTestId("readout-error");
  await own.getByLabel("Reference tolerance", { exact: true }).fill(demoLoggerReadout.readout.reference.tolerance);
  await own.getByLabel("Calibration before use", { exact: true }).selectOption(demoLoggerReadout.calibration);
  await page.getByRole("button", { name: /^Next: Shunt/ }).click();
  await f("E-series (IEC 60063)").selectOption("E192");
  await f("Largest shunt").fill("10 kohm");
  await page.getByRole("button", { name: /^Next: Amplifier/ }).click();
  await page.getByText("1 + Rf/Rg from a resistor series", { exact: true }).click();
  await f("Resistor series for Rf and Rg").selectOption("E24");
  const lowest = page.locator('[name="amplifier.gainSet.min"]');
  const highest = page.locator('[name="amplifier.gainSet.max"]');
  await lowest.fill("2");
  await highest.fill("20");
  const status = page.getByTestId("solve-status");
  await expect(status).toContainText("pairs swept", { timeout: 30_000 });
  const small = Number(/([\d,]+) pairs swept/.exec(await status.innerText())![1]!.replace(/,/g, ""));

  // Gains 2 to 1000 from E24 pairs against every E192 shunt up to 10 kΩ: 1.77 million pairs. This
  // machine sweeps them in 0.1–0.2 s, under the progress line's threshold, so the solver worker is
  // made a slower computer: it holds back the answer to any sweep of over a million pairs for 3 s
  // (its own thread busy, as a long sweep keeps it). A fresh worker is not slowed.
  const solvers = await solverWorkers();
  expect(solvers.length, "one solver worker on the page").toBe(1);
  const stale = solvers[0]!;
  await stale.evaluate(() => {
    const post = self.postMessage.bind(self) as (m: unknown) => void;
    (self as unknown as { postMessage: (m: unknown) => void }).postMessage = (m) => {
      const evaluated = (m as { result?: { evaluated?: number } })?.result?.evaluated ?? 0;
      if (evaluated > 1e6) for (const until = performance.now() + 3000; performance.now() < until;);
      post(m);
    };
  });
  await highest.fill("1000");
  const progress = page.getByTestId("sweep-progress");
  await expect(progress).toBeVisible({ timeout: 10_000 });
  await expect(progress).toContainText("a new edit replaces it");
  // The line ticks: the page's own thread runs while the worker sweeps. Past the point where a
  // stale sweep is stopped rather than awaited (0.6 s).
  await expect.poll(async () => secondsSoFar(await progress.innerText()), { timeout: 30_000 }).toBeGreaterThan(0.8);
  const stopped = new Promise<void>((resolve) => stale.once("close", () => resolve()));

  // The newer edit: the old worker is stopped, a fresh one solves the small sweep.
  await highest.fill("20");
  await stopped;
  await expect
    .poll(async () => (await solverWorkers()).filter((w) => w !== stale).length, {
      message: "a fresh solver worker for the newer edit",
    })
    .toBe(1);
  await expect(progress).toBeHidden();
  await expect(status).toContainText(`${small.toLocaleString("en")} pairs swept`, { timeout: 30_000 });
  await expect(highest).toHaveValue("20");
});
