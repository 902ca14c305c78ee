// The team library as the wizard reads it (GET /api/library, db/schema.ts columns), and an
// amplifier row turned into the wizard's amplifier fields.
import { formatSI } from "@/lib/design/format";
import type { AdcValues, MeterValues } from "@/lib/library/schema";
import { resistorSetGains } from "@/lib/library/to-requirement";
import type { WizardValues } from "./form-values";

export type LibraryAmplifierRow = {
  id: string;
  name: string;
  gainMode: "fixed" | "resistor-set";
  gains: number[];
  offsetV: number;
  offsetDriftVPerK: number;
  gainErrorFraction: number;
  gainDriftPerK: number;
  biasCurrentA: number;
  noiseDensityVPerRtHz: number;
  gbwHz: number;
  swingLowV: number;
  swingHighV: number;
  cmrrDb: number;
  supplyMinV: number;
  supplyMaxV: number;
  /** Absent from rows written before parts had a topology. */
  topology?: string;
  commonModeMinV?: number | null;
  commonModeMaxV?: number | null;
};

export type LibraryShuntRow = {
  id: string;
  name: string;
  series: string;
  minOhms: number;
  maxOhms: number;
  toleranceFraction: number;
  tempcoPerK: number;
  ratingsW: number[];
  fourTerminal: boolean;
};

export type LibraryAdcRow = AdcValues & { id: string };
export type LibraryMeterRow = MeterValues & { id: string };

export type Library = {
  amplifiers: LibraryAmplifierRow[];
  shunts: LibraryShuntRow[];
  adcs: LibraryAdcRow[];
  meters: LibraryMeterRow[];
};

/** The library, or an empty one when the route is missing or refuses (the wizard still works). */
export async function fetchLibrary(): Promise<Library> {
  const res = await fetch("/api/library", { headers: { accept: "application/json" } });
  if (res.status === 404) return { amplifiers: [], shunts: [], adcs: [], meters: [] };
  if (!res.ok) throw new Error(`The library answered ${res.status}`);
  const body = (await res.json()) as Partial<Library>;
  return {
    amplifiers: Array.isArray(body.amplifiers) ? body.amplifiers : [],
    shunts: Array.isArray(body.shunts) ? body.shunts : [],
    adcs: Array.isArray(body.adcs) ? body.adcs : [],
    meters: Array.isArray(body.meters) ? body.meters : [],
  };
}

const ppm = (x: number) => `${Number((x * 1e6).toPrecision(4))} ppm/K`;
const pct = (x: number) => `${Number((x * 100).toPrecision(4))} %`;
const si = (x: number, unit: string) => formatSI(x, unit, 4).replace("µ", "u");

export function libraryAmplifierValues(a: LibraryAmplifierRow): Partial<WizardValues["amplifier"]> {
  const gains = [...a.gains].sort((x, y) => x - y);
  const base: Partial<WizardValues["amplifier"]> = {
    offset: si(a.offsetV, "V"),
    offsetDrift: `${si(a.offsetDriftVPerK, "V")}/K`,
    gainError: pct(a.gainErrorFraction),
    gainDrift: ppm(a.gainDriftPerK),
    biasCurrent: si(a.biasCurrentA, "A"),
    noiseDensity: `${si(a.noiseDensityVPerRtHz, "V")}/rtHz`,
    gbw: si(a.gbwHz, "Hz"),
    swingLow: si(a.swingLowV, "V"),
    swingHigh: si(a.swingHighV, "V"),
    cmrrDb: a.cmrrDb,
    topology: a.topology ?? "",
    commonMode: {
      min: typeof a.commonModeMinV === "number" ? si(a.commonModeMinV, "V") : "",
      max: typeof a.commonModeMaxV === "number" ? si(a.commonModeMaxV, "V") : "",
    },
  };
  // The same rule as the library's own mapping (lib/library/to-requirement.ts).
  if (a.gainMode === "resistor-set" && gains.length > 0) return { ...base, gainSet: resistorSetGains(gains) };
  return { ...base, gains };
}

export function libraryShuntValues(s: LibraryShuntRow): Partial<WizardValues["shunt"]> {
  return {
    series: s.series,
    min: si(s.minOhms, "ohm"),
    max: si(s.maxOhms, "ohm"),
    tolerance: pct(s.toleranceFraction),
    tempco: ppm(s.tempcoPerK),
    ratings: s.ratingsW.map((w) => si(w, "W")),
  };
}

/** A library ADC as the wizard's readout fields: the same figures as adcRequirement, as text. */
export function libraryAdcValues(a: LibraryAdcRow): WizardValues["readout"] {
  return {
    kind: "adc",
    bits: a.bits,
    fullScale: si(a.fullScale, "V"),
    sampleRateHz: si(a.sampleRateHz, "Hz"),
    reference: { tolerance: pct(a.reference.tolerance), tempco: ppm(a.reference.tempco) },
    offsetLsb: a.offsetLsb,
    gainError: pct(a.gainError),
    inlLsb: a.inlLsb,
  };
}

/** A library meter range as the wizard's readout fields (meterRequirement's figures, as text). */
export function libraryMeterValues(m: LibraryMeterRow): WizardValues["readout"] {
  return {
    kind: "meter",
    fullScale: si(m.fullScale, "V"),
    counts: m.counts,
    accuracy: { percentOfReading: pct(m.accuracy.percentOfReading), digits: m.accuracy.digits },
  };
}
