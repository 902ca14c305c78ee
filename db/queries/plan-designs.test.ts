// The plan-design picker's query against a real (in-memory) PGlite: only designs whose current
// revision is a range plan, only the team's own, and approved ones only when asked.
import { afterAll, beforeAll, expect, it } from "vitest";
import { planChoiceOf } from "@/lib/design/range-candidates";
import { evaluateDesign, evaluatePlanDesign } from "@/lib/saved-designs/service";
import { parseRequirement } from "@/lib/design/requirement";
import { solve } from "@/lib/design/solve";
import { closeDb, getDb } from "../client";
import { memberships, teams, users } from "../schema";
import { changeDesignStatus, createDesign } from "./designs";
import { demoDesigns, demoPlanDesign } from "../seed/designs";
import { listPlanDesigns } from "./plan-designs";

const suffix = Math.random().toString(36).slice(2, 8);
let teamId = "";
let otherTeamId = "";
let userId = "";

// docs/model.md §6: the demo logger, which needs a range plan, its converter's own error stated (db/seed/designs.ts): the whole span and its burst range.
const logger = demoPlanDesign.requirement;
const pair = demoDesigns[0]!.requirement;

beforeAll(async () => {
  const db = await getDb();
  const [team] = await db
    .insert(teams)
    .values({ name: `Plan picker ${suffix}` })
    .returning();
  const [other] = await db
    .insert(teams)
    .values({ name: `Other picker ${suffix}` })
    .returning();
  teamId = team!.id;
  otherTeamId = other!.id;
  const [u] = await db
    .insert(users)
    .values({ email: `picker-${suffix}@test.example`, name: `picker ${suffix}`, passwordHash: "x" })
    .returning();
  userId = u!.id;
  await db.insert(memberships).values({ teamId, userId, role: "designer" });
});

afterAll(closeDb);

it("lists the team's plan designs, not its pair designs nor another team's; approved only on request", async () => {
  const parsed = parseRequirement(logger);
  if (!parsed.ok) throw new Error(parsed.message);
  const plan = planChoiceOf(solve(parsed.requirement, { diagnose: false }).rangePlan!);
  const draftPlan = await createDesign({ ...evaluatePlanDesign(logger, plan), teamId, userId, name: "Plan draft" });
  const approvedPlan = await createDesign({ ...evaluatePlanDesign(logger, plan), teamId, userId, name: "Plan ok" });
  await createDesign({ ...evaluateDesign(pair, { shuntOhms: 0.274, gain: 50 }), teamId, userId, name: "Pair" });
  await createDesign({ ...evaluatePlanDesign(logger, plan), teamId: otherTeamId, userId, name: "Elsewhere" });
  for (const [from, to] of [
    ["draft", "in-review"],
    ["in-review", "approved"],
  ] as const) {
    const r = await changeDesignStatus({
      designId: approvedPlan.id,
      teamId,
      actorId: userId,
      revision: 1,
      from: [from],
      to,
      action: `design.${to}`,
    });
    expect(r).toMatchObject({ ok: true });
  }

  const all = await listPlanDesigns(teamId);
  expect(all.map((d) => d.name).sort()).toEqual(["Plan draft", "Plan ok"]);
  expect(all.find((d) => d.id === draftPlan.id)?.revision).toBe(1);
  const approved = await listPlanDesigns(teamId, { approvedOnly: true });
  expect(approved.map((d) => d.name)).toEqual(["Plan ok"]);
});
