// The design page's build-sheet panel in a browser: a maker sees an approved design's downloads,
// parts and bench check; a designer sees a draft marked as not for building.
import { expect, test } from "@playwright/test";
import { apiAs, signInPage } from "../fixtures/auth";
import { firstFeasible, loggerRequirement, parsed } from "../../lib/build-sheet/fixtures";
import { benchRows } from "../../lib/build-sheet/sheet-data";

test("a maker opens the approved demo design and finds the sheet, parts and bench check", async ({ page }) => {
  await signInPage(page, "maker");
  const maker = await apiAs("maker");
  const list = (await (await maker.get("/api/designs")).json()) as { designs: { id: string; status: string }[] };
  const approved = list.designs.find((d) => d.status === "approved")!;
  const design = (await (await maker.get(`/api/designs/${approved.id}`)).json()) as {
    requirement: never;
    choice: never;
  };
  await maker.dispose();
  await page.goto(`/designs/${approved.id}`);
  const panel = page.getByTestId("build-sheet-panel");
  await expect(panel).toBeVisible();
  await expect(panel.getByTestId("download-build-sheet")).toHaveAttribute(
    "href",
    `/api/designs/${approved.id}/build-sheet`,
  );
  await expect(panel.getByText("build from this sheet")).toBeVisible();
  await expect(panel.getByTestId("parts-table").getByRole("rowheader", { name: "R1" })).toBeVisible();
  const rows = benchRows(design.requirement, design.choice);
  for (const r of rows) await expect(panel.getByTestId("bench-table")).toContainText(r.expected);
  await expect(panel.getByTestId("build-cautions")).toContainText("Fuse the measured path");
  const download = page.waitForEvent("download");
  await panel.getByTestId("download-build-sheet").click();
  expect((await download).suggestedFilename()).toMatch(/-rev\d+\.pdf$/);
  await panel.scrollIntoViewIfNeeded();
  await page.screenshot({ path: "test-results/build-sheet/panel-maker.png", fullPage: true });
});

test("a designer's draft is marked not for building", async ({ page }) => {
  const designer = await apiAs("designer");
  const res = await designer.post("/api/designs", {
    data: {
      name: `Panel check ${Date.now().toString(36)}`,
      requirement: loggerRequirement,
      choice: firstFeasible(parsed(loggerRequirement)),
    },
  });
  const { id } = (await res.json()) as { id: string };
  await designer.dispose();
  await signInPage(page, "designer");
  await page.goto(`/designs/${id}`);
  const panel = page.getByTestId("build-sheet-panel");
  await expect(panel.getByText("Do not build from it")).toBeVisible();
  await panel.screenshot({ path: "test-results/build-sheet/panel-draft.png" });
});
