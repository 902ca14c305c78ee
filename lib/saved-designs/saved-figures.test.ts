import { describe, expect, it } from "vitest";
import { evaluateCandidate } from "@/lib/design/candidate";
import { candidateStudy } from "@/lib/design/candidate-study";
import { benchHowTo, benchRows, cautions } from "@/lib/build-sheet/sheet-data";
import { fixtureView, loggerRequirement, pumpRequirement } from "@/lib/build-sheet/fixtures";
import { savedPairVerdict } from "@/lib/design/saved-verdict";
import { toDisplayDigits } from "@/lib/display-digits";
import { pairBuildFigures, savedPairStudy, savedPairStudyToDraw, savedVerdictOf } from "./saved-figures";

// What is kept per revision must be exactly what the engine gives for that revision (the engine's
// own tests check the figures against their sources); these check the keeping.
describe("a saved pair's figures, once per revision", () => {
  const logger = fixtureView(loggerRequirement, { revision: 4 });

  it("are the engine's figures for the revision, as saved", () => {
    expect(savedPairStudy(logger)).toEqual(
      candidateStudy(logger.requirement, logger.choice, { saved: logger.metrics }),
    );
    const metrics = evaluateCandidate(logger.requirement, logger.choice);
    expect(pairBuildFigures(logger)).toEqual({
      metrics,
      bench: benchRows(logger.requirement, logger.choice),
      howTo: benchHowTo(logger.requirement),
      warnings: cautions(logger.requirement, metrics),
    });
    expect(savedVerdictOf(logger)).toEqual(savedPairVerdict(logger.requirement, logger.choice));
  });

  it("are worked out once for a revision and afresh for another revision or design", () => {
    expect(savedPairStudy(logger)).toBe(savedPairStudy({ ...logger }));
    expect(pairBuildFigures(logger)).toBe(pairBuildFigures({ ...logger }));
    expect(savedVerdictOf(logger)).toBe(savedVerdictOf({ ...logger }));
    const pump = fixtureView(pumpRequirement, { revision: 4 });
    const otherDesign = { ...pump, id: "00000000-0000-4000-8000-000000000009" };
    expect(savedPairStudy(otherDesign).detail).toEqual(pump.metrics);
    expect(savedPairStudy(otherDesign)).not.toBe(savedPairStudy(logger));
    const next = fixtureView(pumpRequirement, { revision: 5 }); // same id as logger, a later revision
    expect(savedPairStudy(next).detail).toEqual(next.metrics);
    expect(pairBuildFigures(next).bench).toEqual(benchRows(next.requirement, next.choice));
  });

  it("go to the page drawn at display digits, the pair and its figures exact, rounded once", () => {
    const study = savedPairStudy(logger);
    const drawn = savedPairStudyToDraw(logger);
    expect(drawn.detail).toEqual(study.detail);
    expect(drawn.errorCurves.map((c) => c.points)).toEqual(study.errorCurves.map((c) => toDisplayDigits(c.points)));
    expect(drawn.load).toEqual(toDisplayDigits(study.load));
    expect(drawn.budgets).toEqual(toDisplayDigits(study.budgets));
    // The rounding shows: some drawn value differs from the exact one, by less than 5 digits allow.
    const exact = study.load.flatMap((p) => Object.values(p).filter((v): v is number => typeof v === "number"));
    const shown = drawn.load.flatMap((p) => Object.values(p).filter((v): v is number => typeof v === "number"));
    expect(shown.some((v, k) => v !== exact[k])).toBe(true);
    shown.forEach((v, k) => expect(Math.abs(v - exact[k]!)).toBeLessThanOrEqual(Math.abs(exact[k]!) * 5e-5));
    expect(savedPairStudyToDraw({ ...logger })).toBe(drawn);
  });
});
