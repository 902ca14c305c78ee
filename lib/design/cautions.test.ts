// The cautions' thresholds, checked at their edges. Touch temperatures: the burn thresholds of
// ISO 13732-1 for bare metal, which IEC 61010-1 and IEC 62368-1 build their touchable-surface
// limits on (about 65 °C for a 1 s touch, 51 °C for a 1 min touch; from memory). The 60 V DC
// hazardous-voltage limit: IEC 61010-1 / IEC 62368-1 (from memory).
import { describe, expect, it } from "vitest";
import { evaluateCandidate } from "./candidate";
import {
  BURNS_IF_HELD_C,
  BURNS_ON_BRIEF_TOUCH_C,
  designCautions,
  HAZARDOUS_DC_V,
  switchCautions,
  shuntTouchTemperatureC,
} from "./cautions";
import { req } from "./test-helpers";
import { formatSI } from "./format";
import { evaluatePlan } from "./plan-evaluation";
import { planCautions } from "./plan-cautions";
import { solve } from "./solve";
import type { CandidateDetail } from "./types";

const logger = req({
  current: { min: "1 mA", max: "180 mA" },
  supply: { voltage: "3 V", side: "low" },
  drop: { max: "60 mV" },
  readout: { kind: "adc", bits: 12, fullScale: "2.5 V" },
  resolution: { countsAtMin: 10 },
});
const base = evaluateCandidate(logger, { shuntOhms: 0.27, gain: 50 });
const withRise = (k: number): CandidateDetail => ({ ...base, selfHeatingK: k });
const keys = (r: typeof logger, m: CandidateDetail) => designCautions(r, m).map((c) => `${c.key}:${c.severity}`);

describe("hot shunt", () => {
  it("stays quiet for a shunt that barely warms (12.5 mW, 10 K: the old threshold fired here)", () => {
    expect(keys(logger, { ...withRise(10), dissipationW: 0.0125 })).not.toContain("hot:warn");
    expect(keys(logger, withRise(10)).some((k) => k.startsWith("hot"))).toBe(false);
  });
  it("warns once the surface on a 25 °C bench could burn if held (51 °C, ISO 13732-1, from memory)", () => {
    const edge = BURNS_IF_HELD_C - 25;
    expect(shuntTouchTemperatureC(withRise(edge))).toBe(51);
    expect(keys(logger, withRise(edge - 0.1)).some((k) => k.startsWith("hot"))).toBe(false);
    expect(keys(logger, withRise(edge))).toContain("hot:warn");
  });
  it("calls it a hazard once a brief touch burns (65 °C)", () => {
    const edge = BURNS_ON_BRIEF_TOUCH_C - 25;
    expect(keys(logger, withRise(edge - 0.1))).toContain("hot:warn");
    expect(keys(logger, withRise(edge))).toContain("hot:bad");
    const hot = designCautions(logger, withRise(edge)).find((c) => c.key === "hot")!;
    expect(hot.text).toContain("65 °C on a 25 °C bench");
    // The requirement's highest ambient defaults to 70 °C: 70 + 40 K.
    expect(hot.text).toContain("up to about 110 °C at the highest ambient");
  });
});

describe("voltage", () => {
  const at = (voltage: string, side: "low" | "high") => req({ ...loggerInput, supply: { voltage, side } });
  const loggerInput = {
    current: { min: "1 mA", max: "180 mA" },
    drop: { max: "60 mV" },
    readout: { kind: "adc" as const, bits: 12, fullScale: "2.5 V" },
    resolution: { countsAtMin: 10 },
  };
  it("flags a hazardous supply from 60 V DC, and says where the sense lines sit on the high side", () => {
    expect(HAZARDOUS_DC_V).toBe(60);
    expect(keys(at("59 V", "low"), base)).not.toContain("hazardous:bad");
    expect(keys(at("60 V", "low"), base)).toContain("hazardous:bad");
    const high = designCautions(at("120 V", "high"), base).find((c) => c.key === "hazardous")!;
    expect(high.text).toContain("the sense lines sit at 120 V");
    expect(high.text).toContain("licensed");
  });
  it("asks for the amplifier's common-mode rating on a high side above 30 V (common practice, no source)", () => {
    expect(keys(at("30 V", "high"), base)).not.toContain("common-mode:warn");
    expect(keys(at("36 V", "high"), base)).toContain("common-mode:warn");
    expect(keys(at("36 V", "low"), base)).not.toContain("common-mode:warn");
  });
  it("always ends with the fuse, the inductive-circuit warning and the deferral to local codes", () => {
    for (const r of [logger, at("120 V", "high")]) {
      expect(keys(r, base).slice(-3)).toEqual(["fuse:note", "inductive:note", "codes:note"]);
    }
  });
});

describe("a range plan's switch cautions (issue 13)", () => {
  const demo = req({ current: { min: "3 uA", max: "180 mA" }, supply: { voltage: "3.0 V" }, drop: { max: "60 mV" } });
  const plan = solve(demo).rangePlan!;
  const ev = evaluatePlan(demo, { ranges: plan.ranges, switchPoints: plan.switchPoints });
  if (!ev.ok) throw new Error(ev.message);
  const list = switchCautions(demo, ev.ranges);
  const protection = list.find((c) => c.key === "range-protection");

  it("names the protection and the current each lower range carries until it acts (Ohm's law at the allowed drop)", () => {
    const ron = demo.rangeSwitch.onResistance;
    ev.ranges.slice(0, -1).forEach((r, k) => {
      // I = 60 mV/(R + Ron); P = I²·R (Joule).
      const i = 0.06 / (r.shuntOhms + ron);
      expect(protection?.text).toContain(
        `R${k + 1} (range ${k + 1}, ${formatSI(r.shuntOhms, "Ω")}) carries at most ${formatSI(i, "A")}`,
      );
      expect(protection?.text).toContain(formatSI(i * i * r.shuntOhms, "W"));
    });
    expect(protection?.text).toContain("closes Q3");
    expect(protection?.text).toContain("U4");
  });

  it("says what the top switch dissipates: I²·Ron at the full current", () => {
    const heat = list.find((c) => c.key === "switch-heat");
    expect(heat?.text).toContain(formatSI(0.18 * 0.18 * demo.rangeSwitch.onResistance, "W"));
  });

  it("the plan's cautions carry them once each, before the notes every build needs", () => {
    const all = planCautions(demo, ev).map((c) => c.key);
    expect(all.filter((k) => k === "range-protection")).toHaveLength(1);
    expect(all.indexOf("range-protection")).toBeLessThan(all.indexOf("fuse"));
    expect(all).toEqual(expect.arrayContaining(["range-switch", "switch-heat", "codes"]));
  });
});
