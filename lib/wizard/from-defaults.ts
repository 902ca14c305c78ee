// What a requirement sets differently from the documented defaults (lib/design/DEFAULTS.md),
// grouped by the wizard step that asks for it, for the summary shown before saving.
import { parseRequirement, type Requirement } from "@/lib/design/requirement";
import { diffRevisions, type Change } from "@/lib/saved-designs/diff";
import { deepMerge } from "./deep-merge";
import { readableDefaults } from "./form-values";

const stepOfGroup: Record<string, string> = {
  current: "Current span",
  load: "Current span",
  supply: "Supply and drop",
  drop: "Supply and drop",
  readout: "Readout",
  resolution: "Readout",
  accuracy: "Readout",
  shunt: "Shunt",
  limit: "Shunt",
  amplifier: "Amplifier",
  temperature: "Temperature",
  calibration: "Readout",
};

const extraLabels: Record<string, string> = {
  "amplifier.gainSet.series": "Resistor series for Rf and Rg",
  "amplifier.gainSet.min": "Lowest gain (1 + Rf/Rg)",
  "amplifier.gainSet.max": "Highest gain (1 + Rf/Rg)",
  "readout.bandwidthHz": "Meter bandwidth",
};

/** "amplifier.filterHz" → "filter hz" as a last resort for a field without a label. */
const words = (path: string) =>
  (path.split(".").at(-1) ?? path)
    .replace(/([a-z])([A-Z])/g, "$1 $2")
    .toLowerCase()
    .replace(/^./, (ch) => ch.toUpperCase());

export type StepDifferences = { step: string; changes: Change[] };

/**
 * Every field of `req` that differs from the defaults, by step. The span and supply have no default;
 * the baseline takes them from `req`, so figures derived from them (the accuracy band, a drop given
 * as a share) count as defaults when they follow from them.
 */
export function differencesFromDefaults(req: Requirement): StepDifferences[] {
  const baseInput = {
    ...deepMerge(readableDefaults, {
      current: { min: req.current.min, max: req.current.max },
      supply: { voltage: req.supply.voltage },
    }),
    // A drop given as a share is measured against the engine's default share, 2 % (DEFAULTS.md).
    drop: req.drop.fraction !== undefined ? { fraction: 0.02 } : readableDefaults.drop,
    // The default sweep is the fixed list of gains; a resistor pair is a choice.
    amplifier: { ...readableDefaults.amplifier, gainSet: undefined },
  };
  const parsed = parseRequirement(baseInput);
  if (!parsed.ok) return [];
  const changes = diffRevisions({ requirement: parsed.requirement, choice: null }, { requirement: req, choice: null })
    .filter((c) => c.group === "requirement" && !["current.min", "current.max", "supply.voltage"].includes(c.path))
    // With gains from a resistor pair the swept list is long and follows from the pair's fields.
    .filter((c) => !(req.amplifier.gainSet && c.path === "amplifier.gains"))
    .map((c) => ({
      ...c,
      label: c.label === c.path ? (extraLabels[c.path] ?? words(c.path)) : c.label,
      aText: c.a === undefined || c.a === null ? "not set" : c.aText,
    }));
  const out: StepDifferences[] = [];
  for (const c of changes) {
    const step = stepOfGroup[c.path.split(".")[0] ?? ""] ?? "Other";
    const group = out.find((g) => g.step === step) ?? out[out.push({ step, changes: [] }) - 1]!;
    group.changes.push(c);
  }
  const order = Object.values(stepOfGroup);
  return out.sort((a, b) => order.indexOf(a.step) - order.indexOf(b.step));
}
