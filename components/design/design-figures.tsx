// The saved requirement, the choice, every figure and the charts of one design revision. A server
// component: the engine works the figures out here and the browser gets them as data, so showing a
// design downloads neither the engine nor its unit parser.
import type { PairDesignView as DesignView } from "@/lib/design-view";
import { savedPairStudyToDraw } from "@/lib/saved-designs/saved-figures";
import { CandidateStudyView } from "@/components/candidates/candidate-study-view";
import { Panel } from "@/components/ui/panel";
import { RequirementSummary } from "@/components/wizard/requirement-summary";

export function DesignFigures({ design }: { design: DesignView }) {
  const figures = savedPairStudyToDraw(design); // once per revision: revisions never change
  return (
    <div className="flex flex-col gap-4" data-testid="design-figures">
      <Panel title={`Requirement (revision ${design.revision})`}>
        <RequirementSummary requirement={design.requirement} />
      </Panel>
      <CandidateStudyView req={design.requirement} choice={design.choice} figures={figures} title="Chosen pair" />
    </div>
  );
}
