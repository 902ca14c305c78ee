// Built units over HTTP: record, judge, calibrate, import, edit, delete and export — and every
// refusal (wrong dimension, duplicate serial, a design not approved, a missing test point, a
// maker touching someone else's unit, a CSV refused whole) leaving nothing half-stored.
import { expect, test, type APIRequestContext } from "@playwright/test";
import Papa from "papaparse";
import { apiAs } from "../fixtures/auth";
import { approveDesign, createDesign, submitDesign, unique } from "./authz-helpers";

type Bench = { label: string; currentA: number; expectedV: number; minV: number; maxV: number }[];
type Unit = {
  id: string;
  serial: string;
  pass: boolean;
  revision: number;
  recordedByName: string;
  cause: string | null;
  readings: { currentA: number; outputV: number; expectedV: number; minV: number; maxV: number; inBand: boolean }[];
  calibration: { gain: number; offsetV: number; residualPercent: number };
};
type List = { units: Unit[]; yield: { measured: number | null; predicted: number | null } };

let designer: APIRequestContext;
let maker: APIRequestContext;
let reviewer: APIRequestContext;
let owner: APIRequestContext;
let id = "";
let draft = "";
let bench: Bench = [];

/** Readings "as written on the sheet": the expected output times `factor`, as millivolt strings. */
const readingsAt = (factor: number, offsetV = 0) =>
  bench.map((b) => ({ currentA: b.currentA, outputV: `${((b.expectedV * factor + offsetV) * 1000).toFixed(2)} mV` }));

const units = async (as = designer) => (await (await as.get(`/api/designs/${id}/units`)).json()) as List;

async function expect422(res: Awaited<ReturnType<APIRequestContext["post"]>>, field: string, text: RegExp) {
  expect(res.status(), await res.text()).toBe(422);
  const body = (await res.json()) as { message: string; fieldErrors?: Record<string, string[]> };
  expect(Object.keys(body.fieldErrors ?? {})).toContain(field);
  expect(body.fieldErrors?.[field]?.join(" ") ?? body.message).toMatch(text);
}

test.describe.serial("built units", () => {
  test.beforeAll(async () => {
    [designer, maker, reviewer, owner] = await Promise.all([
      apiAs("designer"),
      apiAs("maker"),
      apiAs("reviewer"),
      apiAs("owner"),
    ]);
    id = await createDesign(designer, `Units ${unique()}`);
    await submitDesign(designer, id);
    await approveDesign(reviewer, id);
    draft = await createDesign(designer, `Units draft ${unique()}`);
  });
  test.afterAll(async () => {
    await Promise.all([designer, maker, reviewer, owner].map((c) => c?.dispose()));
  });

  test("GET /api/designs/[id] carries the bench check the units are judged against", async () => {
    const d = (await (await maker.get(`/api/designs/${id}`)).json()) as { benchCheck: Bench };
    bench = d.benchCheck;
    expect(bench.map((b) => b.currentA)).toEqual([0.002, 0.018, 0.09, 0.18]);
    for (const b of bench) expect(b.minV).toBeLessThan(b.expectedV);
  });

  test("a maker records a good unit: 201, every reading in band, a calibration near 1 and 0", async () => {
    const res = await maker.post(`/api/designs/${id}/units`, {
      data: { serial: `GOOD-${unique()}`, readings: readingsAt(1.001) },
    });
    expect(res.status(), await res.text()).toBe(201);
    const u = (await res.json()) as Unit;
    expect(u).toMatchObject({ pass: true, cause: null, revision: 1, recordedByName: "Demo Maker" });
    expect(u.readings.every((r) => r.inBand)).toBe(true);
    expect(u.calibration.gain).toBeCloseTo(1 / 1.001, 4);
    expect(Math.abs(u.calibration.offsetV)).toBeLessThan(1e-4);
  });

  test("an out-of-band unit gets its likely cause", async () => {
    const res = await maker.post(`/api/designs/${id}/units`, {
      data: { serial: `HIGH-${unique()}`, readings: readingsAt(1.098) },
    });
    expect(res.status()).toBe(201);
    const u = (await res.json()) as Unit;
    expect(u.pass).toBe(false);
    expect(u.cause).toMatch(/Readings are 9\.8 % high at every current/);
    expect(u.readings.some((r) => !r.inBand)).toBe(true);
  });

  test("a reading with the wrong dimension is 422 naming the field; nothing stored", async () => {
    const before = (await units()).units.length;
    const readings = readingsAt(1);
    readings[1] = { currentA: bench[1]!.currentA, outputV: "164 mA" };
    await expect422(
      await maker.post(`/api/designs/${id}/units`, { data: { serial: `DIM-${unique()}`, readings } }),
      "readings.1.outputV",
      /164 mA is a current, not a voltage/,
    );
    await expect422(
      await maker.post(`/api/designs/${id}/units`, {
        data: { serial: `DIM-${unique()}`, readings: [{ currentA: "2 mV", outputV: 0.01 }] },
      }),
      "readings.0.currentA",
      /is a voltage, not a current/,
    );
    expect((await units()).units.length).toBe(before);
  });

  test("a missing test point, an unknown one and an unapproved revision are refused", async () => {
    await expect422(
      await maker.post(`/api/designs/${id}/units`, {
        data: { serial: `MISS-${unique()}`, readings: readingsAt(1).slice(1) },
      }),
      "readings",
      /no reading at minimum current/,
    );
    const odd = readingsAt(1);
    odd[0] = { currentA: 0.005, outputV: "10 mV" };
    await expect422(
      await maker.post(`/api/designs/${id}/units`, { data: { serial: `ODD-${unique()}`, readings: odd } }),
      "readings.0.currentA",
      /5 mA is not a test point/,
    );
    await expect422(
      await maker.post(`/api/designs/${id}/units`, {
        data: { serial: `REV-${unique()}`, revision: 7, readings: readingsAt(1) },
      }),
      "revision",
      /no such revision/,
    );
  });

  test("a duplicate serial (any case) is 422 on serial", async () => {
    const serial = `DUP-${unique()}`;
    expect((await maker.post(`/api/designs/${id}/units`, { data: { serial, readings: readingsAt(1) } })).status()).toBe(
      201,
    );
    await expect422(
      await designer.post(`/api/designs/${id}/units`, {
        data: { serial: serial.toLowerCase(), readings: readingsAt(1) },
      }),
      "serial",
      /already on this design/,
    );
  });

  test("a design that is not approved takes no units: 422 for its editors, 404 for makers", async () => {
    await expect422(
      await designer.post(`/api/designs/${draft}/units`, {
        data: { serial: "D-1", readings: [{ currentA: 0.18, outputV: 2.4 }] },
      }),
      "revision",
      /not approved/,
    );
    expect(
      (
        await maker.post(`/api/designs/${draft}/units`, {
          data: { serial: "D-1", readings: [{ currentA: 0.18, outputV: 2.4 }] },
        })
      ).status(),
    ).toBe(404);
    expect(
      (await reviewer.post(`/api/designs/${id}/units`, { data: { serial: "R-1", readings: readingsAt(1) } })).status(),
    ).toBe(403);
  });

  test("a maker edits their own unit but not a designer's, and deletes only their own", async () => {
    const mine = (await (
      await maker.post(`/api/designs/${id}/units`, { data: { serial: `M-${unique()}`, readings: readingsAt(1) } })
    ).json()) as Unit;
    const theirs = (await (
      await designer.post(`/api/designs/${id}/units`, { data: { serial: `DS-${unique()}`, readings: readingsAt(1) } })
    ).json()) as Unit;
    const edited = await maker.patch(`/api/designs/${id}/units/${mine.id}`, { data: { readings: readingsAt(1.098) } });
    expect(edited.status(), await edited.text()).toBe(200);
    expect(((await edited.json()) as Unit).pass).toBe(false);
    const refused = await maker.patch(`/api/designs/${id}/units/${theirs.id}`, { data: { builtOn: "2026-11-30" } });
    expect(refused.status()).toBe(403);
    expect(((await refused.json()) as { message: string }).message).toMatch(/only the units they recorded/);
    expect((await maker.delete(`/api/designs/${id}/units/${theirs.id}`)).status()).toBe(403);
    // A refused edit changes nothing: bad readings leave the stored ones as they were.
    const bad = readingsAt(1);
    bad[0] = { currentA: bench[0]!.currentA, outputV: "12 ohm" };
    await expect422(
      await maker.patch(`/api/designs/${id}/units/${mine.id}`, { data: { readings: bad } }),
      "readings.0.outputV",
      /resistance/,
    );
    const again = (await (await maker.get(`/api/designs/${id}/units/${mine.id}`)).json()) as Unit;
    expect(again.pass).toBe(false);
    expect((await maker.delete(`/api/designs/${id}/units/${mine.id}`)).status()).toBe(200);
    expect((await designer.delete(`/api/designs/${id}/units/${theirs.id}`)).status()).toBe(200);
    expect((await maker.get(`/api/designs/${id}/units/${mine.id}`)).status()).toBe(404);
  });

  test("a CSV import is all or nothing, naming the row and column it refuses", async () => {
    const before = (await units()).units.length;
    const header = ["serial", "date", ...bench.map((b) => b.label)].join(",");
    const row = (serial: string, factor: number) =>
      [serial, "2026-11-25", ...bench.map((b) => `${(b.expectedV * factor * 1000).toFixed(2)} mV`)].join(",");
    const tag = unique();
    const badFile = [
      header,
      row(`CSV-${tag}-1`, 1),
      row(`CSV-${tag}-2`, 1),
      `CSV-${tag}-3,2026-11-25,1 mV,2 mA,3 mV,4 mV`,
    ].join("\n");
    const res = await maker.post(`/api/designs/${id}/units/import`, {
      multipart: { file: { name: "units.csv", mimeType: "text/csv", buffer: Buffer.from(badFile) } },
    });
    expect(res.status()).toBe(422);
    const body = (await res.json()) as { message: string; row: number; column: string };
    expect(body).toMatchObject({ row: 3, column: bench[1]!.label });
    expect(body.message).toMatch(/Nothing was stored/);
    expect((await units()).units.length).toBe(before);

    const good = [header, row(`CSV-${tag}-1`, 1), row(`=CSV-${tag}-2`, 1.2)].join("\r\n");
    const ok = await maker.post(`/api/designs/${id}/units/import`, {
      multipart: { file: { name: "units.csv", mimeType: "text/csv", buffer: Buffer.from(good) } },
    });
    expect(ok.status(), await ok.text()).toBe(201);
    expect(((await ok.json()) as { imported: number }).imported).toBe(2);
    // The same serial again: refused on its row, nothing of the file stored.
    const dupFile = [header, row(`CSV-${tag}-9`, 1), row(`csv-${tag}-1`, 1)].join("\n");
    const dup = await maker.post(`/api/designs/${id}/units/import`, {
      multipart: { file: { name: "units.csv", mimeType: "text/csv", buffer: Buffer.from(dupFile) } },
    });
    expect(dup.status()).toBe(422);
    expect(await dup.json()).toMatchObject({ row: 2, column: "serial" });
    expect((await units()).units.length).toBe(before + 2);
  });

  test("the calibration exports list every unit with its gain and offset, formula cells neutralised", async () => {
    const list = await units(maker);
    expect(list.yield.measured).toBeGreaterThan(0);
    expect(list.yield.measured).toBeLessThan(1);
    expect(list.yield.predicted).toBeGreaterThan(0.99);
    const csvRes = await maker.get(`/api/designs/${id}/units/calibration.csv`);
    expect(csvRes.status()).toBe(200);
    expect(csvRes.headers()["content-type"]).toMatch(/text\/csv/);
    expect(csvRes.headers()["content-disposition"]).toMatch(/attachment; filename=".+-calibration\.csv"/);
    const rows = Papa.parse<Record<string, string>>((await csvRes.text()).trim(), { header: true }).data;
    expect(rows).toHaveLength(list.units.length);
    const injected = rows.find((r) => r.serial?.includes("=CSV-"));
    expect(injected?.serial?.startsWith("'=")).toBe(true);
    const first = list.units.find((u) => !u.serial.startsWith("="))!;
    const csvFirst = rows.find((r) => r.serial === first.serial)!;
    expect(Number(csvFirst.gain)).toBe(first.calibration.gain);
    expect(Number(csvFirst.offset_v)).toBe(first.calibration.offsetV);
    const json = (await (await maker.get(`/api/designs/${id}/units/calibration.json`)).json()) as {
      units: { serial: string; gain: number; offsetV: number }[];
    };
    expect(json.units.map((u) => u.serial)).toEqual(list.units.map((u) => u.serial));
    const tpl = await maker.get(`/api/designs/${id}/units/template.csv`);
    expect((await tpl.text()).split("\r\n")[0]).toBe(["serial", "date", ...bench.map((b) => b.label)].join(","));
  });
});
