// The documented engine shapes are the engine's own types (checked by the compiler), and the engine's
// real answers, sent through JSON as a route sends them, validate against them.
import { describe, expect, expectTypeOf, it } from "vitest";
import type { z } from "zod";
import { evaluateCandidate, insertion, insertionSchema, parseRequirement, solve } from "@/lib/design";
import type { Candidate, CandidateDetail } from "@/lib/design/types";
import type { Diagnosis } from "@/lib/design/diagnosis";
import type { InsertionResult } from "@/lib/design/insertion";
import type { PlanChoice } from "@/lib/design/plan-choice";
import type { ProfileDesign, ProfileSummary } from "@/lib/design/profile";
import type { RangePlan } from "@/lib/design/range-plan";
import {
  candidateDetailShape,
  candidateShape,
  diagnosisShape,
  insertionShape,
  planChoiceShape,
  profileDesignShape,
  profileSummaryShape,
  rangePlanShape,
  solveShape,
} from "./engine-shapes";
import { responses } from "./responses";

const overJson = (v: unknown): unknown => JSON.parse(JSON.stringify(v));
const requirementOf = (input: unknown) => {
  const parsed = parseRequirement(input);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.fieldErrors));
  return parsed.requirement;
};

describe("engine shapes", () => {
  it("are the engine's types, field for field", () => {
    expectTypeOf<z.output<typeof candidateShape>>().toEqualTypeOf<Candidate>();
    // The engine builds these two as intersections, which toEqualTypeOf tells apart from one object:
    // each way assignable is the same fields.
    expectTypeOf<z.output<typeof candidateDetailShape>>().toExtend<CandidateDetail>();
    expectTypeOf<CandidateDetail>().toExtend<z.output<typeof candidateDetailShape>>();
    expectTypeOf<z.output<typeof rangePlanShape>>().toEqualTypeOf<RangePlan>();
    expectTypeOf<z.output<typeof diagnosisShape>>().toExtend<Diagnosis>();
    expectTypeOf<Diagnosis>().toExtend<z.output<typeof diagnosisShape>>();
    expectTypeOf<z.output<typeof insertionShape>>().toEqualTypeOf<InsertionResult>();
    expectTypeOf<z.output<typeof planChoiceShape>>().toEqualTypeOf<PlanChoice>();
    expectTypeOf<z.output<typeof profileSummaryShape>>().toEqualTypeOf<ProfileSummary>();
    expectTypeOf<z.output<typeof profileDesignShape>>().toEqualTypeOf<ProfileDesign>();
  });

  it("validate a feasible solve with its decade scales", () => {
    const result = solve(
      requirementOf({
        current: { min: "2 mA", max: "180 mA" },
        supply: { voltage: "3.0 V", side: "low" },
        drop: { max: "60 mV" },
        readout: { kind: "adc", bits: 12, fullScale: "2.5 V" },
        // Zeroed once: its converter's typical offset (not stated) is then out of the 2 % budget.
        calibration: "one-point",
      }),
    );
    expect(result.feasibleCount).toBeGreaterThan(0);
    const parsed = solveShape.safeParse(overJson(result));
    expect(parsed.error?.issues ?? []).toEqual([]);
  });

  it("validate a solve with a range plan, and one with a diagnosis", () => {
    const wide = solve(
      requirementOf({
        current: { min: "10 uA", max: "2 A" },
        supply: { voltage: "5 V", side: "low" },
        drop: { max: "100 mV" },
        readout: { kind: "adc", bits: 12, fullScale: "2.5 V" },
      }),
    );
    expect(wide.rangePlan).not.toBeNull();
    expect(solveShape.safeParse(overJson(wide)).error?.issues ?? []).toEqual([]);
    const hopeless = solve(
      requirementOf({
        current: { min: "1 uA", max: "100 A" },
        supply: { voltage: "3 V", side: "low" },
        drop: { max: "1 mV" },
        readout: { kind: "adc", bits: 8, fullScale: "2.5 V" },
      }),
    );
    expect(hopeless.diagnosis).toBeDefined();
    expect(solveShape.safeParse(overJson(hopeless)).error?.issues ?? []).toEqual([]);
  });

  it("validate an insertion", () => {
    const result = insertion(
      insertionSchema.parse({ supply: "5 V", seriesOhms: "0.1 ohm", load: { model: "resistive", current: "0.2 A" } }),
    );
    expect(insertionShape.safeParse(overJson(result)).error?.issues ?? []).toEqual([]);
  });
});

describe("the design answer (API.md v2, Designs)", () => {
  const requirement = requirementOf({
    current: { min: "10 uA", max: "2 A" },
    supply: { voltage: "5 V", side: "low" },
    drop: { max: "100 mV" },
    readout: { kind: "adc", bits: 12, fullScale: "2.5 V" },
  });
  const low = { shuntOhms: 1, gain: 20 };
  const high = { shuntOhms: 0.02, gain: 20 };
  const bench = [{ label: "Minimum current", currentA: 1e-5, expectedV: 2e-4, minV: 1e-4, maxV: 3e-4 }];
  const base = {
    id: "6f1c2d3e-4b5a-4c7d-8e9f-0a1b2c3d4e5f",
    name: "Plan or pair",
    project: null,
    status: "draft",
    revision: 1,
    requirement,
    authorId: "6f1c2d3e-4b5a-4c7d-8e9f-0a1b2c3d4e60",
    authorName: "Demo Designer",
    createdAt: "2026-12-02T08:00:00.000Z",
    updatedAt: "2026-12-02T08:00:00.000Z",
    approval: null,
    revisions: [],
    reviews: [],
  };

  it("takes a pair design: choice, its figures and a bench check", () => {
    const pair = {
      ...base,
      kind: "pair",
      choice: low,
      metrics: evaluateCandidate(requirement, low),
      benchCheck: bench,
    };
    expect(responses.design.safeParse(overJson(pair)).error?.issues ?? []).toEqual([]);
  });

  it("takes a range-plan design: plan, figures per range and a bench check per range", () => {
    const plan = {
      ranges: [
        { minA: 1e-5, maxA: 0.05, ...low },
        { minA: 0.04, maxA: 2, ...high },
      ],
      switchPoints: [{ upA: 0.05, downA: 0.04 }],
    };
    const metrics = { ranges: [evaluateCandidate(requirement, low), evaluateCandidate(requirement, high)] };
    // As GET /api/designs/[id] serves it: each range's bench check under ranges[k] (API.md v2).
    const planned = {
      ...base,
      kind: "plan",
      plan,
      metrics,
      ranges: plan.ranges.map((r) => ({ ...r, benchCheck: bench })),
    };
    expect(responses.design.safeParse(overJson(planned)).error?.issues ?? []).toEqual([]);
    // Not both, and not a pair's figures on a plan.
    expect(responses.design.safeParse(overJson({ ...planned, metrics: metrics.ranges[0] })).success).toBe(false);
  });
});
