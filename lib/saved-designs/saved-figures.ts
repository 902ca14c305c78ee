// The engine's figures of a saved design that the design page shows, worked out once per revision:
// they depend on the revision's requirement, choice (or plan) and saved figures alone, and those
// never change (lib/saved-designs/revision-memo.ts). What depends on anything else (the team's
// library, the design's status) is worked out per request by the caller.
import type { CandidateDetail } from "@/lib/design";
import { evaluateCandidate } from "@/lib/design/candidate";
import { candidateStudy, type CandidateStudyFigures } from "@/lib/design/candidate-study";
import { benchHowTo, benchRows, cautions, type BenchRow } from "@/lib/build-sheet/sheet-data";
import { savedPairVerdict, savedPlanVerdict, type SavedVerdict } from "@/lib/design/saved-verdict";
import type { Choice } from "@/lib/design";
import type { PlanChoice } from "@/lib/design/plan-choice";
import type { Requirement } from "@/lib/design/requirement";
import type { PairDesignView } from "@/lib/design-view";
import { toDisplayDigits } from "@/lib/display-digits";
import { RevisionMemo, revisionKey } from "./revision-memo";

const studies = new RevisionMemo<CandidateStudyFigures>(500);

/** The chosen pair's figures and curves, as saved (candidateStudy with the revision's own figures). */
export function savedPairStudy(design: PairDesignView): CandidateStudyFigures {
  return studies.get(revisionKey(design.id, design.revision), () =>
    candidateStudy(design.requirement, design.choice, { saved: design.metrics }),
  );
}

const drawn = new RevisionMemo<CandidateStudyFigures>(500);

/**
 * savedPairStudy as the design page sends it: the curves and budgets, which are only drawn, at the
 * digits a screen shows (lib/display-digits.ts); the pair and its figures exact. Kept per revision
 * like the study, so a page view does not round them again.
 */
export function savedPairStudyToDraw(design: PairDesignView): CandidateStudyFigures {
  return drawn.get(revisionKey(design.id, design.revision), () => {
    const study = savedPairStudy(design);
    return {
      ...study,
      errorCurves: study.errorCurves.map((c) => ({ ...c, points: toDisplayDigits(c.points) })),
      load: toDisplayDigits(study.load),
      budgets: toDisplayDigits(study.budgets),
    };
  });
}

/** What the build sheet panel shows of a pair beside its parts: today's evaluation, bench check, cautions. */
export type PairBuildFigures = {
  metrics: CandidateDetail;
  bench: BenchRow[];
  howTo: string[];
  warnings: string[];
};

const builds = new RevisionMemo<PairBuildFigures>(500);

export function pairBuildFigures(design: PairDesignView): PairBuildFigures {
  return builds.get(revisionKey(design.id, design.revision), () => {
    const metrics = evaluateCandidate(design.requirement, design.choice);
    return {
      metrics,
      bench: benchRows(design.requirement, design.choice),
      howTo: benchHowTo(design.requirement),
      warnings: cautions(design.requirement, metrics),
    };
  });
}

// Sized for the designs list too: a page of up to 200 rows, each its design's current revision.
const verdicts = new RevisionMemo<SavedVerdict>(4000);

/** What today's model re-checks of a saved revision. */
export type VerdictBasis = { id: string; revision: number; requirement: Requirement } & (
  { kind: "pair"; choice: Choice } | { kind: "plan"; plan: PlanChoice }
);

/** Whether the saved figures still pass under today's model (the page says so at the top when not). */
export function savedVerdictOf(design: VerdictBasis): SavedVerdict {
  return verdicts.get(revisionKey(design.id, design.revision), () =>
    design.kind === "plan"
      ? savedPlanVerdict(design.requirement, design.plan)
      : savedPairVerdict(design.requirement, design.choice),
  );
}

/** The verdict already worked out for a revision, if any (the designs list reads the rest). */
export const knownVerdict = (designId: string, revision: number): SavedVerdict | undefined =>
  verdicts.peek(revisionKey(designId, revision));
