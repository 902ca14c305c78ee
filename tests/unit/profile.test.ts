import { describe, expect, it } from "vitest";
import {
  COULOMBS_PER_MAH,
  batteryLifeS,
  decimateMinMax,
  parseProfileCsv,
  summarizeProfile,
  type ProfileDesign,
} from "@/lib/profile";
import { bytesToFloat64, float64ToBytes } from "@/db/float64-bytes";

// A design to judge profiles against: 0.1 Ω shunt, gain 20, 3.0 V supply, 2.5 V full scale, lsbA 1 mA.
// Clip current = 2.5 V / (0.1 Ω × 20) = 1.25 A.
const design: ProfileDesign = { shuntOhms: 0.1, gain: 20, supplyV: 3.0, fullScaleV: 2.5, lsbA: 1e-3 };

function refused(text: string) {
  const r = parseProfileCsv(text);
  if (r.ok) throw new Error("expected a refusal");
  return r.refusal;
}

describe("summary definitions (hand-computed)", () => {
  // Samples (t s, i A): (0, 0.0005) (1, 0.5) (3, 1.5) (4, 0.5) (6, 0.0002)
  const t = new Float64Array([0, 1, 3, 4, 6]);
  const i = new Float64Array([0.0005, 0.5, 1.5, 0.5, 0.0002]);
  const s = summarizeProfile(t, i, design);

  it("counts samples and duration", () => {
    expect(s.samples).toBe(5);
    // durationS = 6 − 0 = 6
    expect(s.durationS).toBe(6);
  });

  it("integrates charge with the trapezoid rule and divides by the duration", () => {
    // chargeC = (0.0005+0.5)/2·1 + (0.5+1.5)/2·2 + (1.5+0.5)/2·1 + (0.5+0.0002)/2·2
    //         = 0.25025 + 2 + 1 + 0.5002 = 3.75045 C
    expect(s.chargeC).toBeCloseTo(3.75045, 12);
    // averageCurrentA = 3.75045 / 6 = 0.625075 A
    expect(s.averageCurrentA).toBeCloseTo(0.625075, 12);
  });

  it("takes the peak, the burden at the peak and the load voltage left", () => {
    expect(s.peakCurrentA).toBe(1.5);
    // maxBurdenV = 1.5 A × 0.1 Ω = 0.15 V; minLoadVoltageV = 3.0 − 0.15 = 2.85 V
    expect(s.maxBurdenV).toBeCloseTo(0.15, 12);
    expect(s.minLoadVoltageV).toBeCloseTo(2.85, 12);
  });

  it("shares of clipped and below-one-step samples", () => {
    // ideal output I·R·G: 0.001, 1, 3, 1, 0.0004 V; only 3 V > 2.5 V → 1 of 5 = 20 %
    expect(s.clippedPercent).toBeCloseTo(20, 12);
    // below lsbA = 1 mA: 0.0005 A and 0.0002 A → 2 of 5 = 40 %
    expect(s.belowResolutionPercent).toBeCloseTo(40, 12);
    expect(s.clipCurrentA).toBeCloseTo(1.25, 12);
  });

  it("battery life from a capacity at the average current", () => {
    // 1000 mAh = 3600 C; at 0.625075 A: 3600 / 0.625075 = 5759.3 s
    expect(batteryLifeS(1000 * COULOMBS_PER_MAH, s.averageCurrentA)).toBeCloseTo(3600 / 0.625075, 6);
    expect(batteryLifeS(0, 1)).toBeNull();
    expect(batteryLifeS(3600, 0)).toBeNull();
  });
});

describe("parsing", () => {
  it("reads units from the header, in parentheses or brackets, any case", () => {
    const r = parseProfileCsv("Time (ms),current [uA]\n0,3\n10,180000\n20,3\n");
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(Array.from(r.series.timesS)).toEqual([0, 0.01, 0.02]);
    expect(r.series.currentsA[0]).toBeCloseTo(3e-6, 18);
    expect(r.series.currentsA[1]).toBeCloseTo(0.18, 15);
    expect(r.series.columns).toEqual({ time: "Time (ms)", current: "current [uA]" });
  });

  it("takes seconds and amperes without units, t and i, columns in any order, comments, blank lines, semicolons", () => {
    const r = parseProfileCsv("# recorded on the bench\nI;T\n\n0.5;0\n1e-3;2.5\n");
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(Array.from(r.series.timesS)).toEqual([0, 2.5]);
    expect(Array.from(r.series.currentsA)).toEqual([0.5, 0.001]);
  });

  it("accepts µ and the CRLF line ends of spreadsheets", () => {
    const r = parseProfileCsv("time (s),current (µA)\r\n0,1\r\n1,2\r\n");
    expect(r.ok && Array.from(r.series.currentsA)).toEqual([1e-6, 2e-6]);
  });
});

describe("every refusal names the row and the column", () => {
  it("a missing current column", () => {
    const r = refused("time,voltage\n0,1\n1,2\n");
    expect(r.place.column).toBe("voltage"); // the unknown column comes first
    const m = refused("time\n0\n1\n");
    expect(m.message).toMatch(/current column is missing/);
    expect(m.place).toMatchObject({ line: 1, column: "current" });
  });

  it("a missing time column", () => {
    const r = refused("current (mA)\n1\n2\n");
    expect(r.message).toMatch(/time column is missing/);
    expect(r.place.column).toBe("time");
  });

  it("an unknown column", () => {
    const r = refused("time,current,amps\n0,1,1\n1,2,2\n");
    expect(r.message).toMatch(/File line 1, column "amps": "amps" is not a column this file may have/);
  });

  it("a doubled column", () => {
    expect(refused("t,time,i\n0,0,1\n").message).toMatch(/second time column/);
  });

  it("an unknown unit", () => {
    const r = refused("time (fortnights),current\n0,1\n1,2\n");
    expect(r.place).toEqual({ line: 1, column: "time (fortnights)" });
    expect(r.message).toMatch(/unit "fortnights" is not a known unit of time/);
  });

  it("a unit of the wrong dimension", () => {
    const r = refused("time (s),current [V]\n0,1\n1,2\n");
    expect(r.place.column).toBe("current [V]");
    expect(r.message).toBe('File line 1, column "current [V]": unit "V" is a voltage, not a current');
  });

  it("a cell that is not a number", () => {
    const r = refused("time,current\n0,1\n1,abc\n2,3\n");
    expect(r.place).toEqual({ row: 2, line: 3, column: "current" });
    expect(r.message).toBe('Data row 2 (file line 3), column "current": "abc" is not a number');
  });

  it("a decimal comma, with the fix in the message", () => {
    expect(refused("time;current\n0;1\n1;0,5\n").message).toBe(
      'Data row 2 (file line 3), column "current": "0,5" is not a number (write decimals with a point: 0.5)',
    );
  });

  it("NaN and infinity", () => {
    expect(refused("time,current\n0,NaN\n1,2\n").message).toMatch(
      /^Data row 1 \(file line 2\), column "current": "NaN" is not a finite number/,
    );
    expect(refused("time,current\n0,1\nInfinity,2\n").place).toEqual({ row: 2, line: 3, column: "time" });
    expect(refused("time,current\n0,1\n1,-inf\n").message).toMatch(/not a finite number/);
    expect(refused("time,current\n0,1\n1,1e999\n").message).toMatch(/too large/);
  });

  it("an empty cell", () => {
    expect(refused("time,current\n0,1\n1,\n").place).toEqual({ row: 2, line: 3, column: "current" });
  });

  it("time that does not increase, counting lines past comments and blank lines", () => {
    const r = refused("# note\ntime,current\n0,1\n\n1,2\n1,3\n");
    expect(r.place).toEqual({ row: 3, line: 6, column: "time" });
    expect(r.message).toMatch(/time must increase/);
    expect(refused("time,current\n5,1\n4,2\n").place.row).toBe(2);
  });

  it("a row with the wrong number of cells", () => {
    expect(refused("time,current\n0,1\n1,2,3\n").place).toEqual({ row: 2, line: 3 });
  });

  it("fewer than two rows", () => {
    expect(refused("time,current\n0,1\n").message).toMatch(/1 data row; a profile needs at least two/);
    expect(refused("time,current\n").message).toMatch(/0 data rows/);
    expect(refused("").message).toMatch(/empty/);
  });
});

describe("min/max decimation", () => {
  // 10 000 samples over 0..9.999 s of a sine with two spikes placed by hand.
  const n = 10_000;
  const t = new Float64Array(n);
  const i = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    t[k] = k / 1000;
    i[k] = 0.01 + 0.005 * Math.sin(k / 50);
  }
  i[1234] = 0.9; // a spike one sample wide
  i[7777] = -0.2; // a dip one sample wide

  it("keeps each bucket's minimum and maximum sample", () => {
    const width = 100;
    const d = decimateMinMax(t, i, { width, clipA: 1, lsbA: 0 });
    expect(d.tS.length).toBeLessThanOrEqual(2 * width);
    expect(d.currentA).toContain(0.9);
    expect(d.currentA).toContain(-0.2);
    // Every bucket of 100 samples (0.1 s): its true min and max are among the points.
    for (let b = 0; b < width; b++) {
      const slice = Array.from(i.subarray(b * 100, b * 100 + 100));
      const inBucket = d.currentA.filter((_, k) => Math.floor(d.tS[k]! * 10 + 1e-9) === b);
      expect(Math.min(...inBucket)).toBe(Math.min(...slice));
      expect(Math.max(...inBucket)).toBe(Math.max(...slice));
    }
    // Points come out in time order.
    for (let k = 1; k < d.tS.length; k++) expect(d.tS[k]!).toBeGreaterThan(d.tS[k - 1]!);
  });

  it("shades the buckets that clip or read below a step, merging neighbours", () => {
    const d = decimateMinMax(t, i, { width: 100, clipA: 0.5, lsbA: 0 });
    expect(d.clipped).toHaveLength(1);
    const [a, b] = d.clipped[0]!;
    expect(a).toBeLessThanOrEqual(1.234);
    expect(b).toBeGreaterThanOrEqual(1.234);
    expect(b - a).toBeCloseTo(0.09999, 4);
    expect(d.belowStep).toHaveLength(1);
    const all = decimateMinMax(t, i, { width: 100, clipA: 1, lsbA: 1 });
    expect(all.belowStep).toHaveLength(1); // one merged stretch over everything
  });

  it("zooms into a window and returns few samples whole", () => {
    const d = decimateMinMax(t, i, { fromS: 1.2, toS: 1.25, width: 800, clipA: 1, lsbA: 0 });
    expect(d.fromS).toBe(1.2);
    expect(d.windowSamples).toBe(53); // 1.200..1.250 is 51 samples, plus one either side
    expect(d.tS[0]).toBeCloseTo(1.199, 12);
    expect(d.currentA).toContain(0.9);
  });

  it("falls back to the whole recording for an empty or reversed window", () => {
    const d = decimateMinMax(t, i, { fromS: 5, toS: 4, width: 50, clipA: 1, lsbA: 0 });
    expect([d.fromS, d.toS]).toEqual([0, 9.999]);
  });
});

describe("stored samples", () => {
  it("round-trip as little-endian Float64", () => {
    const v = new Float64Array([0, 1.5, -2e-9, 123456.789]);
    const bytes = float64ToBytes(v);
    expect(bytes.byteLength).toBe(32);
    // 1.5 = 0x3FF8000000000000: little-endian puts 0x3F last.
    expect(Array.from(bytes.subarray(8, 16))).toEqual([0, 0, 0, 0, 0, 0, 0xf8, 0x3f]);
    expect(Array.from(bytesToFloat64(bytes))).toEqual(Array.from(v));
  });
});
