// How a range plan sits in the compare table beside single pairs. Only figures a plan takes at the
// same points as a pair are set in the whole-span rows (so "best" is never given for a figure the
// two kinds do not share); the plan's own figures come per range, unranked.
import { formatSI } from "@/lib/design/format";
import type { DesignKind } from "@/lib/design/design-kind";
import type { PlanMetrics } from "@/lib/design/plan-evaluation";
import type { Requirement } from "@/lib/design/requirement";
import type { FieldInfo } from "./figures";

/**
 * The plan's figures at the span's ends, under the pair's field names: at the maximum current the top
 * range is in use (its drop includes its switch: the load sees both), at the minimum current range 1.
 */
export function planWholeSpanFigures(metrics: PlanMetrics): Record<string, number | null> {
  const first = metrics.ranges[0];
  const top = metrics.ranges.at(-1);
  if (!first || !top) return {};
  return {
    burdenV: top.worstBurdenV,
    loadVoltageV: top.loadVoltageV,
    errorAtMinPercent: first.errorAtMinPercent,
    rssAtMinPercent: first.rssAtMinPercent,
    countsAtMin: first.countsAtMin,
    errorAtMaxPercent: top.errorAtMaxPercent,
  };
}

export type PlanRow = { key: string; info: FieldInfo; values: (string | number | null)[] };

type RangeCells = { pair: string; worstBurdenV: number; countsAtBottom: number; errorAtMinPercent: number };

const pairText = (R: number, G: number, lo: number, hi: number) =>
  `${formatSI(R, "Ω")} × ${Number(G.toPrecision(4))}, ${formatSI(lo, "A")} to ${formatSI(hi, "A")}`;

/** Each design's ranges; a single pair is one range over the whole span (no switch in series). */
function rangesOf(d: { requirement: Requirement } & DesignKind): RangeCells[] {
  if (d.kind === "plan")
    return d.metrics.ranges.map((r) => ({
      pair: pairText(r.shuntOhms, r.gain, r.minA, r.maxA),
      worstBurdenV: r.worstBurdenV,
      countsAtBottom: r.countsAtBottom,
      errorAtMinPercent: r.errorAtMinPercent,
    }));
  const m = d.metrics;
  return [
    {
      pair: pairText(m.shuntOhms, m.gain, d.requirement.current.min, d.requirement.current.max),
      worstBurdenV: m.burdenV,
      countsAtBottom: m.countsAtMin,
      errorAtMinPercent: m.errorAtMinPercent,
    },
  ];
}

/** Rows describing each design's ranges (a single pair is one range): the pair, span, drop and bottom of each. */
export function planRows(designs: ({ requirement: Requirement } & DesignKind)[]): PlanRow[] {
  const all = designs.map(rangesOf);
  const most = Math.max(0, ...all.map((r) => r.length));
  const rows: PlanRow[] = [
    { key: "plan.rangeCount", info: { label: "Ranges", kind: "count" }, values: all.map((r) => r.length) },
  ];
  const cell = <K extends keyof RangeCells>(k: number, key: K) => all.map((r) => r[k]?.[key] ?? null);
  for (let k = 0; k < most; k++) {
    rows.push(
      {
        key: `plan.ranges.${k}`,
        info: { label: `Range ${k + 1}: pair and span`, kind: "text" },
        values: cell(k, "pair"),
      },
      {
        key: `plan.ranges.${k}.worstBurdenV`,
        info: { label: `Range ${k + 1}: worst drop at its top (switch included)`, kind: "si", unit: "V" },
        values: cell(k, "worstBurdenV"),
      },
      {
        key: `plan.ranges.${k}.countsAtBottom`,
        info: { label: `Range ${k + 1}: steps at its bottom`, kind: "plain" },
        values: cell(k, "countsAtBottom"),
      },
      {
        key: `plan.ranges.${k}.errorAtMinPercent`,
        info: { label: `Range ${k + 1}: worst-case error at its bottom`, kind: "percent" },
        values: cell(k, "errorAtMinPercent"),
      },
    );
  }
  if (designs.some((d) => d.kind === "plan"))
    rows.push({
      key: "plan.switchPoints",
      info: { label: "Switch points (up above / down below)", kind: "text" },
      values: designs.map((d) =>
        d.plan
          ? d.plan.switchPoints.map((s) => `${formatSI(s.upA, "A")} / ${formatSI(s.downA, "A")}`).join("; ")
          : null,
      ),
    });
  return rows;
}
