// A design made from team-library parts names them on the sheet, and says where a part's data stop
// covering the requirement (Ohm's and Joule's laws on round numbers for the rating: 100 mA through
// 1 Ω dissipates 10 mW; half a rating used at most, common practice, no source).
import { describe, expect, it } from "vitest";
import { demoAdcs, demoAmplifiers, demoMeters, demoShunts } from "@/db/seed/library";
import { evaluateCandidate, parseRequirement, type Choice } from "@/lib/design";
import { adcInput, amplifierInput, meterInput, shuntInput } from "@/lib/library/schema";
import { adcRequirement, amplifierRequirement, meterRequirement, shuntRequirement } from "@/lib/library/to-requirement";
import { matchLibraryParts, nameLibraryParts, type LibraryParts } from "./library-parts";
import { partsList } from "./parts";

const library: LibraryParts = {
  amplifiers: demoAmplifiers.map((a) => amplifierInput.parse(a)),
  shunts: demoShunts.map((s) => shuntInput.parse(s)),
  adcs: demoAdcs.map((a) => adcInput.parse(a)),
  meters: demoMeters.map((m) => meterInput.parse(m)),
};
const amp = library.amplifiers.find((a) => a.name.startsWith("SW-CSA-20"))!;
const thinFilm = shuntInput.parse(demoShunts.find((s) => s.name.startsWith("SW-MF"))!);

function design(current: { min: string; max: string }, choice: Choice) {
  const p = parseRequirement({
    current,
    supply: { voltage: "5 V" },
    drop: { max: "200 mV" },
    amplifier: amplifierRequirement(amp, 5),
    shunt: shuntRequirement(thinFilm),
  });
  if (!p.ok) throw new Error(p.message);
  const m = evaluateCandidate(p.requirement, choice);
  return { req: p.requirement, m, match: matchLibraryParts(p.requirement, choice, m, library) };
}

describe("library parts on the build sheet", () => {
  it("names the amplifier and shunt family the pair came from", () => {
    const choice = { shuntOhms: 1, gain: 20 };
    const { req, m, match } = design({ min: "1 mA", max: "100 mA" }, choice);
    expect(match.amplifier?.name).toBe(amp.name);
    expect(match.shunt?.name).toBe(thinFilm.name);
    expect(m.dissipationW).toBeCloseTo(0.01, 12);
    const parts = nameLibraryParts(partsList(req, choice, m), match);
    const u1 = parts.find((p) => p.designator === "U1")!;
    expect(u1.part).toMatch(/^SW-CSA-20 fixed-gain sense amp \(team library\): /);
    expect(u1.notes).toContain("The library data cover the requirement.");
  });

  it("says where the family's data stop: a rating it does not offer", () => {
    // 2 A through 0.1 Ω dissipates 0.4 W (Joule); at half a rating used it needs 0.8 W, beyond the family's 0.25 W.
    const choice = { shuntOhms: 0.1, gain: 20 };
    const { req, m, match } = design({ min: "100 mA", max: "2 A" }, choice);
    expect(m.dissipationW).toBeCloseTo(0.4, 9);
    expect(match.shunt?.gaps.join(" ")).toContain("it is rated at most 250 mW; this design needs 800 mW");
    const r1 = nameLibraryParts(partsList(req, choice, m), match).find((p) => p.designator === "R1")!;
    expect(r1.notes).toContain("Library data stop short:");
  });

  it("names nothing for a design typed by hand", () => {
    const p = parseRequirement({ current: { min: "1 mA", max: "100 mA" }, supply: { voltage: "5 V" } });
    if (!p.ok) throw new Error(p.message);
    const choice = { shuntOhms: 0.249, gain: 20 };
    const m = evaluateCandidate(p.requirement, choice);
    expect(matchLibraryParts(p.requirement, choice, m, library)).toEqual({
      amplifier: null,
      shunt: null,
      readout: null,
    });
  });

  it("names the library ADC on the readout connector, and a rate above the part's as a gap", () => {
    const adc = library.adcs!.find((a) => a.name.startsWith("SW-ADC12"))!;
    const at = (readout: object) => {
      const p = parseRequirement({ current: { min: "1 mA", max: "100 mA" }, supply: { voltage: "5 V" }, readout });
      if (!p.ok) throw new Error(p.message);
      const choice = { shuntOhms: 0.249, gain: 20 };
      const m = evaluateCandidate(p.requirement, choice);
      return nameLibraryParts(
        partsList(p.requirement, choice, m),
        matchLibraryParts(p.requirement, choice, m, library),
      );
    };
    const j1 = at(adcRequirement(adc)).find((p) => p.designator === "J1")!;
    expect(j1.part).toBe(`2-way connector: OUT and GND, to ${adc.name} (team library)`);
    expect(j1.notes).toContain("The library data cover the requirement.");
    const fast = at({ ...adcRequirement(adc), sampleRateHz: 50_000 }).find((p) => p.designator === "J1")!;
    expect(fast.notes).toContain("the design samples at 50 kHz, above its highest rate of 10 kHz");
    // The same converter with its own error left out (an ideal readout) is not the library part.
    const ideal = at({ kind: "adc", bits: 12, fullScale: 2.5 }).find((p) => p.designator === "J1")!;
    expect(ideal.part).toBe("2-way connector: OUT and GND");
  });

  it("names the library meter range the readout came from", () => {
    const meter = library.meters![0]!;
    const p = parseRequirement({
      current: { min: "1 mA", max: "100 mA" },
      supply: { voltage: "5 V" },
      readout: meterRequirement(meter),
    });
    if (!p.ok) throw new Error(p.message);
    const choice = { shuntOhms: 0.249, gain: 5 };
    const m = evaluateCandidate(p.requirement, choice);
    expect(matchLibraryParts(p.requirement, choice, m, library).readout).toEqual({ name: meter.name, gaps: [] });
  });
});
