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
import { benchCheck } from "@/lib/design/bench-check";
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

describe("issue 14 in ngspice: a bidirectional design", () => {
  // A pack read on the low side through 1 mΩ at gain 50 around a 1.25 V zero level: the engine
  // expects V(out) = 1.25 V + I·R·G (+ G·Vos with the offset), the bench check's expectedV.
  const pack = req({
    current: { min: "-10 A", max: "10 A" },
    supply: { voltage: "48 V" },
    drop: { max: "50 mV" },
    readout: { kind: "adc", bits: 16, fullScale: "2.5 V" },
    amplifier: { gains: [50], reference: { voltage: "1.25 V" }, offset: "100 uV" },
  });
  const choice = { shuntOhms: 0.001, gain: 50 };
  it.each([-10, 0, 10])("at %d A the output is the zero level plus I·R·G within 0.1 %", (I) => {
    const netlist = buildNetlist(pack, choice, { currentA: I, includeOffset: false });
    expect(netlist).toMatch(/^VREF ref 0 DC 1\.25$/m); // the reference is an element of the circuit
    const nodes = operatingPoint(netlist);
    const expected = benchCheck(pack, choice).find((r) => r.currentA === I)?.expectedV ?? NaN;
    within(nodes.out, expected); // 0.75 V, 1.25 V, 1.75 V
    // The shunt's drop, I·R: within 0.1 % of the 10 mV at full current (and ~0 at zero).
    expect(Math.abs((nodes.sp ?? NaN) - (nodes.sn ?? NaN) - I * 0.001)).toBeLessThanOrEqual(1e-5);
    // With the offset: G·Vos = 5 mV more at every current.
    const withOffset = operatingPoint(buildNetlist(pack, choice, { currentA: I }));
    within(withOffset.out, expected + 50 * 100e-6);
  });
  it("a difference stage refers its output to the same zero level", () => {
    const r = req({
      current: { min: "-5 A", max: "5 A" },
      supply: { voltage: "12 V" },
      drop: { max: "100 mV" },
      amplifier: {
        topology: "difference",
        gains: [20],
        gainSet: { series: "E24", min: 20, max: 20, tolerance: "0.1 %" },
        reference: { voltage: "1.2 V" },
      },
    });
    const netlist = buildNetlist(r, { shuntOhms: 0.01, gain: 20 }, { currentA: -5, includeOffset: false });
    expect(netlist).toMatch(/^RF2 inp ref /m);
    // 1.2 V − 5 A × 10 mΩ × 20 = 0.2 V.
    within(operatingPoint(netlist).out, 0.2);
  });
});

describe.skipIf(!hasNgspice)("issue 14 in ngspice: input filter and two-terminal shunt", () => {
  it("a current-sense amplifier behind a mismatched input filter: the bias currents' error matches Ohm's law and the engine within 0.1 %", () => {
    // 1 µA bias and 0.5 µA offset current (a current-sense part's order, from memory) through 100 Ω
    // legs of 1 %: the error is visible at 0.1 % of the output.
    const r = req({
      current: { min: "10 mA", max: "1 A" },
      supply: { voltage: "5 V" },
      amplifier: { gains: [50], biasCurrent: "1 uA", offsetCurrent: "0.5 uA" },
      inputFilter: { resistance: "100 ohm", capacitance: "1 uF", tolerance: "1 %" },
    });
    const choice = { shuntOhms: 0.01, gain: 50 };
    const netlist = buildNetlist(r, choice, { includeOffset: true, worstMismatch: true });
    expect(netlist).toMatch(/^RFP sp fp 9\.9e1$/m);
    expect(netlist).toMatch(/^CFN fn 0 1e-6$/m);
    expect(netlist).toMatch(/^IBP fp 0 DC 1\.25e-6$/m);
    const nodes = operatingPoint(netlist);
    const vShunt = (nodes.sp ?? NaN) - (nodes.sn ?? NaN);
    // Each leg drops (its input current)·(its resistor): + leg 1.25 µA·99 Ω, − leg 0.75 µA·101 Ω.
    const legs = 1.25e-6 * 99 - 0.75e-6 * 101;
    within((nodes.fp ?? NaN) - (nodes.fn ?? NaN), vShunt - legs, 1e-6);
    within(nodes.out ?? NaN, 50 * (vShunt + r.amplifier.offset - legs), 1e-3);
    // The engine's term bounds that from above and is the same to 0.1 % of the output.
    const engineV = (errorAt(r, choice, 1).terms.find((t) => t.source === "inputFilterBias")?.errorA ?? NaN) * 0.01;
    expect(engineV).toBeGreaterThanOrEqual(Math.abs(legs));
    within(nodes.out ?? NaN, 50 * (vShunt + r.amplifier.offset - engineV), 1e-3);
    expect(Math.abs(legs) * 50).toBeGreaterThan(1e-3 * (nodes.out ?? 0)); // visible at this tolerance
  });

  const difference = (filter: string) =>
    req({
      current: { min: "0.5 A", max: "5 A" },
      supply: { voltage: "48 V", side: "high" },
      drop: { max: "200 mV" },
      amplifier: {
        topology: "difference",
        gains: [49],
        gainSet: { series: "E24", min: 49, max: 49, tolerance: "0.1 %" },
        cmrrDb: 200,
        commonMode: { min: "-1 V", max: "60 V" },
      },
      inputFilter: { resistance: filter, capacitance: "100 nF", tolerance: "1 %" },
    });

  it("a filtered difference stage: the filter resistors lower the gain by Rfilt/(Rg + Rfilt), as the engine says, within 0.1 %", () => {
    const r = difference("200 ohm"); // 200/10200 = 1.96 % of gain: well above 0.1 %
    const choice = { shuntOhms: 0.0102, gain: 49 };
    const netlist = buildNetlist(r, choice, { includeOffset: false });
    expect(netlist).toMatch(/^RG1 fn inn 1e4$/m);
    const nodes = operatingPoint(netlist);
    const vShunt = (nodes.sp ?? NaN) - (nodes.sn ?? NaN);
    const loading = (errorAt(r, choice, 5).terms.find((t) => t.source === "inputFilterResistors")?.errorA ?? NaN) / 5;
    // Matched resistors: the budget's term is the filter's loading alone plus its common-mode bound.
    const cmShare = (48 * 2 * 0.01 * 200) / (10_200 * 50) / (5 * 0.0102);
    within(nodes.out ?? NaN, 49 * vShunt * (1 - (loading - cmShare)), 1e-3);
    expect(loading - cmShare).toBeCloseTo(200 / 10_200, 9);
  });

  it("a filtered difference stage with mismatched resistors: ngspice's common-mode error matches the engine's bound", () => {
    const r = difference("200 ohm");
    const choice = { shuntOhms: 0.0102, gain: 49 };
    const skewed = operatingPoint(buildNetlist(r, choice, { includeOffset: false, worstMismatch: true }));
    // Exact ideal-op-amp output: R1 = Rg(1+t) + Rf(1+tf), R2 = 49Rg(1−t), R3 = Rg(1−t) + Rf(1−tf), R4 = 49Rg(1+t).
    const [t, tf] = [0.001, 0.01];
    const R1 = 10_000 * (1 + t) + 200 * (1 + tf);
    const R2 = 490_000 * (1 - t);
    const R3 = 10_000 * (1 - t) + 200 * (1 - tf);
    const R4 = 490_000 * (1 + t);
    const vp = skewed.sp ?? NaN;
    const vn = skewed.sn ?? NaN;
    within(skewed.out ?? NaN, vp * (R4 / (R3 + R4)) * (1 + R2 / R1) - vn * (R2 / R1), 1e-3);
    // Take out the exact differential gain; what is left, referred to the input, is the
    // common-mode error: the stage's resistors' Vcm·4t/(1 + G) plus the filter's share.
    const ad = ((R4 / (R3 + R4)) * (1 + R2 / R1) + R2 / R1) / 2;
    const errV = ((skewed.out ?? NaN) - ad * (vp - vn)) / 49;
    const terms = errorAt(r, choice, 5).terms;
    const cm = (terms.find((x) => x.source === "commonMode")?.errorA ?? NaN) * 0.0102;
    const filterCm = (48 * 2 * 0.01 * 200) / (10_200 * 50);
    within(errV, cm + filterCm, 2e-2); // first order in t and tf: agreement to a couple of per cent of the error
  });

  it("a two-terminal shunt: the pads add to the burden and the output, as the budget's pad term says, within 0.1 %", () => {
    const r = req({
      current: { min: "1 A", max: "20 A" },
      supply: { voltage: "12 V" },
      drop: { max: "100 mV" },
      temperature: { min: "25 degC", max: "25 degC" },
      amplifier: { gains: [50] },
      shunt: { terminals: 2, padResistance: "0.5 mohm" },
    });
    const choice = { shuntOhms: 0.001, gain: 50 };
    const netlist = buildNetlist(r, choice, { includeOffset: false });
    expect(netlist).toMatch(/^RPAD1 sp spi 2\.5e-4$/m);
    const nodes = operatingPoint(netlist);
    const m = evaluateCandidate(r, choice);
    within((nodes.sp ?? NaN) - (nodes.sn ?? NaN), m.burdenV); // 20 A · 1.5 mΩ = 30 mV
    const pads = errorAt(r, choice, 20).terms.find((t) => t.source === "shuntPads")?.errorA ?? NaN;
    within(nodes.out ?? NaN, 50 * (20 + pads) * 0.001); // 1.5 V, not the 1.0 V a Kelvin part gives
    expect(m.outputAtMaxV).toBeCloseTo(1.0, 9);
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
