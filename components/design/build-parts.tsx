// The build side's shared pieces: the header with the approval state and the downloads, and the
// parts table, for a single pair's panel and a range plan's alike.
import { Badge } from "@/components/ui/badge";
import { buttonClass } from "@/components/ui/button";
import type { Part } from "@/lib/build-sheet/parts";
import type { DesignView } from "@/lib/design-view";

/** Extra downloads after the usual four (a range plan's per-range netlist decks). */
export type ExtraLink = { href: string; label: string; testId: string };

export function BuildHeader({
  design,
  maker,
  extra = [],
}: {
  design: Pick<DesignView, "id" | "status" | "revision">;
  maker: boolean;
  extra?: ExtraLink[];
}) {
  const base = `/api/designs/${design.id}`;
  const approved = design.status === "approved";
  return (
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
              <Badge tone="bad">not approved</Badge> A preview for review: the sheet says “not approved” on every page.
              Do not build from it.
            </>
          )}
        </p>
      </div>
      <nav aria-label="Downloads" className="flex flex-wrap gap-2">
        <a href={`${base}/build-sheet`} download className={buttonClass("primary")} data-testid="download-build-sheet">
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
  );
}

export function PartsTable({ parts }: { parts: Part[] }) {
  return (
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
  );
}
