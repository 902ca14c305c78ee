// Compare with bidirectional designs (issue 14), at 1280 px and 390 px: the negative end's drop,
// heat and output have their own rows, the better drop is marked between two designs for the same
// signed span, and the dead zone is not ranked between a one-way and a signed design (it means
// "reads zero below" for one, "sign uncertain within" for the other). Screenshots to PW_OUTPUT_DIR.
import { expect, test } from "@playwright/test";
import { formatSI, parseRequirement, solve, type RequirementInput } from "@/lib/design";
import { apiAs, signInPage } from "../fixtures/auth";
import { checkScreen } from "./screen-check";

const shots = process.env.PW_OUTPUT_DIR ?? "test-results/compare-signed";

// Invented pack monitors: 30 A of discharge, 10 A of charge, low side, a 1.8 V zero level.
const pack: RequirementInput = {
  current: { min: "-30 A", max: "10 A" },
  supply: { voltage: "24 V", side: "low" },
  drop: { max: "60 mV" },
  readout: { kind: "adc", bits: 14, fullScale: "2.5 V" },
  accuracy: { percent: 8, bandMin: "3 A" },
  amplifier: { gains: [20, 50, 100], reference: { voltage: "1.8 V" } },
};
const oneWay: RequirementInput = { ...pack, current: { min: "3 A", max: "10 A" }, amplifier: { gains: [50] } };

/** Feasible pairs the engine finds for a requirement (the API saves only a pair that meets it). */
function feasible(input: RequirementInput) {
  const p = parseRequirement(input);
  if (!p.ok) throw new Error(p.message);
  return solve(p.requirement).candidates.filter((c) => c.feasible);
}

test("compare reads both directions of a bidirectional design", async ({ browser }) => {
  test.setTimeout(120_000);
  const designer = await apiAs("designer");
  const tag = Date.now().toString(36);
  const make = async (name: string, requirement: object, choice: { shuntOhms: number; gain: number }) => {
    const res = await designer.post("/api/designs", { data: { name, requirement, choice } });
    expect(res.status(), await res.text()).toBe(201);
    return ((await res.json()) as { id: string }).id;
  };
  // Two pairs for the pack, the second on a larger shunt; one for the one-way monitor.
  const pairs = feasible(pack);
  const pa = pairs[0]!;
  const pb = pairs.find((p) => p.shuntOhms > pa.shuntOhms * 1.05)!;
  expect(pb, "a second feasible shunt").toBeDefined();
  const pc = feasible(oneWay)[0]!;
  const pick = (p: { shuntOhms: number; gain: number }) => ({ shuntOhms: p.shuntOhms, gain: p.gain });
  const a = await make(`Pack A ${tag}`, pack, pick(pa));
  const b = await make(`Pack B ${tag}`, pack, pick(pb));
  const c = await make(`Discharge only ${tag}`, oneWay, pick(pc));
  await designer.dispose();
  const V = (v: number) => formatSI(v, "V");

  for (const width of [1280, 390]) {
    const ctx = await browser.newContext({ viewport: { width, height: 900 } });
    const page = await ctx.newPage();
    await signInPage(page, "designer");
    await page.goto(`/compare?ids=${a},${b},${c}`);
    await expect(page.getByTestId("compare-error-chart")).toContainText("(magnitude, either direction)");

    // The negative end's drop, 30 A × R (Ohm's law): the smaller shunt's is best; the one-way design has none.
    const burden = page.getByTestId("row-reverseBurdenV");
    await expect(burden.locator("td").nth(0)).toContainText(V(30 * pa.shuntOhms));
    await expect(burden.locator("td").nth(1)).toContainText(V(30 * pb.shuntOhms));
    await expect(burden.locator("td").nth(2)).toHaveText("—");
    await expect(burden.locator("[data-best]")).toHaveCount(1);
    await expect(burden.locator("td").nth(0)).toHaveAttribute("data-best", "true");
    // Joule: (30 A)² × R.
    await expect(page.getByTestId("row-reverseDissipationW").locator("td").nth(0)).toContainText(
      formatSI(900 * pa.shuntOhms, "W"),
    );
    await expect(page.getByTestId("row-floorRoomV")).toBeVisible();

    // The output at full load rides on the zero level: 1.8 V + 10 A × R × G (one-way: 10 A × R × G).
    const out = page.getByTestId("row-outputAtMaxV");
    await expect(out.locator("td").nth(0)).toHaveText(V(1.8 + 10 * pa.shuntOhms * pa.gain));
    await expect(out.locator("td").nth(2)).toHaveText(V(10 * pc.shuntOhms * pc.gain));

    // Dead zone and headroom: one-way against signed is not ranked.
    const dead = page.getByTestId("row-deadZoneA");
    await expect(dead).toContainText("not ranked: taken at a different span direction (one way or both)");
    await expect(dead.locator("[data-best]")).toHaveCount(0);
    await expect(page.getByTestId("row-headroomV").locator("[data-best]")).toHaveCount(0);
    await expect(page.getByTestId("row-ratingW")).toContainText(
      "not ranked: taken at a different largest negative current",
    );

    await checkScreen(page, `${shots}/compare-signed-${width}.png`);
    await page.getByTestId("compare-frame").screenshot({ path: `${shots}/compare-signed-table-${width}.png` });
    await ctx.close();
  }
});
