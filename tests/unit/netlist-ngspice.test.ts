// Outside checks of the netlists against ngspice (batch mode, `.op`), a simulator the project did
// not write: the engine's own netlist (lib/design/netlist.ts) for every topology and load model,
// and the netlist a saved design exports (GET /api/designs/[id]/netlist), low and high side, with
// and without the amplifier offset. Burden V(sp) − V(sn) and output V(out) agree within 0.1 %.
// A machine without ngspice fails here, never skips: the outside check must not go quiet
// (`npm test` installs it: scripts/system-tools.mjs).
import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { designNetlist } from "@/lib/build-sheet/exports";
import { fixtureView, loggerRequirement, pumpRequirement } from "@/lib/build-sheet/fixtures";
import { evaluateCandidate } from "@/lib/design/candidate";
import { errorAt } from "@/lib/design/error-budget";
import { insertion } from "@/lib/design/insertion";
import { buildNetlist, spiceNumber } from "@/lib/design/netlist";
import { planNetlist, rangeDeck } from "@/lib/design/plan-netlist";
import { solve } from "@/lib/design/solve";
import type { Requirement } from "@/lib/design/requirement";
import { req } from "@/lib/design/test-helpers";

const hasNgspice = spawnSync("ngspice", ["--version"], { encoding: "utf8" }).status === 0;

/** Node voltages of the `.op` analysis, as ngspice prints them in batch mode. */
function operatingPoint(netlist: string): Record<string, number> {
  const dir = mkdtempSync(join(tmpdir(), "sensewright-spice-"));
  try {
    const file = join(dir, "design.cir");
    writeFileSync(file, netlist);
    const out = execFileSync("ngspice", ["-b", file], { encoding: "utf8", stdio: ["ignore", "pipe", "pipe"] });
    const nodes: Record<string, number> = {};
    for (const m of out.matchAll(/^\s*([a-z0-9_#]+)\s+(-?\d[\d.]*(?:e[+-]\d+)?)\s*$/gim))
      nodes[(m[1] ?? "").toLowerCase()] = Number(m[2]);
    return nodes;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

const within = (actual: number | undefined, expected: number, rel = 1e-3) => {
  expect(actual).toBeDefined();
  expect(Math.abs((actual as number) - expected)).toBeLessThanOrEqual(rel * Math.abs(expected));
};

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

const designs = [
  ["low side (soil logger)", fixtureView(loggerRequirement)],
  ["high side (pump controller)", fixtureView(pumpRequirement, { name: "Pump controller" })],
] as const;

// A larger offset than the defaults' 10 µV, so that G·Vos is well above the 0.1 % tolerance.
const withOffset = [
  // Same shunt and gain as above (the netlist does not care whether the pair still passes).
  [
    "low side (soil logger)",
    fixtureView({ ...loggerRequirement, amplifier: { offset: "150 uV" } }, { choice: designs[0][1].choice }),
  ],
  [
    "high side (pump controller)",
    fixtureView({ ...pumpRequirement, amplifier: { offset: "300 uV" } }, { choice: designs[1][1].choice }),
  ],
] as const;

describe("exported netlist in ngspice", () => {
  it("has ngspice to run (Debian package ngspice)", () => {
    expect(hasNgspice, "ngspice is not installed: apt-get install -y ngspice").toBe(true);
  });
  it.each(designs)("%s, offset left out: burden and output equal the engine's", (_name, view) => {
    const m = evaluateCandidate(view.requirement, view.choice);
    const nodes = operatingPoint(designNetlist(view, { includeOffset: false }));
    within((nodes.sp ?? NaN) - (nodes.sn ?? NaN), m.burdenV);
    within(nodes.out, m.outputAtMaxV);
    expect(view.requirement.supply.side).toBe(_name.startsWith("low") ? "low" : "high");
  });

  it.each(withOffset)("%s, with offset: output is G·(I·R + Vos)", (_name, view) => {
    const m = evaluateCandidate(view.requirement, view.choice);
    const nodes = operatingPoint(designNetlist(view, { includeOffset: true }));
    within((nodes.sp ?? NaN) - (nodes.sn ?? NaN), m.burdenV);
    const expected = view.choice.gain * (m.burdenV + view.requirement.amplifier.offset);
    within(nodes.out, expected);
    // The offset is visible at this tolerance, and the netlist without it loses exactly G·Vos.
    expect(Math.abs(expected - m.outputAtMaxV)).toBeGreaterThan(2e-3 * m.outputAtMaxV);
    const bare = operatingPoint(designNetlist(view, { includeOffset: false }));
    within((nodes.out ?? NaN) - (bare.out ?? NaN), view.choice.gain * view.requirement.amplifier.offset, 0.01);
  });
});

// Issue 13: a range plan's netlist, one `.op` deck per range with that range's switch closed, the
// others open and the protection in place. ngspice's shunt drop V(sp) − V(sn), the path's drop
// (shunt and switch) and the output agree with the engine within 0.1 % on every range.
const logger = req({ current: { min: "3 uA", max: "180 mA" }, supply: { voltage: "3.0 V" }, drop: { max: "60 mV" } });
const loggerPlan = solve(logger).rangePlan;
const pumpPlanReq = req({
  current: { min: "3 uA", max: "6 A" },
  supply: { voltage: "24 V", side: "high" },
  drop: { max: "100 mV" },
  readout: { kind: "adc", bits: 16, fullScale: "2.5 V" },
  load: { model: "resistive" },
});
const pumpPlan = solve(pumpPlanReq).rangePlan;
const planCases = [
  ["demo logger, low side, constant current", logger, loggerPlan],
  ["3 µA to 6 A, high side, resistive load", pumpPlanReq, pumpPlan],
] as const;

describe("range plan netlists in ngspice (one .op per range)", () => {
  it.each(planCases)("%s: every range's deck agrees with the engine within 0.1 %", (_name, r, plan) => {
    expect(plan).not.toBeNull();
    if (!plan) return;
    const choice = { ranges: plan.ranges, switchPoints: plan.switchPoints };
    for (let k = 0; k < plan.ranges.length; k++) {
      const deck = rangeDeck(r, choice, k);
      // The switch states are in the deck: this range's closed at its on-resistance, the others open.
      expect(deck.netlist).toMatch(new RegExp(`^RSW${k + 1} sn \\S+ ${spiceNumber(r.rangeSwitch.onResistance)} `, "m"));
      expect(deck.netlist).toMatch(/^SPROT /m);
      const nodes = operatingPoint(deck.netlist);
      const join = r.supply.side === "high" ? "ld" : "ret";
      within((nodes.sp ?? NaN) - (nodes.sn ?? NaN), deck.expected.shuntDropV);
      within((nodes.sp ?? NaN) - (nodes[join] ?? 0), deck.expected.pathDropV);
      within(nodes.out, deck.expected.outputV);
      // The path's drop is the plan's worstBurdenV for the range (the switch included).
      within(deck.expected.pathDropV, plan.ranges[k]!.worstBurdenV, 1e-9);
    }
  });

  it("the download holds one deck per range, each ending in .end", () => {
    const text = planNetlist(logger, { ranges: loggerPlan!.ranges, switchPoints: loggerPlan!.switchPoints });
    expect(text.match(/^\.end$/gm)).toHaveLength(loggerPlan!.ranges.length);
    expect(text.match(/^\.op$/gm)).toHaveLength(loggerPlan!.ranges.length);
  });
});
