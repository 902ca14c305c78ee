// Twelve invented units of the demo pump controller, built from its approved revision and drawn
// from the engine's own Monte Carlo model (parts within tolerance, noise, the readout's step), so
// they are consistent with the design's predicted spread. Ten are sound; one was fitted with the
// next E96 shunt value up, and one has a broken low-side sense line that leaves a constant offset.
import { benchCheck, matchTestPoints, nearestInSeries, simulateBench, type UnitFault } from "@/lib/design";
import { listDesigns, listRevisions } from "../queries/designs";
import { insertUnits, type NewUnit } from "../queries/units";
import type { DemoIds } from "./team";

export const DEMO_UNIT_PROJECT = "Pump controller";
export const DEMO_UNIT_COUNT = 12;
/** The faulty units, by serial, with what is wrong with them. */
export const demoUnitFaults: Record<string, { words: string; fault: (shuntOhms: number) => UnitFault }> = {
  "PC-2611-007": {
    words: "fitted with the next E96 shunt value up",
    fault: (R) => ({ shuntOhms: nearestInSeries("E96", R * 1.02) }),
  },
  "PC-2611-011": {
    // An open sense line leaves the input to the filter and bias paths: 1.2 mV at the input, 30 mV out at gain 25.
    words: "a broken low-side sense line",
    fault: () => ({ inputOffsetV: 1.2e-3 }),
  },
};

const serialOf = (k: number) => `PC-2611-${String(k + 1).padStart(3, "0")}`;
/** A technician writes the meter's reading to 0.1 mV. */
const asWritten = (v: number) => Math.round(v * 1e4) / 1e4;

export async function seedDemoUnits(ids: DemoIds): Promise<void> {
  const pump = (await listDesigns(ids.teamId)).find((d) => d.project === DEMO_UNIT_PROJECT);
  if (!pump || pump.status !== "approved") throw new Error("demo units: the pump controller design is not approved");
  const revision = (await listRevisions(pump.id)).find((r) => r.revision === pump.revision);
  if (revision?.kind !== "pair") throw new Error("demo units: the pump controller is a single shunt and gain");
  const { requirement, choice } = revision;
  const bench = benchCheck(requirement, choice);
  const currents = bench.map((b) => b.currentA);
  const units: NewUnit[] = [];
  for (let k = 0; k < DEMO_UNIT_COUNT; k++) {
    const serial = serialOf(k);
    const fault = demoUnitFaults[serial]?.fault(choice.shuntOhms);
    // One unit per seed: its own parts, its own noise.
    const outputs = simulateBench(requirement, choice, currents, { draws: 1, seed: 2611_00 + k, fault });
    const matched = matchTestPoints(
      bench,
      currents.map((currentA, i) => ({ currentA, outputV: asWritten(outputs[i]![0]!) })),
    );
    if (!matched.ok) throw new Error(`demo unit ${serial}: ${matched.errors[0]?.message}`);
    units.push({
      serial,
      revision: pump.revision,
      builtOn: `2026-11-${String(23 + Math.floor(k / 4)).padStart(2, "0")}`,
      readings: matched.rows.map((r, pointIndex) => ({
        rangeIndex: 0,
        pointIndex,
        currentA: r.bench.currentA,
        outputV: r.reading.outputV,
      })),
    });
  }
  const written = await insertUnits({
    teamId: ids.teamId,
    designId: pump.id,
    actorId: ids.userIds.maker,
    units,
    source: "csv",
  });
  if (!written.ok) throw new Error(`demo units: ${written.reason}`);
}
