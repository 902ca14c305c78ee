// What changed between two saved revisions: requirement fields, the choice or the range plan (each
// range and switch point in words) and the engine's figures (per range for two plans).
import type { PlanChoice } from "@/lib/design/plan-choice";
import {
  choiceFields,
  flatten,
  flattenPlan,
  formatField,
  metricFields,
  planFieldInfo,
  requirementFields,
  type FieldInfo,
} from "./figures";

export type Change = {
  group: "design" | "requirement" | "choice" | "plan" | "figures";
  path: string;
  label: string;
  a: unknown;
  b: unknown;
  aText: string;
  bText: string;
};

type Side = {
  name?: string;
  project?: string | null;
  requirement: unknown;
  choice: unknown;
  plan?: PlanChoice | null;
  metrics?: unknown;
};

const same = (x: unknown, y: unknown) => JSON.stringify(x ?? null) === JSON.stringify(y ?? null);

function compareGroup(
  group: Change["group"],
  a: unknown,
  b: unknown,
  fields: Record<string, FieldInfo>,
  onlyKnown: boolean,
): Change[] {
  return compareFlat(group, flatten(a), flatten(b), (path) => fields[path], Object.keys(fields), onlyKnown);
}

function compareFlat(
  group: Change["group"],
  fa: Record<string, unknown>,
  fb: Record<string, unknown>,
  infoOf: (path: string) => FieldInfo | undefined,
  known: string[],
  onlyKnown: boolean,
): Change[] {
  const paths = [...new Set([...known, ...Object.keys(fa), ...Object.keys(fb)])];
  const out: Change[] = [];
  for (const path of paths) {
    const info = infoOf(path);
    if (onlyKnown && !info) continue;
    if (!(path in fa) && !(path in fb)) continue;
    if (same(fa[path], fb[path])) continue;
    out.push({
      group,
      path,
      label: info?.label ?? path,
      a: fa[path],
      b: fb[path],
      aText: formatField(fa[path], info),
      bText: formatField(fb[path], info),
    });
  }
  return out;
}

/** Every difference from a to b, in reading order. */
export function diffRevisions(a: Side, b: Side): Change[] {
  const design: Change[] = [];
  for (const key of ["name", "project"] as const) {
    if (a[key] !== undefined && b[key] !== undefined && !same(a[key], b[key])) {
      const label = key === "name" ? "Name" : "Project";
      design.push({
        group: "design",
        path: key,
        label,
        a: a[key],
        b: b[key],
        aText: String(a[key] ?? "—"),
        bText: String(b[key] ?? "—"),
      });
    }
  }
  return [
    ...design,
    ...compareGroup("requirement", a.requirement, b.requirement, requirementFields, false),
    ...compareGroup("choice", a.choice, b.choice, choiceFields, false),
    ...compareFlat("plan", flattenPlan(a.plan), flattenPlan(b.plan), planFieldInfo, [], false),
    ...figureChanges(a, b),
  ];
}

/** A pair's figures; for two plans, each range's figures under "Range k"; none across kinds (not comparable). */
function figureChanges(a: Side, b: Side): Change[] {
  if (a.metrics === undefined || b.metrics === undefined) return [];
  const ra = rangesOf(a.metrics);
  const rb = rangesOf(b.metrics);
  if (!ra && !rb) return compareGroup("figures", a.metrics, b.metrics, metricFields, true);
  if (!ra || !rb) return [];
  return Array.from({ length: Math.min(ra.length, rb.length) }, (_, k) =>
    compareGroup("figures", ra[k], rb[k], metricFields, true).map((c) => ({
      ...c,
      path: `ranges.${k}.${c.path}`,
      label: `Range ${k + 1}, ${c.label.charAt(0).toLowerCase()}${c.label.slice(1)}`,
    })),
  ).flat();
}

function rangesOf(metrics: unknown): unknown[] | null {
  if (!metrics || typeof metrics !== "object" || !("ranges" in metrics)) return null;
  return Array.isArray(metrics.ranges) ? metrics.ranges : null;
}

/** The dotted paths an edit changed (for the audit trail). */
export function changedFields(a: Side, b: Side): string[] {
  return diffRevisions(a, b).map((c) => (c.group === "design" ? c.path : `${c.group}.${c.path}`));
}
