// A design saved before the readout's own error counted (an ideal converter was assumed when none
// was stated) re-read under today's model: the statement names the failing constraint and the
// class figures now read in its place (readout-error.ts, from memory).
import { describe, expect, it } from "vitest";
import { evaluateCandidate } from "./candidate";
import { solve } from "./solve";
import { savedPairVerdict, savedPlanVerdict } from "./saved-verdict";
import { planChoiceOf } from "./range-candidates";
import { demoLoggerInput, idealLoggerAdc, loggerBurstInput, req } from "./test-helpers";

// docs/model.md §6: the logger's burst range as saved before issue 14, no readout figures stated.
const burst = loggerBurstInput;
const idealAdc = idealLoggerAdc;

describe("a saved pair under today's model", () => {
  // The pair the old rule (an ideal converter) called feasible: with the zeros stated it still is.
  const then = req({ ...burst, readout: idealAdc });
  const choice = solve(then).candidates.find((c) => c.feasible)!;
  it("still passes when its requirement states the figures it was judged with", () => {
    expect(evaluateCandidate(then, choice).feasible).toBe(true);
    expect(savedPairVerdict(then, choice)).toEqual({ fails: false });
  });
  it("fails, naming the constraint and the class figures, when its requirement states none", () => {
    const now = req({ ...burst, readout: { kind: "adc", bits: 12, fullScale: "2.5 V" } });
    const v = savedPairVerdict(now, choice);
    if (!v.fails) throw new Error("expected the saved pair to fail with the class figures");
    expect(v.failing).toContain("accuracy target missed in the accuracy band");
    expect(v.statement).toMatch(/^Under the current model this saved choice fails: .*accuracy target missed/);
    expect(v.statement).toContain("typical of a general-purpose converter with a series reference, not stated");
    expect(v.statement).toContain("from memory");
  });
});

describe("a saved range plan under today's model", () => {
  it("passes on the requirement it was proposed for, and names the range at fault on a harsher one", () => {
    const r = req(demoLoggerInput);
    const plan = planChoiceOf(solve(r).rangePlan!);
    expect(savedPlanVerdict(r, plan)).toEqual({ fails: false });
    // The same plan without its calibration (the converter's offset counts again) and at 1 %.
    const harsher = req({ ...demoLoggerInput, calibration: "none", accuracy: { percent: 1 } });
    const v = savedPlanVerdict(harsher, plan);
    if (!v.fails) throw new Error("expected the plan to fail at 1 % uncalibrated");
    expect(v.statement).toMatch(/^Under the current model this saved range plan fails: .*[Rr]ange \d/);
    expect(v.statement).toMatch(/Revise the range plan\.$/);
  });
});
