// The documented engine shapes are the engine's own types (checked by the compiler), and the engine's
// real answers, sent through JSON as a route sends them, validate against them.
import { describe, expect, expectTypeOf, it } from "vitest";
import type { z } from "zod";
import { insertion, insertionSchema, parseRequirement, solve } from "@/lib/design";
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
