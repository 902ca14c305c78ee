// Whether a figure means the same thing across compared designs. A figure is taken at points set
// by the requirement (the burden at the maximum current, the error at the minimum current); two
// designs made for different spans or supplies put the same label on different things, so "best"
// is marked only when the requirement fields a figure rests on agree. Otherwise each value is
// shown against its own design's limit.
import { formatPercent, formatSI, type Requirement } from "@/lib/design";
import { isSigned } from "@/lib/design/bidirectional";
import { outputCeilingV } from "@/lib/design/model";
import { flatten } from "./figures";

/**
 * Bases that are not one requirement field. A signed span reads its dead zone as the band where the
 * sign is uncertain (a one-way span: where it reads zero), and takes its "minimum current" figures
 * at the accuracy band's low end, a magnitude (a one-way span: at current.min).
 */
const derivedBasis: Record<string, { label: string; of: (r: Requirement) => unknown }> = {
  "span.direction": { label: "span direction (one way or both)", of: (r) => isSigned(r.current) },
  // A signed span's rating is chosen for its larger direction, which may be the negative one.
  "span.reverse": {
    label: "largest negative current",
    of: (r) => (isSigned(r.current) ? r.current.min : null),
  },
  "span.lowEnd": {
    label: "smallest current of interest",
    of: (r) => (isSigned(r.current) ? r.accuracy.bandMin : r.current.min),
  },
};

/** The words for a basis path in "not ranked: taken at a different …". */
export function basisLabel(path: string, requirementLabel: (p: string) => string | undefined): string {
  return derivedBasis[path]?.label ?? requirementLabel(path)?.toLowerCase() ?? path;
}

/** The requirement paths each figure is taken at (load model: the current itself depends on it). */
export const figureBasis: Record<string, string[]> = {
  burdenV: ["current.max", "supply.voltage", "load.model"],
  loadVoltageV: ["current.max", "supply.voltage", "load.model"],
  dissipationW: ["current.max", "supply.voltage", "load.model"],
  ratingW: ["current.max", "supply.voltage", "load.model", "shunt.derating", "span.reverse"],
  selfHeatingK: ["current.max", "supply.voltage", "load.model"],
  headroomV: [
    "current.max",
    "supply.voltage",
    "load.model",
    "amplifier.supply",
    "amplifier.swingHigh",
    "span.direction",
  ],
  lsbA: ["readout.kind", "readout.bits", "readout.counts", "readout.fullScale"],
  countsAtMin: ["span.lowEnd", "readout.kind", "readout.bits", "readout.counts", "readout.fullScale"],
  deadZoneA: ["amplifier.swingLow", "span.direction"],
  offsetErrorA: ["temperature.min", "temperature.max", "supply.voltage", "supply.side"],
  noiseA: [],
  bandwidthHz: [],
  errorAtMinPercent: ["span.lowEnd", "temperature.min", "temperature.max", "supply.voltage", "supply.side"],
  rssAtMinPercent: ["span.lowEnd", "temperature.min", "temperature.max", "supply.voltage", "supply.side"],
  errorAtTypicalPercent: ["current.typical", "temperature.min", "temperature.max", "supply.voltage", "supply.side"],
  errorAtMaxPercent: ["current.max", "temperature.min", "temperature.max", "supply.voltage", "supply.side"],
  accuracyBandPercent: ["accuracy.bandMin", "accuracy.bandMax", "temperature.min", "temperature.max"],
  lowestAccurateCurrentA: [
    "accuracy.percent",
    "temperature.min",
    "temperature.max",
    "supply.voltage",
    "supply.side",
    "span.direction",
  ],
  // A bidirectional design's negative end (signed-compare.ts).
  reverseBurdenV: ["current.min", "supply.voltage"],
  reverseDissipationW: ["current.min"],
};

/**
 * A requirement flattened to dotted paths, once per requirement object: the compare table asks for
 * every figure row, and a saved revision's parsed requirement is one object kept for the revision.
 */
const flattened = new WeakMap<Requirement, Record<string, unknown>>();
function flatRequirement(req: Requirement): Record<string, unknown> {
  let flat = flattened.get(req);
  if (!flat) flattened.set(req, (flat = flatten(req)));
  return flat;
}

/** The requirement fields, among a figure's basis, on which the designs differ (empty: comparable). */
export function basisDiffers(figure: string, requirements: Requirement[]): string[] {
  const basis = figureBasis[figure] ?? [];
  if (basis.length === 0) return [];
  const flat = requirements.map(flatRequirement);
  const valueOf = (path: string, k: number) => derivedBasis[path]?.of(requirements[k]!) ?? flat[k]![path] ?? null;
  return basis.filter((path) => new Set(flat.map((_, k) => JSON.stringify(valueOf(path, k)))).size > 1);
}

const share = (x: number, limit: number) => (limit > 0 ? ` (${Math.round((100 * x) / limit)} %)` : "");

/** A figure against its own design's limit, in words; null when the requirement sets no limit for it. */
export function againstOwnLimit(figure: string, value: unknown, req: Requirement): string | null {
  if (typeof value !== "number" || !Number.isFinite(value)) return null;
  switch (figure) {
    case "burdenV":
      return `of ${formatSI(req.drop.max, "V")} allowed${share(value, req.drop.max)}`;
    case "loadVoltageV":
      return req.drop.loadMin !== undefined
        ? `${formatSI(req.drop.loadMin, "V")} needed, from ${formatSI(req.supply.voltage, "V")}`
        : `from a ${formatSI(req.supply.voltage, "V")} supply`;
    case "outputAtMaxV":
      return `of ${formatSI(req.readout.fullScale, "V")} full scale${share(value, req.readout.fullScale)}`;
    case "outputAtMaxWorstV":
      return `of ${formatSI(outputCeilingV(req), "V")} the output may reach${share(value, outputCeilingV(req))}`;
    case "countsAtMin":
      return `${req.resolution.countsAtMin} wanted at ${formatSI(isSigned(req.current) ? req.accuracy.bandMin : req.current.min, "A")}`;
    case "lsbA":
      return `${formatSI(req.current.min / req.resolution.countsAtMin, "A")} needed`;
    case "errorAtMinPercent":
    case "rssAtMinPercent":
    case "errorAtTypicalPercent":
    case "errorAtMaxPercent":
    case "accuracyBandPercent":
      return `target ${formatPercent(req.accuracy.percent / 100)}`;
    case "lowestAccurateCurrentA":
      return `span from ${formatSI(req.current.min, "A")}`;
    case "dissipationW":
      return `at ${formatSI(req.current.max, "A")}`;
    case "reverseBurdenV":
      return `of ${formatSI(req.drop.max, "V")} allowed${share(value, req.drop.max)}`;
    case "reverseDissipationW":
      return `at ${formatSI(req.current.min, "A")}`;
    default:
      return null;
  }
}
