// The designs list flags a design whose current revision fails under today's model: a pair saved
// when an unstated readout counted as ideal (issue 14's case: the model now reads an unstated
// converter with its class's typical figures, and the accuracy target is missed).
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, getDb } from "@/db/client";
import { createDesign, listDesigns } from "@/db/queries/designs";
import { memberships, teams, users } from "@/db/schema";
import { seedDemoIfEmpty } from "@/db/seed/index";
import type { Caller } from "@/lib/auth/gate";
import { evaluateCandidate } from "@/lib/design/candidate";
import { solve } from "@/lib/design/solve";
import { idealLoggerAdc, loggerBurstInput, req } from "@/lib/design/test-helpers";
import { designsListPage } from "./list-page";

let designer: Caller;
let maker: Caller;
let failingId = "";
let passingId = "";

beforeAll(async () => {
  await seedDemoIfEmpty();
  const db = await getDb();
  const [team] = await db.select().from(teams);
  const members = await db
    .select({ userId: users.id, email: users.email, name: users.name, role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.teamId, team!.id));
  const callerOf = (role: string): Caller => {
    const m = members.find((x) => x.role === role)!;
    return { ...m, teamId: team!.id, teamName: team!.name, via: "session", access: "write" };
  };
  designer = callerOf("designer");
  maker = callerOf("maker");
  // The pair an ideal converter made feasible, saved with the converter unstated (as the old rule read it).
  const ideal = req({ ...loggerBurstInput, readout: idealLoggerAdc });
  const pick = solve(ideal).candidates.find((c) => c.feasible)!;
  const choice = { shuntOhms: pick.shuntOhms, gain: pick.gain };
  const unstated = req({ ...loggerBurstInput, readout: { kind: "adc", bits: 12, fullScale: "2.5 V" } });
  expect(evaluateCandidate(unstated, choice).feasible).toBe(false);
  const save = (name: string, requirement: typeof ideal) =>
    createDesign({
      teamId: team!.id,
      userId: designer.userId,
      name,
      requirement,
      kind: "pair",
      choice,
      plan: null,
      metrics: evaluateCandidate(ideal, choice),
    });
  failingId = (await save("Saved under the old readout rule", unstated)).id;
  passingId = (await save("Same pair, converter stated", ideal)).id;
});

afterAll(closeDb);

describe("the designs list's current-model flag", () => {
  it("flags the design whose saved pair fails today and no other", async () => {
    const page = await designsListPage(designer, { limit: 50 });
    const byId = new Map(page.designs.map((d) => [d.id, d]));
    expect(byId.get(failingId)?.failsCurrentModel).toBe(true);
    expect(byId.get(passingId)?.failsCurrentModel).toBe(false);
    // The demo team's designs (pairs and a range plan) all pass under today's model.
    const demo = (await listDesigns(designer.teamId)).filter((d) => d.id !== failingId && d.id !== passingId);
    expect(demo.length).toBeGreaterThanOrEqual(4);
    for (const d of demo) expect(byId.get(d.id)?.failsCurrentModel, d.name).toBe(false);
  });

  it("answers the same on a second read (verdicts kept per revision) and for a maker's approved-only list", async () => {
    const again = await designsListPage(designer, { limit: 50 });
    expect(again.designs.find((d) => d.id === failingId)?.failsCurrentModel).toBe(true);
    const makers = await designsListPage(maker, { limit: 50 });
    expect(makers.designs.length).toBeGreaterThan(0);
    expect(makers.designs.every((d) => d.status === "approved" && d.failsCurrentModel === false)).toBe(true);
    expect(makers.designs.some((d) => d.id === failingId)).toBe(false);
  });
});
