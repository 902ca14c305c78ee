// HTTP checks of the stateless engine routes: /api/solve, /api/insertion, /api/netlist.
// Refusals must be 422 with the dotted path of the field at fault, never a 500.
import { expect, test, type APIRequestContext } from "@playwright/test";
import { apiAs } from "../fixtures/auth";
import { loggerOneRange } from "../../lib/wizard/scenarios";
import { sensorNodeInput } from "../../lib/design/test-helpers";

type SolveBody = {
  requirement: Record<string, unknown>;
  evaluated: number;
  feasibleCount: number;
  rejected: Record<string, number>;
  candidates: {
    shuntOhms: number;
    gain: number;
    burdenV: number;
    feasible: boolean;
    pareto: boolean;
    reasons: string[];
  }[];
  rangePlan: null | { ranges: { minA: number; maxA: number; shuntOhms: number; gain: number }[] };
};

const base = {
  current: { min: "3 uA", max: "180 mA" },
  supply: { voltage: "3.0 V", side: "low" },
  drop: { max: "60 mV" },
  readout: { kind: "adc", bits: 12, fullScale: "2.5 V" },
  resolution: { countsAtMin: 10 },
};

let designer: APIRequestContext;
test.beforeAll(async () => {
  designer = await apiAs("designer");
});
test.afterAll(async () => {
  await designer.dispose();
});

async function expect422(res: Awaited<ReturnType<APIRequestContext["post"]>>, path: string, text?: RegExp) {
  expect(res.status(), await res.text()).toBe(422);
  const body = (await res.json()) as { message: string; fieldErrors: Record<string, string[]> };
  expect(typeof body.message).toBe("string");
  expect(Object.keys(body.fieldErrors)).toContain(path);
  if (text) expect(body.fieldErrors[path]!.join(" ")).toMatch(text);
}

test.describe("POST /api/solve refusals", () => {
  const cases: { name: string; body: unknown; path: string; text?: RegExp }[] = [
    {
      name: "a voltage for the maximum current",
      body: { ...base, current: { min: "3 uA", max: "5 V" } },
      path: "current.max",
      text: /5 V is a voltage, not a current/,
    },
    {
      name: "minimum above maximum",
      body: { ...base, current: { min: "200 mA", max: "180 mA" } },
      path: "current.min",
      text: /not be above the maximum/,
    },
    {
      name: "a negative supply",
      body: { ...base, supply: { voltage: "-3 V" } },
      path: "supply.voltage",
      text: /above zero/,
    },
    {
      name: "a non-finite number (1e999 reads as Infinity)",
      body: '{"current":{"min":"3 uA","max":1e999},"supply":{"voltage":3},"readout":{"kind":"adc","bits":12,"fullScale":2.5}}',
      path: "current.max",
      text: /expected a (finite )?number/,
    },
    {
      name: "absurd ADC bits",
      body: { ...base, readout: { kind: "adc", bits: 64, fullScale: "2.5 V" } },
      path: "readout.bits",
      text: /at most 32/,
    },
    {
      name: "an unknown E-series",
      body: { ...base, shunt: { series: "E7" } },
      path: "shunt.series",
      text: /unknown series/,
    },
    { name: "a missing required field", body: { supply: { voltage: "3 V" } }, path: "current" },
    {
      name: "a bad ranking expression",
      body: { ...base, rank: "burdenV + process.exit()" },
      path: "rank",
      text: /Ranking expression/,
    },
    {
      name: "an unknown name in the ranking expression",
      body: { ...base, rank: "price * 2" },
      path: "rank",
      text: /unknown name "price"/,
    },
    { name: "a ranking expression that is not text", body: { ...base, rank: 42 }, path: "rank" },
    {
      // Issue 11 item 9: a bare 0.02 reads like the fraction drop.fraction takes (2 %).
      name: "a bare accuracy target of 0.02",
      body: { ...base, accuracy: { percent: 0.02 } },
      path: "accuracy.percent",
      text: /0\.02 reads as 0\.02 %; if you meant 2 %, send 2 or "2 %"; for 0\.02 %, send "0\.02 %"/,
    },
    {
      name: "a bare meter accuracy, named in percent but read as a share",
      body: {
        ...base,
        readout: { kind: "meter", counts: 6000, fullScale: "600 mV", accuracy: { percentOfReading: 0.5, digits: 2 } },
      },
      path: "readout.accuracy.percentOfReading",
      text: /a bare 0\.5 reads as a share of the reading, 50 %/,
    },
  ];
  for (const c of cases) {
    test(`${c.name} → 422 on ${c.path}`, async () => {
      const res = await designer.post("/api/solve", { data: c.body, headers: { "content-type": "application/json" } });
      await expect422(res, c.path, c.text);
    });
  }

  test("an accuracy target with its sign, or a bare one of 0.1 and up, is taken as percent", async () => {
    for (const [percent, expected] of [
      ["0.02 %", 0.02],
      ["500 ppm", 0.05],
      [0.1, 0.1],
      ["2", 2],
    ] as const) {
      const res = await designer.post("/api/solve", { data: { ...base, accuracy: { percent }, limit: 1 } });
      expect(res.status(), await res.text()).toBe(200);
      const body = (await res.json()) as { requirement: { accuracy: { percent: number } } };
      expect(body.requirement.accuracy.percent).toBe(expected);
    }
  });

  test("malformed JSON → 422 on (body)", async () => {
    const res = await designer.post("/api/solve", {
      data: '{"current": {"min": "3 uA",',
      headers: { "content-type": "application/json" },
    });
    await expect422(res, "(body)");
  });

  test("a JSON array instead of a requirement → 422, not 500", async () => {
    const res = await designer.post("/api/solve", { data: "[1,2,3]", headers: { "content-type": "application/json" } });
    expect(res.status()).toBe(422);
  });

  test("signed out → 401", async () => {
    const anon = await apiAs(null);
    const res = await anon.post("/api/solve", { data: base });
    expect(res.status()).toBe(401);
    await anon.dispose();
  });
});

test.describe("POST /api/solve results", () => {
  test("the one-range logger: counts add up and the Pareto front is not empty", async () => {
    const res = await designer.post("/api/solve", { data: loggerOneRange });
    expect(res.status()).toBe(200);
    const s = (await res.json()) as SolveBody;
    const rejectedSum = Object.values(s.rejected).reduce((a, b) => a + b, 0);
    expect(s.feasibleCount + rejectedSum).toBe(s.evaluated);
    expect(s.feasibleCount).toBeGreaterThan(0);
    const front = s.candidates.filter((c) => c.pareto);
    expect(front.length).toBeGreaterThan(0);
    expect(front.every((c) => c.feasible && c.reasons.length === 0)).toBe(true);
    // Every feasible candidate keeps within the 60 mV allowed drop (Ohm's law: Imax · R).
    for (const c of s.candidates.filter((x) => x.feasible)) {
      expect(c.burdenV).toBeLessThanOrEqual(0.06 * (1 + 1e-9));
      expect(c.burdenV).toBeCloseTo(0.18 * c.shuntOhms, 12);
    }
    expect(s.rangePlan).toBeNull();
    // The requirement comes back normalized in SI with every default filled in.
    expect(s.requirement).toMatchObject({
      current: { min: 1e-4, max: 0.18 },
      supply: { voltage: 3, side: "low" },
      drop: { max: 0.06 },
    });
  });

  test("a span too wide for one range through 12 bits: no feasible pair, a range plan covering the span", async () => {
    const res = await designer.post("/api/solve", { data: base });
    expect(res.status()).toBe(200);
    const s = (await res.json()) as SolveBody;
    expect(s.feasibleCount).toBe(0);
    expect(Object.values(s.rejected).reduce((a, b) => a + b, 0)).toBe(s.evaluated);
    const ranges = s.rangePlan!.ranges;
    expect(ranges.length).toBeGreaterThanOrEqual(2);
    expect(ranges[0]!.minA).toBeCloseTo(3e-6, 12);
    expect(ranges.at(-1)!.maxA).toBeCloseTo(0.18, 12);
    for (let k = 1; k < ranges.length; k++) expect(ranges[k]!.minA).toBeLessThan(ranges[k - 1]!.maxA); // they overlap
  });

  test("a valid ranking expression is accepted", async () => {
    const res = await designer.post("/api/solve", {
      data: { ...loggerOneRange, rank: "burdenV * 1000 + errorAtMinPercent", limit: 20 },
    });
    expect(res.status()).toBe(200);
    const s = (await res.json()) as SolveBody;
    expect(s.candidates.length).toBeLessThanOrEqual(Math.max(20, s.candidates.filter((c) => c.pareto).length));
  });
});

test.describe("POST /api/insertion", () => {
  test("200 mA constant-current from 2.0 V through 1.9 Ω: 380 mV burden, 1.62 V at the load (Ohm's law)", async () => {
    const res = await designer.post("/api/insertion", {
      data: { supply: "2.0 V", seriesOhms: "1.9 ohm", load: { model: "constant-current", current: "200 mA" } },
    });
    expect(res.status()).toBe(200);
    const r = (await res.json()) as Record<string, number>;
    expect(r.burdenV).toBeCloseTo(0.38, 9);
    expect(r.loadVoltageV).toBeCloseTo(1.62, 9);
    expect(r.currentA).toBeCloseTo(0.2, 12);
    expect(r.currentChangePercent).toBeCloseTo(0, 9);
    expect(r.powerInSeriesW).toBeCloseTo(0.076, 9); // Joule: I²R = 0.04 · 1.9
  });

  test("a resistive load draws less: 2 V / (10 Ω + 1.9 Ω)", async () => {
    const res = await designer.post("/api/insertion", {
      data: { supply: "2.0 V", seriesOhms: "1.9 ohm", load: { model: "resistive", current: "200 mA" } },
    });
    const r = (await res.json()) as Record<string, number>;
    expect(r.currentA).toBeCloseTo(2 / 11.9, 9);
  });

  test("a constant-power load with no operating point → 422 on seriesOhms", async () => {
    const res = await designer.post("/api/insertion", {
      data: { supply: "2.0 V", seriesOhms: "100 ohm", load: { model: "constant-power", current: "200 mA" } },
    });
    await expect422(res, "seriesOhms", /no operating point/);
  });

  test("−20 A flowing back through 1 mΩ from 48 V: 20 mV drop, the load side at 48.02 V (V − I·R)", async () => {
    const res = await designer.post("/api/insertion", {
      data: { supply: "48 V", seriesOhms: "1 mohm", load: { model: "constant-current", current: "-20 A" } },
    });
    expect(res.status()).toBe(200);
    const r = (await res.json()) as Record<string, number>;
    expect(r.currentA).toBe(-20);
    expect(r.burdenV).toBeCloseTo(0.02, 12);
    expect(r.loadVoltageV).toBeCloseTo(48.02, 12);
    expect(r.powerInSeriesW).toBeCloseTo(0.4, 12); // Joule: I²R either way
  });

  test("a resistive load sending current back → 422 on load.model; zero current → 422 on load.current", async () => {
    const back = await designer.post("/api/insertion", {
      data: { supply: "48 V", seriesOhms: "1 mohm", load: { model: "resistive", current: "-2 A" } },
    });
    await expect422(back, "load.model", /cannot send current back/);
    const zero = await designer.post("/api/insertion", {
      data: { supply: "48 V", seriesOhms: "1 mohm", load: { current: "0 A" } },
    });
    await expect422(zero, "load.current", /cannot be zero/);
  });

  test("a current for the series resistance → 422 on seriesOhms", async () => {
    const res = await designer.post("/api/insertion", {
      data: { supply: "2 V", seriesOhms: "2 mA", load: { current: "1 mA" } },
    });
    await expect422(res, "seriesOhms", /is a current, not a resistance/);
  });

  test("signed out → 401", async () => {
    const anon = await apiAs(null);
    expect((await anon.post("/api/insertion", { data: {} })).status()).toBe(401);
    await anon.dispose();
  });
});

test.describe("POST /api/netlist", () => {
  test("text/plain netlist with the fixed node names; ?offset=0 leaves the offset out", async () => {
    const data = { requirement: loggerOneRange, candidate: { shuntOhms: 0.1, gain: 100 } };
    const res = await designer.post("/api/netlist", { data });
    expect(res.status()).toBe(200);
    expect(res.headers()["content-type"]).toContain("text/plain");
    const text = await res.text();
    expect(text).toMatch(/^RSHUNT sp sn 1e-1$/m);
    expect(text).toMatch(/^EAMP out 0 spo sn 1e2$/m);
    expect(text).toMatch(/^\.op$/m);
    const bare = await (await designer.post("/api/netlist?offset=0", { data })).text();
    expect(bare).not.toMatch(/^VOS /m);
    expect(bare).toMatch(/^EAMP out 0 sp sn 1e2$/m);
  });

  test("bad requirement and bad candidate are both named", async () => {
    const res = await designer.post("/api/netlist", {
      data: { requirement: { ...base, current: { min: "3 uA", max: "5 V" } }, candidate: { shuntOhms: -1, gain: 10 } },
    });
    expect(res.status()).toBe(422);
    const body = (await res.json()) as { fieldErrors: Record<string, string[]> };
    expect(Object.keys(body.fieldErrors)).toEqual(
      expect.arrayContaining(["requirement.current.max", "candidate.shuntOhms"]),
    );
  });

  test("a bad offset query → 422 on offset", async () => {
    const res = await designer.post("/api/netlist?offset=maybe", {
      data: { requirement: base, candidate: { shuntOhms: 0.1, gain: 10 } },
    });
    await expect422(res, "offset");
  });
});

test("nothing feasible: the diagnosis's changes, sent back one at a time, give what they promise (issue 11's sensor node)", async () => {
  test.setTimeout(60_000);
  // A copy through JSON, as a client holds it, so one field can be set by its dotted path.
  const sensorNode = JSON.parse(JSON.stringify(sensorNodeInput)) as Record<string, Record<string, unknown>>;
  const res = await designer.post("/api/solve", { data: sensorNode });
  expect(res.status(), await res.text()).toBe(200);
  type Relax = { field: string; to: number; feasibleCount: number; gives: string; rangeCount: number; says: string };
  const body = (await res.json()) as SolveBody & { diagnosis?: { relax: Relax[]; rangePlan: string | null } };
  expect(body.feasibleCount).toBe(0);
  const relax = body.diagnosis?.relax ?? [];
  expect(relax.map((r) => r.field)).toContain("accuracy.percent");
  // Its converter's own error is not stated: the class's typical figures (0.24 % of reading) on top
  // of its 0.87 % of gain-type errors put 1 % out of reach at any band start (lib/design/diagnosis.test.ts).
  expect(relax.map((r) => r.field)).not.toContain("accuracy.bandMin");
  for (const r of relax) {
    const [group, key] = r.field.split(".") as [string, string];
    const changed = { ...sensorNode, [group]: { ...sensorNode[group], [key]: r.to } };
    const again = await designer.post("/api/solve", { data: changed });
    expect(again.status()).toBe(200);
    const got = (await again.json()) as SolveBody;
    expect(got.feasibleCount, r.says).toBe(r.feasibleCount);
    expect(got.rangePlan?.ranges.length ?? 0, r.says).toBe(r.rangeCount);
  }
});
