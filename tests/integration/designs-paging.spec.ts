// GET /api/designs paged on the server (API v2: limit, cursor, q, status → {designs, nextCursor}):
// a stable order across pages, no duplicate and no gap while designs are added between requests,
// a cursor from another team's list refused, makers paging approved designs only, bad input 422.
import { expect, test, type APIRequestContext } from "@playwright/test";
import { apiAs } from "../fixtures/auth";
import { choice, makeOutsider, requirement, unique } from "./authz-helpers";

type Row = { id: string; name: string; project: string | null; status: string; updatedAt: string };
type Page = { designs: Row[]; nextCursor: string | null };

async function listPage(as: APIRequestContext, query: Record<string, string | number>): Promise<Page> {
  const qs = new URLSearchParams(Object.entries(query).map(([k, v]) => [k, String(v)]));
  const res = await as.get(`/api/designs?${qs}`);
  expect(res.status(), await res.text()).toBe(200);
  return (await res.json()) as Page;
}

/** Every page for `query`, following nextCursor; returns the pages as they came. */
async function allPages(as: APIRequestContext, query: Record<string, string | number>): Promise<Page[]> {
  const pages: Page[] = [];
  let cursor: string | null = null;
  do {
    const page = await listPage(as, cursor ? { ...query, cursor } : query);
    pages.push(page);
    cursor = page.nextCursor;
  } while (cursor && pages.length < 500);
  return pages;
}

async function save(as: APIRequestContext, name: string, project: string) {
  const res = await as.post("/api/designs", { data: { name, project, requirement, choice } });
  expect(res.status(), await res.text()).toBe(201);
  return ((await res.json()) as { id: string }).id;
}

test.describe.configure({ mode: "serial" });

let designer: APIRequestContext;
let maker: APIRequestContext;
let owner: APIRequestContext;
const tag = `Paging ${unique()}`;
const made: string[] = [];

test.beforeAll(async () => {
  [designer, maker, owner] = await Promise.all([apiAs("designer"), apiAs("maker"), apiAs("owner")]);
  for (let k = 0; k < 7; k++) made.push(await save(designer, `Pager check ${k}`, tag));
});

test("pages come in one stable order, newest change first, each design once", async () => {
  const pages = await allPages(designer, { q: tag, limit: 3 });
  expect(pages.map((p) => p.designs.length)).toEqual([3, 3, 1]);
  expect(pages.at(-1)?.nextCursor).toBeNull();
  const ids = pages.flatMap((p) => p.designs.map((d) => d.id));
  expect(new Set(ids)).toEqual(new Set(made));
  // Newest first: the last one saved leads.
  expect(ids).toEqual([...made].reverse());
  const times = pages.flatMap((p) => p.designs.map((d) => d.updatedAt));
  expect([...times].sort().reverse()).toEqual(times);
  // Asked again, the same pages in the same order.
  const again = await allPages(designer, { q: tag, limit: 3 });
  expect(again.flatMap((p) => p.designs.map((d) => d.id))).toEqual(ids);
});

test("designs added between page requests cause no duplicate and no gap", async () => {
  const first = await listPage(designer, { q: tag, limit: 3 });
  expect(first.nextCursor).not.toBeNull();
  const added = [await save(designer, "Pager check added A", tag), await save(designer, "Pager check added B", tag)];
  const rest: Row[] = [];
  let cursor = first.nextCursor;
  while (cursor) {
    const page = await listPage(designer, { q: tag, limit: 3, cursor });
    rest.push(...page.designs);
    cursor = page.nextCursor;
  }
  const seen = [...first.designs, ...rest].map((d) => d.id);
  expect(seen).toHaveLength(made.length);
  expect(new Set(seen)).toEqual(new Set(made));
  // The added designs are newer than every row already paged: a fresh first page leads with them.
  const fresh = await listPage(designer, { q: tag, limit: 2 });
  expect(fresh.designs.map((d) => d.id)).toEqual([...added].reverse());
  made.push(...added);
});

test("search matches name or project, case-insensitively; status filters", async () => {
  const byName = await listPage(designer, { q: "PAGER CHECK ADDED", limit: 50 });
  expect(byName.designs.map((d) => d.name).sort()).toEqual(["Pager check added A", "Pager check added B"]);
  const byProject = await listPage(designer, { q: tag.toLowerCase(), limit: 200 });
  expect(byProject.designs).toHaveLength(made.length);
  const approvedOnes = await listPage(designer, { q: tag, status: "approved" });
  expect(approvedOnes.designs).toEqual([]);
  const drafts = await listPage(designer, { q: tag, status: "draft", limit: 200 });
  expect(drafts.designs).toHaveLength(made.length);
  // A percent sign is a literal, not a wildcard.
  expect((await listPage(designer, { q: "%" })).designs).toEqual([]);
});

test("search finds any substring of a name or project, shorter than a trigram too", async () => {
  // Mid-word pieces of "Pager check added A/B" and of the project tag: the trigram index serves
  // three characters and more, and the same ILIKE answers one or two.
  const names = async (q: string) =>
    (await listPage(designer, { q, limit: 200 })).designs.filter((d) => d.project === tag).map((d) => d.name);
  expect((await names("ger che")).length).toBe(made.length);
  expect((await names("heck ADD")).sort()).toEqual(["Pager check added A", "Pager check added B"]);
  expect((await names("ed A")).sort()).toEqual(["Pager check added A"]);
  const byProjectPiece = await listPage(designer, { q: tag.slice(3, 12), limit: 200 });
  expect(byProjectPiece.designs.filter((d) => d.project === tag)).toHaveLength(made.length);
  // Two characters, below a trigram: still a plain substring match.
  expect((await names("gE")).length).toBe(made.length);
  expect(await names("zzqx")).toEqual([]);
});

test("a cursor from another team's list, or an altered one, is refused with 422 on cursor", async () => {
  const outsider = await makeOutsider(owner);
  await save(outsider, "Other team one", "Elsewhere");
  await save(outsider, "Other team two", "Elsewhere");
  const theirs = await listPage(outsider, { limit: 1 });
  expect(theirs.nextCursor).not.toBeNull();
  const refused = await designer.get(`/api/designs?cursor=${encodeURIComponent(theirs.nextCursor!)}`);
  expect(refused.status()).toBe(422);
  const body = (await refused.json()) as { message: string; fieldErrors: Record<string, string[]> };
  expect(Object.keys(body.fieldErrors)).toEqual(["cursor"]);
  // The outsider's own cursor still works for the outsider.
  expect((await listPage(outsider, { limit: 1, cursor: theirs.nextCursor! })).designs).toHaveLength(1);

  const ours = (await listPage(designer, { q: tag, limit: 1 })).nextCursor!;
  const [payload, mac] = ours.split(".");
  const forged = `${Buffer.from(JSON.stringify(["2999-01-01T00:00:00.000000Z", made[0]])).toString("base64url")}.${mac}`;
  expect(payload).toBeTruthy();
  for (const bad of [forged, `${ours}x`, "not-a-cursor"]) {
    const res = await designer.get(`/api/designs?cursor=${encodeURIComponent(bad)}`);
    expect(res.status(), bad).toBe(422);
  }
});

test("makers page approved designs only", async () => {
  const pages = await allPages(maker, { limit: 1 });
  const rows = pages.flatMap((p) => p.designs);
  expect(rows.length).toBeGreaterThan(0);
  expect(rows.every((d) => d.status === "approved")).toBe(true);
  // Exactly the team's approved designs, as the owner sees them filtered.
  const approved = (await allPages(owner, { status: "approved", limit: 200 })).flatMap((p) => p.designs);
  expect(rows.map((d) => d.id)).toEqual(approved.map((d) => d.id));
  // Asking a maker's list for drafts gives nothing rather than an error.
  expect((await listPage(maker, { status: "draft" })).designs).toEqual([]);
  expect((await listPage(maker, { q: tag })).designs).toEqual([]);
});

test("bad paging input is 422 naming the field", async () => {
  for (const [query, field] of [
    ["limit=0", "limit"],
    ["limit=201", "limit"],
    ["limit=ten", "limit"],
    ["limit=2.5", "limit"],
    ["status=finished", "status"],
    [`q=${"x".repeat(201)}`, "q"],
  ] as const) {
    const res = await designer.get(`/api/designs?${query}`);
    expect(res.status(), query).toBe(422);
    const body = (await res.json()) as { fieldErrors: Record<string, string[]> };
    expect(Object.keys(body.fieldErrors), query).toEqual([field]);
  }
  // The default page size is 50, and 200 is allowed.
  expect((await designer.get("/api/designs?limit=200")).status()).toBe(200);
});
