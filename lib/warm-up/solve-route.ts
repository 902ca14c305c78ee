// POST /api/solve's own code (lib/engine-requests.ts: parse, sweep, rank), warmed as its module
// loads (lib/warm-up/run.ts). Every branch a first call may take runs hot: a feasible pair low side
// and high side, a copper-trace shunt with an input filter, a span too wide for one pair (the
// diagnosis and its re-run sweeps, the range plan), a ranking expression. Shapes count as well as
// branches: V8 optimises the engine for the object shapes it has seen, and a first call whose
// shapes are new throws that code away ("wrong map" under `--trace-deopt`, 29 deopts in the first
// solve, measured 2026-12-02). New shapes came from a body with the fewest fields (no typical
// current, no converter figures: two such bodies below) and from saved designs, whose stored
// requirements the design routes parse before a person solves (so each body is also solved as read
// back from a jsonb column). With both, the first solve after start showed no deopt.
import {
  loggerPlanRequirement,
  loggerRequirement,
  packMonitorRequirement,
  pumpRequirement,
} from "@/lib/build-sheet/fixtures";
import { parseRequirement, solve } from "@/lib/design";
import { requirementOr422, solveRequest } from "@/lib/engine-requests";
import { warmOnLoad } from "./run";

/** The fewest fields: the converter's error is its class's typical figures (invented examples). */
const twelveVoltRail = {
  current: { min: "20 mA", max: "2 A" },
  supply: { voltage: "12 V", side: "high" },
  drop: { max: "100 mV" },
  readout: { kind: "adc", bits: 12, fullScale: "3.3 V" },
  resolution: { countsAtMin: 10 },
  accuracy: { percent: 5 },
};
const sensorNodeSleepToRadio = {
  current: { min: "20 uA", max: "250 mA" },
  supply: { voltage: "3.3 V", side: "low" },
  drop: { max: "50 mV" },
  readout: { kind: "adc", bits: 12, fullScale: "3.3 V" },
  resolution: { countsAtMin: 10 },
};

const bodies: unknown[] = [
  twelveVoltRail,
  sensorNodeSleepToRadio,
  loggerRequirement,
  pumpRequirement,
  packMonitorRequirement,
  loggerPlanRequirement,
  { ...loggerRequirement, rank: "burdenV * 1000 + errorAtMinPercent" },
];

/**
 * A value as a jsonb column gives it back: object keys shortest first, then in byte order
 * (PostgreSQL's jsonb order, from memory).
 */
function asStored(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(asStored);
  if (value === null || typeof value !== "object") return value;
  const keys = Object.keys(value).sort((a, b) => a.length - b.length || (a < b ? -1 : a > b ? 1 : 0));
  return Object.fromEntries(keys.map((k) => [k, asStored((value as Record<string, unknown>)[k])]));
}

export const warmSolveRoute = () =>
  warmOnLoad("solve route", () =>
    bodies.flatMap((body) => {
      const { rank: _rank, ...input } = body as Record<string, unknown>;
      const stored = JSON.parse(JSON.stringify(asStored(requirementOr422(input))));
      return [
        () => JSON.stringify(solveRequest(body)),
        // The same requirement read back from a saved design (db/queries/designs.ts: storedRequirement).
        () => {
          const parsed = parseRequirement(stored);
          if (!parsed.ok) throw new Error(parsed.message);
          return solve(parsed.requirement);
        },
      ];
    }),
  );
