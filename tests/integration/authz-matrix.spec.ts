// Every API route × signed out, each demo role and an owner of another team, with the exact
// status each must get (the role rules of each route, listed in docs/api.md).
// To extend: add a row to `routes`; `setup` may create what one cell needs (it runs per caller).
import { expect, test, type APIRequestContext } from "@playwright/test";
import {
  allContexts,
  approveDesign,
  choice,
  createDesign,
  everyone,
  requirement,
  submitDesign,
  unique,
  adcBody,
  amplifierBody,
  meterBody,
  shuntBody,
  type Contexts,
  type Who,
} from "./authz-helpers";
import { acceptAndSignIn, makeTwoTeamMember, tokenContext } from "./authz-helpers";

type Method = "GET" | "POST" | "PUT" | "PATCH" | "DELETE";
type Cell = {
  path: string;
  data?: unknown;
  multipart?: Record<string, string | { name: string; mimeType: string; buffer: Buffer }>;
};
type Row = {
  name: string;
  method: Method;
  /** Built once per caller (so a cell that changes state gets its own fresh design, invitation…). */
  setup: (who: Who) => Promise<Cell>;
  expect: Record<Who, number>;
  /** Only a signed-in session may call it (an API token gets 403). */
  sessionOnly?: boolean;
};

let c: Contexts;
const f = {
  draft: "",
  approved: "",
  approvedB: "",
  reviewerId: "",
  makerId: "",
  amplifierId: "",
  shuntId: "",
  adcId: "",
  meterId: "",
};
const NO_SUCH = "00000000-0000-4000-8000-000000000000";

const fixed = (path: string, data?: unknown) => async (): Promise<Cell> => ({ path, data });
const members = (status: number, outsider = status): Record<Who, number> => ({
  anon: 401,
  owner: status,
  designer: status,
  reviewer: status,
  maker: status,
  outsider,
});
const ownerOnly = (ok: number, outsider = ok): Record<Who, number> => ({
  anon: 401,
  owner: ok,
  designer: 403,
  reviewer: 403,
  maker: 403,
  outsider,
});
const editors = (ok: number, outsider = ok): Record<Who, number> => ({
  anon: 401,
  owner: ok,
  designer: ok,
  reviewer: 403,
  maker: 403,
  outsider,
});
/** A Harbourline draft: members see it, makers and other teams get 404. */
const draftSeen = (ok: number): Record<Who, number> => ({
  anon: 401,
  owner: ok,
  designer: ok,
  reviewer: ok,
  maker: 404,
  outsider: 404,
});

async function freshDraft() {
  return createDesign(c.designer);
}
async function freshInReview() {
  const id = await createDesign(c.designer);
  await submitDesign(c.designer, id);
  return id;
}
async function pendingInvitation() {
  const res = await c.owner.post("/api/invitations", {
    data: { email: `pending-${unique()}@invitee.example`, role: "maker" },
  });
  expect(res.status()).toBe(201);
  return ((await res.json()) as { id: string }).id;
}
async function disposableMember() {
  const email = `leaving-${unique()}@invitee.example`;
  const res = await c.owner.post("/api/invitations", { data: { email, role: "maker" } });
  const ctx = await acceptAndSignIn(((await res.json()) as { link: string }).link, email, "Leaving Member");
  const me = (await (await ctx.get("/api/team")).json()) as { members: { userId: string; email: string }[] };
  await ctx.dispose();
  return me.members.find((m) => m.email === email)!.userId;
}

const csv = {
  file: {
    name: "p.csv",
    mimeType: "text/csv",
    buffer: Buffer.from("time (s),current (A)\n0,0.01\n0.001,0.02\n0.002,0.015\n"),
  },
};

const shuntCsv = (name: string) => ({
  kind: "shunts",
  file: {
    name: "shunts.csv",
    mimeType: "text/csv",
    buffer: Buffer.from(
      `name,series,minOhms,maxOhms,toleranceFraction,tempcoPerK,ratingsW,fourTerminal\n${name},E24,0.001,0.1,0.01,0.00005,0.5;1,no\n`,
    ),
  },
});
/** A profile the designer uploads to the Harbourline draft, for one caller to try to delete. */
async function freshProfile(): Promise<string> {
  const res = await c.designer.post(`/api/designs/${f.draft}/profiles`, { multipart: csv });
  expect(res.status(), await res.text()).toBe(201);
  return ((await res.json()) as { id: string }).id;
}
// Built units (issue 18): a unit's readings at the approved design's own test points, a fresh serial each call.
async function unitBody() {
  const d = (await (await c.designer.get(`/api/designs/${f.approved}`)).json()) as {
    benchCheck: { currentA: number; expectedV: number }[];
  };
  return {
    serial: `MX-${unique()}`,
    readings: d.benchCheck.map((b) => ({ currentA: b.currentA, outputV: b.expectedV })),
  };
}
async function unitsCsv() {
  const { serial, readings } = await unitBody();
  const text = `serial,${readings.map((r) => `${r.currentA} A`).join(",")}\n${serial},${readings.map((r) => r.outputV).join(",")}\n`;
  return { file: { name: "units.csv", mimeType: "text/csv", buffer: Buffer.from(text) } };
}
async function unitBy(as: APIRequestContext) {
  const res = await as.post(`/api/designs/${f.approved}/units`, { data: await unitBody() });
  expect(res.status(), await res.text()).toBe(201);
  return ((await res.json()) as { id: string }).id;
}

const routes: Row[] = [
  { name: "GET /api/health", method: "GET", setup: fixed("/api/health"), expect: { ...members(200), anon: 200 } },
  { name: "GET /api/team", method: "GET", setup: fixed("/api/team"), expect: members(200) },
  { name: "GET /api/me", method: "GET", setup: fixed("/api/me"), expect: members(200) },
  { name: "PATCH /api/me (nothing)", method: "PATCH", setup: fixed("/api/me", {}), expect: members(200) },
  { name: "GET /api/openapi.json", method: "GET", setup: fixed("/api/openapi.json"), expect: members(200) },
  { name: "GET /api/tokens", method: "GET", setup: fixed("/api/tokens"), expect: members(200) },
  {
    name: "POST /api/tokens",
    method: "POST",
    setup: fixed("/api/tokens", { name: "matrix", access: "read", expiresInDays: 1 }),
    expect: members(201),
    sessionOnly: true,
  },
  {
    name: "DELETE /api/tokens/[unknown]",
    method: "DELETE",
    setup: fixed(`/api/tokens/${NO_SUCH}`),
    expect: members(404),
  },
  {
    name: "PATCH /api/team/members/[id] (role unchanged)",
    method: "PATCH",
    setup: async () => ({ path: `/api/team/members/${f.reviewerId}`, data: { role: "reviewer" } }),
    expect: ownerOnly(200, 404),
  },
  {
    name: "DELETE /api/team/members/[id]",
    method: "DELETE",
    setup: async (who) => ({ path: `/api/team/members/${who === "owner" ? await disposableMember() : f.makerId}` }),
    expect: ownerOnly(200, 404),
  },
  { name: "GET /api/team/audit", method: "GET", setup: fixed("/api/team/audit"), expect: ownerOnly(200) },
  { name: "GET /api/designs", method: "GET", setup: fixed("/api/designs"), expect: members(200) },
  {
    name: "POST /api/designs",
    method: "POST",
    setup: fixed("/api/designs", { name: "Matrix new", requirement, choice }),
    expect: editors(201),
  },
  {
    name: "POST /api/designs/import",
    method: "POST",
    // A fresh name each time: a name already in the team is refused with a suggestion (409).
    setup: async () => ({
      path: "/api/designs/import",
      data: { format: "sensewright-design", version: 1, name: `Imported ${unique()}`, requirement, choice },
    }),
    expect: editors(201),
  },
  {
    name: "GET /api/designs/[draft]",
    method: "GET",
    setup: async () => ({ path: `/api/designs/${f.draft}` }),
    expect: draftSeen(200),
  },
  {
    name: "GET /api/designs/[approved]",
    method: "GET",
    setup: async () => ({ path: `/api/designs/${f.approved}` }),
    expect: { ...members(200), outsider: 404 },
  },
  { name: "GET /api/designs/not-a-uuid", method: "GET", setup: fixed("/api/designs/not-a-uuid"), expect: members(404) },
  {
    name: "GET /api/designs/[unknown uuid]",
    method: "GET",
    setup: fixed(`/api/designs/${NO_SUCH}`),
    expect: members(404),
  },
  {
    name: "PATCH /api/designs/[draft]",
    method: "PATCH",
    setup: async () => ({ path: `/api/designs/${await freshDraft()}`, data: { revision: 1, name: "Matrix renamed" } }),
    expect: { anon: 401, owner: 200, designer: 200, reviewer: 403, maker: 403, outsider: 404 },
  },
  {
    name: "GET /api/designs/[draft]/revisions",
    method: "GET",
    setup: async () => ({ path: `/api/designs/${f.draft}/revisions` }),
    expect: draftSeen(200),
  },
  {
    name: "GET /api/designs/[draft]/revisions?a=1&b=1",
    method: "GET",
    setup: async () => ({ path: `/api/designs/${f.draft}/revisions?a=1&b=1` }),
    expect: draftSeen(200),
  },
  {
    name: "POST /api/designs/[draft]/submit",
    method: "POST",
    setup: async () => ({ path: `/api/designs/${await freshDraft()}/submit`, data: {} }),
    expect: { anon: 401, owner: 200, designer: 200, reviewer: 403, maker: 403, outsider: 404 },
  },
  {
    name: "GET /api/designs/[draft]/reviews",
    method: "GET",
    setup: async () => ({ path: `/api/designs/${f.draft}/reviews` }),
    expect: draftSeen(200),
  },
  {
    name: "POST reviews comment on a draft",
    method: "POST",
    setup: async () => ({ path: `/api/designs/${f.draft}/reviews`, data: { verdict: "comment", body: "a note" } }),
    expect: draftSeen(201),
  },
  {
    name: "POST reviews comment on an approved design",
    method: "POST",
    setup: async () => ({
      path: `/api/designs/${f.approved}/reviews`,
      data: { verdict: "comment", body: "bench note" },
    }),
    expect: { ...members(201), outsider: 404 },
  },
  {
    name: "POST reviews approve (in review, by the designer's revision)",
    method: "POST",
    setup: async () => ({
      path: `/api/designs/${await freshInReview()}/reviews`,
      data: { verdict: "approve", body: "" },
    }),
    expect: { anon: 401, owner: 201, designer: 403, reviewer: 201, maker: 404, outsider: 404 },
  },
  {
    name: "POST reviews return (in review)",
    method: "POST",
    setup: async () => ({
      path: `/api/designs/${await freshInReview()}/reviews`,
      data: { verdict: "return", body: "too much drop" },
    }),
    expect: { anon: 401, owner: 201, designer: 403, reviewer: 201, maker: 404, outsider: 404 },
  },
  {
    name: "POST reviews unknown verdict",
    method: "POST",
    setup: async () => ({ path: `/api/designs/${f.draft}/reviews`, data: { verdict: "maybe", body: "?" } }),
    expect: { anon: 401, owner: 422, designer: 422, reviewer: 422, maker: 422, outsider: 422 },
  },
  {
    name: "GET /api/compare (two drafts)",
    method: "GET",
    setup: async () => ({ path: `/api/compare?ids=${f.draft},${f.approved}` }),
    expect: draftSeen(200),
  },
  {
    name: "GET /api/compare (two approved)",
    method: "GET",
    setup: async () => ({ path: `/api/compare?ids=${f.approved},${f.approvedB}` }),
    expect: { ...members(200), outsider: 404 },
  },
  {
    name: "GET /api/compare (one id)",
    method: "GET",
    setup: async () => ({ path: `/api/compare?ids=${f.draft}` }),
    expect: members(422),
  },
  { name: "GET /api/outbox", method: "GET", setup: fixed("/api/outbox"), expect: ownerOnly(200) },
  { name: "GET /api/invitations", method: "GET", setup: fixed("/api/invitations"), expect: ownerOnly(200) },
  {
    name: "POST /api/invitations",
    method: "POST",
    setup: async () => ({
      path: "/api/invitations",
      data: { email: `matrix-${unique()}@invitee.example`, role: "designer" },
    }),
    expect: ownerOnly(201),
  },
  {
    name: "DELETE /api/invitations/[id]",
    method: "DELETE",
    setup: async () => ({ path: `/api/invitations/${await pendingInvitation()}` }),
    expect: ownerOnly(200, 404),
  },
  {
    // A wrong current password: 422 on that field for any signed-in member, changing nothing.
    name: "PUT /api/me/password",
    method: "PUT",
    setup: fixed("/api/me/password", { currentPassword: "not-the-password", newPassword: "tall-copper-kettle-41" }),
    expect: members(422),
    // A token is a script's credential: only a signed-in session changes a password (403 for a token).
    sessionOnly: true,
  },
  {
    name: "POST /api/invitations/accept (bad token)",
    method: "POST",
    setup: fixed("/api/invitations/accept", { token: "x".repeat(43), name: "N", password: "long-enough-pw" }),
    expect: { ...members(404), anon: 404 },
  },
  { name: "POST /api/solve", method: "POST", setup: fixed("/api/solve", requirement), expect: members(200) },
  {
    name: "POST /api/insertion",
    method: "POST",
    setup: fixed("/api/insertion", {
      supply: "2.0 V",
      seriesOhms: "1.9 ohm",
      load: { model: "resistive", current: "200 mA" },
    }),
    expect: members(200),
  },
  {
    name: "POST /api/netlist",
    method: "POST",
    setup: fixed("/api/netlist", { requirement, candidate: { shuntOhms: 0.274, gain: 50 } }),
    expect: members(200),
  },
  {
    name: "GET /api/designs/[draft]/build-sheet",
    method: "GET",
    setup: async () => ({ path: `/api/designs/${f.draft}/build-sheet` }),
    expect: draftSeen(200),
  },
  {
    name: "GET /api/designs/[approved]/build-sheet",
    method: "GET",
    setup: async () => ({ path: `/api/designs/${f.approved}/build-sheet` }),
    expect: { ...members(200), outsider: 404 },
  },
  {
    name: "GET /api/designs/[draft]/netlist",
    method: "GET",
    setup: async () => ({ path: `/api/designs/${f.draft}/netlist` }),
    expect: draftSeen(200),
  },
  {
    name: "GET /api/designs/[draft]/parts.csv",
    method: "GET",
    setup: async () => ({ path: `/api/designs/${f.draft}/parts.csv` }),
    expect: draftSeen(200),
  },
  {
    name: "GET /api/designs/[draft]/export",
    method: "GET",
    setup: async () => ({ path: `/api/designs/${f.draft}/export` }),
    expect: draftSeen(200),
  },
  {
    name: "GET /api/designs/[draft]/profiles",
    method: "GET",
    setup: async () => ({ path: `/api/designs/${f.draft}/profiles` }),
    expect: draftSeen(200),
  },
  {
    name: "POST /api/designs/[draft]/profiles",
    method: "POST",
    setup: async () => ({ path: `/api/designs/${f.draft}/profiles`, multipart: csv }),
    expect: { anon: 401, owner: 201, designer: 201, reviewer: 403, maker: 403, outsider: 404 },
  },
  {
    name: "GET /api/designs/[draft]/profiles/[unknown]",
    method: "GET",
    setup: async () => ({ path: `/api/designs/${f.draft}/profiles/${NO_SUCH}` }),
    expect: { anon: 401, owner: 404, designer: 404, reviewer: 404, maker: 404, outsider: 404 },
  },
  { name: "GET /api/library", method: "GET", setup: fixed("/api/library"), expect: members(200) },
  {
    name: "GET /api/library/export?kind=shunts",
    method: "GET",
    setup: fixed("/api/library/export?kind=shunts"),
    expect: members(200),
  },
  {
    name: "POST /api/library/amplifiers",
    method: "POST",
    setup: async (who) => ({ path: "/api/library/amplifiers", data: amplifierBody(`Matrix amp ${who} ${unique()}`) }),
    expect: editors(201),
  },
  {
    name: "PATCH /api/library/amplifiers/[id]",
    method: "PATCH",
    setup: async () => ({ path: `/api/library/amplifiers/${f.amplifierId}`, data: { gbwHz: "600 kHz" } }),
    expect: editors(200, 404),
  },
  {
    name: "POST /api/library/shunts",
    method: "POST",
    setup: async (who) => ({ path: "/api/library/shunts", data: shuntBody(`Matrix shunt ${who} ${unique()}`) }),
    expect: editors(201),
  },
  {
    name: "PATCH /api/library/shunts/[id]",
    method: "PATCH",
    setup: async () => ({ path: `/api/library/shunts/${f.shuntId}`, data: { tempcoPerK: "75 ppm/K" } }),
    expect: editors(200, 404),
  },
  {
    name: "POST /api/library/adcs",
    method: "POST",
    setup: async (who) => ({ path: "/api/library/adcs", data: adcBody(`Matrix ADC ${who} ${unique()}`) }),
    expect: editors(201),
  },
  {
    name: "PATCH /api/library/adcs/[id]",
    method: "PATCH",
    setup: async () => ({ path: `/api/library/adcs/${f.adcId}`, data: { inlLsb: 3 } }),
    expect: editors(200, 404),
  },
  {
    name: "POST /api/library/meters",
    method: "POST",
    setup: async (who) => ({ path: "/api/library/meters", data: meterBody(`Matrix meter ${who} ${unique()}`) }),
    expect: editors(201),
  },
  {
    name: "PATCH /api/library/meters/[id]",
    method: "PATCH",
    setup: async () => ({ path: `/api/library/meters/${f.meterId}`, data: { accuracy: { digits: 3 } } }),
    expect: editors(200, 404),
  },
  {
    name: "POST /api/library/import",
    method: "POST",
    setup: async (who) => ({ path: "/api/library/import", multipart: shuntCsv(`Matrix import ${who} ${unique()}`) }),
    expect: editors(200),
  },
  {
    name: "DELETE /api/designs/[draft]/profiles/[id] (uploaded by the designer)",
    method: "DELETE",
    setup: async () => ({ path: `/api/designs/${f.draft}/profiles/${await freshProfile()}` }),
    expect: { anon: 401, owner: 200, designer: 200, reviewer: 403, maker: 404, outsider: 404 },
  },
  {
    name: "DELETE /api/library/amplifiers/[unknown]",
    method: "DELETE",
    setup: fixed(`/api/library/amplifiers/${NO_SUCH}`),
    expect: editors(404),
  },
  {
    name: "DELETE /api/library/shunts/[unknown]",
    method: "DELETE",
    setup: fixed(`/api/library/shunts/${NO_SUCH}`),
    expect: editors(404),
  },
  {
    name: "DELETE /api/library/adcs/[unknown]",
    method: "DELETE",
    setup: fixed(`/api/library/adcs/${NO_SUCH}`),
    expect: editors(404),
  },
  {
    name: "DELETE /api/library/meters/[unknown]",
    method: "DELETE",
    setup: fixed(`/api/library/meters/${NO_SUCH}`),
    expect: editors(404),
  },

  // --- Built units (issue 18): record, import, read, edit, delete, export. ---
  {
    name: "GET /api/designs/[approved]/units",
    method: "GET",
    setup: async () => ({ path: `/api/designs/${f.approved}/units` }),
    expect: members(200, 404),
  },
  {
    name: "POST /api/designs/[approved]/units",
    method: "POST",
    setup: async () => ({ path: `/api/designs/${f.approved}/units`, data: await unitBody() }),
    expect: { anon: 401, owner: 201, designer: 201, reviewer: 403, maker: 201, outsider: 404 },
  },
  {
    name: "POST /api/designs/[draft]/units",
    method: "POST",
    setup: async () => ({ path: `/api/designs/${f.draft}/units`, data: await unitBody() }),
    expect: { anon: 401, owner: 422, designer: 422, reviewer: 403, maker: 404, outsider: 404 },
  },
  {
    name: "POST /api/designs/[approved]/units/import",
    method: "POST",
    setup: async () => ({ path: `/api/designs/${f.approved}/units/import`, multipart: await unitsCsv() }),
    expect: { anon: 401, owner: 201, designer: 201, reviewer: 403, maker: 201, outsider: 404 },
  },
  {
    name: "GET /api/designs/[approved]/units/calibration.csv",
    method: "GET",
    setup: async () => ({ path: `/api/designs/${f.approved}/units/calibration.csv` }),
    expect: members(200, 404),
  },
  {
    name: "GET /api/designs/[approved]/units/calibration.json",
    method: "GET",
    setup: async () => ({ path: `/api/designs/${f.approved}/units/calibration.json` }),
    expect: members(200, 404),
  },
  {
    name: "GET /api/designs/[approved]/units/template.csv",
    method: "GET",
    setup: async () => ({ path: `/api/designs/${f.approved}/units/template.csv` }),
    expect: members(200, 404),
  },
  {
    name: "GET /api/designs/[approved]/units/[maker's unit]",
    method: "GET",
    setup: async () => ({ path: `/api/designs/${f.approved}/units/${await unitBy(c.maker)}` }),
    expect: members(200, 404),
  },
  {
    name: "PATCH /api/designs/[approved]/units/[designer's unit]",
    method: "PATCH",
    setup: async () => ({
      path: `/api/designs/${f.approved}/units/${await unitBy(c.designer)}`,
      data: { builtOn: "2026-11-30" },
    }),
    expect: { anon: 401, owner: 200, designer: 200, reviewer: 403, maker: 403, outsider: 404 },
  },
  {
    name: "PATCH /api/designs/[approved]/units/[maker's unit]",
    method: "PATCH",
    setup: async () => ({
      path: `/api/designs/${f.approved}/units/${await unitBy(c.maker)}`,
      data: { builtOn: "2026-11-30" },
    }),
    expect: { anon: 401, owner: 200, designer: 200, reviewer: 403, maker: 200, outsider: 404 },
  },
  {
    name: "DELETE /api/designs/[approved]/units/[designer's unit]",
    method: "DELETE",
    setup: async () => ({ path: `/api/designs/${f.approved}/units/${await unitBy(c.designer)}` }),
    expect: { anon: 401, owner: 200, designer: 200, reviewer: 403, maker: 403, outsider: 404 },
  },
  {
    name: "DELETE /api/designs/[approved]/units/[maker's unit]",
    method: "DELETE",
    setup: async () => ({ path: `/api/designs/${f.approved}/units/${await unitBy(c.maker)}` }),
    expect: { anon: 401, owner: 200, designer: 200, reviewer: 403, maker: 200, outsider: 404 },
  },
  {
    name: "DELETE /api/designs/[approved]/units/[unknown]",
    method: "DELETE",
    setup: async () => ({ path: `/api/designs/${f.approved}/units/${NO_SUCH}` }),
    expect: { anon: 401, owner: 404, designer: 404, reviewer: 403, maker: 404, outsider: 404 },
  },
];

async function call(ctx: APIRequestContext, method: Method, cell: Cell): Promise<number> {
  const opts = cell.multipart ? { multipart: cell.multipart } : cell.data === undefined ? {} : { data: cell.data };
  const res = await ctx.fetch(cell.path, { method, ...opts, maxRedirects: 0 });
  return res.status();
}

test.describe.serial("authorization matrix", () => {
  test.beforeAll(async () => {
    c = await allContexts();
    f.draft = await createDesign(c.designer, `Matrix draft ${unique()}`);
    for (const key of ["approved", "approvedB"] as const) {
      f[key] = await createDesign(c.designer, `Matrix approved ${unique()}`);
      await submitDesign(c.designer, f[key]);
      await approveDesign(c.reviewer, f[key]);
    }
    const team = (await (await c.owner.get("/api/team")).json()) as { members: { userId: string; email: string }[] };
    f.reviewerId = team.members.find((m) => m.email === "reviewer@harbourline.example")!.userId;
    f.makerId = team.members.find((m) => m.email === "maker@harbourline.example")!.userId;
    const amp = await c.designer.post("/api/library/amplifiers", { data: amplifierBody(`Matrix amp ${unique()}`) });
    expect(amp.status(), await amp.text()).toBe(201);
    f.amplifierId = ((await amp.json()) as { id: string }).id;
    const shunt = await c.designer.post("/api/library/shunts", { data: shuntBody(`Matrix shunt ${unique()}`) });
    expect(shunt.status(), await shunt.text()).toBe(201);
    f.shuntId = ((await shunt.json()) as { id: string }).id;
    const adc = await c.designer.post("/api/library/adcs", { data: adcBody(`Matrix ADC ${unique()}`) });
    expect(adc.status(), await adc.text()).toBe(201);
    f.adcId = ((await adc.json()) as { id: string }).id;
    const meter = await c.designer.post("/api/library/meters", { data: meterBody(`Matrix meter ${unique()}`) });
    expect(meter.status(), await meter.text()).toBe(201);
    f.meterId = ((await meter.json()) as { id: string }).id;
  });

  test.afterAll(async () => {
    await Promise.all(Object.values(c ?? {}).map((ctx) => ctx.dispose()));
  });

  for (const row of routes) {
    test(row.name, async () => {
      const got: Partial<Record<Who, number>> = {};
      for (const who of everyone) got[who] = await call(c[who], row.method, await row.setup(who));
      expect(got, `${row.method} statuses by caller`).toEqual(row.expect);
    });
  }

  // A person in two teams: maker in Harbourline (where sign-in lands), owner of a team of their
  // own. In each team every route answers them exactly as it answers that team's role.
  test("a member of two teams gets a maker's answers in one and an owner's in the other", async () => {
    const two = await makeTwoTeamMember(c.owner);
    try {
      const asMaker: Partial<Record<string, number>> = {};
      const asOwner: Partial<Record<string, number>> = {};
      for (const row of routes) asMaker[row.name] = await call(two.ctx, row.method, await row.setup("maker"));
      // Except where the answer rests on who the caller is, not their role: the demo maker's unit
      // may be changed by the maker who recorded it, and this is another maker (policy unit.change).
      const notTheRecorder: Record<string, number> = {
        "PATCH /api/designs/[approved]/units/[maker's unit]": 403,
        "DELETE /api/designs/[approved]/units/[maker's unit]": 403,
      };
      expect(asMaker).toEqual(
        Object.fromEntries(routes.map((r) => [r.name, notTheRecorder[r.name] ?? r.expect.maker])),
      );
      const switched = await two.ctx.put("/api/me/team", { data: { teamId: two.ownTeamId } });
      expect(switched.status(), await switched.text()).toBe(200);
      // The outsider column is an owner of another team: the same place this person now stands.
      for (const row of routes) asOwner[row.name] = await call(two.ctx, row.method, await row.setup("outsider"));
      expect(asOwner).toEqual(Object.fromEntries(routes.map((r) => [r.name, r.expect.outsider])));
      // …and back: the switch is the session's, and it goes both ways.
      expect((await two.ctx.put("/api/me/team", { data: { teamId: two.harbourlineId } })).status()).toBe(200);
      expect((await two.ctx.get("/api/team/audit")).status()).toBe(403);
    } finally {
      await two.ctx.dispose();
    }
  });

  // A read token may only GET: every route of the table that writes refuses it with 403.
  test("an owner's read token is refused on every write route", async () => {
    const token = await tokenContext(c.owner, "read");
    try {
      const got: Record<string, number> = {};
      const writes = routes.filter((r) => r.method !== "GET" && r.expect.anon === 401);
      expect(writes.length).toBeGreaterThan(10);
      for (const row of writes) got[row.name] = await call(token, row.method, await row.setup("owner"));
      expect(got).toEqual(Object.fromEntries(writes.map((r) => [r.name, 403])));
    } finally {
      await token.dispose();
    }
  });

  // A write token acts as its owner: the designer's token gets the designer's column on every row.
  test("a designer's write token gets the designer's answers on every route", async () => {
    const token = await tokenContext(c.designer, "write");
    try {
      const got: Record<string, number> = {};
      const rows = routes.filter((r) => r.expect.anon === 401 && !r.sessionOnly);
      for (const row of rows) got[row.name] = await call(token, row.method, await row.setup("designer"));
      expect(got).toEqual(Object.fromEntries(rows.map((r) => [r.name, r.expect.designer])));
    } finally {
      await token.dispose();
    }
  });

  test("another team's owner sees none of Harbourline's designs in lists", async () => {
    const list = (await (await c.outsider.get("/api/designs")).json()) as { designs: { id: string }[] };
    expect(list.designs.map((d) => d.id)).not.toContain(f.draft);
    expect(list.designs.map((d) => d.id)).not.toContain(f.approved);
  });

  test("makers list approved designs only", async () => {
    const list = (await (await c.maker.get("/api/designs")).json()) as { designs: { id: string; status: string }[] };
    expect(list.designs.length).toBeGreaterThan(0);
    expect(new Set(list.designs.map((d) => d.status))).toEqual(new Set(["approved"]));
    expect(list.designs.map((d) => d.id)).not.toContain(f.draft);
  });
});
