// A recorded current profile read through a range plan: the switching rule (hysteresis and a
// switch delay) run over the samples, and what the recording then says about the plan — the
// single-range summary of profile.ts with the figures a plan adds (docs/model.md, "Current
// profiles"; API.md v2: rangeSwitches, timeInRangeS).
import { buildModel, resolvableStepA } from "./model";
import type { PlanChoice, SwitchPoint } from "./plan-choice";
import { segmentCharge, type ProfileSummary } from "./profile";
import { readoutStepV } from "./model";
import type { Requirement } from "./requirement";
import type { Amps, Ohms, Seconds, Volts } from "./units";

/** One range as a recording is judged against it. */
export type PlanProfileRange = {
  minA: Amps;
  maxA: Amps;
  shuntOhms: Ohms;
  gain: number;
  /** On-resistance of the switch in series with this range's shunt. */
  switchOhms: Ohms;
  /** One readout step referred to current: full scale / (2^bits · R·G). */
  lsbA: Amps;
  /** The smallest current step this range tells apart: the readout step, or the noise where larger. */
  resolvableStepA: Amps;
  /** Where the ideal output I·R·G reaches the readout's full scale. */
  clipCurrentA: Amps;
};

/** The few figures of a plan design a profile is judged against. */
export type PlanProfileDesign = {
  supplyV: Volts;
  fullScaleV: Volts;
  /** The allowed drop: the protection closes the top range's switch when the path's drop reaches it. */
  dropMaxV: Volts;
  switchDelayS: Seconds;
  ranges: PlanProfileRange[];
  switchPoints: SwitchPoint[];
};

export type PlanProfileSummary = ProfileSummary & {
  /** How many times the switch acted. */
  rangeSwitches: number;
  /** Time spent on each range, s (ascending ranges, as the plan lists them). */
  timeInRangeS: Seconds[];
  /** Samples read on each range. */
  samplesInRange: number[];
  /** The switch delay the count below assumes, s. */
  switchDelayS: Seconds;
  /** Samples read on a range where they sit below one resolvable step of that range. */
  belowStepSamples: number;
  /** Samples above the top of the range in use while the switch waited out its delay. */
  clippedBeforeSwitchSamples: number;
  clippedBeforeSwitchPercent: number;
};

/** The plan's figures for judging recordings, from the requirement and the saved plan. */
export function planProfileDesign(req: Requirement, plan: PlanChoice): PlanProfileDesign {
  const m = buildModel(req);
  const lsbV = readoutStepV(req);
  const ron = req.rangeSwitch.onResistance;
  return {
    supplyV: req.supply.voltage,
    fullScaleV: req.readout.fullScale,
    dropMaxV: req.drop.max,
    switchDelayS: req.rangeSwitch.delay,
    switchPoints: plan.switchPoints,
    ranges: plan.ranges.map((r) => {
      const rg = r.shuntOhms * r.gain;
      return {
        minA: r.minA,
        maxA: r.maxA,
        shuntOhms: r.shuntOhms,
        gain: r.gain,
        switchOhms: ron,
        lsbA: lsbV / rg,
        resolvableStepA: resolvableStepA(m, r.shuntOhms, r.gain),
        clipCurrentA: req.readout.fullScale / rg,
      };
    }),
  };
}

/** The range a current starts in: the lowest whose switch-up point it does not pass. */
export function startingRange(currentA: Amps, switchPoints: readonly SwitchPoint[]): number {
  let k = 0;
  while (k < switchPoints.length && currentA > switchPoints[k]!.upA) k++;
  return k;
}

/**
 * Where the switching rule wants to be for this current, seen from range k: up past every switch
 * point the current is above, down past every one it is below (hysteresis: downA < upA).
 */
export function wantedRange(k: number, currentA: Amps, switchPoints: readonly SwitchPoint[]): number {
  let j = k;
  while (j < switchPoints.length && currentA > switchPoints[j]!.upA) j++;
  if (j !== k) return j;
  while (j > 0 && currentA < switchPoints[j - 1]!.downA) j--;
  return j;
}

export type RangeTrace = {
  /** The range each sample was read on. */
  rangeOf: Uint8Array;
  /** Sample indices read late: above their range's top while a switch up was pending. */
  late: Uint8Array;
  switches: number;
  timeInRangeS: number[];
};

/**
 * Runs the switching rule over the samples. A sample outside the hysteresis window of the range in
 * use asks for the range that fits it; the switch acts `delay` later (at once when the delay is 0)
 * and is not called back. Samples until then are read on the old range. Time in each range counts
 * to the instant the switch acts, which may fall between samples.
 */
export function traceRanges(
  timesS: Float64Array,
  currentsA: Float64Array,
  switchPoints: readonly SwitchPoint[],
  delayS: Seconds,
  topOf: (k: number) => number,
): RangeTrace {
  const n = timesS.length;
  const nRanges = switchPoints.length + 1;
  const rangeOf = new Uint8Array(n);
  const late = new Uint8Array(n);
  const timeInRangeS = new Array<number>(nRanges).fill(0);
  let k = startingRange(currentsA[0] ?? 0, switchPoints);
  let mark = timesS[0] ?? 0;
  let pending: { to: number; atS: number } | null = null;
  let switches = 0;
  for (let i = 0; i < n; i++) {
    const t = timesS[i]!;
    const I = currentsA[i]!;
    // Act on a pending switch that is due, then let this sample ask for the next one.
    for (;;) {
      if (pending && t >= pending.atS) {
        timeInRangeS[k]! += pending.atS - mark;
        mark = pending.atS;
        if (pending.to !== k) switches++;
        k = pending.to;
        pending = null;
      }
      if (pending) break;
      const want = wantedRange(k, I, switchPoints);
      if (want === k) break;
      pending = { to: want, atS: t + delayS };
      if (delayS > 0) break;
    }
    rangeOf[i] = k;
    if (pending && pending.to > k && I > topOf(k)) late[i] = 1;
  }
  timeInRangeS[k]! += (timesS[n - 1] ?? 0) - mark;
  return { rangeOf, late, switches, timeInRangeS };
}

/**
 * Resistance of the measured path while range k is in use at current I, Ω: its shunt and switch;
 * a lower range whose path would drop more than the allowed drop has the protection close the top
 * range's switch beside it (the comparator is taken to act at once and to hold until the switching
 * rule takes over), leaving the two paths in parallel.
 */
export function pathOhms(d: PlanProfileDesign, k: number, currentA: Amps): Ohms {
  const r = d.ranges[k]!;
  const own = r.shuntOhms + r.switchOhms;
  const topIndex = d.ranges.length - 1;
  if (k === topIndex || currentA * own <= d.dropMaxV) return own;
  const top = d.ranges[topIndex]!;
  const bypass = top.shuntOhms + top.switchOhms;
  return (own * bypass) / (own + bypass);
}

export function summarizePlanProfile(
  timesS: Float64Array,
  currentsA: Float64Array,
  d: PlanProfileDesign,
): { summary: PlanProfileSummary; trace: RangeTrace } {
  const n = timesS.length;
  if (n < 2 || currentsA.length !== n) throw new Error("a profile needs at least two samples of time and current");
  const trace = traceRanges(timesS, currentsA, d.switchPoints, d.switchDelayS, (k) => d.ranges[k]!.maxA);
  const samplesInRange = new Array<number>(d.ranges.length).fill(0);
  let charge = 0;
  let chargeIn = 0;
  let chargeOut = 0;
  let peak = -Infinity;
  let maxDrop = -Infinity;
  let clipped = 0;
  let below = 0;
  let late = 0;
  for (let i = 0; i < n; i++) {
    const I = currentsA[i]!;
    const k = trace.rangeOf[i]!;
    const r = d.ranges[k]!;
    samplesInRange[k]!++;
    if (I > peak) peak = I;
    // The drop the load sees: the current through the path in use (Ohm's law).
    const drop = I * pathOhms(d, k, I);
    if (drop > maxDrop) maxDrop = drop;
    if (I > r.clipCurrentA) clipped++;
    if (I < r.resolvableStepA) below++;
    if (trace.late[i]) late++;
    if (i > 0) {
      const dt = timesS[i]! - timesS[i - 1]!;
      charge += ((currentsA[i - 1]! + I) / 2) * dt;
      const seg = segmentCharge(currentsA[i - 1]!, I, dt);
      chargeIn += seg.inC;
      chargeOut += seg.outC;
    }
  }
  const durationS = timesS[n - 1]! - timesS[0]!;
  const lowest = d.ranges[0]!;
  const top = d.ranges[d.ranges.length - 1]!;
  return {
    trace,
    summary: {
      samples: n,
      durationS,
      chargeC: charge,
      chargeInC: chargeIn,
      chargeOutC: chargeOut,
      averageCurrentA: charge / durationS,
      peakCurrentA: peak,
      maxBurdenV: maxDrop,
      minLoadVoltageV: d.supplyV - maxDrop,
      clippedPercent: (100 * clipped) / n,
      belowResolutionPercent: (100 * below) / n,
      // The plan reads up to its top range's clip current and down to its lowest range's step.
      clipCurrentA: top.clipCurrentA,
      lsbA: lowest.lsbA,
      rangeSwitches: trace.switches,
      timeInRangeS: trace.timeInRangeS,
      samplesInRange,
      switchDelayS: d.switchDelayS,
      belowStepSamples: below,
      clippedBeforeSwitchSamples: late,
      clippedBeforeSwitchPercent: (100 * late) / n,
    },
  };
}
