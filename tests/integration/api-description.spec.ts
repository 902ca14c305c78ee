// GET /api/openapi.json, and a real answer of every documented operation checked against it: the
// status must be one the document lists, the body must validate against the document's JSON Schema
// (Ajv, draft 2020-12), and an operation this walk never reached fails the test.
import { expect, test, type APIResponse } from "@playwright/test";
import { openApiDocument } from "../../lib/api-description/openapi";
import { apiAs, type DemoRole } from "../fixtures/auth";
import {
  adcBody,
  amplifierBody,
  choice,
  makeTwoTeamMember,
  meterBody,
  requirement,
  shuntBody,
  unique,
} from "./authz-helpers";
import { Conformance, type OpenApiDocument } from "./openapi-conformance";
import { profileRequirement } from "./profiles-helpers";

const csvFile = (name: string, text: string) => ({ name, mimeType: "text/csv", buffer: Buffer.from(text, "utf8") });
const bodyOf = async <T>(res: APIResponse, status: number): Promise<T> => {
  expect(res.status(), await res.text()).toBe(status);
  return (await res.json()) as T;
};

test("the served document is the generated one, and every documented operation answers as it says", async () => {
  test.setTimeout(180_000);
  const raw = await apiAs(null);
  const signedIn = await apiAs("designer");
  expect((await raw.get("/api/openapi.json")).status()).toBe(401);
  // The answers are checked against the document generated here; the server must serve the same one.
  const doc = JSON.parse(JSON.stringify(openApiDocument())) as OpenApiDocument;
  const api = new Conformance(doc);

  const ctx: Record<DemoRole | "anon", Awaited<ReturnType<typeof apiAs>>> = {
    anon: raw,
    designer: signedIn,
    owner: await apiAs("owner"),
    reviewer: await apiAs("reviewer"),
    maker: await apiAs("maker"),
  };
  const anon = api.checked(ctx.anon);
  const designer = api.checked(ctx.designer);
  const owner = api.checked(ctx.owner);
  const reviewer = api.checked(ctx.reviewer);
  const maker = api.checked(ctx.maker);

  // Refusals share the one error shape.
  await anon.get("/api/me");
  await maker.post("/api/designs", { data: { name: "Not mine to make", requirement, choice } });
  await designer.post("/api/tokens", { data: { name: 3 } });
  await designer.get(`/api/designs/00000000-0000-4000-8000-000000000000`);

  // The account, tokens, the document itself.
  await anon.get("/api/health");
  await designer.get("/api/openapi.json");
  await designer.get("/api/me");
  await designer.patch("/api/me", { data: { mail: { comments: true } } });
  const token = await bodyOf<{ id: string }>(
    await designer.post("/api/tokens", { data: { name: `described ${unique()}`, access: "read" } }),
    201,
  );
  await designer.get("/api/tokens");
  await designer.delete(`/api/tokens/${token.id}`);

  // The engine.
  await designer.post("/api/solve", { data: requirement });
  await designer.post("/api/solve", { data: { ...requirement, current: { min: "1 uA", max: "100 A" } } });
  await designer.post("/api/insertion", {
    data: { supply: "5 V", seriesOhms: "100 mohm", load: { model: "resistive", current: "200 mA" } },
  });
  await designer.post("/api/netlist", { data: { requirement, candidate: { shuntOhms: 0.274, gain: 50 } } });

  // A design's life: save, revise, submit, comment, approve.
  const solved = await bodyOf<{ candidates: { shuntOhms: number; gain: number; feasible: boolean }[] }>(
    await designer.post("/api/solve", { data: profileRequirement }),
    200,
  );
  const pick = solved.candidates.find((c) => c.feasible)!;
  const created = await bodyOf<{ id: string }>(
    await designer.post("/api/designs", {
      data: {
        name: `Described ${unique()}`,
        project: "API description",
        requirement: profileRequirement,
        choice: pick,
      },
    }),
    201,
  );
  const id = created.id;
  const other = await bodyOf<{ id: string }>(
    await designer.post("/api/designs", { data: { name: `Described other ${unique()}`, requirement, choice } }),
    201,
  );
  await designer.get("/api/designs?limit=2");
  await designer.patch(`/api/designs/${id}`, { data: { revision: 1, project: "API description, revised" } });
  await designer.patch(`/api/designs/${id}`, { data: { revision: 1, name: "Stale" } });
  await designer.patch(`/api/designs/${id}`, { data: { revision: 2, project: "API description, revised" } });
  await designer.get(`/api/designs/${id}/revisions`);
  await designer.get(`/api/designs/${id}/revisions?a=1&b=2`);
  await designer.post(`/api/designs/${id}/submit`, { data: {} });
  const comment = await bodyOf<{ id: string }>(
    await reviewer.post(`/api/designs/${id}/reviews`, { data: { verdict: "comment", body: "Check the fuse." } }),
    201,
  );
  await designer.post(`/api/designs/${id}/reviews`, {
    data: { verdict: "comment", body: "Done.", parentId: comment.id },
  });
  await reviewer.post(`/api/designs/${id}/reviews`, { data: { verdict: "approve", body: "" } });
  await designer.get(`/api/designs/${id}/reviews`);
  await designer.get(`/api/designs/${id}`);
  await designer.get(`/api/compare?ids=${id},${other.id}`);

  // What a maker takes to the bench.
  await maker.get(`/api/designs/${id}/build-sheet`);
  await maker.get(`/api/designs/${id}/netlist?offset=0`);
  await maker.get(`/api/designs/${id}/parts.csv`);
  const exported = await bodyOf<Record<string, unknown>>(await designer.get(`/api/designs/${id}/export`), 200);
  await designer.post("/api/designs/import", { data: exported });
  await designer.post("/api/designs/import", { data: { ...exported, name: `Imported ${unique()}` } });

  // Recordings.
  const profile = await bodyOf<{ id: string }>(
    await designer.post(`/api/designs/${id}/profiles`, {
      multipart: { file: csvFile("night.csv", "time (s),current (mA)\n0,5\n0.5,40\n1,80\n1.5,20\n") },
    }),
    201,
  );
  await designer.post(`/api/designs/${id}/profiles`, { multipart: { file: csvFile("bad.csv", "time\n0\n1\n") } });
  await designer.get(`/api/designs/${id}/profiles`);
  await designer.get(`/api/designs/${id}/profiles/${profile.id}?width=100`);
  await designer.delete(`/api/designs/${id}/profiles/${profile.id}`);

  // Built units.
  const design = await bodyOf<{ benchCheck: { label: string; currentA: number; expectedV: number }[] }>(
    await maker.get(`/api/designs/${id}`),
    200,
  );
  const readings = design.benchCheck.map((b) => ({ currentA: b.currentA, outputV: `${b.expectedV * 1000} mV` }));
  const unit = await bodyOf<{ id: string }>(
    await maker.post(`/api/designs/${id}/units`, { data: { serial: `U-${unique()}`, readings } }),
    201,
  );
  await maker.get(`/api/designs/${id}/units/template.csv`);
  const header = ["serial", ...design.benchCheck.map((b) => b.label)].join(",");
  const row = [`CSV-${unique()}`, ...design.benchCheck.map((b) => `${(b.expectedV * 1010).toFixed(3)} mV`)].join(",");
  await maker.post(`/api/designs/${id}/units/import`, {
    multipart: { file: csvFile("units.csv", `${header}\n${row}\n`) },
  });
  await maker.get(`/api/designs/${id}/units`);
  await maker.get(`/api/designs/${id}/units/${unit.id}`);
  await maker.patch(`/api/designs/${id}/units/${unit.id}`, { data: { builtOn: "2026-11-30" } });
  await maker.get(`/api/designs/${id}/units/calibration.csv`);
  await maker.get(`/api/designs/${id}/units/calibration.json`);
  await maker.delete(`/api/designs/${id}/units/${unit.id}`);

  // The parts library.
  await designer.get("/api/library");
  const amp = await bodyOf<{ id: string; updatedAt: string }>(
    await designer.post("/api/library/amplifiers", { data: amplifierBody(`Described amp ${unique()}`) }),
    201,
  );
  await designer.patch(`/api/library/amplifiers/${amp.id}`, { data: { updatedAt: amp.updatedAt, cmrrDb: 110 } });
  await designer.delete(`/api/library/amplifiers/${amp.id}`);
  const shunt = await bodyOf<{ id: string; updatedAt: string }>(
    await designer.post("/api/library/shunts", { data: shuntBody(`Described shunt ${unique()}`) }),
    201,
  );
  await designer.patch(`/api/library/shunts/${shunt.id}`, { data: { updatedAt: shunt.updatedAt, fourTerminal: true } });
  await designer.delete(`/api/library/shunts/${shunt.id}`);
  const adc = await bodyOf<{ id: string; updatedAt: string }>(
    await designer.post("/api/library/adcs", { data: adcBody(`Described ADC ${unique()}`) }),
    201,
  );
  await designer.patch(`/api/library/adcs/${adc.id}`, {
    data: { updatedAt: adc.updatedAt, reference: { tempco: "10 ppm/K" } },
  });
  await designer.patch(`/api/library/adcs/${adc.id}`, { data: { bits: 3 } }); // 422 naming the field
  await designer.delete(`/api/library/adcs/${adc.id}`);
  const meter = await bodyOf<{ id: string; updatedAt: string }>(
    await designer.post("/api/library/meters", { data: meterBody(`Described meter ${unique()}`) }),
    201,
  );
  await designer.patch(`/api/library/meters/${meter.id}`, { data: { updatedAt: meter.updatedAt, counts: 4000 } });
  await designer.delete(`/api/library/meters/${meter.id}`);
  const shunts = await designer.get("/api/library/export?kind=shunts");
  await designer.post("/api/library/import", {
    multipart: { kind: "shunts", file: csvFile("s.csv", await shunts.text()) },
  });
  await designer.post("/api/library/import", { multipart: { kind: "shunts", file: csvFile("s.csv", "name\n,\n") } });

  // The team: invitations, members, the log, the outbox.
  await owner.get("/api/team");
  await owner.get("/api/team/audit?limit=20");
  await owner.get("/api/outbox");
  await owner.get("/api/invitations");
  const email = `described-${unique()}@bench.example`;
  const invited = await bodyOf<{ id: string; link: string }>(
    await owner.post("/api/invitations", { data: { email, role: "maker" } }),
    201,
  );
  const password = `pw-${unique()}-long`;
  await anon.post("/api/invitations/accept", {
    data: { token: new URL(invited.link).pathname.split("/").pop(), name: "Described Maker", password },
  });
  const members = await bodyOf<{ members: { userId: string; email: string }[] }>(await owner.get("/api/team"), 200);
  const joined = members.members.find((m) => m.email === email)!;
  await owner.patch(`/api/team/members/${joined.userId}`, { data: { role: "reviewer" } });
  await owner.delete(`/api/team/members/${joined.userId}`);
  const pending = await bodyOf<{ id: string }>(
    await owner.post("/api/invitations", { data: { email: `pending-${unique()}@bench.example`, role: "designer" } }),
    201,
  );
  await owner.delete(`/api/invitations/${pending.id}`);
  expect(invited.id).not.toBe(pending.id);

  // A person in two teams switches, then changes their password.
  const two = await makeTwoTeamMember(ctx.owner);
  const twoApi = api.checked(two.ctx);
  await twoApi.put("/api/me/team", { data: { teamId: two.ownTeamId } });
  await twoApi.put("/api/me/password", {
    data: { currentPassword: two.password, newPassword: `nw-${unique()}-longer` },
  });

  expect(await bodyOf<OpenApiDocument>(await ctx.designer.get("/api/openapi.json"), 200)).toEqual(doc);
  const missed = api.operations().filter((op) => !api.seen.has(op));
  expect(missed, "documented operations no request of this walk reached").toEqual([]);
  await Promise.all([...Object.values(ctx), two.ctx].map((c) => c.dispose()));
});

test("/api-docs renders the reference", async ({ page }) => {
  const { signInPage } = await import("../fixtures/auth");
  await signInPage(page, "designer");
  await page.goto("/api-docs");
  await expect(page.getByRole("heading", { name: "API reference" })).toBeVisible();
  await expect(page.getByTestId("api-reference")).toContainText("/api/tokens/{id}", { timeout: 30_000 });
  const shots = process.env.PW_OUTPUT_DIR ?? "test-results/playwright";
  await page.screenshot({ path: `${shots}/api-docs-1440.png` });
  await page.setViewportSize({ width: 390, height: 844 });
  await page.screenshot({ path: `${shots}/api-docs-390.png` });
});
