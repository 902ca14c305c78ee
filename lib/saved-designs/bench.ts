// A saved revision's choice or plan, its figures and its bench check, as GET /api/designs/[id]
// reports them (API.md v2 "Designs" and "Built units").
import { storedRequirement } from "@/db/queries/designs";
import { benchCheck, designKindOf, type BenchCheckRow, type Choice, type DesignKind } from "@/lib/design";

export function savedBenchCheck(requirement: unknown, choice: Choice): BenchCheckRow[] {
  return benchCheck(storedRequirement(requirement), choice);
}

/**
 * A pair: `choice`, `metrics` and `benchCheck`. A plan: `plan`, `metrics: { ranges, switchRule,
 * protection }` and `ranges[k]` with the range's pair and its `benchCheck` (the engine's rows,
 * saved with the revision).
 */
export function savedDesignFigures(row: { requirement: unknown } & Parameters<typeof designKindOf>[0]) {
  const saved: DesignKind = designKindOf(row);
  if (saved.kind === "pair")
    return {
      kind: saved.kind,
      choice: saved.choice,
      metrics: saved.metrics,
      benchCheck: savedBenchCheck(row.requirement, saved.choice),
    };
  return {
    kind: saved.kind,
    plan: saved.plan,
    metrics: saved.metrics,
    ranges: saved.metrics.ranges.map((r) => ({
      minA: r.minA,
      maxA: r.maxA,
      shuntOhms: r.shuntOhms,
      gain: r.gain,
      benchCheck: r.benchCheck,
    })),
  };
}
