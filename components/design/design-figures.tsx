"use client";
// The saved requirement, the choice, every figure and the charts of one design revision.
import type { PairDesignView as DesignView } from "@/lib/design-view";
import { CandidateStudy } from "@/components/candidates/candidate-study";
import { Panel } from "@/components/ui/panel";
import { RequirementSummary } from "@/components/wizard/requirement-summary";

export function DesignFigures({ design }: { design: DesignView }) {
  return (
    <div className="flex flex-col gap-4" data-testid="design-figures">
      <Panel title={`Requirement (revision ${design.revision})`}>
        <RequirementSummary requirement={design.requirement} />
      </Panel>
      <CandidateStudy req={design.requirement} choice={design.choice} saved={design.metrics} title="Chosen pair" />
    </div>
  );
}
