import type { PairDesignView as DesignView, DesignViewer } from "@/lib/design-view";
import { designParts, type LibraryParts } from "@/lib/build-sheet/library-parts";
import { pairBuildFigures } from "@/lib/saved-designs/saved-figures";
import { BuildHeader, PartsTable } from "@/components/design/build-parts";

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
  const maker = viewer.leadsWithBuildSheet;
  // Worked out once per revision; only the library match is read afresh (the library changes).
  const { metrics, bench, howTo, warnings } = pairBuildFigures(design);
  const parts = designParts(design.requirement, design.choice, metrics, library);
  return (
    <section
      aria-labelledby="build-sheet-heading"
      data-testid="build-sheet-panel"
      className={`rounded-panel border bg-panel ${maker ? "border-copper shadow-sm" : "border-line"}`}
    >
      <BuildHeader design={design} maker={maker} />

      <div className="flex flex-col gap-5 p-4">
        <PartsTable parts={parts} />

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
