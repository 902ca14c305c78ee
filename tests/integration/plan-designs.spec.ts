// Range plans as designs over HTTP (issue 13, API.md v2 "Designs"): a plan the engine proposes is
// saved, read back with per-range figures and bench rows, revised, reviewed, exported and imported;
// every unsound plan is refused with 422 naming the range (or switch point) at fault.
import { expect, test, type APIRequestContext } from "@playwright/test";
import { seriesValues } from "../../lib/design/eseries";
import { buildModel } from "../../lib/design/model";
import { pairMask } from "../../lib/design/pair";
import { subModel } from "../../lib/design/range-plan";
import { parseRequirement } from "../../lib/design/requirement";
import { apiAs } from "../fixtures/auth";
import { unique } from "./authz-helpers";
import { demoLoggerReadout } from "../../lib/design/test-helpers";

type Range = { minA: number; maxA: number; shuntOhms: number; gain: number };
type Plan = { ranges: Range[]; switchPoints: { upA: number; downA: number }[] };
type BenchRow = { label: string; currentA: number; expectedV: number; minV: number; maxV: number };
type PlanDesign = {
  id: string;
  kind: string;
  status: string;
  revision: number;
  plan: Plan;
  choice?: unknown;
  benchCheck?: unknown;
  metrics: {
    ranges: (Range & { worstBurdenV: number; switchOhms: number; feasible: boolean; benchCheck: BenchRow[] })[];
    switchRule: string;
    protection: string;
  };
  ranges: (Range & { benchCheck: BenchRow[] })[];
  revisions: { revision: number; kind: string }[];
};

// docs/model.md §6: the demo logger, 3 µA asleep to 180 mA transmitting, on a 3.0 V cell.
const logger = {
  current: { min: "3 uA", max: "180 mA" },
  supply: { voltage: "3.0 V", side: "low" },
  drop: { max: "60 mV" },
  ...demoLoggerReadout, // its converter's own error stated and zeroed once (db/seed/designs.ts)
  resolution: { countsAtMin: 10 },
};

let designer: APIRequestContext;
let reviewer: APIRequestContext;
let maker: APIRequestContext;
let plan: Plan;

/** The plan the product's own solver proposes (POST /api/solve), as a designer would save it. */
async function proposedPlan(as: APIRequestContext, requirement: unknown): Promise<Plan> {
  const res = await as.post("/api/solve", { data: requirement });
  expect(res.status()).toBe(200);
  const body = (await res.json()) as { rangePlan: (Plan & { ranges: Range[] }) | null };
  if (!body.rangePlan) throw new Error("the solver proposed no range plan");
  return {
    ranges: body.rangePlan.ranges.map(({ minA, maxA, shuntOhms, gain }) => ({ minA, maxA, shuntOhms, gain })),
    switchPoints: body.rangePlan.switchPoints.map(({ upA, downA }) => ({ upA, downA })),
  };
}

const edited = (p: Plan, change: (x: Plan) => void): Plan => {
  const copy = structuredClone(p);
  change(copy);
  return copy;
};

async function save(as: APIRequestContext, name: string, body: Record<string, unknown>) {
  return as.post("/api/designs", { data: { name, project: "Soil-moisture logger", requirement: logger, ...body } });
}

async function refusedAt(body: Record<string, unknown>, requirement: unknown = logger) {
  const res = await designer.post("/api/designs", { data: { name: `Refused ${unique()}`, requirement, ...body } });
  expect(res.status(), await res.text()).toBe(422);
  const json = (await res.json()) as { message: string; fieldErrors: Record<string, string[]> };
  return { paths: Object.keys(json.fieldErrors), message: json.message, fieldErrors: json.fieldErrors };
}

test.describe.configure({ mode: "serial" });

test.beforeAll(async () => {
  [designer, reviewer, maker] = await Promise.all([apiAs("designer"), apiAs("reviewer"), apiAs("maker")]);
  plan = await proposedPlan(designer, logger);
});

test.afterAll(async () => {
  await Promise.all([designer.dispose(), reviewer.dispose(), maker.dispose()]);
});

let id: string;
const savedName = `Logger plan ${unique()}`;

test("a plan is saved and read back with per-range figures and bench rows from the engine", async () => {
  const res = await save(designer, savedName, { plan });
  expect(res.status(), await res.text()).toBe(201);
  const created = (await res.json()) as { id: string; revision: number; status: string };
  expect(created).toMatchObject({ revision: 1, status: "draft" });
  id = created.id;
  const d = (await (await designer.get(`/api/designs/${id}`)).json()) as PlanDesign;
  expect(d.kind).toBe("plan");
  expect(d.plan).toEqual(plan);
  expect(d.choice).toBeUndefined();
  expect(d.benchCheck).toBeUndefined();
  expect(d.metrics.ranges).toHaveLength(plan.ranges.length);
  expect(d.metrics.protection).toMatch(/comparator/);
  expect(d.metrics.switchRule).toMatch(/hysteresis/);
  d.metrics.ranges.forEach((r, k) => {
    const c = plan.ranges[k]!;
    expect(r.feasible).toBe(true);
    // Ohm's law at the range's top, constant-current load: I·(R + Ron), within the allowed 60 mV.
    expect(r.worstBurdenV).toBeCloseTo(c.maxA * (c.shuntOhms + r.switchOhms), 12);
    expect(r.worstBurdenV).toBeLessThanOrEqual(0.06 * (1 + 1e-9));
    // The bench rows of each range, at GET's ranges[k].benchCheck: expected output I·R·G.
    const rows = d.ranges[k]!.benchCheck;
    expect(rows.length).toBeGreaterThanOrEqual(3);
    for (const row of rows) expect(row.expectedV).toBeCloseTo(row.currentA * c.shuntOhms * c.gain, 12);
    expect(rows).toEqual(r.benchCheck);
  });
  // The list says it is a range plan.
  const list = (await (await designer.get(`/api/designs?q=${encodeURIComponent("Logger plan")}`)).json()) as {
    designs: { id: string; planRanges: number | null; shuntOhms: number | null }[];
  };
  const row = list.designs.find((x) => x.id === id);
  expect(row).toMatchObject({ planRanges: plan.ranges.length, shuntOhms: null });
});

test("a moved switch point makes a revision, the same plan makes none, a stale one is refused with 409", async () => {
  const moved = edited(plan, (p) => {
    const s = p.switchPoints[0]!;
    s.downA = (p.ranges[1]!.minA + s.upA) / 2;
  });
  const r2 = await designer.patch(`/api/designs/${id}`, { data: { revision: 1, plan: moved } });
  expect(r2.status(), await r2.text()).toBe(200);
  expect(await r2.json()).toEqual({ revision: 2 });
  const same = await designer.patch(`/api/designs/${id}`, { data: { revision: 2, plan: moved } });
  expect(await same.json()).toEqual({ revision: 2, unchanged: true });
  const before = await (await designer.get(`/api/designs/${id}`)).json();
  const stale = await designer.patch(`/api/designs/${id}`, { data: { revision: 1, plan } });
  expect(stale.status()).toBe(409);
  expect(await (await designer.get(`/api/designs/${id}`)).json()).toEqual(before);
  // The diff says what moved, in words.
  const diff = (await (await designer.get(`/api/designs/${id}/revisions?a=1&b=2`)).json()) as {
    changes: { group: string; path: string; label: string; aText: string; bText: string }[];
  };
  const change = diff.changes.find((c) => c.group === "plan");
  expect(change).toMatchObject({ path: "switchPoints.0.downA", label: "Switch point 1, switching down below" });
  expect(change?.bText).toMatch(/A$/);
  expect(diff.changes.filter((c) => c.group === "plan")).toHaveLength(1);
  // An unsound edit changes nothing and names the range at fault.
  const bad = await designer.patch(`/api/designs/${id}`, {
    data: { revision: 2, plan: edited(moved, (p) => void (p.ranges[0]!.minA = 5e-6)) },
  });
  expect(bad.status()).toBe(422);
  expect(Object.keys((await bad.json()).fieldErrors)).toEqual(["plan.ranges.0.minA"]);
  expect(((await (await designer.get(`/api/designs/${id}`)).json()) as PlanDesign).revision).toBe(2);
});

test("a plan design goes through review: submit, approve", async () => {
  const submit = await designer.post(`/api/designs/${id}/submit`, { data: {} });
  expect(submit.status()).toBe(200);
  const approve = await reviewer.post(`/api/designs/${id}/reviews`, {
    data: { verdict: "approve", body: "Each range works on its own span; approved." },
  });
  expect(approve.status(), await approve.text()).toBe(201);
  const d = (await (await maker.get(`/api/designs/${id}`)).json()) as PlanDesign;
  expect(d).toMatchObject({ status: "approved", revision: 2, kind: "plan" });
  expect(d.revisions.map((r) => r.kind)).toEqual(["plan", "plan"]);
  // The mail to reviewers describes the plan range by range (sent after the response: poll, bounded).
  const owner = await apiAs("owner");
  const requested = async () =>
    (
      (await (await owner.get("/api/outbox")).json()) as { messages: { to: string; subject: string; text: string }[] }
    ).messages.find((m) => m.subject.includes(savedName) && m.to === "reviewer@harbourline.example");
  await expect
    .poll(async () => (await requested())?.text ?? "", { timeout: 10_000 })
    .toContain(`A range plan of ${plan.ranges.length} ranges`);
  expect((await requested())?.text).toMatch(/Range 1: 3 µA to /);
  await owner.dispose();
});

test("the parts of the build that read one pair say so with 422, never a 500", async () => {
  // The build sheet, netlist, parts list and profiles read plans now (tests/integration/plan-build.spec.ts).
  for (const path of ["units"]) {
    const res = await designer.get(`/api/designs/${id}/${path}`);
    expect(res.status(), path).toBe(422);
    expect((await res.json()).message).toMatch(/not available for a range plan yet/);
  }
  const unit = await maker.post(`/api/designs/${id}/units`, {
    data: { serial: "PLAN-001", readings: [{ currentA: 1e-3, outputV: 1 }] },
  });
  expect(unit.status()).toBe(422);
});

test("export and import round-trip the plan; an unsound plan in a file is refused with 422", async () => {
  const file = (await (await designer.get(`/api/designs/${id}/export`)).json()) as Record<string, unknown> & {
    plan: Plan;
  };
  expect(file).toMatchObject({ format: "sensewright-design", version: 1 });
  expect(file.choice).toBeUndefined();
  const source = (await (await designer.get(`/api/designs/${id}`)).json()) as PlanDesign;
  expect(file.plan).toEqual(source.plan);
  const name = `Imported plan ${unique()}`;
  const imported = await designer.post("/api/designs/import", { data: { ...file, name } });
  expect(imported.status(), await imported.text()).toBe(201);
  const copy = (await (await designer.get(`/api/designs/${(await imported.json()).id}`)).json()) as PlanDesign;
  expect(copy).toMatchObject({ kind: "plan", status: "draft", revision: 1 });
  expect(copy.plan).toEqual(source.plan);
  expect(copy.metrics).toEqual(source.metrics);
  const unsound = edited(file.plan, (p) => void (p.switchPoints[0]!.upA = p.ranges[0]!.maxA * 1.2));
  const refused = await designer.post("/api/designs/import", {
    data: { ...file, name: `Unsound ${unique()}`, plan: unsound },
  });
  expect(refused.status()).toBe(422);
  expect(Object.keys((await refused.json()).fieldErrors)).toEqual(["plan.switchPoints.0.upA"]);
});

test("a plan and a pair compare side by side", async () => {
  const pair = await designer.get("/api/designs?q=radio-burst");
  const other = ((await pair.json()) as { designs: { id: string }[] }).designs[0];
  expect(other).toBeDefined();
  const res = await designer.get(`/api/compare?ids=${id},${other!.id}`);
  expect(res.status()).toBe(200);
  const body = (await res.json()) as { designs: { kind: string; plan?: Plan; choice?: unknown; metrics: object }[] };
  expect(body.designs.map((d) => d.kind)).toEqual(["plan", "pair"]);
  expect(body.designs[0]!.plan?.ranges.length).toBe(plan.ranges.length);
  expect(body.designs[1]!.choice).toBeDefined();
});

test("the same Idempotency-Key saves a plan once", async () => {
  const key = `plan-${unique()}`;
  const name = `Idempotent plan ${unique()}`;
  const headers = { "Idempotency-Key": key };
  const data = { name, requirement: logger, plan };
  const first = await designer.post("/api/designs", { data, headers });
  const again = await designer.post("/api/designs", { data, headers });
  expect(first.status()).toBe(201);
  expect(await again.json()).toEqual(await first.json());
  const list = (await (await designer.get(`/api/designs?q=${encodeURIComponent(name)}`)).json()) as {
    designs: unknown[];
  };
  expect(list.designs).toHaveLength(1);
});

test.describe("every unsound plan is refused with 422 on the range at fault", () => {
  const top = () => plan.ranges.length - 1;

  test("choice and plan together, or neither", async () => {
    const both = await refusedAt({ plan, choice: { shuntOhms: 0.274, gain: 50 } });
    expect(both.paths).toEqual(["plan"]);
    const neither = await refusedAt({});
    expect(neither.paths).toEqual(["choice"]);
  });

  test("a shunt outside the sweep (275 is not an E96 value; IEC 60063)", async () => {
    const r = await refusedAt({ plan: edited(plan, (p) => void (p.ranges[top()]!.shuntOhms = 0.275)) });
    expect(r.paths).toEqual([`plan.ranges.${top()}.shuntOhms`]);
  });

  test("a range infeasible on its own span, with the constraint in words", async () => {
    // The middle range's shunt on the top span: 180 mA through it drops far more than 60 mV (Ohm's law).
    const mid = plan.ranges[1]!;
    expect(0.18 * mid.shuntOhms).toBeGreaterThan(0.06);
    const r = await refusedAt({
      plan: edited(plan, (p) => Object.assign(p.ranges[top()]!, { shuntOhms: mid.shuntOhms, gain: mid.gain })),
    });
    expect(r.paths).toEqual([`plan.ranges.${top()}`]);
    expect(r.message).toMatch(/drop over the limit/);
  });

  test("ranges that do not cover the span", async () => {
    const r = await refusedAt({ plan: edited(plan, (p) => void (p.ranges[top()]!.maxA = 0.15)) });
    expect(r.paths).toEqual([`plan.ranges.${top()}.maxA`]);
    expect(r.message).toMatch(/180 mA/);
  });

  test("ranges that do not overlap", async () => {
    const r = await refusedAt({ plan: edited(plan, (p) => void (p.ranges[1]!.minA = p.ranges[0]!.maxA * 1.1)) });
    expect(r.paths).toEqual(["plan.ranges.1.minA"]);
    expect(r.message).toMatch(/do not overlap/);
  });

  test("a switch point outside the overlap, and one switching down above switching up", async () => {
    const outside = await refusedAt({
      plan: edited(plan, (p) => void (p.switchPoints[1]!.downA = p.ranges[2]!.minA * 0.5)),
    });
    expect(outside.paths).toEqual(["plan.switchPoints.1.downA"]);
    const crossed = await refusedAt({
      plan: edited(plan, (p) => {
        const t = p.ranges[0]!.maxA;
        Object.assign(p.switchPoints[0]!, { upA: 0.9 * t, downA: 0.95 * t });
      }),
    });
    expect(crossed.paths).toEqual(["plan.switchPoints.0.downA"]);
    expect(crossed.message).toMatch(/must be below switching up/);
  });

  test("a low range unprotected at the span's full current", async () => {
    // Only 100 mW parts, used to 6 % of their rating: at most 6 mW in any shunt.
    const tight = { ...logger, shunt: { ratings: ["100 mW"], derating: 0.06 } };
    const p = await proposedPlan(designer, tight);
    const parsed = parseRequirement(tight);
    if (!parsed.ok) throw new Error(parsed.message);
    const req = parsed.requirement;
    const mid = p.ranges[1]!;
    const sub = subModel(req, buildModel(req), mid.minA, mid.maxA);
    // A pair that works on the middle span but would burn before the bypass closes.
    const weak = seriesValues(req.shunt.series, req.shunt.min, req.shunt.max)
      .flatMap((R) => req.amplifier.gains.map((G) => ({ R, G })))
      .find(({ R, G }) => pairMask({ ...sub, clampV: 0 }, R, G).mask === 0 && pairMask(sub, R, G).mask !== 0);
    if (!weak) throw new Error("no such pair in the sweep");
    // Independent arithmetic: 60 mV/(R + Ron) through R (Ohm's law), I²·R (Joule) over 100 mW · 0.06.
    const fault = 0.06 / (weak.R + req.rangeSwitch.onResistance);
    expect(fault * fault * weak.R).toBeGreaterThan(0.1 * 0.06);
    const r = await refusedAt(
      { plan: edited(p, (x) => Object.assign(x.ranges[1]!, { shuntOhms: weak.R, gain: weak.G })) },
      tight,
    );
    expect(r.paths).toEqual(["plan.ranges.1"]);
    expect(r.message).toMatch(/unprotected at the span's full current 180 mA/);
  });

  test("a plan that is not a plan: one range, a missing switch point, a number that is not a current", async () => {
    const one = await refusedAt({ plan: { ranges: plan.ranges.slice(0, 1), switchPoints: [] } });
    expect(one.paths).toEqual(["plan.ranges"]);
    const missing = await refusedAt({ plan: { ...plan, switchPoints: [] } });
    expect(missing.paths).toEqual(["plan.switchPoints"]);
    const volts = await refusedAt({
      plan: { ...plan, ranges: [{ ...plan.ranges[0], maxA: "2 V" }, ...plan.ranges.slice(1)] },
    });
    expect(volts.paths).toEqual(["plan.ranges.0.maxA"]);
  });
});
