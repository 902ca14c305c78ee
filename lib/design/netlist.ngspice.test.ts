// Runs the netlist through ngspice (an outside simulator) and compares its operating point with
// the engine's burden and output voltage. Test files may use Node APIs; the engine may not.
import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { evaluateCandidate } from "./candidate";
import { insertion } from "./insertion";
import { buildNetlist } from "./netlist";
import type { Requirement } from "./requirement";
import { req } from "./test-helpers";

const hasNgspice = spawnSync("ngspice", ["--version"], { encoding: "utf8" }).status === 0;

// A missing simulator is a failure, not a skip: skipping would hide the only outside check.
it("has ngspice to run against (Debian package ngspice; .ci/run installs it)", () => {
  expect(hasNgspice, "ngspice is not installed: apt-get install -y ngspice").toBe(true);
});

function operatingPoint(netlist: string): Record<string, number> {
  const dir = mkdtempSync(join(tmpdir(), "sensewright-spice-"));
  try {
    const file = join(dir, "design.cir");
    writeFileSync(file, netlist);
    const out = execFileSync("ngspice", ["-b", file], { encoding: "utf8", stdio: ["ignore", "pipe", "pipe"] });
    const nodes: Record<string, number> = {};
    for (const m of out.matchAll(/^\s*([a-z0-9_#]+)\s+(-?\d[\d.]*e[+-]\d+)\s*$/gim))
      nodes[(m[1] ?? "").toLowerCase()] = Number(m[2]);
    return nodes;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

const within = (actual: number, expected: number, rel: number) =>
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(rel * Math.abs(expected));

const cases: [string, Requirement, { shuntOhms: number; gain: number }][] = [
  [
    "low side, constant current",
    req({ current: { min: "1 mA", max: "180 mA" }, supply: { voltage: "3 V" } }),
    { shuntOhms: 0.274, gain: 50 },
  ],
  [
    "high side, constant current",
    req({ current: { min: "60 mA", max: "6 A" }, supply: { voltage: "24 V", side: "high" }, drop: { max: "100 mV" } }),
    { shuntOhms: 0.01, gain: 20 },
  ],
  [
    "low side, resistive",
    req({ current: { min: "1 mA", max: "200 mA" }, supply: { voltage: "2 V" }, load: { model: "resistive" } }),
    { shuntOhms: 1.9, gain: 1 },
  ],
  [
    "high side, constant power",
    req({
      current: { min: "1 mA", max: "500 mA" },
      supply: { voltage: "5 V", side: "high" },
      load: { model: "constant-power" },
    }),
    { shuntOhms: 0.5, gain: 10 },
  ],
];

describe("netlist in ngspice (batch mode .op)", () => {
  it.each(cases)("%s: burden and output agree with the engine within 0.1 %", (_name, r, choice) => {
    const nodes = operatingPoint(buildNetlist(r, choice));
    const spiceBurden = (nodes.sp ?? NaN) - (nodes.sn ?? NaN);
    // The engine's operating point for this load model (insertion) and its output I·R·G + G·Vos.
    const op = insertion({
      supply: r.supply.voltage,
      seriesOhms: choice.shuntOhms,
      load: { model: r.load.model, current: r.current.max },
    });
    within(spiceBurden, op.burdenV, 1e-3);
    within(nodes.out ?? NaN, choice.gain * (op.burdenV + r.amplifier.offset), 1e-3);
    if (r.load.model === "constant-current") within(spiceBurden, evaluateCandidate(r, choice).burdenV, 1e-3);
    // Without the offset the output is the ideal outputAtMaxV.
    const ideal = operatingPoint(buildNetlist(r, choice, { includeOffset: false }));
    if (r.load.model === "constant-current") within(ideal.out ?? NaN, evaluateCandidate(r, choice).outputAtMaxV, 1e-3);
  });
});
