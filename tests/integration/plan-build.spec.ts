// HTTP checks of a range plan as something to build and check (issue 13, items 2 and 3): a plan
// saved through the API, approved, then its build sheet read back with pdftotext (poppler-utils)
// for every range's parts and bench rows, its netlist (one .op deck per range), its parts list,
// and a recording uploaded against it, whose switches and times are counted by hand below.
import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { expect, test, type APIRequestContext } from "@playwright/test";
import { formatSI } from "@/lib/design/format";
import { resistorCode } from "@/lib/design/resistor-code";
import { apiAs } from "../fixtures/auth";
import { uploadCsv } from "./profiles-helpers";
import { demoLoggerReadout } from "../../lib/design/test-helpers";

// The demo logger's whole span (docs/model.md §6): 3 µA asleep to 180 mA transmitting, 3.0 V cell.
const requirement = {
  current: { min: "3 uA", max: "180 mA" },
  supply: { voltage: "3.0 V", side: "low" },
  drop: { max: "60 mV" },
  ...demoLoggerReadout, // its converter's own error stated and zeroed once (db/seed/designs.ts)
  resolution: { countsAtMin: 10 },
};

type Range = { minA: number; maxA: number; shuntOhms: number; gain: number };
type Bench = { label: string; currentA: number; expectedV: number; minV: number; maxV: number };
type PlanView = {
  id: string;
  status: string;
  requirement: { rangeSwitch: { onResistance: number; delay: number }; supply: { voltage: number } };
  plan: { ranges: Range[]; switchPoints: { upA: number; downA: number }[] };
  metrics: { ranges: (Range & { switchOhms: number; benchCheck: Bench[] })[] };
};

let designer: APIRequestContext;
let reviewer: APIRequestContext;
let maker: APIRequestContext;
let design: PlanView;

const squash = (s: string) => s.normalize("NFKC").replace(/\s+/g, " ");

function pdfText(pdf: Buffer): string {
  expect(spawnSync("pdftotext", ["-v"]).status, "pdftotext is not installed: apt-get install -y poppler-utils").toBe(0);
  const dir = mkdtempSync(path.join(tmpdir(), "sensewright-plan-pdf-"));
  try {
    writeFileSync(path.join(dir, "s.pdf"), pdf);
    return squash(execFileSync("pdftotext", ["-raw", path.join(dir, "s.pdf"), "-"], { encoding: "utf8" }));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

test.beforeAll(async () => {
  [designer, reviewer, maker] = await Promise.all([apiAs("designer"), apiAs("reviewer"), apiAs("maker")]);
  const solved = await designer.post("/api/solve", { data: requirement });
  expect(solved.status()).toBe(200);
  const { rangePlan } = (await solved.json()) as {
    rangePlan: { ranges: Range[]; switchPoints: PlanView["plan"]["switchPoints"] };
  };
  expect(rangePlan, "the engine proposes a plan for 3 µA to 180 mA").toBeTruthy();
  const created = await designer.post("/api/designs", {
    data: {
      name: `Logger plan build ${Date.now()}`,
      project: "Soil-moisture logger",
      requirement,
      plan: {
        ranges: rangePlan.ranges.map(({ minA, maxA, shuntOhms, gain }) => ({ minA, maxA, shuntOhms, gain })),
        switchPoints: rangePlan.switchPoints,
      },
    },
  });
  expect(created.status(), await created.text()).toBe(201);
  const { id } = (await created.json()) as { id: string };
  design = (await (await designer.get(`/api/designs/${id}`)).json()) as PlanView;
  expect(design.plan.ranges).toHaveLength(3);
});
test.afterAll(async () => {
  await Promise.all([designer, reviewer, maker].map((c) => c.dispose()));
});

test("a draft plan's sheet says not approved; once approved the maker gets every range's parts and bench rows", async () => {
  const draft = await designer.get(`/api/designs/${design.id}/build-sheet`);
  expect(draft.status()).toBe(200);
  expect(draft.headers()["content-type"]).toBe("application/pdf");
  expect(pdfText(await draft.body())).toContain("NOT APPROVED");

  expect((await designer.post(`/api/designs/${design.id}/submit`, { data: {} })).status()).toBe(200);
  const approve = await reviewer.post(`/api/designs/${design.id}/reviews`, {
    data: { verdict: "approve", body: "Three ranges, protection checked." },
  });
  expect(approve.status(), await approve.text()).toBe(201);

  const res = await maker.get(`/api/designs/${design.id}/build-sheet`);
  expect(res.status()).toBe(200);
  expect(res.headers()["content-disposition"]).toMatch(/attachment; filename=".+-rev1\.pdf"/);
  const text = pdfText(await res.body());
  expect(text).not.toContain("NOT APPROVED");
  const ron = design.requirement.rangeSwitch.onResistance;
  design.metrics.ranges.forEach((r, k) => {
    // Each shunt with its IEC 60062 code, its switch, its amplifier and gain.
    expect(text).toContain(squash(`${formatSI(r.shuntOhms, "Ω")} (${resistorCode(r.shuntOhms)})`));
    expect(text).toContain(`Range switch, range ${k + 1}`);
    expect(text).toContain(`Current-sense amplifier for range ${k + 1}`);
    expect(text).toContain(`Bench check, range ${k + 1}`);
    for (const b of r.benchCheck)
      expect(text).toContain(
        squash(
          `${formatSI(b.currentA, "A")} ${formatSI(b.expectedV, "V")} ${formatSI(b.minV, "V")} to ${formatSI(b.maxV, "V")}`,
        ),
      );
  });
  expect(text).toContain(squash(`on-resistance at most ${formatSI(ron, "Ω")}`));
  expect(text).toContain("Protection: comparator with latch");
  for (const p of design.plan.switchPoints) {
    expect(text).toContain(squash(`rises above ${formatSI(p.upA, "A")}`));
    expect(text).toContain(squash(`falls below ${formatSI(p.downA, "A")}`));
  }
  expect(text).toContain("A low range left in at full current");
  expect(text).toContain("Local codes decide");
});

test("the netlist has one .op deck per range, one deck alone with ?range=N, and names a range out of the plan", async () => {
  const all = await designer.get(`/api/designs/${design.id}/netlist`);
  expect(all.status()).toBe(200);
  const text = await all.text();
  expect(text.match(/^\.op$/gm)).toHaveLength(3);
  const one = await designer.get(`/api/designs/${design.id}/netlist?range=2`);
  expect(one.status()).toBe(200);
  const deck = await one.text();
  expect(deck.match(/^\.end$/gm)).toHaveLength(1);
  // Range 2's switch closed at the on-resistance, the others open.
  expect(deck).toMatch(/^RSW2 sn ret \S+ ; range 2 switch closed/m);
  expect(deck).toMatch(/^RSW1 sn1 ret 1e9 ; range 1 switch open/m);
  const tooFar = await designer.get(`/api/designs/${design.id}/netlist?range=4`);
  expect(tooFar.status()).toBe(422);
  expect(((await tooFar.json()) as { fieldErrors: Record<string, string[]> }).fieldErrors.range?.[0]).toMatch(
    /3 ranges/,
  );
  const notANumber = await designer.get(`/api/designs/${design.id}/netlist?range=two`);
  expect(notANumber.status()).toBe(422);
});

test("parts.csv lists every range's shunt, switch and amplifier with SI values", async () => {
  const res = await designer.get(`/api/designs/${design.id}/parts.csv`);
  expect(res.status()).toBe(200);
  const lines = (await res.text()).trim().split("\r\n");
  expect(lines[0]).toBe("designator,part,value,tolerance,tempco,rating,notes,value_si,unit,code");
  design.plan.ranges.forEach((r, k) => {
    expect(lines.find((l) => l.startsWith(`R${k + 1},`))).toMatch(new RegExp(`,${r.shuntOhms},ohm,[0-9RKMG]+$`));
    expect(lines.some((l) => l.startsWith(`Q${k + 1},`))).toBe(true);
    expect(lines.some((l) => l.startsWith(`U${k + 1},`))).toBe(true);
  });
  expect(lines.some((l) => l.startsWith("U4,"))).toBe(true);
});

test("a recording against the plan: switches, time in each range, the drop with the switch, samples read late", async () => {
  // One sample a millisecond: asleep at 5 µA, a 150 mA burst for 3 ms, asleep at 10 µA.
  const mA = [0.005, 0.005, 150, 150, 150, 0.01, 0.01, 0.01, 0.01, 0.01];
  const csv = "time (ms),current (mA)\n" + mA.map((i, t) => `${t},${i}`).join("\n") + "\n";
  const res = await designer.post(`/api/designs/${design.id}/profiles`, {
    multipart: { file: { name: "burst.csv", mimeType: "text/csv", buffer: Buffer.from(csv, "utf8") } },
  });
  expect(res.status(), await res.text()).toBe(201);
  const { summary } = (await res.json()) as {
    summary: {
      rangeSwitches: number;
      timeInRangeS: number[];
      maxBurdenV: number;
      minLoadVoltageV: number;
      clippedBeforeSwitchSamples: number;
      belowStepSamples: number;
      switchDelayS: number;
    };
  };
  // Counted by hand with the default 100 µs delay: the burst at 2 ms asks for range 3 (150 mA is
  // above both switch-up points), which acts at 2.1 ms; 10 µA at 5 ms asks for range 1, acting at
  // 5.1 ms. Range 1: 0–2.1 ms and 5.1–9 ms (6 ms); range 2: never; range 3: 2.1–5.1 ms (3 ms).
  expect(design.requirement.rangeSwitch.delay).toBe(100e-6);
  expect(summary.switchDelayS).toBe(100e-6);
  expect(summary.rangeSwitches).toBe(2);
  expect(summary.timeInRangeS).toHaveLength(3);
  expect(summary.timeInRangeS[0]).toBeCloseTo(6e-3, 9);
  expect(summary.timeInRangeS[1]).toBeCloseTo(0, 12);
  expect(summary.timeInRangeS[2]).toBeCloseTo(3e-3, 9);
  // The sample at 2 ms is read on range 1, far above its top, while the switch waits.
  expect(summary.clippedBeforeSwitchSamples).toBe(1);
  // Ohm's law: 150 mA through range 3's shunt and its switch is the worst drop the load sees.
  const top = design.metrics.ranges[2]!;
  expect(summary.maxBurdenV).toBeCloseTo(0.15 * (top.shuntOhms + top.switchOhms), 9);
  expect(summary.minLoadVoltageV).toBeCloseTo(design.requirement.supply.voltage - summary.maxBurdenV, 9);
  expect(summary.belowStepSamples).toBeGreaterThanOrEqual(0);

  // The chart's series says which range each stretch was read on.
  const list = (await (await designer.get(`/api/designs/${design.id}/profiles`)).json()) as {
    profiles: { id: string }[];
  };
  const detail = await designer.get(`/api/designs/${design.id}/profiles/${list.profiles[0]!.id}?width=200`);
  expect(detail.status()).toBe(200);
  const body = (await detail.json()) as { series: { plan: { ranges: { range: number }[]; loadV: number[] } } };
  expect(body.series.plan.ranges.map((r) => r.range)).toEqual([0, 2, 0]);
  expect(Math.min(...body.series.plan.loadV)).toBeCloseTo(summary.minLoadVoltageV, 9);
});

test("a bad recording on a plan is refused naming the row and column, and nothing is stored", async () => {
  const before = ((await (await designer.get(`/api/designs/${design.id}/profiles`)).json()) as { profiles: unknown[] })
    .profiles.length;
  const res = await uploadCsv(designer, design.id, "bad.csv", "time,current\n0,1\n1,lots\n");
  expect(res.status()).toBe(422);
  expect(((await res.json()) as { column?: string }).column).toBe("current");
  const after = ((await (await designer.get(`/api/designs/${design.id}/profiles`)).json()) as { profiles: unknown[] })
    .profiles.length;
  expect(after).toBe(before);
});
