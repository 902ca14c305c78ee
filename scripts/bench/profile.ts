// Profile benchmark: a 1,000,000-sample recording through the CSV reader, the summary and the
// per-pixel decimation, each against a plain hand-written loop doing the least the same job needs
// (split lines and Number(), one pass of sums, one pass of min/max). Reported as ratios.
import { decimateMinMax } from "../../lib/profile/decimate";
import { parseProfileCsv } from "../../lib/profile/parse";
import { summarizeProfile } from "../../lib/design/profile";

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? (s[mid] as number) : ((s[mid - 1] as number) + (s[mid] as number)) / 2;
};

function time(repeats: number, fn: () => void): number {
  fn(); // warm-up
  const t: number[] = [];
  for (let k = 0; k < repeats; k++) {
    const t0 = performance.now();
    fn();
    t.push(performance.now() - t0);
  }
  return median(t);
}

/** The logger of docs/model.md §6: sleeping at a few µA, bursting to 180 mA, sampled every 100 µs. */
function recording(n: number): string {
  const parts = ["time (s),current (A)\n"];
  for (let k = 0; k < n; k++)
    parts.push(`${(k * 1e-4).toFixed(4)},${(k % 1000 < 20 ? 0.18 : 3e-6).toExponential(3)}\n`);
  return parts.join("");
}

function baselineParse(text: string) {
  const lines = text.split("\n");
  const t = new Float64Array(lines.length);
  const i = new Float64Array(lines.length);
  for (let k = 1; k < lines.length; k++) {
    const line = lines[k]!;
    const c = line.indexOf(",");
    if (c < 0) continue;
    t[k] = Number(line.slice(0, c));
    i[k] = Number(line.slice(c + 1));
  }
  return { t, i };
}

const design = { shuntOhms: 0.1, gain: 20, supplyV: 3, fullScaleV: 2.5, lsbA: 3e-5 };

export async function run(): Promise<Record<string, number>> {
  const n = 1_000_000;
  const text = recording(n);
  const parsed = parseProfileCsv(text);
  if (!parsed.ok) throw new Error(parsed.refusal.message);
  const { timesS, currentsA } = parsed.series;

  const parseMs = time(3, () => parseProfileCsv(text));
  const parseBase = time(3, () => baselineParse(text));

  const summaryMs = time(9, () => summarizeProfile(timesS, currentsA, design));
  const summaryBase = time(9, () => {
    let q = 0;
    let peak = -Infinity;
    for (let k = 1; k < n; k++) {
      q += ((currentsA[k - 1]! + currentsA[k]!) / 2) * (timesS[k]! - timesS[k - 1]!);
      if (currentsA[k]! > peak) peak = currentsA[k]!;
    }
    return q + peak;
  });

  const decimateMs = time(9, () => decimateMinMax(timesS, currentsA, { width: 800, clipA: 1.25, lsbA: 3e-5 }));
  const decimateBase = time(9, () => {
    let lo = Infinity;
    let hi = -Infinity;
    for (let k = 0; k < n; k++) {
      const v = currentsA[k]!;
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
    return lo + hi;
  });

  return {
    "profile.samples": n,
    "profile.parse.ms": parseMs,
    "profile.parse.ratio": parseMs / parseBase,
    "profile.summary.ms": summaryMs,
    "profile.summary.ratio": summaryMs / summaryBase,
    "profile.decimate.ms": decimateMs,
    "profile.decimate.ratio": decimateMs / decimateBase,
  };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  run().then((r) => console.log(JSON.stringify(r, null, 2)));
}
