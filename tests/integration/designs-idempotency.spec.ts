// API v2: POST /api/designs honours Idempotency-Key (same key, same user, 24 h → the first answer,
// nothing created); a PATCH that changes nothing makes no revision.
import { expect, test } from "@playwright/test";
import { apiAs } from "../fixtures/auth";
import { choice, requirement, unique } from "./authz-helpers";

test("the same Idempotency-Key twice creates one design and answers the same", async () => {
  const designer = await apiAs("designer");
  const owner = await apiAs("owner");
  const count = async () =>
    ((await (await designer.get("/api/designs?limit=200")).json()) as { designs: unknown[] }).designs.length;
  const before = await count();
  const key = `save-${unique()}`;
  const data = { name: `Idempotent ${unique()}`, requirement, choice };
  const first = await designer.post("/api/designs", { data, headers: { "Idempotency-Key": key } });
  expect(first.status(), await first.text()).toBe(201);
  const again = await designer.post("/api/designs", { data, headers: { "Idempotency-Key": key } });
  expect(again.status()).toBe(201);
  expect(await again.json()).toEqual(await first.json());
  expect(await count()).toBe(before + 1);

  // Another user's key is their own; another key is another design.
  const theirs = await owner.post("/api/designs", { data, headers: { "Idempotency-Key": key } });
  expect(theirs.status()).toBe(201);
  expect(((await theirs.json()) as { id: string }).id).not.toBe(((await first.json()) as { id: string }).id);
  const other = await designer.post("/api/designs", { data, headers: { "Idempotency-Key": `${key}-2` } });
  expect(((await other.json()) as { id: string }).id).not.toBe(((await first.json()) as { id: string }).id);

  const bad = await designer.post("/api/designs", { data, headers: { "Idempotency-Key": "x".repeat(300) } });
  expect(bad.status()).toBe(422);
  expect(((await bad.json()) as { fieldErrors: Record<string, string[]> }).fieldErrors).toHaveProperty(
    "Idempotency-Key",
  );
});

test("concurrent repeats of one key still create one design", async () => {
  const designer = await apiAs("designer");
  const key = `race-${unique()}`;
  const data = { name: `Double click ${unique()}`, requirement, choice };
  const answers = await Promise.all(
    [0, 1, 2].map(() => designer.post("/api/designs", { data, headers: { "Idempotency-Key": key } })),
  );
  const ids = await Promise.all(answers.map(async (r) => ((await r.json()) as { id: string }).id));
  expect(answers.map((r) => r.status())).toEqual([201, 201, 201]);
  expect(new Set(ids).size).toBe(1);
});

test("a PATCH that changes nothing makes no revision", async () => {
  const designer = await apiAs("designer");
  const name = `No-op ${unique()}`;
  const created = await designer.post("/api/designs", { data: { name, requirement, choice } });
  const { id } = (await created.json()) as { id: string };
  const same = await designer.patch(`/api/designs/${id}`, { data: { revision: 1, name: `  ${name} ` } });
  expect(same.status(), await same.text()).toBe(200);
  expect(await same.json()).toEqual({ revision: 1, unchanged: true });
  const sameReq = await designer.patch(`/api/designs/${id}`, { data: { revision: 1, requirement, choice } });
  expect(await sameReq.json()).toEqual({ revision: 1, unchanged: true });
  const view = (await (await designer.get(`/api/designs/${id}`)).json()) as { revision: number; revisions: unknown[] };
  expect(view.revision).toBe(1);
  expect(view.revisions).toHaveLength(1);
  // A real change still makes the next revision; the old revision number is then stale.
  const renamed = await designer.patch(`/api/designs/${id}`, { data: { revision: 1, name: `${name} b` } });
  expect(await renamed.json()).toEqual({ revision: 2 });
  expect((await designer.patch(`/api/designs/${id}`, { data: { revision: 1, name } })).status()).toBe(409);
});
