// A built unit's bench readings judged against the sheet: in or out of each test point's accept
// band, the likely cause from the pattern of the errors, and a gain-and-offset calibration.
// The bands come from benchCheck (the sheet's own table); nothing here re-derives them.
import type { BenchCheckRow } from "./bench-check";
import { nearestInSeries, seriesValues } from "./eseries";
import { buildModel } from "./model";
import type { Requirement } from "./requirement";
import type { Choice } from "./types";
import { formatSI } from "./format";

export type UnitReading = { currentA: number; outputV: number };

export type JudgedReading = UnitReading & {
  label: string;
  expectedV: number;
  minV: number;
  maxV: number;
  inBand: boolean;
  /** outputV − expectedV. */
  errorV: number;
  /** 100 · errorV / expectedV. */
  errorPercent: number;
  /** The reading sits at the amplifier's output floor (clipped, not a measurement). */
  atFloor: boolean;
  /** After the unit's own calibration: gain · outputV + offsetV. */
  correctedV: number;
  correctedErrorPercent: number;
};

export type CauseKind = "no-output" | "dead-zone" | "offset" | "gain" | "self-heating" | "mixed" | "single-point";

export type Calibration = {
  /** corrected = gain · raw + offsetV */
  gain: number;
  offsetV: number;
  /** Largest |corrected − expected| over the points fitted, % of the expected reading. */
  residualPercent: number;
  method: "least-squares" | "two-point" | "gain-only" | "none";
  /** How many readings the fit used (readings at the output floor are left out: they are clipped). */
  points: number;
};

export type UnitJudgement = {
  pass: boolean;
  readings: JudgedReading[];
  cause: string | null;
  causeKind: CauseKind | null;
  calibration: Calibration;
};

/** Two currents name the same test point when they agree to this fraction (typed-in values are rounded). */
export const TEST_POINT_MATCH = 0.005;

export type PointMatch =
  | { ok: true; rows: { bench: BenchCheckRow; reading: UnitReading }[] }
  | { ok: false; errors: { path: string; message: string }[] };

/**
 * Pairs each reading with the sheet's test point at its current. Every test point needs exactly one
 * reading; a reading at a current the sheet does not list is refused, naming its index.
 */
export function matchTestPoints(bench: BenchCheckRow[], readings: UnitReading[]): PointMatch {
  const errors: { path: string; message: string }[] = [];
  const taken = new Map<number, number>();
  readings.forEach((r, i) => {
    const k = bench.findIndex((b) => Math.abs(r.currentA - b.currentA) <= TEST_POINT_MATCH * Math.abs(b.currentA));
    if (k < 0) {
      const list = bench.map((b) => formatSI(b.currentA, "A", 4)).join(", ");
      errors.push({
        path: `readings.${i}.currentA`,
        message: `${formatSI(r.currentA, "A", 4)} is not a test point of this design's bench check (${list})`,
      });
      return;
    }
    const first = taken.get(k);
    if (first !== undefined) {
      errors.push({
        path: `readings.${i}.currentA`,
        message: `a second reading at ${bench[k]!.label.toLowerCase()} (${formatSI(bench[k]!.currentA, "A", 4)}); reading ${first + 1} already has it`,
      });
      return;
    }
    taken.set(k, i);
  });
  bench.forEach((b, k) => {
    if (!taken.has(k))
      errors.push({
        path: "readings",
        message: `no reading at ${b.label.toLowerCase()} (${formatSI(b.currentA, "A", 4)}); the sheet asks for one at every test point`,
      });
  });
  if (errors.length) return { ok: false, errors };
  return {
    ok: true,
    rows: bench.map((b, k) => ({ bench: b, reading: readings[taken.get(k) as number] as UnitReading })),
  };
}

/** How close to the output floor a reading must be to count as stuck there, V. */
export function floorTolerance(req: Requirement): number {
  const m = buildModel(req);
  return Math.max(3 * m.lsbV, 0.5 * req.amplifier.swingLow, 1e-4);
}

/** y = slope·x + intercept by ordinary least squares, from the normal equations; null when x does not vary. */
export function straightLine(xs: number[], ys: number[]): { slope: number; intercept: number } | null {
  const n = xs.length;
  if (n < 2) return null;
  const mx = xs.reduce((s, x) => s + x, 0) / n;
  const my = ys.reduce((s, y) => s + y, 0) / n;
  let sxx = 0;
  let sxy = 0;
  xs.forEach((x, i) => {
    sxx += (x - mx) ** 2;
    sxy += (x - mx) * ((ys[i] as number) - my);
  });
  if (!(sxx > 0)) return null;
  const slope = sxy / sxx;
  return { slope, intercept: my - slope * mx };
}

/**
 * Ordinary least squares of expected on raw (two points: the line through both; one: gain only).
 * Closed form from the normal equations: gain = Sxy/Sxx, offset = ȳ − gain·x̄.
 */
export function fitCalibration(points: { rawV: number; expectedV: number }[]): Calibration {
  const n = points.length;
  if (n === 0) return { gain: 1, offsetV: 0, residualPercent: NaN, method: "none", points: 0 };
  let gain: number;
  let offsetV: number;
  if (n === 1) {
    const p = points[0]!;
    gain = p.rawV !== 0 ? p.expectedV / p.rawV : 1;
    offsetV = 0;
  } else {
    const line = straightLine(
      points.map((p) => p.rawV),
      points.map((p) => p.expectedV),
    );
    gain = line?.slope ?? 1;
    offsetV = line?.intercept ?? 0;
  }
  let residual = 0;
  for (const p of points) {
    const r = Math.abs(gain * p.rawV + offsetV - p.expectedV) / Math.abs(p.expectedV);
    if (Number.isFinite(r)) residual = Math.max(residual, r);
  }
  const method = n === 1 ? "gain-only" : n === 2 ? "two-point" : "least-squares";
  return { gain, offsetV, residualPercent: 100 * residual, method, points: n };
}

/** Judges one unit's readings (already matched to the sheet's test points, in the sheet's order). */
export function judgeUnit(
  req: Requirement,
  choice: Choice,
  rows: { bench: BenchCheckRow; reading: UnitReading }[],
): UnitJudgement {
  const floorV = req.amplifier.swingLow;
  const tol = floorTolerance(req);
  const base = rows.map(({ bench: b, reading: r }) => {
    const errorV = r.outputV - b.expectedV;
    return {
      label: b.label,
      currentA: r.currentA,
      outputV: r.outputV,
      expectedV: b.expectedV,
      minV: b.minV,
      maxV: b.maxV,
      inBand: r.outputV >= b.minV && r.outputV <= b.maxV,
      errorV,
      errorPercent: (100 * errorV) / b.expectedV,
      atFloor: r.outputV <= floorV + tol && b.expectedV > floorV + tol,
    };
  });
  const fitted = base.filter((r) => !r.atFloor);
  const calibration = fitCalibration(fitted.map((r) => ({ rawV: r.outputV, expectedV: r.expectedV })));
  const readings: JudgedReading[] = base.map((r) => {
    const correctedV = calibration.gain * r.outputV + calibration.offsetV;
    return { ...r, correctedV, correctedErrorPercent: (100 * (correctedV - r.expectedV)) / r.expectedV };
  });
  const pass = readings.length > 0 && readings.every((r) => r.inBand);
  const found = pass ? null : likelyCause(req, choice, readings);
  return { pass, readings, cause: found?.text ?? null, causeKind: found?.kind ?? null, calibration };
}

const pct = (x: number) => `${String(Number(Math.abs(x).toPrecision(2)))} %`;
const volts = (v: number) => formatSI(Math.abs(v), "V", 3);
const highLow = (x: number) => (x >= 0 ? "high" : "low");

/** "the next value up", "two values down" in the requirement's series, or null when R' is no series value. */
function seriesStep(req: Requirement, from: number, impliedOhms: number): { value: number; words: string } | null {
  const n = nearestInSeries(req.shunt.series, impliedOhms);
  // The implied value must sit on a series value within the shunt's own tolerance (and a little slack).
  if (Math.abs(Math.log(n / impliedOhms)) > req.shunt.tolerance + 0.005) return null;
  const lo = Math.min(from, n);
  const hi = Math.max(from, n);
  const steps = seriesValues(req.shunt.series, lo, hi).length - 1;
  if (steps <= 0) return null;
  const dir = n > from ? "up" : "down";
  const count = ["", "the next value", "two values", "three values"][steps] ?? `${steps} values`;
  return { value: n, words: `${count} ${dir}` };
}

/**
 * The likely cause of an out-of-band unit, from the shape of its errors against current:
 * stuck at the output floor → dead zone (or no output at all); then the one-parameter model that
 * explains the errors best: constant (offset), ∝ I (shunt value or gain), ∝ I³ (self-heating:
 * ΔTs = I²·R·θ makes the shunt's error ∝ I·ΔTs); none explaining 90 % → offset and gain together.
 */
export function likelyCause(
  req: Requirement,
  choice: Choice,
  readings: Pick<JudgedReading, "label" | "currentA" | "outputV" | "expectedV" | "errorV" | "inBand" | "atFloor">[],
): { kind: CauseKind; text: string } | null {
  if (readings.length === 0) return null;
  const { shuntOhms: R, gain: G } = choice;
  const tz = R * G;
  const floorV = req.amplifier.swingLow;
  const floorWords = floorV > 0 ? `the output floor (${formatSI(floorV, "V")})` : "zero";

  const stuck = readings.filter((r) => r.atFloor);
  if (stuck.length === readings.length) {
    return {
      kind: "no-output",
      text:
        `The output sits at ${floorWords} at every test current: no signal reaches the amplifier. ` +
        "Check the amplifier's supply, both sense lines from the shunt (open or unsoldered), and the output for a short to ground.",
    };
  }
  const moving = readings.filter((r) => !r.atFloor);
  let tail = "";
  if (stuck.some((r) => !r.inBand)) {
    const top = stuck.reduce((a, b) => (b.currentA > a.currentA ? b : a));
    const headline =
      `At ${top.label.toLowerCase()} (${formatSI(top.currentA, "A")}) the output is stuck at ${floorWords} where ${formatSI(top.expectedV, "V")} was expected: ` +
      `that current falls in the amplifier's dead zone on this unit. Check that the fitted amplifier swings to within ${formatSI(floorV, "V")} of ground as specified and that its ground and supply are sound.`;
    const rest = patternOf(req, choice, moving, tz);
    if (!rest || moving.every((r) => r.inBand)) return { kind: "dead-zone", text: headline };
    tail = rest.text;
    return { kind: "dead-zone", text: `${headline} Above it: ${tail.charAt(0).toLowerCase()}${tail.slice(1)}` };
  }
  return patternOf(req, choice, moving, tz);
}

function patternOf(
  req: Requirement,
  choice: Choice,
  rows: Pick<JudgedReading, "label" | "currentA" | "expectedV" | "errorV" | "inBand">[],
  tz: number,
): { kind: CauseKind; text: string } | null {
  const { shuntOhms: R, gain: G } = choice;
  if (rows.length === 0) return null;
  if (rows.length === 1) {
    const r = rows[0]!;
    return {
      kind: "single-point",
      text: `The reading at ${r.label.toLowerCase()} is ${pct((100 * r.errorV) / r.expectedV)} ${highLow(r.errorV)}; one reading cannot tell an offset from a gain error. Check the shunt value, the gain resistors and the sense lines.`,
    };
  }
  // One-parameter least squares for each shape e = c·f(I): c = Σe·f / Σf².
  const shapes: { kind: "offset" | "gain" | "self-heating"; f: (I: number) => number }[] = [
    { kind: "offset", f: () => 1 },
    { kind: "gain", f: (I) => I },
    { kind: "self-heating", f: (I) => I * I * I },
  ];
  const total = rows.reduce((s, r) => s + r.errorV * r.errorV, 0);
  const fits = shapes.map((sh) => {
    let ef = 0;
    let ff = 0;
    for (const r of rows) {
      const f = sh.f(r.currentA);
      ef += r.errorV * f;
      ff += f * f;
    }
    const c = ff > 0 ? ef / ff : 0;
    const residual = rows.reduce((s, r) => s + (r.errorV - c * sh.f(r.currentA)) ** 2, 0);
    return { ...sh, c, residual };
  });
  const best = fits.reduce((a, b) => (b.residual < a.residual ? b : a));
  const explained = total > 0 ? 1 - best.residual / total : 0;
  if (explained < 0.9) {
    const line = straightLine(
      rows.map((r) => r.currentA),
      rows.map((r) => r.errorV),
    );
    const a = line?.intercept ?? 0;
    const b = line?.slope ?? 0;
    return {
      kind: "mixed",
      text:
        `The errors follow no single pattern: about ${volts(a)} ${highLow(a)} of offset and a gain ${pct((100 * b) / tz)} ${highLow(b)} together. ` +
        "Check the shunt value and the gain resistors, then the sense lines and the amplifier's offset.",
    };
  }
  if (best.kind === "offset") {
    const c = best.c;
    return {
      kind: "offset",
      text:
        `Readings are ${volts(c)} ${highLow(c)} at every current (${formatSI(Math.abs(c) / G, "V")} at the amplifier input, ${formatSI(Math.abs(c) / tz, "A")} referred to current): a constant offset. ` +
        `Check the sense lines first (an open, cracked or badly soldered Kelvin line, or one taken from the wrong pad, adds a fixed voltage), then the amplifier's input offset: the sheet allows ${formatSI(req.amplifier.offset * G, "V")} at the output.`,
    };
  }
  if (best.kind === "gain") {
    const p = best.c / tz; // relative error
    const words = [`Readings are ${pct(100 * p)} ${highLow(p)} at every current:`];
    const step = seriesStep(req, R, R * (1 + p));
    const gainMatch = req.amplifier.gains.find((g) => g !== G && Math.abs(g / (G * (1 + p)) - 1) < 0.005);
    if (step)
      words.push(
        `the shunt may be ${step.words} (${formatSI(step.value, "Ω")} instead of ${formatSI(R, "Ω")}), or the gain resistor wrong.`,
      );
    else if (gainMatch !== undefined)
      words.push(
        `the amplifier may be set to a gain of ${formatSI(gainMatch, "")} instead of ${formatSI(G, "")}, or the shunt value wrong.`,
      );
    else
      words.push(
        `the shunt value or the gain is off by that much. Measure the shunt (four-wire) and check the gain resistors against the parts list.`,
      );
    return { kind: "gain", text: words.join(" ") };
  }
  const sorted = [...rows].sort((a, b) => a.currentA - b.currentA);
  const top = sorted[sorted.length - 1]!;
  const mid = sorted[sorted.length - 2]!;
  const at = (r: (typeof rows)[number]) => `${pct((100 * r.errorV) / r.expectedV)} at ${formatSI(r.currentA, "A")}`;
  return {
    kind: "self-heating",
    text:
      `The error grows faster than the current (${at(mid)}, ${at(top)}): the shunt is heating more than the design allows. ` +
      "Check the fitted shunt's power rating and tempco against the parts list, its pads and copper area against the layout notes, and let it cool between readings. Caution: the shunt may be hot.",
  };
}
