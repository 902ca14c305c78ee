// Engine benchmark: the solver's sweep against a hand-written Float64Array loop that computes
// the same per-pair figures and feasibility on the same grid (E192, 1 mΩ–10 kΩ × resistor-pair gains).
// Reported as ratios; nothing here asserts a wall-clock time.
import { buildModel, type Model } from "../../lib/design/model";
import { parseRequirement, type RequirementInput } from "../../lib/design/requirement";
import { solve } from "../../lib/design/solve";
import { evaluatePlan } from "../../lib/design/plan-evaluation";
import { planStretches } from "../../lib/design/plan-stretches";
import { moveSwitchPoint, planChoiceOf, rangeCandidates } from "../../lib/design/range-candidates";
import { sweepGrid, sweepValues } from "../../lib/design/sweep";

/** A pump controller like the demo's (docs/model.md), sensed on the low side (a resistor-pair
 * gain is a non-inverting stage, ground-referenced), swept wide on purpose. */
export const benchRequirement: RequirementInput = {
  current: { min: "20 mA", max: "2 A" },
  supply: { voltage: "12 V", side: "low" },
  drop: { max: "100 mV" },
  // The converter's own error stated, so that its terms are in the inner loop (issue 14).
  readout: {
    kind: "adc",
    bits: 16,
    fullScale: "2.5 V",
    reference: { tolerance: "0.1 %", tempco: "20 ppm/K" },
    offsetLsb: 2,
    gainError: "0.05 %",
    inlLsb: 1,
  },
  resolution: { countsAtMin: 10 },
  amplifier: { gains: { series: "E12", min: 5, max: 200 } },
  // Issue 14's front-end terms in the inner loop: an input filter, 2-terminal pads, thermal EMF.
  inputFilter: { resistance: "47 ohm", capacitance: "4.7 uF" },
  shunt: { series: "E192", min: "1 mohm", max: "10 kohm", terminals: 2, padResistance: "0.2 mohm", gradient: "1 K" },
};

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? (s[mid] as number) : ((s[mid - 1] as number) + (s[mid] as number)) / 2;
};

function time(repeats: number, fn: () => void): number {
  for (let k = 0; k < 5; k++) fn(); // warm-up: let the JIT settle
  const t: number[] = [];
  for (let k = 0; k < repeats; k++) {
    const t0 = performance.now();
    fn();
    t.push(performance.now() - t0);
  }
  return median(t);
}

/**
 * The same figures and constraints as the engine, written out by hand in one loop:
 * the floor the engine's abstractions are measured against. Like the engine it allocates
 * its result arrays on every run.
 */
export function baselineSweep(m: Model, values: Float64Array, gains: Float64Array) {
  const nG = gains.length;
  const mask = new Uint8Array(values.length * nG);
  const errMin = new Float64Array(values.length * nG);
  const rejected = new Int32Array(8);
  const sqrtNbw = new Float64Array(nG);
  const bw = new Float64Array(nG);
  const epsG = new Float64Array(nG);
  const cmK = new Float64Array(nG);
  const cmErr = new Float64Array(nG);
  const tol = m.gainSetTol;
  for (let j = 0; j < nG; j++) {
    const g = gains[j] as number;
    bw[j] = Math.min(m.gbw / g, m.filterHz);
    sqrtNbw[j] = Math.sqrt((Math.PI / 2) * (bw[j] as number));
    const diff = m.topology === 1;
    epsG[j] = tol === 0 ? 0 : diff ? 2 * tol : m.topology === 3 ? (tol * (g - 1)) / g : (2 * tol * (g - 1)) / g;
    cmK[j] = diff ? g / (1 + g) : 1;
    cmErr[j] =
      (m.topology === 2 ? 0 : m.vCm * (cmK[j] as number) * m.cmrrLin + (diff ? (m.vCm * 4 * tol) / (1 + g) : 0)) +
      m.fe.filterCmV / (1 + g);
  }
  const ratings = Float64Array.from(m.ratings);
  const slack = 1 + 1e-12;
  let feasible = 0;
  for (let i = 0; i < values.length; i++) {
    const R = values[i] as number;
    // drop and current at the operating point, for the three load models
    let burden: number;
    let iOp: number;
    const path = R + m.fe.padOhms;
    if (m.loadModel === 0) {
      burden = m.iMax * path;
      iOp = m.iMax;
    } else if (m.loadModel === 1) {
      burden = (m.vBus * path) / (m.vBus / m.iMax + path);
      iOp = m.vBus / (m.vBus / m.iMax + path);
    } else {
      const disc = m.vBus * m.vBus - 4 * m.vBus * m.iMax * path;
      burden = disc < 0 ? NaN : m.vBus - (m.vBus + Math.sqrt(disc)) / 2;
      iOp = disc < 0 ? NaN : (m.vBus * m.iMax) / ((m.vBus + Math.sqrt(disc)) / 2);
    }
    const dropFails =
      !(burden <= m.dropMax * slack) ||
      m.iMax * path > m.dropMax * slack ||
      m.iNeg * path > m.dropMax * slack ||
      m.vBus - burden < m.loadMin / slack;
    const iHeat = Math.max(Number.isNaN(iOp) ? m.iMax : iOp, m.iNeg);
    const power = iHeat * iHeat * R;
    let rating = NaN;
    if (m.ambientDerate > 0) {
      const need = power / (m.derating * m.ambientDerate);
      for (let k = 0; k < ratings.length; k++) {
        if ((ratings[k] as number) >= need * (1 - 1e-12)) {
          rating = ratings[k] as number;
          break;
        }
      }
    }
    const theta =
      m.thetaFixed ?? m.ratedRise / (Number.isNaN(rating) ? (ratings[ratings.length - 1] as number) : rating);
    const hot = m.tAmbMax + power * theta > m.maxTempC * slack;
    const b = Number.isNaN(burden) ? m.iMax * R : burden;
    const vLo = m.high ? m.vBus - b : 0;
    const vHi = m.high ? m.vBus : b;
    const offsetBase = (m.vosWorst + m.fe.filterBiasV + m.fe.thermalEmfV) / R + m.ib;
    const accOffsetBase =
      (m.accOffKeep * (m.vosRef + m.fe.filterBiasV) + (m.vosWorst - m.vosRef) + m.fe.thermalEmfV) / R +
      m.accOffKeep * m.ib;
    const noisePerR = Math.sqrt(m.en2 + m.fourKT * R) / R;
    const heat = m.alphaR * R * theta;
    const gainConst = m.gainConst + m.fe.padOhmsWorst / R;
    const accGain =
      m.accGainConst +
      m.accEpsKeep * m.fe.filterLoading +
      (m.accEpsKeep * m.fe.padOhms + m.fe.padOhmsWorst - m.fe.padOhms) / R;
    const gainLo = accGain + heat * m.bandLo * m.bandLo;
    const gainHi = accGain + heat * m.bandHi * m.bandHi;
    const gainMin = accGain + heat * m.iMin * m.iMin;
    for (let j = 0; j < nG; j++) {
      const G = gains[j] as number;
      const rg = R * G;
      const eps = epsG[j] as number;
      let bits = dropFails ? 1 : 0;
      const k = cmK[j] as number;
      if ((m.topology === 2 && m.high) || k * vHi > m.cmMax * slack || k * vLo < m.cmMin / slack) bits |= 2;
      const offA = offsetBase + (cmErr[j] as number) / R;
      const noiseRms = noisePerR * (sqrtNbw[j] as number);
      const outWorst =
        (iOp * (1 + gainConst + heat * iOp * iOp + eps) + offA + m.crest * noiseRms) * rg + m.vRef + m.refErrV;
      if (outWorst > m.outCeil * slack) bits |= 4;
      const gNeg = 1 + gainConst + heat * m.iNeg * m.iNeg;
      const outLow = m.vRef - m.refErrV - (m.iNeg * (gNeg + eps) + offA + m.crest * noiseRms) * rg;
      if (m.signed && outLow < m.swingLow / slack) bits |= 4;
      const step = Math.max(m.lsbV / rg, noiseRms);
      if (m.iMin < (m.countsAtMin / slack) * step) bits |= 8;
      if (Number.isNaN(rating) || hot) bits |= 16;
      if ((bw[j] as number) < m.bwReq / slack) bits |= 32;
      const accOffA = accOffsetBase + (m.accOffKeep * (cmErr[j] as number)) / R;
      const fixedA = accOffA + m.accOutV / rg + m.crest * noiseRms;
      const epsAcc = m.accEpsKeep * eps;
      const lo = gainLo + epsAcc + fixedA / m.bandLo;
      const hi = gainHi + epsAcc + fixedA / m.bandHi;
      if (lo > m.accRatio * slack || hi > m.accRatio * slack) bits |= 64;
      if ((m.deadFloorV + m.refErrV) / rg + offA > m.iMin * slack) bits |= 128;
      const p = i * nG + j;
      mask[p] = bits;
      errMin[p] = gainMin + epsAcc + fixedA / m.iMin;
      if (bits === 0) feasible++;
      else {
        const kk = 31 - Math.clz32(bits & -bits);
        rejected[kk] = (rejected[kk] ?? 0) + 1;
      }
    }
  }
  return { feasible, rejected, mask, errMin };
}

export async function run(): Promise<Record<string, number>> {
  const parsed = parseRequirement(benchRequirement);
  if (!parsed.ok) throw new Error(parsed.message);
  const r = parsed.requirement;
  const m = buildModel(r);
  const values = sweepValues(r);
  const gains = Float64Array.from(r.amplifier.gains);
  const n = values.length * gains.length;

  // Same answer, or the comparison means nothing.
  const engine = sweepGrid(m, values, gains);
  const base = baselineSweep(m, values, gains);
  const same =
    base.feasible === engine.feasibleCount &&
    base.rejected.every((c, k) => c === engine.rejectedCounts[k]) &&
    base.mask.every((b, p) => b === engine.mask[p]) &&
    base.errMin.every((e, p) => Math.abs(e - (engine.errMin[p] as number)) <= 1e-12 * Math.abs(e));
  if (!same)
    throw new Error(`bench: baseline (${base.feasible} feasible) and engine (${engine.feasibleCount}) disagree`);

  // Warm both up until the JIT has settled, then interleave single runs so that load from
  // other processes on the machine falls on both alike.
  const runEngine = () => sweepGrid(m, values, gains);
  const runBaseline = () => baselineSweep(m, values, gains);
  for (let k = 0; k < 40; k++) {
    runEngine();
    runBaseline();
  }
  const sweepTimes: number[] = [];
  const baseTimes: number[] = [];
  for (let k = 0; k < 101; k++) {
    let t0 = performance.now();
    runEngine();
    sweepTimes.push(performance.now() - t0);
    t0 = performance.now();
    runBaseline();
    baseTimes.push(performance.now() - t0);
  }
  const sweepMs = median(sweepTimes);
  const baselineMs = median(baseTimes);
  let listed = 0;
  const solveMs = time(7, () => {
    const p = parseRequirement(benchRequirement);
    if (!p.ok) throw new Error(p.message);
    listed = solve(p.requirement).candidates.length;
  });
  const front = solve(r).candidates.filter((c) => c.pareto).length;

  // The wizard's plan editor: one adjustment (a moved switch point) re-checked as the plan worker
  // does it (each range's own sweep, evaluatePlan, the curves), against a solve of the same
  // requirement, interleaved. The demo logger (docs/model.md §6) is the requirement.
  const logger = parseRequirement({
    current: { min: "3 uA", max: "180 mA" },
    supply: { voltage: "3.0 V" },
    drop: { max: "60 mV" },
  });
  if (!logger.ok) throw new Error(logger.message);
  const lr = logger.requirement;
  const proposal = solve(lr, { diagnose: false }).rangePlan;
  if (!proposal) throw new Error("bench: the logger gets no range plan");
  const plan = planChoiceOf(proposal);
  const at = plan.switchPoints[0]!.upA * 0.9;
  const recheck = () => {
    const moved = moveSwitchPoint(plan, 0, at);
    if (!moved.ok) throw new Error(moved.message);
    moved.plan.ranges.forEach((_, k) => rangeCandidates(lr, moved.plan, k));
    evaluatePlan(lr, moved.plan);
    planStretches(lr, moved.plan);
  };
  const solveLogger = () => solve(lr, { diagnose: false });
  const planTimes: number[] = [];
  const loggerTimes: number[] = [];
  for (let k = 0; k < 5; k++) {
    recheck();
    solveLogger();
  }
  for (let k = 0; k < 21; k++) {
    let t0 = performance.now();
    recheck();
    planTimes.push(performance.now() - t0);
    t0 = performance.now();
    solveLogger();
    loggerTimes.push(performance.now() - t0);
  }
  return {
    "planCheck.ms": median(planTimes),
    "planCheck.solve.ms": median(loggerTimes),
    "planCheck.ratio": median(planTimes) / median(loggerTimes),
    "sweep.candidates": n,
    "sweep.values": values.length,
    "sweep.gains": gains.length,
    "sweep.feasible": engine.feasibleCount,
    "sweep.ms": sweepMs,
    "baseline.ms": baselineMs,
    "sweep.ratio": sweepMs / baselineMs,
    "solve.ms": solveMs,
    "solve.listed": listed,
    "solve.front": front,
  };
}
