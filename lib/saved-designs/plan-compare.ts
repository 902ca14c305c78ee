// How a range plan sits in the compare table beside single pairs. Only figures a plan takes at the
// same points as a pair are set in the whole-span rows (so "best" is never given for a figure the
// two kinds do not share); the plan's own figures come per range, unranked.
import { formatSI } from "@/lib/design/format";
import type { DesignKind } from "@/lib/design/design-kind";
import type { PlanMetrics } from "@/lib/design/plan-evaluation";
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

/** Rows describing each design's ranges (a single pair is one range): the pair, span and drop of each. */
export function planRows(designs: DesignKind[]): PlanRow[] {
  const plans = designs.map((d) => (d.kind === "plan" ? d.metrics : null));
  const most = Math.max(0, ...plans.map((p) => p?.ranges.length ?? 0));
  const rows: PlanRow[] = [
    {
      key: "plan.rangeCount",
      info: { label: "Ranges", kind: "count" },
      values: plans.map((p) => p?.ranges.length ?? 1),
    },
  ];
  for (let k = 0; k < most; k++) {
    rows.push({
      key: `plan.ranges.${k}`,
      info: { label: `Range ${k + 1}: pair and span`, kind: "text" },
      values: plans.map((p) => {
        const r = p?.ranges[k];
        return r
          ? `${formatSI(r.shuntOhms, "Ω")} × ${Number(r.gain.toPrecision(4))}, ${formatSI(r.minA, "A")} to ${formatSI(r.maxA, "A")}`
          : null;
      }),
    });
    rows.push({
      key: `plan.ranges.${k}.worstBurdenV`,
      info: { label: `Range ${k + 1}: worst drop, switch included`, kind: "si", unit: "V" },
      values: plans.map((p) => p?.ranges[k]?.worstBurdenV ?? null),
    });
    rows.push({
      key: `plan.ranges.${k}.countsAtBottom`,
      info: { label: `Range ${k + 1}: steps at its bottom`, kind: "plain" },
      values: plans.map((p) => p?.ranges[k]?.countsAtBottom ?? null),
    });
    rows.push({
      key: `plan.ranges.${k}.errorAtMinPercent`,
      info: { label: `Range ${k + 1}: worst-case error at its bottom`, kind: "percent" },
      values: plans.map((p) => p?.ranges[k]?.errorAtMinPercent ?? null),
    });
  }
  if (plans.some((p) => p && p.ranges.length > 1))
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
