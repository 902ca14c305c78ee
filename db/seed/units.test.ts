// The demo pump controller's twelve units: recorded against its approved revision, ten in band, the
// wrong shunt and the broken sense line caught with their likely causes, and the batch consistent
// with the design's predicted spread (no flag: two build faults are not evidence against the model).
import { afterAll, describe, expect, it } from "vitest";
import { formatSI, nearestInSeries } from "@/lib/design";
import { summarizeUnits } from "@/lib/built-units/judge";
import { closeDb, getDb } from "../client";
import { listDesigns, listRevisions } from "../queries/designs";
import { listUnits, listUnitsOfEach } from "../queries/units";
import { teams } from "../schema";
import { seedDemoIfEmpty } from "./index";
import { DEMO_UNIT_COUNT } from "./units";

afterAll(closeDb);

describe("demo units", () => {
  it("gives the pump controller twelve units: ten in band, one wrong shunt, one broken sense line", async () => {
    expect(await seedDemoIfEmpty()).toBe(true);
    const db = await getDb();
    const [team] = await db.select().from(teams);
    const pump = (await listDesigns(team!.id)).find((d) => d.project === "Pump controller")!;
    const revisions = (await listRevisions(pump.id)).flatMap((r) =>
      r.kind === "pair"
        ? [{ revision: r.revision, requirement: r.requirement, choice: r.choice, approved: r.approval !== null }]
        : [],
    );
    const stored = await listUnits(pump.id);
    expect(stored).toHaveLength(DEMO_UNIT_COUNT);
    // Read with other designs (the compare page's one read), each design keeps its own units, in order.
    const other = (await listDesigns(team!.id)).find((d) => d.id !== pump.id)!;
    const both = await listUnitsOfEach([other.id, pump.id]);
    expect(both.get(pump.id)).toEqual(stored);
    expect(both.get(other.id)).toEqual(await listUnits(other.id));
    expect([...both.keys()]).toEqual([other.id, pump.id]);
    expect(new Set(stored.map((u) => u.revision))).toEqual(new Set([2]));
    expect(stored.every((u) => u.recordedByName === "Demo Maker")).toBe(true);
    const s = summarizeUnits(stored, revisions);
    const failing = s.units.filter((u) => !u.pass);
    expect(failing.map((u) => u.serial)).toEqual(["PC-2611-007", "PC-2611-011"]);
    const [shunt, sense] = failing;
    expect(shunt!.causeKind).toBe("gain");
    // The fitted shunt is the next E96 value above the approved one (IEC 60063), whatever pair the engine chose.
    const approvedR = revisions.find((r) => r.revision === 2)!.choice.shuntOhms;
    const nextUp = nearestInSeries("E96", approvedR * 1.02);
    expect(shunt!.cause).toContain(
      `the shunt may be the next value up (${formatSI(nextUp, "Ω")} instead of ${formatSI(approvedR, "Ω")})`,
    );
    expect(sense!.causeKind).toBe("offset");
    expect(sense!.cause).toMatch(/at every current .*a constant offset/);
    expect(s.yield).toMatchObject({ measured: 10 / 12, units: 12, passing: 10, revision: 2 });
    expect(s.yield.predicted).toBeGreaterThan(0.99);
    // The ten sound units sit inside the predicted spread; the two faulty ones outside it.
    expect(s.units.filter((u) => u.outsideSpread).map((u) => u.serial)).toEqual(["PC-2611-007", "PC-2611-011"]);
    expect(s.spread?.flagged).toBe(false);
    // Every reading of every unit is at one of the sheet's test points.
    for (const u of s.units) expect(u.readings).toHaveLength(s.benchCheck.length);
  });
});
