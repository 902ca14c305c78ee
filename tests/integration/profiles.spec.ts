// HTTP checks of current-profile uploads: every refusal is 422 naming the row and the column and
// stores nothing (the list is counted before and after), 413 over 10 MB, roles, and a good summary.
import { expect, test, type APIRequestContext } from "@playwright/test";
import { apiAs } from "../fixtures/auth";
import { createProfileDesign, uploadCsv, type SavedDesign } from "./profiles-helpers";

let designer: APIRequestContext;
let owner: APIRequestContext;
let maker: APIRequestContext;
let reviewer: APIRequestContext;
let design: SavedDesign;

test.beforeAll(async () => {
  [designer, owner, maker, reviewer] = await Promise.all([
    apiAs("designer"),
    apiAs("owner"),
    apiAs("maker"),
    apiAs("reviewer"),
  ]);
  design = await createProfileDesign(designer, `Profile checks ${Date.now()}`);
});
test.afterAll(async () => {
  await Promise.all([designer, owner, maker, reviewer].map((c) => c.dispose()));
});

async function count(): Promise<number> {
  const res = await designer.get(`/api/designs/${design.id}/profiles`);
  expect(res.status()).toBe(200);
  return ((await res.json()) as { profiles: unknown[] }).profiles.length;
}

type Refusal = { message: string; row?: number; line?: number; column?: string; fieldErrors: Record<string, string[]> };

const refusals: { what: string; csv: string; row?: number; line?: number; column: string | undefined; text: RegExp }[] =
  [
    {
      what: "a missing current column",
      csv: "time\n0\n1\n",
      line: 1,
      column: "current",
      text: /current column is missing/,
    },
    {
      what: "a missing time column",
      csv: "current (mA)\n1\n2\n",
      line: 1,
      column: "time",
      text: /time column is missing/,
    },
    {
      what: "an unknown column",
      csv: "time,current,temperature\n0,1,20\n1,2,21\n",
      line: 1,
      column: "temperature",
      text: /not a column this file may have/,
    },
    {
      what: "an unknown unit",
      csv: "time (fortnights),current\n0,1\n1,2\n",
      line: 1,
      column: "time (fortnights)",
      text: /unit "fortnights" is not a known unit of time/,
    },
    {
      what: "a unit of the wrong dimension",
      csv: "time (s),current [V]\n0,1\n1,2\n",
      line: 1,
      column: "current [V]",
      text: /unit "V" is a voltage, not a current/,
    },
    {
      what: "a cell that is not a number",
      csv: "time,current\n0,1\n1,2\n2,lots\n",
      row: 3,
      line: 4,
      column: "current",
      text: /"lots" is not a number/,
    },
    { what: "NaN", csv: "time,current\n0,1\n1,NaN\n", row: 2, line: 3, column: "current", text: /not a finite number/ },
    { what: "infinity", csv: "t,i\n0,1\nInfinity,2\n", row: 2, line: 3, column: "t", text: /not a finite number/ },
    {
      what: "time that does not increase",
      csv: "time (ms),current (uA)\n0,5\n10,6\n10,7\n",
      row: 3,
      line: 4,
      column: "time (ms)",
      text: /time must increase/,
    },
    {
      what: "fewer than two rows",
      csv: "time,current\n0,1\n",
      row: 1,
      line: undefined,
      column: undefined,
      text: /at least two/,
    },
  ];

test.describe("refused files store nothing", () => {
  for (const r of refusals) {
    test(`${r.what} → 422 naming the place`, async () => {
      const before = await count();
      const res = await uploadCsv(designer, design.id, "bad.csv", r.csv);
      expect(res.status(), await res.text()).toBe(422);
      const body = (await res.json()) as Refusal;
      expect(body.message).toMatch(r.text);
      expect(body.message).toMatch(/Nothing was stored/);
      expect(body.fieldErrors.file?.length).toBe(1);
      if (r.column !== undefined) {
        expect(body.column).toBe(r.column);
        expect(body.message).toContain(`column "${r.column}"`);
      }
      if (r.row !== undefined) {
        expect(body.row).toBe(r.row);
        expect(body.message).toContain(`Data row ${r.row}`);
      }
      if (r.line !== undefined) expect(body.line).toBe(r.line);
      expect(await count()).toBe(before);
    });
  }

  test("an 11 MB file → 413, nothing stored", async () => {
    const before = await count();
    const row = "0.000000001,0.000000001\n";
    const big = Buffer.from(`time,current\n${row.repeat(Math.ceil(11_000_000 / row.length))}`);
    expect(big.byteLength).toBeGreaterThan(11_000_000);
    const res = await uploadCsv(designer, design.id, "big.csv", big);
    expect(res.status()).toBe(413);
    expect(((await res.json()) as { message: string }).message).toMatch(/larger than 10 MB/);
    expect(await count()).toBe(before);
  });

  test("an 11 MB body sent without Content-Length → 413 while it streams in, nothing stored", async () => {
    const before = await count();
    const { cookies } = await designer.storageState();
    const cookie = cookies.map((c) => `${c.name}=${c.value}`).join("; ");
    const chunk = new TextEncoder().encode("0.000000001,0.000000001\n".repeat(40_000)); // ~1 MB
    let sent = 0;
    const body = new ReadableStream<Uint8Array>({
      start(controller) {
        controller.enqueue(new TextEncoder().encode("time,current\n"));
      },
      pull(controller) {
        if (sent >= 11) return controller.close();
        sent += 1;
        controller.enqueue(chunk);
      },
    });
    const { baseURL } = test.info().project.use;
    const res = await fetch(`${baseURL}/api/designs/${design.id}/profiles?name=streamed.csv`, {
      method: "POST",
      headers: { "content-type": "text/csv", cookie },
      body,
      duplex: "half",
    } as RequestInit);
    expect(res.status).toBe(413);
    expect(await count()).toBe(before);
  });

  test("a form without the file field → 422", async () => {
    const res = await designer.post(`/api/designs/${design.id}/profiles`, { multipart: { other: "x" } });
    expect(res.status()).toBe(422);
    expect(((await res.json()) as Refusal).fieldErrors.file).toBeTruthy();
  });
});

test.describe("who may upload", () => {
  test("a maker's upload is refused with 403", async () => {
    const before = await count();
    const res = await uploadCsv(maker, design.id, "maker.csv", "time,current\n0,1\n1,2\n");
    expect(res.status()).toBe(403);
    expect(((await res.json()) as { message: string }).message).toMatch(/Only owners and designers may upload/);
    expect(await count()).toBe(before);
  });

  test("a reviewer's upload is refused with 403", async () => {
    expect((await uploadCsv(reviewer, design.id, "r.csv", "time,current\n0,1\n1,2\n")).status()).toBe(403);
  });

  test("signed out is 401; a design that is not the team's is 404", async () => {
    const anon = await apiAs(null);
    expect((await uploadCsv(anon, design.id, "a.csv", "time,current\n0,1\n1,2\n")).status()).toBe(401);
    await anon.dispose();
    expect(
      (await uploadCsv(designer, "00000000-0000-4000-8000-000000000000", "a.csv", "time,current\n0,1\n1,2\n")).status(),
    ).toBe(404);
    expect((await designer.get("/api/designs/not-a-uuid/profiles")).status()).toBe(404);
  });
});

test.describe("a good upload", () => {
  test("returns the summary by the issue's definitions, lists it, serves its series, and deletes by the rules", async () => {
    const R = design.choice.shuntOhms;
    const G = design.choice.gain;
    const fs = design.requirement.readout.fullScale;
    const lsb = design.metrics.lsbA;
    const supply = design.requirement.supply.voltage;
    const clip = fs / (R * G);
    // Samples (ms, µA): a sleep below one step, a burst past full scale, back to a mid current.
    const currents = [lsb / 2, 0.05, clip * 1.5, 0.05, lsb / 2];
    const times = [0, 10, 20, 30, 40]; // ms
    const csv = `Time (ms),Current [uA]\n${times.map((t, k) => `${t},${currents[k]! * 1e6}`).join("\n")}\n`;
    const before = await count();
    const res = await uploadCsv(designer, design.id, "burst.csv", csv);
    expect(res.status(), await res.text()).toBe(201);
    const body = (await res.json()) as { id: string; samples: number; summary: Record<string, number> };
    expect(body.samples).toBe(5);
    const s = body.summary;
    let charge = 0;
    for (let k = 1; k < 5; k++)
      charge += ((currents[k - 1]! + currents[k]!) / 2) * ((times[k]! - times[k - 1]!) / 1000);
    expect(s.samples).toBe(5);
    expect(s.durationS).toBeCloseTo(0.04, 12);
    expect(s.chargeC).toBeCloseTo(charge, 9);
    expect(s.averageCurrentA).toBeCloseTo(charge / 0.04, 9);
    expect(s.peakCurrentA).toBeCloseTo(clip * 1.5, 9);
    expect(s.maxBurdenV).toBeCloseTo(clip * 1.5 * R, 9);
    expect(s.minLoadVoltageV).toBeCloseTo(supply - clip * 1.5 * R, 9);
    expect(s.clippedPercent).toBeCloseTo(20, 9); // 1 of 5
    expect(s.belowResolutionPercent).toBeCloseTo(40, 9); // 2 of 5
    expect(await count()).toBe(before + 1);

    const detail = await designer.get(`/api/designs/${design.id}/profiles/${body.id}?width=100`);
    expect(detail.status()).toBe(200);
    const d = (await detail.json()) as {
      series: { tS: number[]; currentA: number[]; clipped: unknown[]; belowStep: unknown[] };
      fileName: string;
    };
    expect(d.fileName).toBe("burst.csv");
    expect(d.series.tS).toHaveLength(5);
    expect(d.series.clipped.length).toBe(1);
    expect(d.series.belowStep.length).toBe(2);
    const zoomed = (await (
      await designer.get(`/api/designs/${design.id}/profiles/${body.id}?from=0.015&to=0.025&width=100`)
    ).json()) as { series: { tS: number[] } };
    expect(zoomed.series.tS).toEqual([0.01, 0.02, 0.03]); // the window plus one sample either side
    expect((await designer.get(`/api/designs/${design.id}/profiles/${body.id}?width=abc`)).status()).toBe(422);

    // Members read it; only the uploader or an owner deletes it.
    expect((await reviewer.get(`/api/designs/${design.id}/profiles/${body.id}`)).status()).toBe(200);
    expect((await reviewer.delete(`/api/designs/${design.id}/profiles/${body.id}`)).status()).toBe(403);
    expect((await designer.delete(`/api/designs/${design.id}/profiles/${body.id}`)).status()).toBe(200);
    expect(await count()).toBe(before);
    expect((await designer.get(`/api/designs/${design.id}/profiles/${body.id}`)).status()).toBe(404);

    const again = (await (await uploadCsv(designer, design.id, "again.csv", csv)).json()) as { id: string };
    expect((await owner.delete(`/api/designs/${design.id}/profiles/${again.id}`)).status()).toBe(200);
  });

  test("takes a bare text/csv body too", async () => {
    const res = await designer.post(`/api/designs/${design.id}/profiles?name=bare.csv`, {
      headers: { "content-type": "text/csv" },
      data: "t,i\n0,0.001\n1,0.002\n",
    });
    expect(res.status(), await res.text()).toBe(201);
    const { id, summary } = (await res.json()) as { id: string; summary: { chargeC: number } };
    expect(summary.chargeC).toBeCloseTo(0.0015, 12); // (1 mA + 2 mA)/2 × 1 s
    expect((await designer.delete(`/api/designs/${design.id}/profiles/${id}`)).status()).toBe(200);
  });
});
