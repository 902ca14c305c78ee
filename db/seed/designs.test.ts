// The demo designs build through the design service with choices from the solver's front, and
// land in the states the demo promises: the logger approved (its radio-burst range as one pair, and
// the whole span as a range plan), the pump controller approved at revision 2 after a return (and
// built: db/seed/units.ts), the bench adapter a draft.
import { afterAll, describe, expect, it } from "vitest";
import { evaluateCandidate, evaluatePlan, parseRequirement } from "@/lib/design";
import { readoutFigures } from "@/lib/design/readout-error";
import { demoLoggerInput, demoLoggerReadout, demoPumpReadout } from "@/lib/design/test-helpers";
import { closeDb, getDb } from "../client";
import { listDesigns, listRevisions } from "../queries/designs";
import { listReviews } from "../queries/reviews";
import { teams } from "../schema";
import { demoDesigns, demoPlanDesign } from "./designs";
import { seedDemoIfEmpty } from "./index";

afterAll(closeDb);

describe("demo designs", () => {
  it("seed three approved (the pump controller at revision 2, after a return; the logger's range plan) and one draft, figures equal to the engine's", async () => {
    expect(await seedDemoIfEmpty()).toBe(true);
    const db = await getDb();
    const [team] = await db.select().from(teams);
    const designs = await listDesigns(team!.id);
    expect(designs.map((d) => [d.project, d.status, d.revision]).sort()).toEqual([
      ["Bench adapter", "draft", 1],
      ["Pump controller", "approved", 2],
      ["Soil-moisture logger", "approved", 1],
      ["Soil-moisture logger", "approved", 1],
    ]);
    for (const d of designs) {
      const revs = await listRevisions(d.id);
      const last = revs.at(-1)!;
      const parsed = parseRequirement(last.requirement);
      expect(parsed.ok).toBe(true);
      if (!parsed.ok) continue;
      if (last.kind === "plan") {
        const again = evaluatePlan(parsed.requirement, last.plan);
        if (!again.ok) throw new Error(again.message);
        expect(last.metrics.ranges.map((r) => r.worstBurdenV)).toEqual(again.ranges.map((r) => r.worstBurdenV));
        continue;
      }
      const again = evaluateCandidate(parsed.requirement, last.choice);
      expect(again.feasible).toBe(true);
      expect(last.metrics.burdenV).toBeCloseTo(again.burdenV, 12);
    }
    const adapter = designs.find((d) => d.project === "Bench adapter")!;
    expect((adapter.shuntOhms ?? NaN) * (adapter.gain ?? NaN)).toBeCloseTo(1000, 6); // 1 mV per µA is 1000 V/A
    // The logger as one instrument: a range plan over 3 µA to 180 mA (docs/model.md §6).
    const plan = designs.find((d) => d.planRanges !== null)!;
    expect(plan.planRanges).toBeGreaterThanOrEqual(2);
    const planRevision = (await listRevisions(plan.id))[0]!;
    if (planRevision.kind !== "plan") throw new Error("the logger's plan design holds no plan");
    expect(planRevision.plan.ranges[0]!.minA).toBe(3e-6);
    expect(planRevision.plan.ranges.at(-1)!.maxA).toBe(0.18);
    expect((await listReviews(plan.id)).map((r) => r.verdict)).toEqual(["approve"]);
    const pump = designs.find((d) => d.project === "Pump controller")!;
    const verdicts = (await listReviews(pump.id)).map((r) => [r.revision, r.verdict]);
    expect(verdicts).toEqual([
      [1, "return"],
      [1, "comment"],
      [2, "approve"],
    ]);
    const [r1, r2] = await listRevisions(pump.id);
    if (r1?.kind !== "pair" || r2?.kind !== "pair") throw new Error("the pump controller is a single pair");
    expect(r2.metrics.burdenV).toBeLessThan(r1.metrics.burdenV);
  });
});

describe("the demo logger's readout", () => {
  it("is the one the engine's tests read the logger and the pump controller with (lib/design/test-helpers.ts), its own error stated", () => {
    expect(demoPlanDesign.requirement).toEqual(demoLoggerInput);
    const burst = demoDesigns.find((d) => d.name === "Logger radio-burst range")!.requirement;
    expect({ readout: burst.readout, calibration: burst.calibration }).toEqual(demoLoggerReadout);
    const pump = demoDesigns.find((d) => d.project === "Pump controller")!.requirement;
    expect({ readout: pump.readout, calibration: pump.calibration }).toEqual(demoPumpReadout);
  });
  it("every demo design states every figure of its readout's own error", () => {
    for (const d of [...demoDesigns, demoPlanDesign]) {
      const parsed = parseRequirement(d.requirement);
      if (!parsed.ok) throw new Error(parsed.message);
      expect(readoutFigures(parsed.requirement.readout).filter((f) => !f.stated)).toEqual([]);
    }
  });
});
