import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { BuildSheetPanel } from "@/components/design/build-sheet-panel";
import { DesignFigures } from "@/components/design/design-figures";
import { PlanBuildPanel } from "@/components/design/plan-build-panel";
import { PlanFigures } from "@/components/design/plan-figures";
import { SavedVerdictNotice } from "@/components/design/saved-verdict-notice";
import { ProfilesPanel } from "@/components/design/profiles-panel";
import { ComparePicker } from "@/components/review/compare-picker";
import { ReviewPanel } from "@/components/review/review-panel";
import { StatusBadge, statusExplained } from "@/components/review/status-badge";
import { UnitsPanel } from "@/components/units/units-panel";
import { getDesignPage } from "@/db/queries/design-page";
import { isUuid } from "@/lib/ids";
import { formatSI } from "@/lib/design/format";
import { requirePageCaller } from "@/lib/auth/gate";
import { can } from "@/lib/auth/policy";
import { clientDesignView, designViewerFor } from "@/lib/design-view";
import { revisionChanges } from "@/lib/saved-designs/revision-changes";
import { savedVerdictOf } from "@/lib/saved-designs/saved-figures";
import { formatWhen } from "@/lib/saved-designs/when";

export const metadata: Metadata = { title: "Design" };

export default async function DesignPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const caller = await requirePageCaller(`/designs/${id}`);
  if (!isUuid(id)) notFound();
  const found = await getDesignPage(id, caller.teamId);
  // Makers see approved designs only; anything else is "not found" for them, as in the API.
  if (!found || !can(caller, "design.read", found.view)) notFound();
  const { view: design, heads: revisions, reviews, audit } = found;
  // Only a pair's parts are named from the library (a plan's build sheet lists its own).
  const library = design.kind === "pair" ? found.library : undefined;
  const viewer = designViewerFor(caller, design);
  // The history lists each revision's head; the one diff it opens on (the last save against the
  // one before) is worked out from those two revisions' full records, once: revisions never change.
  const last = design.revision;
  const firstPair = [Math.max(1, last - 1), last] as const;
  const changes = await revisionChanges(design.id, ...firstPair);
  const firstDiff = { a: firstPair[0], b: firstPair[1], changes };
  // One object for every client section (sent once in the page's data), without the revision list.
  const forClient = clientDesignView(design);
  // The picker reads the team's designs itself when it is opened.
  const picker = <ComparePicker current={{ id: design.id, name: design.name }} />;
  const review = (
    <ReviewPanel
      design={forClient}
      viewer={viewer}
      revisions={revisions}
      firstDiff={firstDiff}
      reviews={reviews}
      audit={audit.map((e) => ({ ...e, at: e.at.toISOString() }))}
    />
  );
  // The saved figures are the ones it was approved on; today's model may no longer pass them.
  const verdict = savedVerdictOf(design);
  const worstDropV =
    design.kind === "plan" ? Math.max(...design.metrics.ranges.map((r) => r.worstBurdenV)) : design.metrics.burdenV;
  return (
    <div className="flex flex-col gap-4">
      <header className="flex flex-wrap items-start justify-between gap-4">
        <div className="min-w-0">
          <p className="text-xs text-ink-muted">
            <Link href="/designs" className="hover:text-ink">
              Designs
            </Link>
            {design.project && <> / {design.project}</>}
          </p>
          <h1 className="flex flex-wrap items-center gap-2 text-lg font-semibold">
            <span data-testid="design-name">{design.name}</span>
            <StatusBadge status={design.status} />
            <span className="text-xs font-normal text-ink-muted num" data-testid="design-revision">
              revision {design.revision}
            </span>
          </h1>
          <p className="mt-0.5 text-xs text-ink-muted">
            {statusExplained[design.status]} Revision {design.revision} by {design.authorName}, saved{" "}
            {formatWhen(design.updatedAt)}.
            {design.approval && (
              <>
                {" "}
                Approved by {design.approval.byName} on {formatWhen(design.approval.at)}.
              </>
            )}{" "}
            <a href="#review" className="text-copper hover:underline">
              Review, comments and revisions
            </a>
          </p>
        </div>
        {design.kind === "plan" ? (
          <dl className="grid grid-cols-3 gap-x-6 gap-y-0.5 text-right text-xs num" data-testid="design-headline">
            <dt className="text-ink-muted">Range plan</dt>
            <dt className="text-ink-muted">Span</dt>
            <dt className="text-ink-muted">Worst drop</dt>
            <dd className="text-base font-semibold">{design.plan.ranges.length} ranges</dd>
            <dd className="text-base font-semibold">
              {formatSI(design.requirement.current.min, "A")} to {formatSI(design.requirement.current.max, "A")}
            </dd>
            <dd className="text-base font-semibold">{formatSI(worstDropV, "V")}</dd>
          </dl>
        ) : (
          <dl className="grid grid-cols-3 gap-x-6 gap-y-0.5 text-right text-xs num" data-testid="design-headline">
            <dt className="text-ink-muted">Shunt</dt>
            <dt className="text-ink-muted">Gain</dt>
            <dt className="text-ink-muted">Burden</dt>
            <dd className="text-base font-semibold">{formatSI(design.choice.shuntOhms, "Ω")}</dd>
            <dd className="text-base font-semibold">{formatSI(design.choice.gain, "")}</dd>
            <dd className="text-base font-semibold">{formatSI(worstDropV, "V")}</dd>
          </dl>
        )}
      </header>
      <SavedVerdictNotice verdict={verdict} />
      {design.kind === "plan" ? (
        <>
          {viewer.leadsWithBuildSheet && <PlanBuildPanel design={design} viewer={viewer} />}
          {picker}
          <PlanFigures design={design} />
          <p className="text-xs">
            <Link
              href={`/meter?design=${design.id}`}
              className="text-copper-strong underline"
              data-testid="plan-meter-link"
            >
              This plan beside a bench meter&apos;s current ranges, on the same load
            </Link>
          </p>
          {review}
          {!viewer.leadsWithBuildSheet && <PlanBuildPanel design={design} viewer={viewer} />}
          <ProfilesPanel design={forClient} viewer={viewer} />
        </>
      ) : (
        <>
          {/* A maker comes to build: the download, parts list and bench check lead the page. */}
          {viewer.leadsWithBuildSheet && <BuildSheetPanel design={design} viewer={viewer} library={library} />}
          {viewer.leadsWithBuildSheet && <UnitsPanel design={forClient} viewer={viewer} />}
          {picker}
          <DesignFigures design={design} />
          {review}
          {!viewer.leadsWithBuildSheet && <BuildSheetPanel design={design} viewer={viewer} library={library} />}
          <ProfilesPanel design={forClient} viewer={viewer} />
          {!viewer.leadsWithBuildSheet && <UnitsPanel design={forClient} viewer={viewer} />}
        </>
      )}
    </div>
  );
}
