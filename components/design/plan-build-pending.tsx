// The build side of a range plan (sheet, parts, netlist, current profiles, built units) reads one
// pair today; until it learns plans this says so in one place, and offers what does work: the
// design file. The API answers the same routes with 422 (lib/saved-designs/access.ts, rangePlanNotYet).
import { buttonClass } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import type { PlanDesignView } from "@/lib/design-view";

export function PlanBuildPending({ design }: { design: PlanDesignView }) {
  return (
    <Panel title="Build and bench check" className="border-dashed">
      <div className="flex flex-wrap items-center justify-between gap-3" data-testid="plan-build-pending">
        <p className="max-w-prose text-xs text-ink-muted">
          The PDF build sheet, parts list, SPICE netlist, current-profile checks and built-unit records are not
          available for a range plan yet. Each range&apos;s figures and bench rows are on this page, and the design file
          carries the whole plan.
        </p>
        <a
          href={`/api/designs/${design.id}/export`}
          download
          className={buttonClass("secondary")}
          data-testid="download-export"
        >
          Design file (JSON)
        </a>
      </div>
    </Panel>
  );
}
