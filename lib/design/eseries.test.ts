import { describe, expect, it } from "vitest";
import { isInSeries, nearestInSeries, seriesTables, seriesValues } from "./eseries";

// IEC 60063 preferred number tables; the tables in eseries.ts were typed from memory and are
// checked here against the standard's own construction rules and its published exceptions.
describe("IEC 60063 tables", () => {
  it("have the series' number of values per decade", () => {
    expect(Object.fromEntries(Object.entries(seriesTables).map(([k, t]) => [k, t.length]))).toEqual({
      E6: 6,
      E12: 12,
      E24: 24,
      E48: 48,
      E96: 96,
      E192: 192,
    });
  });

  it("E24 is the published table, not the rounded formula (IEC 60063)", () => {
    expect(seriesTables.E24).toEqual([
      1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2,
      9.1,
    ]);
    // The published E24 departs from round(10^(i/24), 1) at exactly these eight values.
    const departures = seriesTables.E24.filter((v, i) => v !== Number((10 ** (i / 24)).toFixed(1)));
    expect(departures).toEqual([2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2]);
  });

  it("E48 and E96 follow round(10^(i/N), 2) throughout (IEC 60063)", () => {
    for (const name of ["E48", "E96"] as const) {
      const t = seriesTables[name];
      t.forEach((v, i) => expect(v).toBe(Number((10 ** (i / t.length)).toFixed(2))));
    }
  });

  it("E192 has 9.20 where the formula gives 9.19, and follows the formula elsewhere (IEC 60063)", () => {
    const t = seriesTables.E192;
    const departures = t.map((v, i) => [v, Number((10 ** (i / 192)).toFixed(2))]).filter(([a, b]) => a !== b);
    expect(departures).toEqual([[9.2, 9.19]]);
    expect(t).toContain(9.2);
    expect(t).not.toContain(9.19);
  });

  it("E12 and E6 are every second value of the series above (IEC 60063)", () => {
    expect(seriesTables.E12).toEqual([1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2]);
    expect(seriesTables.E6).toEqual([1.0, 1.5, 2.2, 3.3, 4.7, 6.8]);
  });
});

describe("seriesValues, nearestInSeries, isInSeries", () => {
  it("lists every value in bounds across decades, inclusive", () => {
    expect(seriesValues("E6", 0.001, 0.01)).toEqual([0.001, 0.0015, 0.0022, 0.0033, 0.0047, 0.0068, 0.01]);
    expect(seriesValues("E192", 0.001, 10_000)).toHaveLength(7 * 192 + 1);
    expect(seriesValues("E24", 5, 4)).toEqual([]);
  });
  it("finds the nearest value on a log scale and tests membership", () => {
    expect(nearestInSeries("E24", 0.0048)).toBe(0.0047);
    expect(nearestInSeries("E24", 0.0049)).toBe(0.0051); // 4.9 is nearer 5.1 than 4.7 in ratio
    expect(nearestInSeries("E12", 9.6)).toBe(10);
    expect(nearestInSeries("E192", 9.195e3)).toBe(9200);
    expect(isInSeries("E96", 0.0976)).toBe(true);
    expect(isInSeries("E96", 0.0975)).toBe(false);
    expect(isInSeries("E24", 4.7e6)).toBe(true);
    expect(isInSeries("E24", 4.6e6)).toBe(false);
  });
});
