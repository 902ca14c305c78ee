// The engine's figures of a saved design that the design page shows, worked out once per revision:
// they depend on the revision's requirement, choice (or plan) and saved figures alone, and those
// never change (lib/saved-designs/revision-memo.ts). What depends on anything else (the team's
// library, the design's status) is worked out per request by the caller.
import type { CandidateDetail } from "@/lib/design";
import { evaluateCandidate } from "@/lib/design/candidate";
import { candidateStudy, type CandidateStudyFigures } from "@/lib/design/candidate-study";
import { benchHowTo, benchRows, cautions, type BenchRow } from "@/lib/build-sheet/sheet-data";
import { savedPairVerdict, savedPlanVerdict, type SavedVerdict } from "@/lib/design/saved-verdict";
import type { DesignView, PairDesignView } from "@/lib/design-view";
import { RevisionMemo, revisionKey } from "./revision-memo";

const studies = new RevisionMemo<CandidateStudyFigures>(500);

/** The chosen pair's figures and curves, as saved (candidateStudy with the revision's own figures). */
export function savedPairStudy(design: PairDesignView): CandidateStudyFigures {
  return studies.get(revisionKey(design.id, design.revision), () =>
    candidateStudy(design.requirement, design.choice, { saved: design.metrics }),
  );
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

const verdicts = new RevisionMemo<SavedVerdict>(1000);

/** Whether the saved figures still pass under today's model (the page says so at the top when not). */
export function savedVerdictOf(design: DesignView): SavedVerdict {
  return verdicts.get(revisionKey(design.id, design.revision), () =>
    design.kind === "plan"
      ? savedPlanVerdict(design.requirement, design.plan)
      : savedPairVerdict(design.requirement, design.choice),
  );
}
