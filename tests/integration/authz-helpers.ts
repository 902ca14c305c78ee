// Shared set-up for the HTTP-level authorization and review tests: signed-in contexts for each
// demo role, a member of another team (made through the product's own invitation flow, never by
// writing to the database), and designs in known states made through the API.
import { expect, request as playwrightRequest, type APIRequestContext } from "@playwright/test";
import { baseURL } from "../../playwright.config";
import { apiAs, signInApi, type DemoRole } from "../fixtures/auth";
import { demoLoggerReadout } from "../../lib/design/test-helpers";

export type Who = "anon" | DemoRole | "outsider";
export const everyone: Who[] = ["anon", "owner", "designer", "reviewer", "maker", "outsider"];

// The demo logger's burst range, its converter's own error stated and zeroed once (db/seed/designs.ts).
export const requirement = {
  current: { min: "2 mA", max: "180 mA" },
  supply: { voltage: "3.0 V", side: "low" },
  drop: { max: "60 mV" },
  ...demoLoggerReadout,
};
export const choice = { shuntOhms: "274 mohm", gain: 50 };

/** A valid library amplifier and shunt (unit strings, as a person types them). */
export const amplifierBody = (name: string) => ({
  name,
  gainMode: "fixed",
  gains: [20, 50],
  offsetV: "25 uV",
  offsetDriftVPerK: "0.1 uV/K",
  gainErrorFraction: "0.2 %",
  gainDriftPerK: "10 ppm/K",
  biasCurrentA: "15 nA",
  noiseDensityVPerRtHz: "35 nV/rtHz",
  gbwHz: "500 kHz",
  swingLowV: "10 mV",
  swingHighV: "30 mV",
  cmrrDb: 105,
  supplyMinV: "2.7 V",
  supplyMaxV: "5.5 V",
});
export const shuntBody = (name: string) => ({
  name,
  series: "E24",
  minOhms: "1 mohm",
  maxOhms: "100 mohm",
  toleranceFraction: "1 %",
  tempcoPerK: "50 ppm/K",
  ratingsW: ["0.5 W", "1 W"],
  fourTerminal: false,
});
export const adcBody = (name: string) => ({
  name,
  bits: 16,
  fullScale: "4.096 V",
  sampleRateHz: "2 kHz",
  reference: { tolerance: "0.05 %", tempco: "5 ppm/K" },
  offsetLsb: 3,
  gainError: "0.02 %",
  inlLsb: 2,
});
export const meterBody = (name: string) => ({
  name,
  fullScale: "2 V",
  counts: 20000,
  accuracy: { percentOfReading: "0.1 %", digits: 5 },
});
export const unique = () => `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 7)}`;

/** Joins through an invitation link as a new account; returns the signed-in context. */
export async function acceptAndSignIn(link: string, email: string, name: string): Promise<APIRequestContext> {
  const token = new URL(link).pathname.split("/").pop()!;
  const ctx = await playwrightRequest.newContext({ baseURL });
  const password = `pw-${unique()}-long`;
  const res = await ctx.post("/api/invitations/accept", { data: { token, name, password } });
  expect(res.status(), await res.text()).toBe(201);
  expect(await signInApi(ctx, email, password)).toBe(true);
  return ctx;
}

/** An owner of a separate team, founded through an invitation the demo owner sends. */
export async function makeOutsider(owner: APIRequestContext): Promise<APIRequestContext> {
  const email = `outsider-${unique()}@other.example`;
  const res = await owner.post("/api/invitations", { data: { email, newTeam: `Tidewater Instruments ${unique()}` } });
  expect(res.status(), await res.text()).toBe(201);
  const { link } = (await res.json()) as { link: string };
  return acceptAndSignIn(link, email, "Outside Owner");
}

export type Contexts = Record<Who, APIRequestContext>;

export async function allContexts(): Promise<Contexts> {
  const [anon, owner, designer, reviewer, maker] = await Promise.all([
    apiAs(null),
    apiAs("owner"),
    apiAs("designer"),
    apiAs("reviewer"),
    apiAs("maker"),
  ]);
  const outsider = await makeOutsider(owner);
  return { anon, owner, designer, reviewer, maker, outsider };
}

export async function createDesign(as: APIRequestContext, name = `Matrix ${unique()}`): Promise<string> {
  const res = await as.post("/api/designs", { data: { name, project: "Access checks", requirement, choice } });
  expect(res.status(), await res.text()).toBe(201);
  return ((await res.json()) as { id: string }).id;
}

export async function submitDesign(as: APIRequestContext, id: string) {
  const res = await as.post(`/api/designs/${id}/submit`, { data: {} });
  expect(res.status(), await res.text()).toBe(200);
}

export async function approveDesign(as: APIRequestContext, id: string) {
  const res = await as.post(`/api/designs/${id}/reviews`, { data: { verdict: "approve", body: "fine" } });
  expect(res.status(), await res.text()).toBe(201);
}

/** A context that calls the API with a fresh personal token of `owner` (bearer header, no cookie). */
export async function tokenContext(owner: APIRequestContext, access: "read" | "write"): Promise<APIRequestContext> {
  const res = await owner.post("/api/tokens", { data: { name: `matrix ${access} ${unique()}`, access } });
  expect(res.status(), await res.text()).toBe(201);
  const { token } = (await res.json()) as { token: string };
  return playwrightRequest.newContext({ baseURL, extraHTTPHeaders: { authorization: `Bearer ${token}` } });
}

/**
 * A person who is a maker in Harbourline (joined first, so sign-in lands there) and the owner of a
 * team they founded through a second invitation — both made through the product's own invitations.
 */
export async function makeTwoTeamMember(owner: APIRequestContext) {
  const email = `two-teams-${unique()}@bench.example`;
  const password = `pw-${unique()}-long`;
  const invite = async (data: Record<string, string>) => {
    const res = await owner.post("/api/invitations", { data: { email, ...data } });
    expect(res.status(), await res.text()).toBe(201);
    return new URL(((await res.json()) as { link: string }).link).pathname.split("/").pop()!;
  };
  const ctx = await playwrightRequest.newContext({ baseURL });
  const joined = await ctx.post("/api/invitations/accept", {
    data: { token: await invite({ role: "maker" }), name: "Two Teams", password },
  });
  expect(joined.status(), await joined.text()).toBe(201);
  // An existing account joins another team signed in as itself, with the token alone (never a password).
  expect(await signInApi(ctx, email, password)).toBe(true);
  const founded = await ctx.post("/api/invitations/accept", {
    data: { token: await invite({ newTeam: `Second Bench ${unique()}` }) },
  });
  expect(founded.status(), await founded.text()).toBe(201);
  const me = (await (await ctx.get("/api/me")).json()) as {
    teams: { id: string; name: string; role: string }[];
    currentTeamId: string;
  };
  const harbourline = me.teams.find((t) => t.role === "maker")!;
  const own = me.teams.find((t) => t.role === "owner")!;
  expect(me.currentTeamId).toBe(harbourline.id);
  return { ctx, email, password, harbourlineId: harbourline.id, ownTeamId: own.id };
}
