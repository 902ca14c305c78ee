import { Panel } from "@/components/ui/panel";
import type { RevisionHead } from "@/db/queries/designs";
import type { ReviewRecord } from "@/db/queries/reviews";
import type { DesignView, DesignViewer } from "@/lib/design-view";
import { AuditTimeline, type AuditEntry } from "./audit-timeline";
import { CommentThreads } from "./comment-thread";
import { ReviewActions } from "./review-actions";
import { RevisionHistory, type RevisionDiff } from "./revision-history";

/** The design page's review section: status and verdicts, comments, revisions, timeline. */
export function ReviewPanel(props: {
  design: DesignView;
  viewer: DesignViewer;
  revisions: RevisionHead[];
  firstDiff: RevisionDiff;
  reviews: ReviewRecord[];
  audit: AuditEntry[];
}) {
  const { design, viewer } = props;
  return (
    <div id="review" className="grid scroll-mt-4 grid-cols-1 gap-4 lg:grid-cols-2">
      <Panel title="Review" className="lg:col-span-2">
        <ReviewActions design={design} viewer={viewer} />
      </Panel>
      <Panel title="Comments and verdicts" className="min-w-0">
        <CommentThreads designId={design.id} currentRevision={design.revision} reviews={props.reviews} />
      </Panel>
      <div className="flex min-w-0 flex-col gap-4">
        <Panel title="Revisions">
          <RevisionHistory designId={design.id} revisions={props.revisions} firstDiff={props.firstDiff} />
        </Panel>
        <Panel title="Timeline">
          <AuditTimeline entries={props.audit} />
        </Panel>
      </div>
    </div>
  );
}
