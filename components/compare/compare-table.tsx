import Link from "next/link";
import { StatusBadge } from "@/components/review/status-badge";
import type { SavedVerdict } from "@/lib/design/saved-verdict";
import type { DesignView, DesignViewer } from "@/lib/design-view";
import { bestIndexes } from "@/lib/saved-designs/compare";
import { againstOwnLimit, basisDiffers, basisLabel } from "@/lib/saved-designs/figure-basis";
import {
  choiceFields,
  flatten,
  formatField,
  metricFields,
  requirementFields,
  type FieldInfo,
} from "@/lib/saved-designs/figures";
import { planRows, planWholeSpanFigures } from "@/lib/saved-designs/plan-compare";
import { reverseFields, reverseFigures } from "@/lib/saved-designs/signed-compare";
import { CompareVerdict } from "./compare-verdict";
import { seriesColours } from "./colours";

/** A field across the designs: its values and each as shown (formatted once, read several times). */
type Row = { key: string; info: FieldInfo; values: unknown[]; texts: string[] };

const shown = (r: Omit<Row, "texts">): Row => ({ ...r, texts: r.values.map((v) => formatField(v, r.info)) });

function rows(fields: Record<string, FieldInfo>, objects: unknown[]): Row[] {
  const flat = objects.map((o) => flatten(o));
  return Object.entries(fields)
    .filter(([path]) => flat.some((f) => f[path] !== undefined && f[path] !== null))
    .map(([path, info]) => shown({ key: path, info, values: flat.map((f) => f[path]) }));
}

const differs = (r: Row) => new Set(r.texts).size > 1;

function SameRows({ list, columns }: { list: Row[]; columns: number }) {
  if (list.length === 0) return null;
  return (
    <tr>
      <td colSpan={columns + 1} className="px-3 py-1.5">
        <details>
          <summary className="cursor-pointer text-xs text-ink-muted">
            {list.length} requirement fields are the same in every design
          </summary>
          <dl className="mt-1 grid grid-cols-1 gap-x-6 gap-y-0.5 text-xs sm:grid-cols-2 lg:grid-cols-3">
            {list.map((r) => (
              <div key={r.key} className="flex justify-between gap-2 border-b border-line py-0.5">
                <dt className="text-ink-muted">{r.info.label}</dt>
                <dd className="text-right num">{r.texts[0]}</dd>
              </div>
            ))}
          </dl>
        </details>
      </td>
    </tr>
  );
}

/**
 * One block of rows. With `requirements` (the figures), a row is ranked only where the figures are
 * taken at the same points in every design; otherwise each value is read against its own limit.
 */
function Section({
  title,
  list,
  mark,
  requirements,
  ranked,
}: {
  title: string;
  list: Row[];
  mark: boolean;
  requirements?: DesignView["requirement"][];
  /** Per design: whether it takes part in "best" (not when it fails under today's model). */
  ranked?: boolean[];
}) {
  return (
    <>
      <tr>
        <th colSpan={99} className="bg-sunken px-3 py-1 text-left text-2xs font-semibold tracking-wide text-ink-muted">
          {title}
        </th>
      </tr>
      {list.map((r) => {
        // Only designs that have the figure are weighed (a one-way design has no negative end).
        const apart = requirements
          ? basisDiffers(
              r.key,
              requirements.filter((_, i) => r.values[i] !== undefined && r.values[i] !== null),
            )
          : [];
        const best = mark && apart.length === 0 ? bestIndexes(r.values, r.info, ranked) : [];
        return (
          <tr key={r.key} className="border-b border-line last:border-0" data-testid={`row-${r.key}`}>
            <th
              scope="row"
              className={`sticky left-0 z-10 bg-panel px-3 py-1 text-left font-normal ${differs(r) ? "text-ink" : "text-ink-muted"}`}
            >
              {r.info.label}
              {r.info.better && apart.length === 0 && (
                <span className="ml-1 whitespace-nowrap text-2xs text-ink-faint" title={`${r.info.better} is better`}>
                  {r.info.better === "lower" ? "↓ better" : "↑ better"}
                </span>
              )}
              {r.info.better && apart.length > 0 && (
                <span className="block text-2xs text-ink-faint" data-testid="not-ranked">
                  not ranked: taken at a different{" "}
                  {apart.map((p) => basisLabel(p, (q) => requirementFields[q]?.label)).join(", ")}
                </span>
              )}
            </th>
            {r.values.map((v, i) => {
              const own = apart.length > 0 && requirements?.[i] ? againstOwnLimit(r.key, v, requirements[i]) : null;
              return (
                <td
                  key={i}
                  className={`px-3 py-1 text-right ${best.includes(i) ? "font-semibold text-good" : ""}`}
                  data-best={best.includes(i) || undefined}
                >
                  {r.texts[i]}
                  {own && (
                    <span className="block text-2xs text-ink-muted" data-testid="own-limit">
                      {own}
                    </span>
                  )}
                  {best.includes(i) && (
                    <span className="ml-1 text-2xs" aria-label="best in this row">
                      best
                    </span>
                  )}
                </td>
              );
            })}
          </tr>
        );
      })}
      {list.length === 0 && (
        <tr>
          <td colSpan={99} className="px-3 py-1 text-xs text-ink-faint">
            None: every design states the same requirement.
          </td>
        </tr>
      )}
    </>
  );
}

// Measured against predicted yield of the units built so far (issue 18), shown when any design has units.
const builtFields: Record<string, FieldInfo> = {
  measuredYield: { label: "Measured yield (built units passing the bench check)", kind: "fraction", better: "higher" },
  predictedYield: { label: "Predicted yield (Monte Carlo)", kind: "fraction" },
  unitsBuilt: { label: "Units recorded", kind: "count" },
};

/** Requirement, choice and every figure side by side, the best value in each figure row marked. */
export function CompareTable({
  designs,
  viewers,
  built = [],
  verdicts = [],
}: {
  designs: DesignView[];
  /** Per design, in order: whether its saved pair or plan still passes under today's model. */
  verdicts?: SavedVerdict[];
  /** Per design id, from the policy on the server. */
  viewers: Record<string, DesignViewer>;
  built?: (Record<keyof typeof builtFields, number | null> | null)[];
}) {
  const ranked = designs.map((_, i) => !verdicts[i]?.fails);
  const requirementRows = rows(
    requirementFields,
    designs.map((d) => d.requirement),
  );
  return (
    // Wider than a phone: the table scrolls inside its own frame, the row names stay in view.
    <div className="overflow-x-auto rounded-panel border border-line bg-panel" data-testid="compare-frame">
      <table className="w-full text-sm">
        <thead>
          <tr className="border-b border-line align-top">
            <th className="sticky left-0 z-10 w-40 min-w-40 bg-panel px-3 py-2 text-left text-xs font-medium text-ink-muted sm:min-w-72">
              Design
            </th>
            {designs.map((d, i) => (
              <th key={d.id} className="px-3 py-2 text-right font-normal" data-testid="compare-column">
                <div className="flex flex-col items-end gap-1">
                  <span className="flex items-center gap-1.5">
                    <span
                      aria-hidden
                      className="inline-block h-2 w-2 rounded-full"
                      style={{ background: seriesColours[i % seriesColours.length] }}
                    />
                    <Link href={`/designs/${d.id}`} className="font-semibold hover:text-copper">
                      {d.name}
                    </Link>
                  </span>
                  <span className="text-xs text-ink-muted">
                    {d.project ?? "no project"} · revision {d.revision} · {d.authorName}
                  </span>
                  <StatusBadge status={d.status} />
                  {verdicts[i]?.fails && (
                    // Its figures below are as saved; today's model refuses them (its page says why).
                    <span className="max-w-56 text-right text-xs text-bad" data-testid="compare-fails-today">
                      Fails under the current model: {verdicts[i].failing.join("; ")}
                    </span>
                  )}
                  {viewers[d.id] && (
                    // Only what the verdict buttons read: the whole design would ride along in the page's data.
                    <CompareVerdict
                      design={{ id: d.id, name: d.name, status: d.status, revision: d.revision, authorId: d.authorId }}
                      viewer={viewers[d.id]!}
                    />
                  )}
                </div>
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          <Section
            title="Choice"
            list={rows(
              choiceFields,
              designs.map((d) => d.choice),
            )}
            mark={false}
          />
          {designs.some((d) => d.kind === "plan") && (
            <Section title="Ranges (a single pair is one range)" list={planRows(designs).map(shown)} mark={false} />
          )}
          <Section
            title="Figures (from the engine, at each design's own requirement)"
            list={rows(
              metricFields,
              designs.map((d) => (d.kind === "plan" ? planWholeSpanFigures(d.metrics) : d.metrics)),
            )}
            mark
            requirements={designs.map((d) => d.requirement)}
            ranked={ranked}
          />
          {designs.some((d) => d.requirement.current.min < 0) && (
            <Section
              title="The negative direction (bidirectional designs; the rows above take the positive end)"
              list={rows(reverseFields, designs.map(reverseFigures))}
              mark
              requirements={designs.map((d) => d.requirement)}
              ranked={ranked}
            />
          )}
          {built.some(Boolean) && (
            <Section
              title="Built units"
              list={rows(
                builtFields,
                designs.map((_, i) => built[i] ?? {}),
              )}
              mark
            />
          )}
          <Section title="Requirement: where the designs differ" list={requirementRows.filter(differs)} mark={false} />
          <SameRows list={requirementRows.filter((r) => !differs(r))} columns={designs.length} />
        </tbody>
      </table>
    </div>
  );
}
