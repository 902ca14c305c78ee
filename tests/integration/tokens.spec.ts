// Personal API tokens over HTTP (issue 17 item 1): the lifecycle, each refusal, and a token after
// its owner's demotion and removal. The matrix (authz-matrix.spec.ts) runs read and write tokens
// across its whole route table.
import { expect, request as playwrightRequest, test, type APIRequestContext } from "@playwright/test";
import { baseURL } from "../../playwright.config";
import { apiAs } from "../fixtures/auth";
import { acceptAndSignIn, choice, requirement, unique } from "./authz-helpers";

const bearer = (token: string) =>
  playwrightRequest.newContext({ baseURL, extraHTTPHeaders: { authorization: `Bearer ${token}` } });

async function createToken(ctx: APIRequestContext, data: Record<string, unknown>) {
  const res = await ctx.post("/api/tokens", { data });
  expect(res.status(), await res.text()).toBe(201);
  return (await res.json()) as { id: string; token: string; expiresAt: string | null };
}

const newDesign = { name: "Scripted design", project: "Night rig", requirement, choice };

test.describe.serial("personal API tokens", () => {
  let owner: APIRequestContext;
  let designer: APIRequestContext;
  test.beforeAll(async () => {
    owner = await apiAs("owner");
    designer = await apiAs("designer");
  });
  test.afterAll(async () => {
    await owner?.dispose();
    await designer?.dispose();
  });

  test("create, use, list without the secret, revoke, refused after", async () => {
    const name = `rig ${unique()}`;
    const created = await createToken(designer, { name, access: "write" });
    expect(created.token).toMatch(/^swt_[A-Za-z0-9_-]{43}$/);

    const script = await bearer(created.token);
    const made = await script.post("/api/designs", { data: newDesign });
    expect(made.status(), await made.text()).toBe(201);
    expect((await script.get("/api/designs")).status()).toBe(200);

    const listText = await (await designer.get("/api/tokens")).text();
    expect(listText).not.toContain(created.token);
    const listed = (
      JSON.parse(listText) as { tokens: { id: string; name: string; access: string; lastUsedAt: string | null }[] }
    ).tokens.find((t) => t.id === created.id);
    expect(listed).toMatchObject({ name, access: "write" });
    expect(listed?.lastUsedAt).not.toBeNull();

    expect((await designer.delete(`/api/tokens/${created.id}`)).status()).toBe(200);
    const after = await script.get("/api/designs");
    expect(after.status()).toBe(401);
    expect(await after.text()).not.toContain(created.token);
    expect((await designer.delete(`/api/tokens/${created.id}`)).status()).toBe(404);
    const stillListed = (await (await designer.get("/api/tokens")).json()) as { tokens: { id: string }[] };
    expect(stillListed.tokens.map((t) => t.id)).not.toContain(created.id);

    const log = (await (await owner.get("/api/team/audit")).json()) as {
      events: { action: string; targetId: string | null }[];
    };
    const about = log.events.filter((e) => e.targetId === created.id).map((e) => e.action);
    expect(about).toEqual(expect.arrayContaining(["token.created", "token.revoked"]));
    await script.dispose();
  });

  test("unknown, malformed, expired: 401 that never repeats the secret", async () => {
    for (const secret of [`swt_${"A".repeat(43)}`, "not-a-token", `swt_${"x".repeat(500)}`]) {
      const ctx = await bearer(secret);
      const res = await ctx.get("/api/designs");
      expect(res.status(), secret.slice(0, 12)).toBe(401);
      expect(await res.text()).not.toContain(secret);
      await ctx.dispose();
    }
    const soon = new Date(Date.now() + 2_000).toISOString();
    const expiring = await createToken(designer, { name: `brief ${unique()}`, access: "read", expiresAt: soon });
    const ctx = await bearer(expiring.token);
    expect((await ctx.get("/api/designs")).status()).toBe(200);
    await new Promise((r) => setTimeout(r, 2_500));
    const res = await ctx.get("/api/designs");
    expect(res.status()).toBe(401);
    expect(((await res.json()) as { message: string }).message).toMatch(/unknown, revoked or expired/);
    await ctx.dispose();
  });

  test("a read token reads and may not write (403)", async () => {
    const { token } = await createToken(designer, { name: `reader ${unique()}`, access: "read" });
    const ctx = await bearer(token);
    expect((await ctx.get("/api/designs")).status()).toBe(200);
    const refused = await ctx.post("/api/designs", { data: newDesign });
    expect(refused.status()).toBe(403);
    const text = await refused.text();
    expect(text).toMatch(/read-only/);
    expect(text).not.toContain(token);
    await ctx.dispose();
  });

  test("bad bodies are refused naming the field; a token mints no tokens nor switches teams", async () => {
    const bad = await designer.post("/api/tokens", { data: { name: "", access: "admin" } });
    expect(bad.status()).toBe(422);
    const { fieldErrors } = (await bad.json()) as { fieldErrors: Record<string, string[]> };
    expect(Object.keys(fieldErrors).sort()).toEqual(["access", "name"]);
    const past = await designer.post("/api/tokens", {
      data: { name: "late", access: "read", expiresAt: "2001-01-01T00:00:00Z" },
    });
    expect(past.status()).toBe(422);
    expect(Object.keys(((await past.json()) as { fieldErrors: object }).fieldErrors)).toEqual(["expiresAt"]);

    const { token } = await createToken(designer, { name: `writer ${unique()}`, access: "write" });
    const ctx = await bearer(token);
    expect((await ctx.post("/api/tokens", { data: { name: "child", access: "write" } })).status()).toBe(403);
    const me = (await (await ctx.get("/api/me")).json()) as { currentTeamId: string; user: { email: string } };
    expect(me.user.email).toBe("designer@harbourline.example");
    expect((await ctx.put("/api/me/team", { data: { teamId: me.currentTeamId } })).status()).toBe(403);
    await ctx.dispose();
  });

  test("bearer requests carry no cookie, so a foreign Origin does not matter to them", async () => {
    const { token } = await createToken(designer, { name: `cross ${unique()}`, access: "write" });
    const ctx = await playwrightRequest.newContext({
      baseURL,
      extraHTTPHeaders: { authorization: `Bearer ${token}`, origin: "https://elsewhere.example" },
    });
    expect((await ctx.post("/api/designs", { data: newDesign })).status()).toBe(201);
    await ctx.dispose();
  });

  test("a token follows its owner's role: demoted → 403 on writes, removed → 401", async () => {
    const email = `scripted-${unique()}@invitee.example`;
    const inv = await owner.post("/api/invitations", { data: { email, role: "designer" } });
    const member = await acceptAndSignIn(((await inv.json()) as { link: string }).link, email, "Script Writer");
    const { token } = await createToken(member, { name: "lab notebook", access: "write" });
    const script = await bearer(token);
    expect((await script.post("/api/designs", { data: newDesign })).status()).toBe(201);

    const team = (await (await owner.get("/api/team")).json()) as { members: { userId: string; email: string }[] };
    const userId = team.members.find((m) => m.email === email)!.userId;
    expect((await owner.patch(`/api/team/members/${userId}`, { data: { role: "maker" } })).status()).toBe(200);
    const demoted = await script.post("/api/designs", { data: newDesign });
    expect(demoted.status()).toBe(403);
    expect(((await demoted.json()) as { message: string }).message).toMatch(/signed in as a maker/);
    const list = (await (await script.get("/api/designs")).json()) as { designs: { status: string }[] };
    expect(list.designs.every((d) => d.status === "approved")).toBe(true);

    expect((await owner.delete(`/api/team/members/${userId}`)).status()).toBe(200);
    const removed = await script.get("/api/designs");
    expect(removed.status()).toBe(401);
    expect(await removed.text()).not.toContain(token);
    await script.dispose();
    await member.dispose();
  });

  test("each token is throttled on its own: 429 with Retry-After past the limit", async () => {
    const { token } = await createToken(designer, { name: `busy ${unique()}`, access: "read" });
    const ctx = await bearer(token);
    let statuses: number[] = [];
    let retryAfter: string | undefined;
    for (let batch = 0; batch < 7 && !statuses.includes(429); batch++) {
      const res = await Promise.all(Array.from({ length: 50 }, () => ctx.get("/api/me")));
      statuses = statuses.concat(res.map((r) => r.status()));
      retryAfter ??= res.find((r) => r.status() === 429)?.headers()["retry-after"];
    }
    expect(statuses.filter((s) => s === 200).length).toBe(300);
    expect(statuses).toContain(429);
    expect(Number(retryAfter)).toBeGreaterThan(0);
    // Another token of the same person is not slowed by it.
    const other = await createToken(designer, { name: `calm ${unique()}`, access: "read" });
    const calm = await bearer(other.token);
    expect((await calm.get("/api/me")).status()).toBe(200);
    await calm.dispose();
    await ctx.dispose();
  });
});
