import { Panel } from "@/components/ui/panel";
import type { RevisionHead } from "@/db/queries/designs";
import type { ReviewRecord } from "@/db/queries/reviews";
import type { ClientDesignView, DesignViewer } from "@/lib/design-view";
import { AuditTimeline, type AuditEntry } from "./audit-timeline";
import { CommentThreads } from "./comment-thread";
import { ReviewActions } from "./review-actions";
import { RevisionHistory, type HistoryRow, type RevisionDiff } from "./revision-history";

/** A revision head as the history shows it (the client gets these fields only). */
function historyRow(h: RevisionHead): HistoryRow {
  const base = {
    revision: h.revision,
    authorName: h.authorName,
    createdAt: h.createdAt,
    approval: h.approval && { byName: h.approval.byName, at: h.approval.at },
  };
  return h.kind === "plan"
    ? {
        ...base,
        kind: "plan",
        choice: null,
        plan: { ranges: h.plan.ranges.map(({ shuntOhms, gain }) => ({ shuntOhms, gain })) },
      }
    : { ...base, kind: "pair", choice: { shuntOhms: h.choice.shuntOhms, gain: h.choice.gain }, plan: null };
}

/** The design page's review section: status and verdicts, comments, revisions, timeline. */
export function ReviewPanel(props: {
  design: ClientDesignView;
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
          <RevisionHistory
            designId={design.id}
            revisions={props.revisions.map(historyRow)}
            firstDiff={props.firstDiff}
          />
        </Panel>
        <Panel title="Timeline">
          <AuditTimeline entries={props.audit} />
        </Panel>
      </div>
    </div>
  );
}
