// Demo parts library: invented generic parts with made-up names (no real part numbers or makers).
import {
  adcInput,
  amplifierInput,
  meterInput,
  shuntInput,
  type AdcInput,
  type AmplifierInput,
  type MeterInput,
  type ShuntInput,
} from "@/lib/library/schema";
import { getDb } from "../client";
import { libraryAdcs, libraryAmplifiers, libraryMeters, libraryShunts } from "../schema";
import type { DemoIds } from "./team";

export const demoAmplifiers: AmplifierInput[] = [
  {
    name: "SW-CSA-20 fixed-gain sense amp",
    gainMode: "fixed",
    gains: [20],
    offsetV: "35 uV",
    offsetDriftVPerK: "0.1 uV/K",
    gainErrorFraction: "0.2 %",
    gainDriftPerK: "10 ppm/K",
    biasCurrentA: "20 nA",
    noiseDensityVPerRtHz: "40 nV/rtHz",
    gbwHz: "400 kHz",
    swingLowV: "10 mV",
    swingHighV: "30 mV",
    cmrrDb: 100,
    supplyMinV: "2.7 V",
    supplyMaxV: "5.5 V",
  },
  {
    name: "SW-CSA-Q four-step sense amp",
    gainMode: "fixed",
    gains: [25, 50, 100, 200],
    offsetV: "15 uV",
    offsetDriftVPerK: "0.05 uV/K",
    gainErrorFraction: "0.3 %",
    gainDriftPerK: "15 ppm/K",
    biasCurrentA: "10 nA",
    noiseDensityVPerRtHz: "30 nV/rtHz",
    gbwHz: "1 MHz",
    swingLowV: "15 mV",
    swingHighV: "40 mV",
    cmrrDb: 110,
    supplyMinV: "1.8 V",
    supplyMaxV: "5.5 V",
  },
  {
    name: "SW-ZD-RS zero-drift resistor-set amp",
    gainMode: "resistor-set",
    gains: [1, 1000],
    offsetV: "5 uV",
    offsetDriftVPerK: "0.02 uV/K",
    gainErrorFraction: "0.1 %",
    gainDriftPerK: "5 ppm/K",
    biasCurrentA: "0.2 nA",
    noiseDensityVPerRtHz: "60 nV/rtHz",
    gbwHz: "1.5 MHz",
    swingLowV: "20 mV",
    swingHighV: "50 mV",
    cmrrDb: 120,
    supplyMinV: "2.2 V",
    supplyMaxV: "5.5 V",
    // G = 1 + Rf/Rg around an op-amp: ground-referenced, low side only.
    topology: "non-inverting",
  },
  {
    name: "SW-HV-10 high-side amp (36 V common mode)",
    gainMode: "fixed",
    gains: [10, 20],
    offsetV: "100 uV",
    offsetDriftVPerK: "0.5 uV/K",
    gainErrorFraction: "0.5 %",
    gainDriftPerK: "20 ppm/K",
    biasCurrentA: "50 nA",
    noiseDensityVPerRtHz: "50 nV/rtHz",
    gbwHz: "2 MHz",
    swingLowV: "25 mV",
    swingHighV: "60 mV",
    cmrrDb: 95,
    supplyMinV: "2.7 V",
    supplyMaxV: "5.5 V",
    commonModeMinV: "-0.3 V",
    commonModeMaxV: "36 V",
  },
];

export const demoShunts: ShuntInput[] = [
  {
    name: "SW-MF thin-film chip, 0.1 %",
    series: "E96",
    minOhms: "0.1 ohm",
    maxOhms: "1 kohm",
    toleranceFraction: "0.1 %",
    tempcoPerK: "25 ppm/K",
    ratingsW: ["0.1 W", "0.125 W", "0.25 W"],
    fourTerminal: false,
  },
  {
    name: "SW-MS metal-strip low-ohm, 1 %",
    series: "E24",
    minOhms: "1 mohm",
    maxOhms: "100 mohm",
    toleranceFraction: "1 %",
    tempcoPerK: "75 ppm/K",
    ratingsW: ["0.5 W", "1 W", "2 W", "3 W"],
    fourTerminal: false,
  },
  {
    name: "SW-K4 four-terminal foil, 0.5 %",
    series: "E48",
    minOhms: "0.5 mohm",
    maxOhms: "50 mohm",
    toleranceFraction: "0.5 %",
    tempcoPerK: "50 ppm/K",
    ratingsW: ["1 W", "2 W", "3 W", "5 W"],
    fourTerminal: true,
  },
  {
    name: "SW-TF thick-film general, 1 %",
    series: "E96",
    minOhms: "10 ohm",
    maxOhms: "100 kohm",
    toleranceFraction: "1 %",
    tempcoPerK: "100 ppm/K",
    ratingsW: ["0.1 W", "0.25 W"],
    fourTerminal: false,
  },
];

// Invented readouts: a converter class with an external series reference, and a handheld-class
// meter's millivolt range (figures of a class of part, from memory; no particular product).
export const demoAdcs: AdcInput[] = [
  {
    name: "SW-ADC12 converter with 2.5 V reference",
    bits: 12,
    fullScale: "2.5 V",
    sampleRateHz: "10 kHz",
    reference: { tolerance: "0.1 %", tempco: "20 ppm/K" },
    offsetLsb: 2,
    gainError: "0.05 %",
    inlLsb: 1,
  },
  {
    name: "SW-ADC16 precision converter, 4.096 V",
    bits: 16,
    fullScale: "4.096 V",
    sampleRateHz: "1 kHz",
    reference: { tolerance: "0.05 %", tempco: "5 ppm/K" },
    offsetLsb: 4,
    gainError: "0.02 %",
    inlLsb: 2,
  },
];

export const demoMeters: MeterInput[] = [
  {
    name: "SW-DM20 handheld, 200 mV range",
    fullScale: "200 mV",
    counts: 2000,
    accuracy: { percentOfReading: "0.5 %", digits: 2 },
  },
];

/** Loads the demo parts into the demo team's library. */
export async function seedDemoLibrary(ids: DemoIds): Promise<void> {
  const db = await getDb();
  await db.transaction(async (tx) => {
    for (const a of demoAmplifiers)
      await tx.insert(libraryAmplifiers).values({ ...amplifierInput.parse(a), teamId: ids.teamId });
    for (const s of demoShunts) await tx.insert(libraryShunts).values({ ...shuntInput.parse(s), teamId: ids.teamId });
    for (const a of demoAdcs) await tx.insert(libraryAdcs).values({ ...adcInput.parse(a), teamId: ids.teamId });
    for (const m of demoMeters) await tx.insert(libraryMeters).values({ ...meterInput.parse(m), teamId: ids.teamId });
  });
}
