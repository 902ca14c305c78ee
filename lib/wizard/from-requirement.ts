// A saved (normalized, SI) requirement back into the wizard's typed form, for revising a design.
// Values are written with 12 significant figures so the round trip through the parser is exact and
// an untouched field never shows up as a change in the next revision.
import { accuracyTargetText } from "@/lib/design/accuracy-text";
import { formatSI } from "@/lib/design/format";
import type { Requirement } from "@/lib/design/requirement";
import { readableDefaults, type WizardValues } from "./form-values";
import { defaultZeroLevelV, largestMagnitude, outputWindow } from "@/lib/design/bidirectional";

const exact = (x: number, unit: string) => formatSI(x, unit, 12);
const plain = (x: number) => String(Number(x.toPrecision(12)));
const percent = (ratio: number) => `${plain(ratio * 100)} %`;
const ppm = (perK: number) => `${plain(perK * 1e6)} ppm/K`;

export type RevisionStart = {
  values: WizardValues;
  dropMode: "volts" | "share";
  gainMode: "list" | "pair";
  /** Fields the wizard does not show, kept as saved so a revision does not silently reset them. */
  base: Record<string, unknown>;
};

/** Paths the wizard's steps own; everything else in a saved requirement is carried over as it is. */
function withoutShown(req: Requirement): Record<string, unknown> {
  const copy = JSON.parse(JSON.stringify(req)) as Record<string, Record<string, unknown> | unknown>;
  const drop = (group: string, keys: string[]) => {
    const g = copy[group];
    if (g && typeof g === "object") for (const k of keys) delete (g as Record<string, unknown>)[k];
  };
  for (const [group, shown] of Object.entries(readableDefaults)) {
    if (shown && typeof shown === "object" && !Array.isArray(shown)) drop(group, Object.keys(shown));
    else delete copy[group];
  }
  drop("current", ["typical"]);
  drop("drop", ["fraction", "loadMin"]);
  drop("accuracy", ["bandMin", "bandMax"]);
  drop("readout", ["bits", "counts"]);
  drop("amplifier", ["gainSet"]);
  return copy;
}

/** The readout's own error as typed, only the figures the saved requirement states. */
function readoutErrorValues(r: Requirement["readout"]) {
  if (r.kind === "meter") {
    const acc = r.accuracy;
    if (!acc) return {};
    return {
      accuracy: {
        ...(acc.percentOfReading !== undefined ? { percentOfReading: percent(acc.percentOfReading) } : {}),
        ...(acc.digits !== undefined ? { digits: acc.digits } : {}),
      },
    };
  }
  return {
    ...(r.reference
      ? {
          reference: {
            ...(r.reference.tolerance !== undefined ? { tolerance: percent(r.reference.tolerance) } : {}),
            ...(r.reference.tempco !== undefined ? { tempco: ppm(r.reference.tempco) } : {}),
          },
        }
      : {}),
    ...(r.offsetLsb !== undefined ? { offsetLsb: r.offsetLsb } : {}),
    ...(r.gainError !== undefined ? { gainError: percent(r.gainError) } : {}),
    ...(r.inlLsb !== undefined ? { inlLsb: r.inlLsb } : {}),
  };
}

export function revisionStart(req: Requirement): RevisionStart {
  const a = req.amplifier;
  const share = req.drop.fraction !== undefined;
  // Defaults that follow the span (a signed span's band is a magnitude; its zero level is placed).
  const signed = req.current.min < 0;
  const top = largestMagnitude(req.current);
  const bandMinDefault = signed ? 0.1 * top : Math.max(req.current.min, 0.1 * req.current.max);
  const bandMaxDefault = signed ? top : req.current.max;
  const zeroDefault = defaultZeroLevelV(req.current, outputWindow(a, req.readout.fullScale));
  const values: WizardValues = {
    current: {
      min: exact(req.current.min, "A"),
      max: exact(req.current.max, "A"),
      ...(req.current.typical !== undefined ? { typical: exact(req.current.typical, "A") } : {}),
    },
    supply: { voltage: exact(req.supply.voltage, "V"), side: req.supply.side },
    drop: {
      ...(share ? { fraction: percent(req.drop.fraction!) } : { max: exact(req.drop.max, "V") }),
      ...(req.drop.loadMin !== undefined ? { loadMin: exact(req.drop.loadMin, "V") } : {}),
    },
    load: { model: req.load.model },
    readout:
      req.readout.kind === "adc"
        ? {
            kind: "adc",
            bits: req.readout.bits,
            fullScale: exact(req.readout.fullScale, "V"),
            sampleRateHz: exact(req.readout.sampleRateHz, "Hz"),
            ...readoutErrorValues(req.readout),
          }
        : {
            kind: "meter",
            counts: req.readout.counts,
            fullScale: exact(req.readout.fullScale, "V"),
            ...readoutErrorValues(req.readout),
          },
    calibration: req.calibration,
    resolution: { countsAtMin: req.resolution.countsAtMin },
    accuracy: {
      percent: accuracyTargetText(req.accuracy.percent),
      // A band left at its default follows the span; only a band the designer set is written out.
      ...(Math.abs(req.accuracy.bandMin - bandMinDefault) > 1e-12 * top
        ? { bandMin: exact(req.accuracy.bandMin, "A") }
        : {}),
      ...(Math.abs(req.accuracy.bandMax - bandMaxDefault) > 1e-12 * top
        ? { bandMax: exact(req.accuracy.bandMax, "A") }
        : {}),
    },
    temperature: { min: `${plain(req.temperature.min)} °C`, max: `${plain(req.temperature.max)} °C` },
    shunt: {
      series: req.shunt.series,
      min: exact(req.shunt.min, "Ω"),
      max: exact(req.shunt.max, "Ω"),
      tolerance: percent(req.shunt.tolerance),
      tempco: ppm(req.shunt.tempco),
      ratings: req.shunt.ratings.map((w) => exact(w, "W")),
      derating: req.shunt.derating,
      deratingKneeC: `${plain(req.shunt.deratingKneeC)} °C`,
      maxTempC: `${plain(req.shunt.maxTempC)} °C`,
      kind: req.shunt.kind,
      trace: req.shunt.trace
        ? {
            width: exact(req.shunt.trace.width, "m"),
            length: exact(req.shunt.trace.length, "m"),
            thickness: exact(req.shunt.trace.thickness, "m"),
            layer: req.shunt.trace.layer,
            tolerance: percent(req.shunt.trace.tolerance),
          }
        : readableDefaults.shunt.trace,
      terminals: req.shunt.terminals === 2 ? "2" : "4",
      padResistance:
        req.shunt.terminals === 2 ? exact(req.shunt.padResistance, "Ω") : readableDefaults.shunt.padResistance,
      thermalEmf: exact(req.shunt.thermalEmf, "V/K"),
      gradient: exact(req.shunt.gradient, "K"),
    },
    amplifier: {
      ...(a.gainSet ? { gainSet: { ...a.gainSet, tolerance: percent(a.gainSet.tolerance) } } : { gains: [...a.gains] }),
      topology: a.topology,
      commonMode: { min: exact(a.commonMode.min, "V"), max: exact(a.commonMode.max, "V") },
      filterHz: a.filterHz === null ? "" : exact(a.filterHz, "Hz"),
      offset: exact(a.offset, "V"),
      offsetDrift: exact(a.offsetDrift, "V/K"),
      gainError: percent(a.gainError),
      gainDrift: ppm(a.gainDrift),
      biasCurrent: exact(a.biasCurrent, "A"),
      offsetCurrent: a.offsetCurrent === undefined ? "" : exact(a.offsetCurrent, "A"),
      noiseDensity: exact(a.noiseDensity, "V/rtHz"),
      gbw: exact(a.gbw, "Hz"),
      supply: exact(a.supply, "V"),
      swingLow: exact(a.swingLow, "V"),
      swingHigh: exact(a.swingHigh, "V"),
      cmrrDb: a.cmrrDb,
      reference: {
        ...(Math.abs(a.reference.voltage - zeroDefault) > 1e-12 ? { voltage: exact(a.reference.voltage, "V") } : {}),
        tolerance: percent(a.reference.tolerance),
        tempco: ppm(a.reference.tempco),
      },
    },
    limit: req.limit,
    inputFilterOn: req.inputFilter !== null,
    inputFilter: req.inputFilter
      ? {
          resistance: exact(req.inputFilter.resistance, "Ω"),
          capacitance: exact(req.inputFilter.capacitance, "F"),
          tolerance: percent(req.inputFilter.tolerance),
        }
      : readableDefaults.inputFilter,
  };
  return {
    values,
    dropMode: share ? "share" : "volts",
    gainMode: a.gainSet ? "pair" : "list",
    base: withoutShown(req),
  };
}
