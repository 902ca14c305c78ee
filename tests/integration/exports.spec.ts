// HTTP checks of a saved design's downloads: the build sheet PDF (who may have it, its file name,
// its not-approved notice), the netlist (the same text as POST /api/netlist), the parts CSV, and
// the JSON export that imports back as a new design with identical figures.
import { expect, test, type APIRequestContext, type APIResponse } from "@playwright/test";
import Papa from "papaparse";
import { extractText } from "unpdf";
import { apiAs } from "../fixtures/auth";
import { loggerRequirement, parsed, firstFeasible } from "../../lib/build-sheet/fixtures";
import type { LibraryParts } from "../../lib/build-sheet/library-parts";
import { amplifierInput, shuntInput } from "../../lib/library/schema";
import { amplifierRequirement, shuntRequirement } from "../../lib/library/to-requirement";

type DesignBody = {
  id: string;
  name: string;
  status: string;
  revision: number;
  requirement: unknown;
  choice: { shuntOhms: number; gain: number };
  metrics: Record<string, unknown>;
};

let owner: APIRequestContext;
let designer: APIRequestContext;
let reviewer: APIRequestContext;
let maker: APIRequestContext;
let anonymous: APIRequestContext;
let draftId: string;
const stamp = Date.now().toString(36);
const draftName = `Export check ${stamp}, low side`;
const choice = firstFeasible(parsed(loggerRequirement));

test.beforeAll(async () => {
  [owner, designer, reviewer, maker, anonymous] = await Promise.all([
    apiAs("owner"),
    apiAs("designer"),
    apiAs("reviewer"),
    apiAs("maker"),
    apiAs(null),
  ]);
  const res = await designer.post("/api/designs", {
    data: { name: draftName, project: "Soil-moisture logger", requirement: loggerRequirement, choice },
  });
  expect(res.status(), await res.text()).toBe(201);
  draftId = ((await res.json()) as { id: string }).id;
});

test.afterAll(async () => {
  await Promise.all([owner, designer, reviewer, maker, anonymous].map((c) => c.dispose()));
});

async function pdfText(res: APIResponse): Promise<string[]> {
  const { text } = await extractText(new Uint8Array(await res.body()), { mergePages: false });
  return text.map((t) => t.normalize("NFKC").replace(/\s+/g, " "));
}

async function expectJsonError(res: APIResponse, status: number, pattern?: RegExp) {
  expect(res.status(), await res.text()).toBe(status);
  const body = (await res.json()) as { message: string };
  expect(typeof body.message).toBe("string");
  if (pattern) expect(body.message).toMatch(pattern);
}

test.describe("GET /api/designs/[id]/build-sheet", () => {
  test("a designer previews a draft: a PDF download named after the design, not approved on every page", async () => {
    const res = await designer.get(`/api/designs/${draftId}/build-sheet`);
    expect(res.status()).toBe(200);
    expect(res.headers()["content-type"]).toBe("application/pdf");
    expect(res.headers()["content-disposition"]).toBe(`attachment; filename="export-check-${stamp}-low-side-rev1.pdf"`);
    const pages = await pdfText(res);
    expect(pages.length).toBeGreaterThanOrEqual(1);
    expect(pages.length).toBeLessThanOrEqual(4);
    for (const page of pages) expect(page).toContain("NOT APPROVED — draft for review");
    expect(pages[0]).toContain(draftName);
    expect(pages[0]).toContain("Harbourline Labs");
  });

  test("a reviewer and an owner may preview it too", async () => {
    for (const ctx of [reviewer, owner])
      expect((await ctx.get(`/api/designs/${draftId}/build-sheet`)).status()).toBe(200);
  });

  test("a maker does not get a draft's sheet, signed out is 401, an unknown design 404", async () => {
    await expectJsonError(await maker.get(`/api/designs/${draftId}/build-sheet`), 404, /approved/);
    await expectJsonError(await anonymous.get(`/api/designs/${draftId}/build-sheet`), 401);
    await expectJsonError(await designer.get(`/api/designs/00000000-0000-4000-8000-00000000beef/build-sheet`), 404);
    await expectJsonError(await designer.get(`/api/designs/not-a-design/build-sheet`), 404);
  });

  test("a maker downloads the demo team's approved design, without the notice", async () => {
    const list = (await (await maker.get("/api/designs")).json()) as {
      designs: { id: string; name: string; status: string }[];
    };
    const approved = list.designs.find((d) => d.status === "approved");
    expect(approved, "the demo data has an approved design").toBeTruthy();
    const res = await maker.get(`/api/designs/${approved!.id}/build-sheet`);
    expect(res.status()).toBe(200);
    const pages = await pdfText(res);
    expect(pages.join(" ")).not.toContain("NOT APPROVED");
    expect(pages[0]).toContain(approved!.name);
    expect(pages[0]).toMatch(/Approved by .+, \d{4}-\d\d-\d\d \d\d:\d\d UTC/);
  });

  test("once a reviewer approves the draft, the maker gets its sheet and it names the approver", async () => {
    const created = await designer.post("/api/designs", {
      data: { name: `Approval check ${stamp}`, requirement: loggerRequirement, choice },
    });
    const { id } = (await created.json()) as { id: string };
    await expectJsonError(await maker.get(`/api/designs/${id}/build-sheet`), 404);
    expect((await designer.post(`/api/designs/${id}/submit`, { data: {} })).status()).toBe(200);
    const review = await reviewer.post(`/api/designs/${id}/reviews`, {
      data: { verdict: "approve", body: "Checked against the bench." },
    });
    expect(review.status(), await review.text()).toBe(201);
    const res = await maker.get(`/api/designs/${id}/build-sheet`);
    expect(res.status()).toBe(200);
    const pages = await pdfText(res);
    expect(pages.join(" ")).not.toContain("NOT APPROVED");
    expect(pages[0]).toMatch(/Approved by \S.*UTC/);
    expect(pages[0]).toContain("approved");
  });
});

test.describe("GET /api/designs/[id]/netlist", () => {
  test("is the same text as POST /api/netlist for the saved requirement and choice, with and without offset", async () => {
    const design = (await (await designer.get(`/api/designs/${draftId}`)).json()) as DesignBody;
    for (const q of ["", "?offset=0"]) {
      const saved = await designer.get(`/api/designs/${draftId}/netlist${q}`);
      expect(saved.status()).toBe(200);
      expect(saved.headers()["content-type"]).toMatch(/^text\/plain/);
      const stateless = await designer.post(`/api/netlist${q}`, {
        data: { requirement: design.requirement, candidate: design.choice },
      });
      expect(stateless.status()).toBe(200);
      const text = await saved.text();
      expect(text).toBe(await stateless.text());
      expect(text).toMatch(/^RSHUNT sp sn /m);
      expect(text.includes("VOS ")).toBe(q === "");
    }
    await expectJsonError(await designer.get(`/api/designs/${draftId}/netlist?offset=2`), 422, /offset/);
    await expectJsonError(await maker.get(`/api/designs/${draftId}/netlist`), 404);
  });
});

test.describe("GET /api/designs/[id]/parts.csv", () => {
  test("is CSV with a header row and the shunt and gain of the design", async () => {
    const res = await designer.get(`/api/designs/${draftId}/parts.csv`);
    expect(res.status()).toBe(200);
    expect(res.headers()["content-type"]).toMatch(/^text\/csv/);
    expect(res.headers()["content-disposition"]).toMatch(/filename=".+-rev1\.parts\.csv"/);
    const parsedCsv = Papa.parse<Record<string, string>>(await res.text(), { header: true, skipEmptyLines: true });
    expect(parsedCsv.errors).toEqual([]);
    expect(parsedCsv.meta.fields?.slice(0, 7)).toEqual([
      "designator",
      "part",
      "value",
      "tolerance",
      "tempco",
      "rating",
      "notes",
    ]);
    const byRef = Object.fromEntries(parsedCsv.data.map((r) => [r.designator, r]));
    expect(Number(byRef.R1?.value_si)).toBe(choice.shuntOhms);
    expect(byRef.R1?.unit).toBe("ohm");
    expect(Number(byRef.U1?.value_si)).toBe(choice.gain);
  });
});

test.describe("GET /api/designs/[id]/parts.csv of a design made from team-library parts", () => {
  test("names the library amplifier and shunt family in the part column, with a coverage line in the notes", async () => {
    // The demo library as the server stores it (GET /api/library), and a requirement filled from two of its parts.
    const lib = (await (await designer.get("/api/library")).json()) as LibraryParts;
    const ampRow = lib.amplifiers.find((a) => a.name.startsWith("SW-CSA-20"));
    const shuntRow = lib.shunts.find((x) => x.name.startsWith("SW-MF"));
    if (!ampRow || !shuntRow) throw new Error("demo library parts missing");
    const amp = amplifierInput.parse(ampRow);
    const shunt = shuntInput.parse(shuntRow);
    const requirement = {
      current: { min: "1 mA", max: "100 mA" },
      supply: { voltage: "5 V" },
      drop: { max: "200 mV" },
      amplifier: amplifierRequirement(amp, 5),
      shunt: shuntRequirement(shunt),
    };
    const libChoice = firstFeasible(parsed(requirement));
    const made = await designer.post("/api/designs", {
      data: { name: `Library parts ${stamp}`, requirement, choice: libChoice },
    });
    expect(made.status(), await made.text()).toBe(201);
    const id = ((await made.json()) as { id: string }).id;
    const res = await designer.get(`/api/designs/${id}/parts.csv`);
    expect(res.status()).toBe(200);
    const rows = Papa.parse<Record<string, string>>(await res.text(), { header: true, skipEmptyLines: true });
    expect(rows.errors).toEqual([]);
    const byRef = Object.fromEntries(rows.data.map((r) => [r.designator, r]));
    expect(byRef.U1?.part).toMatch(new RegExp(`^${escapeRe(amp.name)} \\(team library\\): `));
    expect(byRef.R1?.part).toMatch(new RegExp(`^${escapeRe(shunt.name)} \\(team library\\): `));
    for (const ref of ["U1", "R1"])
      expect(byRef[ref]?.notes).toMatch(/The library data cover the requirement\.|Library data stop short: /);
    // The hand-typed design names no library part.
    const plain = await designer.get(`/api/designs/${draftId}/parts.csv`);
    expect(await plain.text()).not.toContain("(team library)");
  });
});

const escapeRe = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");

test.describe("design export and import", () => {
  test("exports JSON that imports back as a new draft with identical figures", async () => {
    const exported = await designer.get(`/api/designs/${draftId}/export`);
    expect(exported.status()).toBe(200);
    expect(exported.headers()["content-type"]).toMatch(/^application\/json/);
    const file = (await exported.json()) as Record<string, unknown>;
    expect(file).toMatchObject({
      format: "sensewright-design",
      version: 1,
      name: draftName,
      project: "Soil-moisture logger",
    });
    // The same name again is refused with a free one offered; importing under it works.
    const same = await owner.post("/api/designs/import", { data: file });
    expect(same.status(), await same.text()).toBe(409);
    const refused = (await same.json()) as { message: string; suggestedName: string };
    expect(refused.message).toContain(`already has a design named “${draftName}”`);
    expect(refused.suggestedName).toBe(`${draftName} (2)`);
    const imported = await owner.post("/api/designs/import", { data: { ...file, name: refused.suggestedName } });
    expect(imported.status(), await imported.text()).toBe(201);
    const { id, revision, status } = (await imported.json()) as { id: string; revision: number; status: string };
    expect(id).not.toBe(draftId);
    expect({ revision, status }).toEqual({ revision: 1, status: "draft" });
    const [a, b] = await Promise.all([designer.get(`/api/designs/${draftId}`), designer.get(`/api/designs/${id}`)]);
    const original = (await a.json()) as DesignBody;
    const copy = (await b.json()) as DesignBody;
    expect(copy.name).toBe(`${original.name} (2)`);
    expect(copy.requirement).toEqual(original.requirement);
    expect(copy.choice).toEqual(original.choice);
    expect(copy.metrics).toEqual(original.metrics);
    // And the copy exports to the same file, but for its own id.
    const again = (await (await designer.get(`/api/designs/${id}/export`)).json()) as Record<string, unknown>;
    expect({ ...again, exportedAt: null, source: null }).toEqual({
      ...file,
      name: refused.suggestedName,
      exportedAt: null,
      source: null,
    });
  });

  test("only owners and designers import; a bad file is 422 naming the field and saves nothing", async () => {
    const file = (await (await designer.get(`/api/designs/${draftId}/export`)).json()) as Record<string, unknown>;
    await expectJsonError(await maker.post("/api/designs/import", { data: file }), 403, /owners and designers/);
    await expectJsonError(await reviewer.post("/api/designs/import", { data: file }), 403);
    // The list is paged newest first: a design saved by any of these would lead its first page.
    const newest = async () =>
      ((await (await designer.get("/api/designs?limit=1")).json()) as { designs: { id: string }[] }).designs[0]?.id;
    const before = await newest();
    const cases: [unknown, string][] = [
      [{ ...file, format: "spreadsheet" }, "format"],
      [{ ...file, version: 7 }, "version"],
      [{ ...file, choice: { shuntOhms: 0.274 } }, "choice.gain"],
      [
        { ...file, requirement: { ...(file.requirement as object), current: { min: "1 mA", max: "5 V" } } },
        "requirement.current.max",
      ],
      [{ ...file, choice: { ...(file.choice as object), shuntOhms: 0.2745 } }, "choice.shuntOhms"],
    ];
    for (const [data, path] of cases) {
      const res = await designer.post("/api/designs/import", { data });
      expect(res.status(), `${path}: ${await res.text()}`).toBe(422);
      const body = (await res.json()) as { fieldErrors: Record<string, string[]> };
      expect(Object.keys(body.fieldErrors)).toContain(path);
    }
    const notJson = await designer.post("/api/designs/import", {
      data: "{not json",
      headers: { "content-type": "application/json" },
    });
    expect(notJson.status()).toBe(422);
    expect(await newest()).toBe(before);
  });
});
