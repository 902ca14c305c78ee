import type { DesignView, DesignViewer } from "@/lib/design-view";
import { benchHowTo, benchRows, cautions } from "@/lib/build-sheet/sheet-data";
import { designParts, type LibraryParts } from "@/lib/build-sheet/library-parts";
import { evaluateCandidate } from "@/lib/design/candidate";
import { Badge } from "@/components/ui/badge";
import { buttonClass } from "@/components/ui/button";

/**
 * What a maker builds and checks from: the downloads (build sheet PDF, SPICE netlist, parts CSV,
 * design file), the parts list and the bench check, with the cautions. Figures from the engine,
 * worded by lib/build-sheet exactly as on the printed sheet.
 */
export function BuildSheetPanel({
  design,
  viewer,
  library,
}: {
  design: DesignView;
  viewer: DesignViewer;
  /** The team library, to name the parts the pair came from. */
  library?: LibraryParts;
}) {
  const base = `/api/designs/${design.id}`;
  const approved = design.status === "approved";
  const maker = viewer.leadsWithBuildSheet;
  const metrics = evaluateCandidate(design.requirement, design.choice);
  const parts = designParts(design.requirement, design.choice, metrics, library);
  const bench = benchRows(design.requirement, design.choice);
  const howTo = benchHowTo(design.requirement);
  const warnings = cautions(design.requirement, metrics);
  return (
    <section
      aria-labelledby="build-sheet-heading"
      data-testid="build-sheet-panel"
      className={`rounded-panel border bg-panel ${maker ? "border-copper shadow-sm" : "border-line"}`}
    >
      <header className="flex flex-wrap items-center justify-between gap-3 border-b border-line px-4 py-3">
        <div className="min-w-0">
          <h2
            id="build-sheet-heading"
            className={maker ? "text-base font-semibold" : "text-xs font-semibold tracking-wide text-ink-muted"}
          >
            Build and bench check
          </h2>
          <p className="mt-0.5 text-xs text-ink-muted">
            {approved ? (
              <>
                <Badge tone="good">approved</Badge> Revision {design.revision} is approved: build from this sheet.
              </>
            ) : (
              <>
                <Badge tone="bad">not approved</Badge> A preview for review: the sheet says “not approved” on every
                page. Do not build from it.
              </>
            )}
          </p>
        </div>
        <nav aria-label="Downloads" className="flex flex-wrap gap-2">
          <a
            href={`${base}/build-sheet`}
            download
            className={buttonClass("primary")}
            data-testid="download-build-sheet"
          >
            Build sheet (PDF)
          </a>
          <a href={`${base}/parts.csv`} download className={buttonClass("secondary")} data-testid="download-parts-csv">
            Parts list (CSV)
          </a>
          <a href={`${base}/netlist`} download className={buttonClass("secondary")} data-testid="download-netlist">
            SPICE netlist
          </a>
          <a href={`${base}/export`} download className={buttonClass("secondary")} data-testid="download-export">
            Design file (JSON)
          </a>
        </nav>
      </header>

      <div className="flex flex-col gap-5 p-4">
        <div>
          <h3 className="mb-1.5 text-sm font-semibold">Parts</h3>
          <div className="overflow-x-auto">
            <table className="w-full text-left text-sm" data-testid="parts-table">
              <thead className="border-b border-line text-xs text-ink-muted">
                <tr>
                  <th scope="col" className="py-1 pr-3 font-medium">
                    Ref
                  </th>
                  <th scope="col" className="py-1 pr-3 font-medium">
                    Part
                  </th>
                  <th scope="col" className="py-1 pr-3 font-medium">
                    Value
                  </th>
                  <th scope="col" className="py-1 pr-3 font-medium">
                    Tolerance
                  </th>
                  <th scope="col" className="py-1 pr-3 font-medium">
                    Tempco
                  </th>
                  <th scope="col" className="py-1 pr-3 font-medium">
                    Rating
                  </th>
                </tr>
              </thead>
              {parts.map((p) => (
                <tbody key={p.designator} className="border-b border-line align-top">
                  <tr>
                    <th scope="row" className="pt-1.5 pr-3 font-semibold">
                      {p.designator}
                    </th>
                    <td className="pt-1.5 pr-3">{p.part}</td>
                    <td className="pt-1.5 pr-3 font-semibold num whitespace-nowrap">{p.value}</td>
                    <td className="pt-1.5 pr-3 num">{p.tolerance}</td>
                    <td className="pt-1.5 pr-3 num">{p.tempco}</td>
                    <td className="pt-1.5 pr-3 num whitespace-nowrap">{p.rating}</td>
                  </tr>
                  <tr>
                    <td />
                    <td colSpan={5} className="pb-1.5 pr-3 text-xs text-ink-muted">
                      {p.notes}
                    </td>
                  </tr>
                </tbody>
              ))}
            </table>
          </div>
        </div>

        <div>
          <h3 className="mb-1.5 text-sm font-semibold">Bench check</h3>
          <div className="overflow-x-auto">
            <table className="w-full text-sm num" data-testid="bench-table">
              <thead className="border-b border-line text-xs text-ink-muted">
                <tr>
                  <th scope="col" className="py-1 pr-3 text-left font-medium">
                    Test point
                  </th>
                  <th scope="col" className="py-1 pr-3 text-right font-medium">
                    Test current
                  </th>
                  <th scope="col" className="py-1 pr-3 text-right font-medium">
                    Expected output
                  </th>
                  <th scope="col" className="py-1 text-right font-medium">
                    Accept between
                  </th>
                </tr>
              </thead>
              <tbody>
                {bench.map((r) => (
                  <tr key={r.label} className="border-b border-line">
                    <th scope="row" className="py-1 pr-3 text-left font-normal">
                      {r.label}
                    </th>
                    <td className="py-1 pr-3 text-right">{r.current}</td>
                    <td className="py-1 pr-3 text-right font-semibold">{r.expected}</td>
                    <td className="py-1 text-right">{r.band}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <ul className="mt-2 list-disc space-y-0.5 pl-5 text-xs text-ink-muted">
            {howTo.map((t) => (
              <li key={t}>{t}</li>
            ))}
          </ul>
        </div>

        <div
          role="note"
          aria-label="Cautions"
          className="rounded border border-bad/40 bg-bad/5 px-3 py-2"
          data-testid="build-cautions"
        >
          <h3 className="text-sm font-semibold text-bad">Cautions</h3>
          <ul className="mt-1 list-disc space-y-0.5 pl-5 text-xs">
            {warnings.map((t) => (
              <li key={t}>{t}</li>
            ))}
          </ul>
        </div>
      </div>
    </section>
  );
}
