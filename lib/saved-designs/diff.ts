// What changed between two saved revisions: requirement fields, the choice and the engine's figures.
import { choiceFields, flatten, formatField, metricFields, requirementFields, type FieldInfo } from "./figures";

export type Change = {
  group: "design" | "requirement" | "choice" | "figures";
  path: string;
  label: string;
  a: unknown;
  b: unknown;
  aText: string;
  bText: string;
};

type Side = { name?: string; project?: string | null; requirement: unknown; choice: unknown; metrics?: unknown };

const same = (x: unknown, y: unknown) => JSON.stringify(x ?? null) === JSON.stringify(y ?? null);

function compareGroup(
  group: Change["group"],
  a: unknown,
  b: unknown,
  fields: Record<string, FieldInfo>,
  onlyKnown: boolean,
): Change[] {
  const fa = flatten(a);
  const fb = flatten(b);
  const paths = [...new Set([...Object.keys(fields), ...Object.keys(fa), ...Object.keys(fb)])];
  const out: Change[] = [];
  for (const path of paths) {
    const info = fields[path];
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
    ...(a.metrics !== undefined && b.metrics !== undefined
      ? compareGroup("figures", a.metrics, b.metrics, metricFields, true)
      : []),
  ];
}

/** The dotted paths an edit changed (for the audit trail). */
export function changedFields(a: Side, b: Side): string[] {
  return diffRevisions(a, b).map((c) => (c.group === "design" ? c.path : `${c.group}.${c.path}`));
}
