// Accounts, sign-in and sessions tried as an attacker would (issue "Hardening", items 2, 3, 6, 7, 8, 11),
// over HTTP against the built app with the demo team, plus the invitation screens in the browser.
// Fresh accounts are made through the product's own invitation flow, so no demo account is locked
// out or signed out for the specs that run after this one.
import { expect, request as playwrightRequest, test, type APIRequestContext } from "@playwright/test";
import { baseURL } from "../../playwright.config";
import { apiAs, signInApi, signInPage } from "../fixtures/auth";
import { createDesign, makeOutsider, unique } from "./authz-helpers";

const shots = process.env.PW_OUTPUT_DIR ?? "test-results/security-accounts";

type Account = { email: string; password: string; userId: string };

/** A new member of the inviter's team, made through an invitation; not signed in anywhere. */
async function newAccount(inviter: APIRequestContext, role = "maker"): Promise<Account> {
  const email = `acct-${unique()}@invitee.example`;
  const password = `pw-${unique()}-long`;
  const invited = await inviter.post("/api/invitations", { data: { email, role } });
  expect(invited.status(), await invited.text()).toBe(201);
  const token = new URL(((await invited.json()) as { link: string }).link).pathname.split("/").pop()!;
  const anon = await playwrightRequest.newContext({ baseURL });
  const accepted = await anon.post("/api/invitations/accept", { data: { token, name: "Fresh Member", password } });
  expect(accepted.status(), await accepted.text()).toBe(201);
  await anon.dispose();
  const team = (await (await inviter.get("/api/team")).json()) as { members: { userId: string; email: string }[] };
  return { email, password, userId: team.members.find((m) => m.email === email)!.userId };
}

async function signedIn(account: Account): Promise<APIRequestContext> {
  const ctx = await playwrightRequest.newContext({ baseURL });
  expect(await signInApi(ctx, account.email, account.password), `sign in as ${account.email}`).toBe(true);
  return ctx;
}

/** One credentials sign-in attempt; the raw response (status, Retry-After, body). */
async function attempt(email: string, password: string, headers: Record<string, string> = {}) {
  const ctx = await playwrightRequest.newContext({ baseURL, extraHTTPHeaders: headers });
  const { csrfToken } = (await (await ctx.get("/api/auth/csrf")).json()) as { csrfToken: string };
  const res = await ctx.post("/api/auth/callback/credentials", {
    form: { csrfToken, email, password, json: "true" },
    maxRedirects: 0,
  });
  const result = { status: res.status(), retryAfter: res.headers()["retry-after"], body: await res.text() };
  await ctx.dispose();
  return result;
}

const tokenOf = (link: string) => new URL(link).pathname.split("/").pop()!;

test.describe.configure({ mode: "serial" });

test("an existing account never joins by a password sent to the accept route; every refusal is audited", async () => {
  const owner = await apiAs("owner");
  const victim = await newAccount(owner);
  const outsider = await makeOutsider(owner);
  const invited = await outsider.post("/api/invitations", { data: { email: victim.email, role: "designer" } });
  expect(invited.status()).toBe(201);
  const { id: invitationId, link } = (await invited.json()) as { id: string; link: string };
  const token = tokenOf(link);

  // Signed out, the right password and a wrong one get the same answer: nothing to learn from it.
  const anon = await apiAs(null);
  const right = await anon.post("/api/invitations/accept", { data: { token, password: victim.password } });
  const wrong = await anon.post("/api/invitations/accept", { data: { token, password: "not-the-password-1" } });
  expect(right.status()).toBe(401);
  expect(wrong.status()).toBe(401);
  expect(await right.json()).toEqual(await wrong.json());
  // The inviting owner, signed in as themselves, is refused too.
  const asInviter = await outsider.post("/api/invitations/accept", { data: { token, password: victim.password } });
  expect(asInviter.status()).toBe(403);

  // The victim's own team sees each refused attempt in its audit log.
  const log = (await (await owner.get("/api/team/audit?limit=200")).json()) as {
    events: { action: string; targetId: string; details: { reason?: string; passwordOffered?: boolean } }[];
  };
  const refused = log.events.filter((e) => e.action === "invitation.refused" && e.targetId === invitationId);
  expect(refused.map((e) => e.details.reason).sort()).toEqual([
    "password offered for an existing account",
    "password offered for an existing account",
    "signed in as another account",
  ]);

  // Still pending: the victim, signed in, joins with the token alone.
  const victimCtx = await signedIn(victim);
  const joined = await victimCtx.post("/api/invitations/accept", { data: { token } });
  expect(joined.status(), await joined.text()).toBe(201);
  expect(await joined.json()).toMatchObject({ email: victim.email, role: "designer", newAccount: false });

  // Removal from a team ends every session of the user, the one working in their other team included.
  expect((await victimCtx.get("/api/designs")).status()).toBe(200);
  expect((await outsider.delete(`/api/team/members/${victim.userId}`)).status()).toBe(200);
  expect((await victimCtx.get("/api/designs")).status()).toBe(401);
});

test("rotating X-Forwarded-For does not reset the limit; a locked pair gets 429 with Retry-After", async () => {
  const owner = await apiAs("owner");
  const account = await newAccount(owner);
  for (let i = 1; i <= 5; i++) {
    const failed = await attempt(account.email, `wrong-guess-${i}`, { "X-Forwarded-For": `203.0.113.${i}` });
    expect(failed.status, failed.body).toBe(401);
  }
  // A sixth try from yet another claimed address, with the right password, is still held back.
  const held = await attempt(account.email, account.password, { "X-Forwarded-For": "198.51.100.77" });
  expect(held.status).toBe(429);
  const seconds = Number(held.retryAfter);
  expect(seconds).toBeGreaterThan(0);
  expect(seconds).toBeLessThanOrEqual(15 * 60);
  expect(JSON.parse(held.body).message).toContain("Too many failed sign-ins");

  // The failures were counted against the connection's own address, never the claimed ones.
  const log = (await (await owner.get("/api/team/audit?limit=200")).json()) as {
    events: { action: string; targetId: string; details: { address?: string } }[];
  };
  const addresses = log.events
    .filter((e) => e.action === "sign-in.failed" && e.targetId === account.userId)
    .map((e) => e.details.address);
  expect(addresses).toHaveLength(5);
  for (const address of addresses) expect(address).toMatch(/^(127\.0\.0\.1|::1)$/);
});

test("a stranger's failures on made-up e-mails do not lock a real user out", async () => {
  const owner = await apiAs("owner");
  const account = await newAccount(owner);
  // More than the old shared limit of 20 per address.
  for (let i = 0; i < 25; i++) {
    const failed = await attempt(`made-up-${unique()}@nowhere.example`, "guess-guess-guess");
    expect(failed.status).toBe(401);
  }
  const ok = await attempt(account.email, account.password);
  expect(ok.status, ok.body).toBe(200);
  expect(ok.body).not.toContain("error=");
});

test("a message planted with a fake team header line stays out of the other team's outbox", async () => {
  const owner = await apiAs("owner");
  const victimTeamId = ((await (await owner.get("/api/team")).json()) as { team: { id: string } }).team.id;
  const outsider = await makeOutsider(owner);
  await newAccount(outsider, "reviewer"); // someone in the outsider's team to receive the review request
  const tag = unique();
  const id = await createDesign(outsider, `Planted ${tag}\nX-Sensewright-Team: ${victimTeamId}`);
  expect((await outsider.post(`/api/designs/${id}/submit`, { data: {} })).status()).toBe(200);

  type Outbox = { messages: { subject: string; text: string }[] };
  const planted = async (ctx: APIRequestContext) =>
    ((await (await ctx.get("/api/outbox")).json()) as Outbox).messages.filter((m) => m.text.includes(`Planted ${tag}`));
  // Mail goes out after the response: wait, bounded, until the outsider's own outbox has it.
  await expect.poll(async () => (await planted(outsider)).length, { timeout: 10_000 }).toBe(1);
  expect((await planted(outsider))[0]!.text).toContain(`X-Sensewright-Team: ${victimTeamId}`);
  expect(await planted(owner)).toEqual([]);
});

test("sign-in's next never leaves the app", async ({ browser }) => {
  const designer = await apiAs("designer");
  const res = await designer.get("/sign-in?next=/%5Cevil.example", { maxRedirects: 0 });
  expect(res.status()).toBe(307);
  expect(res.headers()["location"]).toBe("/designs");
  const twice = await designer.get("/sign-in?next=/.//evil.example", { maxRedirects: 0 });
  expect(twice.headers()["location"]).toBe("/designs");

  // Signing in through the form with that next lands on the designs list of this app.
  const ctx = await browser.newContext();
  const page = await ctx.newPage();
  await page.goto("/sign-in?next=/%5Cevil.example");
  await page.getByLabel("E-mail").fill("reviewer@harbourline.example");
  await page.getByLabel("Password").fill("sensewright-demo");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page).toHaveURL(`${baseURL}/designs`);
  await ctx.close();
});

test("a callbackUrl with a bad port is a 4xx, never a 500, anywhere under /api/auth", async () => {
  const bad = "http://localhost:99999/";
  const anon = await apiAs(null);
  const { csrfToken } = (await (await anon.get("/api/auth/csrf")).json()) as { csrfToken: string };
  const answers: Record<string, number> = {};
  for (const path of ["signin", "session", "csrf", "providers", "signout", "error"]) {
    answers[`GET ${path}?callbackUrl`] = (
      await anon.get(`/api/auth/${path}?callbackUrl=${encodeURIComponent(bad)}`)
    ).status();
    answers[`GET ${path} cookie`] = (
      await anon.get(`/api/auth/${path}`, { headers: { cookie: `next-auth.callback-url=${encodeURIComponent(bad)}` } })
    ).status();
  }
  answers["POST signin/credentials ?callbackUrl"] = (
    await anon.post(`/api/auth/signin/credentials?callbackUrl=${encodeURIComponent(bad)}`, {
      form: { csrfToken, callbackUrl: bad, json: "true" },
      maxRedirects: 0,
    })
  ).status();
  answers["POST callback/credentials body"] = (
    await anon.post("/api/auth/callback/credentials", {
      form: { csrfToken, email: "made-up@nowhere.example", password: "x", callbackUrl: bad, json: "true" },
      maxRedirects: 0,
    })
  ).status();
  answers["POST signout body"] = (
    await anon.post("/api/auth/signout", { form: { csrfToken, callbackUrl: bad, json: "true" }, maxRedirects: 0 })
  ).status();
  for (const [what, status] of Object.entries(answers)) expect(status, what).toBeLessThan(500);
  const refused = await anon.get(`/api/auth/signin?callbackUrl=${encodeURIComponent(bad)}`);
  expect(refused.status()).toBe(400);
  expect((await refused.json()).fieldErrors).toHaveProperty("callbackUrl");
});

async function signOut(ctx: APIRequestContext) {
  const { csrfToken } = (await (await ctx.get("/api/auth/csrf")).json()) as { csrfToken: string };
  const res = await ctx.post("/api/auth/signout", { form: { csrfToken, json: "true" }, maxRedirects: 0 });
  expect(res.status()).toBe(200);
}

test("a session cookie copied before sign-out is refused after it", async () => {
  const owner = await apiAs("owner");
  const account = await newAccount(owner);
  const ctx = await signedIn(account);
  const copy = await playwrightRequest.newContext({ baseURL, storageState: await ctx.storageState() });
  expect((await copy.get("/api/designs")).status()).toBe(200);
  await signOut(ctx);
  expect((await copy.get("/api/designs")).status()).toBe(401);
  const page = await copy.get("/designs", { maxRedirects: 0 });
  expect(page.headers()["location"] ?? "").toContain("/sign-in");
  // Signing in again works as before.
  expect((await (await signedIn(account)).get("/api/designs")).status()).toBe(200);
});

test("password rules: 11 characters, the e-mail itself and a common password are 422 on the field", async () => {
  const owner = await apiAs("owner");
  const email = `rules-${unique()}@invitee.example`;
  const { link } = (await (await owner.post("/api/invitations", { data: { email, role: "maker" } })).json()) as {
    link: string;
  };
  const anon = await apiAs(null);
  const accept = (password: string) =>
    anon.post("/api/invitations/accept", { data: { token: tokenOf(link), name: "Rules", password } });
  // "qwertyuiop123" is on the common-password list the app ships (checked against the package's data).
  for (const [password, words] of [
    ["eleven-char", "at least 12 characters"],
    [email.toUpperCase(), "must not be your e-mail address"],
    ["qwertyuiop123", "common passwords"],
  ] as const) {
    const res = await accept(password);
    expect(res.status(), password).toBe(422);
    expect((await res.json()).fieldErrors.password.join(" ")).toContain(words);
  }

  const account = await newAccount(owner);
  const ctx = await signedIn(account);
  const change = (currentPassword: string, newPassword: string) =>
    ctx.put("/api/me/password", { data: { currentPassword, newPassword } });
  for (const [password, words] of [
    ["eleven-char", "at least 12 characters"],
    [account.email, "must not be your e-mail address"],
    ["Password1234", "common passwords"],
  ] as const) {
    const res = await change(account.password, password);
    expect(res.status(), password).toBe(422);
    const body = await res.json();
    expect(Object.keys(body.fieldErrors)).toEqual(["newPassword"]);
    expect(body.fieldErrors.newPassword.join(" ")).toContain(words);
  }
  const wrongCurrent = await change("not-my-password", "tall-copper-kettle-41");
  expect(wrongCurrent.status()).toBe(422);
  expect(Object.keys((await wrongCurrent.json()).fieldErrors)).toEqual(["currentPassword"]);
  expect((await (await apiAs(null)).put("/api/me/password", { data: {} })).status()).toBe(401);
});

test("a password change ends every other session and keeps the one that made it", async () => {
  const owner = await apiAs("owner");
  const account = await newAccount(owner);
  const here = await signedIn(account);
  const elsewhere = await signedIn(account);
  const changed = await here.put("/api/me/password", {
    data: { currentPassword: account.password, newPassword: "tall-copper-kettle-41" },
  });
  expect(changed.status(), await changed.text()).toBe(200);
  expect(await changed.json()).toEqual({ ok: true });
  expect((await here.get("/api/designs")).status()).toBe(200);
  expect((await elsewhere.get("/api/designs")).status()).toBe(401);
  expect((await attempt(account.email, account.password)).status).toBe(401);
  expect(await signInApi(await playwrightRequest.newContext({ baseURL }), account.email, "tall-copper-kettle-41")).toBe(
    true,
  );
});

test("on screen: a signed-out invitee with an account signs in, comes back, and joins with one press", async ({
  browser,
}) => {
  const owner = await apiAs("owner");
  const account = await newAccount(owner);
  const outsider = await makeOutsider(owner);
  const team = ((await (await outsider.get("/api/team")).json()) as { team: { name: string } }).team.name;
  const { link } = (await (
    await outsider.post("/api/invitations", { data: { email: account.email, role: "reviewer" } })
  ).json()) as {
    link: string;
  };
  const path = new URL(link).pathname;

  for (const width of [1440, 390]) {
    const ctx = await browser.newContext({ viewport: { width, height: 900 } });
    const page = await ctx.newPage();
    await page.goto(path);
    await expect(page).toHaveURL(/\/sign-in\?next=%2Finvitations%2F/);
    await expect(page.getByTestId("sign-in-for-invitation")).toBeVisible();
    await page.screenshot({ path: `${shots}/invitation-sign-in-${width}.png`, fullPage: true });
    await page.getByLabel("E-mail").fill(account.email);
    await page.getByLabel("Password").fill(account.password);
    await page.getByRole("button", { name: "Sign in" }).click();
    await expect(page).toHaveURL(`${baseURL}${path}`);
    const join = page.getByRole("button", { name: `Join ${team}` });
    await expect(join).toBeVisible();
    await expect(page.getByLabel(/password/i)).toHaveCount(0);
    await page.screenshot({ path: `${shots}/invitation-join-${width}.png`, fullPage: true });
    if (width === 390) {
      await join.click();
      await expect(page.getByTestId("joined")).toContainText(`You are now a member of ${team}`);
      await page.screenshot({ path: `${shots}/invitation-joined-${width}.png`, fullPage: true });
    }
    await ctx.close();
  }

  // Signed in as someone else: the page says whose invitation it is and offers to switch accounts.
  const other = await newAccount(owner);
  const second = (await (
    await outsider.post("/api/invitations", { data: { email: other.email, role: "maker" } })
  ).json()) as {
    link: string;
  };
  const ctx = await browser.newContext({ viewport: { width: 1440, height: 900 } });
  const page = await ctx.newPage();
  await signInPage(page, "maker");
  await page.goto(new URL(second.link).pathname);
  await expect(page.getByTestId("wrong-account")).toContainText(other.email);
  await expect(page.getByRole("button", { name: `Sign in as ${other.email}` })).toBeVisible();
  await page.screenshot({ path: `${shots}/invitation-wrong-account-1440.png`, fullPage: true });
  await ctx.close();
});

test("on screen: a held-back sign-in says how long to wait", async ({ browser }) => {
  const email = `locked-${unique()}@nowhere.example`;
  const ctx = await browser.newContext({ viewport: { width: 390, height: 844 } });
  const page = await ctx.newPage();
  await page.goto("/sign-in");
  // Through the form, so every try comes from the browser's own connection (one address).
  for (let i = 0; i < 6; i++) {
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password").fill(`wrong-${i}-guess`);
    // Wait for this try's own answer: the message of the try before reads the same, so checking the
    // text alone could pass before this try has been counted.
    const answered = page.waitForResponse((r) => r.url().includes("/api/auth/callback/credentials"));
    await page.getByRole("button", { name: "Sign in" }).click();
    await answered;
    await expect(page.getByTestId("sign-in-error")).toHaveText(
      i < 5
        ? "That e-mail and password do not match an account."
        : /^Too many failed sign-ins\. Try again in 1[45] minutes\.$/,
    );
  }
  await page.screenshot({ path: `${shots}/sign-in-held-back-390.png`, fullPage: true });
  await ctx.close();
});
