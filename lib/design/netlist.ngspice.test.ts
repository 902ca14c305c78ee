// Runs the netlist through ngspice (an outside simulator) and compares its operating point with
// the engine's burden and output voltage. Test files may use Node APIs; the engine may not.
import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { evaluateCandidate } from "./candidate";
import { insertion } from "./insertion";
import { errorAt } from "./error-budget";
import { buildNetlist } from "./netlist";
import type { Requirement } from "./requirement";
import { req } from "./test-helpers";

// A missing simulator fails the suite, never skips it (`npm test` installs it: scripts/system-tools.mjs).
const hasNgspice = spawnSync("ngspice", ["--version"], { encoding: "utf8" }).status === 0;

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
  it("has ngspice to run (Debian package ngspice)", () => {
    expect(hasNgspice, "ngspice is not installed: apt-get install -y ngspice").toBe(true);
  });
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

describe.skipIf(!hasNgspice)("issue 11 in ngspice", () => {
  it("a 3.3 V, 1 A constant-power load through 0.33 Ω: ngspice's current and output match operatingCurrentA", () => {
    const r = req({
      current: { min: "10 mA", max: "1 A" },
      supply: { voltage: "3.3 V" },
      drop: { max: "400 mV" },
      load: { model: "constant-power" },
      readout: { kind: "adc", bits: 12, fullScale: "2.5 V" },
      amplifier: { gains: [7.5] },
    });
    const choice = { shuntOhms: 0.33, gain: 7.5 };
    const nodes = operatingPoint(buildNetlist(r, choice, { includeOffset: false }));
    const d = evaluateCandidate(r, choice);
    within(((nodes.sp ?? NaN) - (nodes.sn ?? NaN)) / 0.33, d.operatingCurrentA, 1e-4); // 1.127 A, not 1 A
    within(nodes.out ?? NaN, d.outputAtMaxV, 1e-4); // 2.789 V, over the 2.5 V full scale
    expect(d.reasons).toContain("output");
  });

  it("a difference stage with worst-case mismatched resistors: ngspice's common-mode error matches Vcm·4t/(1 + G)", () => {
    const r = req({
      current: { min: "0.5 A", max: "5 A" },
      supply: { voltage: "48 V", side: "high" },
      drop: { max: "200 mV" },
      amplifier: {
        topology: "difference",
        gains: [49],
        gainSet: { series: "E24", min: 49, max: 49, tolerance: "0.1 %" },
        cmrrDb: 200, // the engine's op-amp term out of the way; the netlist's op-amp is ideal
        commonMode: { min: "-1 V", max: "60 V" },
      },
    });
    const choice = { shuntOhms: 0.0102, gain: 49 };
    const netlist = buildNetlist(r, choice, { includeOffset: false, worstMismatch: true });
    expect(netlist).toMatch(/^RG1 sn inn /m); // the four resistors are in the netlist
    expect(netlist).toMatch(/^RF2 inp 0 /m);
    const skewed = operatingPoint(netlist);
    // The skew also moves the differential gain: Vout = V+·(1 + R2/R1) − V−·R2/R1 with
    // V+ = Vp·R4/(R3 + R4) gives Ad = (R4/(R3 + R4)·(1 + R2/R1) + R2/R1)/2 (circuit analysis).
    // Take that out; what is left, referred to the input, is the common-mode error.
    const t = 0.001;
    const [R1, R2, R3, R4] = [1 + t, 49 * (1 - t), 1 - t, 49 * (1 + t)];
    const ad = ((R4 / (R3 + R4)) * (1 + R2 / R1) + R2 / R1) / 2;
    const vShunt = (skewed.sp ?? NaN) - (skewed.sn ?? NaN);
    const errV = ((skewed.out ?? NaN) - ad * vShunt) / 49;
    const engine = (errorAt(r, choice, 5).terms.find((t) => t.source === "commonMode")?.errorA ?? NaN) * 0.0102;
    within(errV, engine, 1e-2); // 3.84 mV; first order in t, so agreement to about 2t
    // Matched resistors: no common-mode error to speak of.
    const matched = operatingPoint(buildNetlist(r, choice, { includeOffset: false }));
    const errMatched = (matched.out ?? NaN) / 49 - ((matched.sp ?? NaN) - (matched.sn ?? NaN));
    expect(Math.abs(errMatched)).toBeLessThan(engine / 100);
  });
});
