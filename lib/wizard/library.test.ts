// The wizard's readout fields filled from a library part read back (as the wizard sends them) to
// exactly the readout the library's own mapping gives: the typed text loses no figure.
import { describe, expect, it } from "vitest";
import { demoAdcs, demoMeters } from "@/db/seed/library";
import { parseRequirement } from "@/lib/design";
import { adcInput, meterInput } from "@/lib/library/schema";
import { adcRequirement, meterRequirement } from "@/lib/library/to-requirement";
import { libraryAdcValues, libraryMeterValues } from "./library";

const base = { current: { min: "1 mA", max: "100 mA" }, supply: { voltage: "5 V" } };
const readoutOf = (readout: unknown) => {
  const r = parseRequirement({ ...base, readout });
  if (!r.ok) throw new Error(r.message);
  return r.requirement.readout;
};

describe("library readouts in the wizard", () => {
  it.each(demoAdcs.map((a) => [a.name, a] as const))("%s fills text that reads back to its figures", (_, a) => {
    const adc = adcInput.parse(a);
    const fromForm = readoutOf(libraryAdcValues({ ...adc, id: "x" }));
    const fromLibrary = readoutOf(adcRequirement(adc));
    expect(fromForm).toEqual(fromLibrary);
    expect(fromForm).toMatchObject({ kind: "adc", bits: adc.bits, offsetLsb: adc.offsetLsb });
  });

  it.each(demoMeters.map((m) => [m.name, m] as const))("%s fills text that reads back to its figures", (_, m) => {
    const meter = meterInput.parse(m);
    expect(libraryMeterValues({ ...meter, id: "x" })).toEqual({
      kind: "meter",
      fullScale: "200 mV",
      counts: 2000,
      accuracy: { percentOfReading: "0.5 %", digits: 2 },
    });
    expect(readoutOf(libraryMeterValues({ ...meter, id: "x" }))).toEqual(readoutOf(meterRequirement(meter)));
  });
});
