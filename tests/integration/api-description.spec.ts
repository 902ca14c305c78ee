// GET /api/openapi.json, and real answers checked against the response schemas it documents
// (the same zod schemas lib/api-description/operations.ts turns into the document).
import { expect, test } from "@playwright/test";
import { responses } from "../../lib/api-description/operations";
import { apiAs } from "../fixtures/auth";
import { choice, requirement } from "./authz-helpers";

test("the document is served to members and every documented answer matches a real one", async () => {
  const designer = await apiAs("designer");
  const anon = await apiAs(null);
  expect((await anon.get("/api/openapi.json")).status()).toBe(401);
  const doc = (await (await designer.get("/api/openapi.json")).json()) as { openapi: string; paths: object };
  expect(doc.openapi).toBe("3.1.0");
  expect(Object.keys(doc.paths)).toContain("/api/tokens/{id}");

  const check = async (
    schema: { safeParse: (v: unknown) => { success: boolean; error?: unknown } },
    res: { json(): Promise<unknown> },
  ) => {
    const parsed = schema.safeParse(await res.json());
    expect(parsed.success, JSON.stringify(parsed.error)).toBe(true);
  };
  await check(responses.health, await anon.get("/api/health"));
  await check(responses.me, await designer.get("/api/me"));
  await check(responses.team, await designer.get("/api/team"));
  await check(responses.designList, await designer.get("/api/designs"));
  const made = await designer.post("/api/designs", { data: { name: "Described", requirement, choice } });
  expect(made.status()).toBe(201);
  await check(responses.designCreated, made);
  const token = await designer.post("/api/tokens", { data: { name: "described", access: "read" } });
  await check(responses.tokenCreated, token);
  await check(responses.tokens, await designer.get("/api/tokens"));

  // The one error shape: {message, fieldErrors?}.
  const bad = await designer.post("/api/tokens", { data: { name: 3 } });
  expect(bad.status()).toBe(422);
  const body = (await bad.json()) as { message: unknown; fieldErrors: Record<string, unknown> };
  expect(typeof body.message).toBe("string");
  expect(Object.values(body.fieldErrors).every((v) => Array.isArray(v))).toBe(true);
  await designer.dispose();
  await anon.dispose();
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
