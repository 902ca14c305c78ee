// The netlist a saved design exports (GET /api/designs/[id]/netlist), run through ngspice in batch
// mode — a simulator the project did not write — must agree with the engine: the burden
// V(sp) − V(sn) and the output V(out) within 0.1 %, low side and high side, with and without
// the amplifier offset. A machine without ngspice fails here: the outside check must not go quiet.
import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { evaluateCandidate } from "@/lib/design";
import { designNetlist } from "@/lib/build-sheet/exports";
import { fixtureView, loggerRequirement, pumpRequirement } from "@/lib/build-sheet/fixtures";

// A missing simulator fails the suite, never skips it (`npm test` installs it: scripts/system-tools.mjs).
const hasNgspice = spawnSync("ngspice", ["--version"], { encoding: "utf8" }).status === 0;

/** Node voltages of the `.op` analysis, as ngspice prints them in batch mode. */
function operatingPoint(netlist: string): Record<string, number> {
  const dir = mkdtempSync(join(tmpdir(), "sensewright-sheet-spice-"));
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
