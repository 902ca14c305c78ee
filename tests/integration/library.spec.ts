// HTTP checks of the parts library: everyone reads, owners and designers edit, CSV import is all
// or nothing with the row and column named, export imports back unchanged.
import { expect, test, type APIRequestContext } from "@playwright/test";
import { apiAs } from "../fixtures/auth";
import { adcBody, amplifierBody, meterBody } from "./authz-helpers";

type Part = Record<string, unknown> & { id: string; name: string; updatedAt: string };
type Library = { amplifiers: Part[]; shunts: Part[]; adcs: Part[]; meters: Part[] };

let designer: APIRequestContext;
let owner: APIRequestContext;
let maker: APIRequestContext;
const tag = Date.now().toString(36);

test.beforeAll(async () => {
  [designer, owner, maker] = await Promise.all([apiAs("designer"), apiAs("owner"), apiAs("maker")]);
});
test.afterAll(async () => {
  await Promise.all([designer, owner, maker].map((c) => c.dispose()));
});

async function library(ctx: APIRequestContext = designer): Promise<Library> {
  const res = await ctx.get("/api/library");
  expect(res.status()).toBe(200);
  return (await res.json()) as Library;
}

function importCsv(ctx: APIRequestContext, kind: string, csv: string) {
  return ctx.post("/api/library/import", {
    multipart: { kind, file: { name: `${kind}.csv`, mimeType: "text/csv", buffer: Buffer.from(csv) } },
  });
}

const amp = amplifierBody;

test("every member reads the demo library, in SI with ISO dates", async () => {
  const lib = await library(maker);
  expect(lib.amplifiers.length).toBeGreaterThanOrEqual(3);
  expect(lib.shunts.length).toBeGreaterThanOrEqual(3);
  const first = lib.amplifiers.find((a) => a.name.startsWith("SW-CSA-20"))!;
  expect(first.offsetV).toBeCloseTo(35e-6, 12);
  expect(first.gains).toEqual([20]);
  expect(new Date(first.createdAt as string).toISOString()).toBe(first.createdAt);
});

test("a maker cannot add, edit, delete or import", async () => {
  const lib = await library(maker);
  const target = lib.shunts[0]!;
  expect((await maker.post("/api/library/amplifiers", { data: amp(`maker ${tag}`) })).status()).toBe(403);
  const patch = await maker.patch(`/api/library/shunts/${target.id}`, { data: { tempcoPerK: "1 ppm/K" } });
  expect(patch.status()).toBe(403);
  expect(((await patch.json()) as { message: string }).message).toMatch(/Only owners and designers/);
  expect((await maker.delete(`/api/library/shunts/${target.id}`)).status()).toBe(403);
  expect((await importCsv(maker, "shunts", "name\nx\n")).status()).toBe(403);
  expect(await library(maker)).toEqual(lib);
});

test("a designer adds, edits and deletes; stale edits and bad input are refused", async () => {
  const created = await designer.post("/api/library/amplifiers", { data: amp(`Bench amp ${tag}`) });
  expect(created.status(), await created.text()).toBe(201);
  const a = (await created.json()) as Part;
  expect(a.offsetV).toBeCloseTo(25e-6, 12);
  expect(a.gbwHz).toBe(500_000);
  expect((await designer.post("/api/library/amplifiers", { data: amp(`Bench amp ${tag}`) })).status()).toBe(422); // name taken

  const bad = await designer.post("/api/library/amplifiers", { data: { ...amp(`Bad ${tag}`), offsetV: "25 mA" } });
  expect(bad.status()).toBe(422);
  expect(((await bad.json()) as { fieldErrors: Record<string, string[]> }).fieldErrors.offsetV?.[0]).toMatch(
    /is a current, not a voltage/,
  );

  const edited = await owner.patch(`/api/library/amplifiers/${a.id}`, {
    data: { gains: [10, 20, 50], updatedAt: a.updatedAt },
  });
  expect(edited.status(), await edited.text()).toBe(200);
  expect(((await edited.json()) as Part).gains).toEqual([10, 20, 50]);
  const stale = await designer.patch(`/api/library/amplifiers/${a.id}`, {
    data: { cmrrDb: 90, updatedAt: a.updatedAt },
  });
  expect(stale.status()).toBe(409);
  const mixed = await designer.patch(`/api/library/amplifiers/${a.id}`, { data: { supplyMinV: "6 V" } });
  expect(mixed.status()).toBe(422); // above the highest supply once merged

  expect((await designer.delete(`/api/library/amplifiers/${a.id}`)).status()).toBe(200);
  expect((await designer.delete(`/api/library/amplifiers/${a.id}`)).status()).toBe(404);
  expect((await designer.patch(`/api/library/amplifiers/not-an-id`, { data: { cmrrDb: 90 } })).status()).toBe(404);
});

test("CSV import is all or nothing and names the row and column", async () => {
  const before = await library();
  const header = "name,series,minOhms [mohm],maxOhms [mohm],toleranceFraction,tempcoPerK,ratingsW,fourTerminal";
  const good1 = `Strip A ${tag},E24,1,100,1 %,50 ppm/K,0.5 W;1 W,no`;
  const good2 = `Strip B ${tag},E48,0.5,50,0.5 %,25 ppm/K,1;2,yes`;
  const bad = `Strip C ${tag},E24,1,100,1 %,50 ppm/K,0.5 W,maybe`;
  const res = await importCsv(designer, "shunts", `${header}\n${good1}\n${good2}\n${bad}\n`);
  expect(res.status()).toBe(422);
  const body = (await res.json()) as { message: string; row: number; line: number; column: string };
  expect(body).toMatchObject({ row: 3, line: 4, column: "fourTerminal" });
  expect(body.message).toMatch(
    /^Data row 3 \(file line 4\), column "fourTerminal": "maybe" is not yes or no\. Nothing was imported\.$/,
  );
  expect(await library()).toEqual(before);

  const wrongUnit = await importCsv(designer, "shunts", `${header.replace("[mohm]", "[mA]")}\n${good1}\n`);
  expect(wrongUnit.status()).toBe(422);
  expect(((await wrongUnit.json()) as { message: string }).message).toMatch(
    /column "minOhms \[mA\]": unit "mA" is a current, not a resistance/,
  );
  const unknown = await importCsv(designer, "shunts", `${header},colour\n${good1},red\n`);
  expect(((await unknown.json()) as { column: string }).column).toBe("colour");
  const missing = await importCsv(designer, "shunts", "name,series\nX,E24\n");
  expect(((await missing.json()) as { message: string }).message).toMatch(/missing/);
  const nan = await importCsv(designer, "shunts", `${header}\n${good1.replace(",1,100,", ",NaN,100,")}\n`);
  expect((await nan.json()) as { row: number; column: string }).toMatchObject({ row: 1, column: "minOhms [mohm]" });
  expect((await importCsv(designer, "gizmos", `${header}\n${good1}\n`)).status()).toBe(422);
  expect(await library()).toEqual(before);

  const ok = await importCsv(designer, "shunts", `${header}\n${good1}\n${good2}\n`);
  expect(ok.status(), await ok.text()).toBe(200);
  expect(await ok.json()).toMatchObject({ kind: "shunts", created: 2, updated: 0 });
  const after = await library();
  const a = after.shunts.find((s) => s.name === `Strip A ${tag}`)!;
  expect(a).toMatchObject({
    series: "E24",
    minOhms: 0.001,
    maxOhms: 0.1,
    toleranceFraction: 0.01,
    ratingsW: [0.5, 1],
    fourTerminal: false,
  });
});

test("export round-trips through import, readouts included", async () => {
  for (const kind of ["amplifiers", "shunts", "adcs", "meters"] as const) {
    const before = await library();
    const res = await designer.get(`/api/library/export?kind=${kind}`);
    expect(res.status()).toBe(200);
    expect(res.headers()["content-type"]).toMatch(/text\/csv/);
    expect(res.headers()["content-disposition"]).toMatch(/attachment; filename="library-.*\.csv"/);
    const csv = await res.text();
    expect(csv.split("\n").length - 2).toBe(before[kind].length);
    const back = await importCsv(designer, kind, csv);
    expect(back.status(), await back.text()).toBe(200);
    expect(await back.json()).toMatchObject({ created: 0, updated: before[kind].length });
    const after = await library();
    const strip = (parts: Part[]) => parts.map(({ updatedAt: _u, ...rest }) => rest);
    expect(strip(after[kind])).toEqual(strip(before[kind]));
    expect(await (await designer.get(`/api/library/export?kind=${kind}`)).text()).toBe(csv);
  }
  const wrongKind = await designer.get("/api/library/export?kind=resistors");
  expect(wrongKind.status()).toBe(422);
  expect(await wrongKind.json()).toMatchObject({
    fieldErrors: { kind: ['expected "amplifiers", "shunts", "adcs" or "meters"'] },
  });
});

test("an ADC file imports all or nothing, a bad figure named by row and dotted column", async () => {
  const head = "name,bits,fullScale,sampleRateHz,reference.tolerance,reference.tempco,offsetLsb,gainError,inlLsb";
  const good = `Import converter ${tag},14,2.048 V,50 kHz,0.1 %,10 ppm/K,3,0.05 %,1.5`;
  const before = await library();
  const bad = await importCsv(
    designer,
    "adcs",
    [head, good, `Second ${tag},14,2.048 V,50 kHz,30 %,10 ppm/K,3,0.05 %,1`].join("\n"),
  );
  expect(bad.status()).toBe(422);
  expect(await bad.json()).toMatchObject({ row: 2, line: 3, column: "reference.tolerance" });
  expect((await library()).adcs).toEqual(before.adcs);
  const ok = await importCsv(designer, "adcs", [head, good].join("\n"));
  expect(ok.status(), await ok.text()).toBe(200);
  expect(await ok.json()).toMatchObject({ kind: "adcs", created: 1, updated: 0 });
  const added = (await library()).adcs.find((a) => a.name === `Import converter ${tag}`)!;
  expect(added).toMatchObject({ bits: 14, fullScale: 2.048, sampleRateHz: 50_000, reference: { tolerance: 0.001 } });
  expect((await designer.delete(`/api/library/adcs/${added.id}`)).status()).toBe(200);
});

test("ADCs and meter ranges: every member reads the demo ones under the readout's names", async () => {
  const lib = await library(maker);
  const adc = lib.adcs.find((a) => a.name.startsWith("SW-ADC12"))!;
  expect(adc).toMatchObject({
    bits: 12,
    fullScale: 2.5,
    sampleRateHz: 10_000,
    reference: { tolerance: 0.001, tempco: 20e-6 },
    offsetLsb: 2,
    gainError: 0.0005,
    inlLsb: 1,
  });
  expect(lib.meters.find((m) => m.name.startsWith("SW-DM20"))).toMatchObject({
    fullScale: 0.2,
    counts: 2000,
    accuracy: { percentOfReading: 0.005, digits: 2 },
  });
  expect((await maker.post("/api/library/adcs", { data: adcBody(`maker ${tag}`) })).status()).toBe(403);
  expect((await maker.patch(`/api/library/adcs/${adc.id}`, { data: { bits: 14 } })).status()).toBe(403);
  expect((await maker.delete(`/api/library/meters/${lib.meters[0]!.id}`)).status()).toBe(403);
  expect(await library(maker)).toEqual(lib);
});

test("a designer adds, edits and removes an ADC; one figure of a group patches alone; stale and bad input refused", async () => {
  const created = await designer.post("/api/library/adcs", { data: adcBody(`Bench ADC ${tag}`) });
  expect(created.status(), await created.text()).toBe(201);
  const a = (await created.json()) as Part;
  expect(a).toMatchObject({ bits: 16, fullScale: 4.096, sampleRateHz: 2000, reference: { tolerance: 0.0005 } });
  expect((await designer.post("/api/library/adcs", { data: adcBody(`Bench ADC ${tag}`) })).status()).toBe(422);

  const bad = await designer.post("/api/library/adcs", {
    data: { ...adcBody(`Bad ${tag}`), reference: { tolerance: "2 mV", tempco: "5 ppm/K" }, inlLsb: -1 },
  });
  expect(bad.status()).toBe(422);
  const errors = ((await bad.json()) as { fieldErrors: Record<string, string[]> }).fieldErrors;
  expect(errors["reference.tolerance"]?.[0]).toMatch(/Reference tolerance/);
  expect(errors.inlLsb?.[0]).toBe("Integral nonlinearity (INL) cannot be negative");

  const edited = await owner.patch(`/api/library/adcs/${a.id}`, {
    data: { reference: { tempco: "10 ppm/K" }, updatedAt: a.updatedAt },
  });
  expect(edited.status(), await edited.text()).toBe(200);
  expect(((await edited.json()) as Part).reference).toEqual({ tolerance: 0.0005, tempco: 10e-6 });
  const stale = await designer.patch(`/api/library/adcs/${a.id}`, { data: { bits: 14, updatedAt: a.updatedAt } });
  expect(stale.status()).toBe(409);
  expect(((await stale.json()) as { message: string }).message).toMatch(/Someone changed this ADC/);
  const wrong = await designer.patch(`/api/library/adcs/${a.id}`, { data: { bits: 3 } });
  expect(wrong.status()).toBe(422);
  expect(((await wrong.json()) as { message: string }).message).toMatch(/ADC resolution \(bits\) must be at least 4/);

  expect((await designer.delete(`/api/library/adcs/${a.id}`)).status()).toBe(200);
  expect((await designer.delete(`/api/library/adcs/${a.id}`)).status()).toBe(404);
  expect((await designer.patch(`/api/library/adcs/not-an-id`, { data: { bits: 12 } })).status()).toBe(404);
});

test("a designer adds, edits and removes a meter range; its accuracy is required and named", async () => {
  const { accuracy: _a, ...noAccuracy } = meterBody(`No accuracy ${tag}`);
  const missing = await designer.post("/api/library/meters", { data: noAccuracy });
  expect(missing.status()).toBe(422);
  expect(((await missing.json()) as { fieldErrors: Record<string, string[]> }).fieldErrors.accuracy).toEqual([
    "Accuracy is required",
  ]);
  const created = await designer.post("/api/library/meters", { data: meterBody(`Bench meter ${tag}`) });
  expect(created.status(), await created.text()).toBe(201);
  const m = (await created.json()) as Part;
  const edited = await designer.patch(`/api/library/meters/${m.id}`, {
    data: { accuracy: { percentOfReading: "0.05 %" }, updatedAt: m.updatedAt },
  });
  expect(edited.status(), await edited.text()).toBe(200);
  expect(((await edited.json()) as Part).accuracy).toEqual({ percentOfReading: 0.0005, digits: 5 });
  const tooFew = await designer.patch(`/api/library/meters/${m.id}`, { data: { counts: 5 } });
  expect(((await tooFew.json()) as { fieldErrors: Record<string, string[]> }).fieldErrors.counts).toEqual([
    "Counts must be at least 10",
  ]);
  expect((await designer.delete(`/api/library/meters/${m.id}`)).status()).toBe(200);
});
