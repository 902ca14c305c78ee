import { describe, expect, it } from "vitest";
import { demoAdcs, demoAmplifiers, demoMeters, demoShunts } from "@/db/seed/library";
import { libraryToCsv, parseLibraryCsv } from "./csv";
import { adcInput, amplifierInput, meterInput, shuntInput } from "./schema";

const ampHeader =
  "name,gainMode,gains,offsetV,offsetDriftVPerK,gainErrorFraction,gainDriftPerK,biasCurrentA,noiseDensityVPerRtHz,gbwHz,swingLowV,swingHighV,cmrrDb,supplyMinV,supplyMaxV,topology,commonModeMinV,commonModeMaxV";

function refusal(kind: "amplifiers" | "shunts" | "adcs" | "meters", text: string) {
  const r = parseLibraryCsv(kind, text);
  if (r.ok) throw new Error("expected a refusal");
  return r.refusal;
}

describe("library CSV", () => {
  it("the demo parts pass their schemas", () => {
    for (const a of demoAmplifiers) expect(amplifierInput.safeParse(a).success).toBe(true);
    for (const s of demoShunts) expect(shuntInput.safeParse(s).success).toBe(true);
  });

  it("round-trips an export", () => {
    const amps = demoAmplifiers.map((a) => amplifierInput.parse(a));
    const csv = libraryToCsv("amplifiers", amps);
    expect(csv.split("\n")[0]).toBe(ampHeader);
    const back = parseLibraryCsv("amplifiers", csv);
    expect(back.ok && back.parts.rows).toEqual(amps);
    const shunts = demoShunts.map((s) => shuntInput.parse(s));
    const s = parseLibraryCsv("shunts", libraryToCsv("shunts", shunts));
    expect(s.ok && s.parts.rows).toEqual(shunts);
  });

  it("reads plain names with units in the header or the cell", () => {
    const r = parseLibraryCsv(
      "shunts",
      "Name,Series,Min [mohm],Max (mohm),Tolerance,Tempco,Ratings,4-terminal\nBench strip,E24,1,100,1 %,50 ppm/K,0.5 W; 1 W,yes\n",
    );
    expect(r.ok).toBe(true);
    if (!r.ok || r.parts.kind !== "shunts") return;
    expect(r.parts.rows[0]).toMatchObject({
      minOhms: 0.001,
      maxOhms: 0.1,
      toleranceFraction: 0.01,
      tempcoPerK: 50e-6,
      ratingsW: [0.5, 1],
      fourTerminal: true,
    });
  });

  it("refuses naming the row and the column", () => {
    const base = "name,series,minOhms,maxOhms,toleranceFraction,tempcoPerK,ratingsW,fourTerminal\n";
    expect(refusal("shunts", `${base}A,E24,0.001,0.1,0.01,5e-5,1,no\nB,E24,abc,0.1,0.01,5e-5,1,no\n`).message).toBe(
      'Data row 2 (file line 3), column "minOhms": cannot read "abc" as a resistance (try a number with a unit, e.g. "4.7 mohm")',
    );
    expect(
      refusal("shunts", `${base.replace("minOhms", "minOhms [mohm]")}A,E24,abc,0.1,0.01,5e-5,1,no\n`).message,
    ).toMatch(/"abc" is not a number/);
    expect(refusal("shunts", `${base}A,E24,NaN,0.1,0.01,5e-5,1,no\n`).place).toEqual({
      row: 1,
      line: 2,
      column: "minOhms",
    });
    expect(refusal("shunts", `${base}A,E25,0.001,0.1,0.01,5e-5,1,no\n`).place.column).toBe("series");
    expect(refusal("shunts", `${base}A,E24,0.2,0.1,0.01,5e-5,1,no\n`).place.column).toBe("maxOhms");
    expect(
      refusal("shunts", `${base}A,E24,0.001,0.1,0.01,5e-5,1,no\na,E24,0.001,0.1,0.01,5e-5,1,no\n`).message,
    ).toMatch(/already used by data row 1/);
    expect(
      refusal("shunts", "name,series,minOhms [V],maxOhms,toleranceFraction,tempcoPerK,ratingsW,fourTerminal\n").message,
    ).toMatch(/column "minOhms \[V\]": unit "V" is a voltage, not a resistance/);
    expect(
      refusal("shunts", "name,series,minOhms [zz],maxOhms,toleranceFraction,tempcoPerK,ratingsW,fourTerminal\n").place
        .column,
    ).toBe("minOhms [zz]");
    expect(refusal("shunts", "name,series,minOhms,maxOhms,toleranceFraction,tempcoPerK,ratingsW\n").message).toMatch(
      /"fourTerminal" is missing/,
    );
    expect(refusal("shunts", `${base.trim()},colour\n`).place.column).toBe("colour");
    expect(refusal("shunts", `${base}A,E24,5 V,0.1,0.01,5e-5,1,no\n`).message).toMatch(
      /5 V is a voltage, not a resistance/,
    );
    expect(
      refusal("amplifiers", `${ampHeader}\nX,fixed,10;inf,0,0,0,0,0,0,1e6,0,0,100,3,5,current-sense,,\n`).place,
    ).toEqual({
      row: 1,
      line: 2,
      column: "gains",
    });
  });
});

describe("library CSV problems", () => {
  const good = "Bench strip,E24,1,100,1 %,50 ppm/K,0.5 W; 1 W,yes";
  const head = "Name,Series,Min [mohm],Max (mohm),Tolerance,Tempco,Ratings,4-terminal";
  it("reports every bad row, not only the first", () => {
    const text = [head, good, "Bad one,E7,1,100,1 %,50 ppm/K,1 W,yes", "Bad two,E24,1,100,lots,50 ppm/K,1 W,yes"].join(
      "\n",
    );
    const r = parseLibraryCsv("shunts", text);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems?.map((p) => p.place.row)).toEqual([2, 3]);
    expect(r.stopped).toBe(false);
  });
  it("stops after 50 bad rows", () => {
    const bad = Array.from({ length: 80 }, (_, i) => `Bad ${i},E7,1,100,1 %,50 ppm/K,1 W,yes`);
    const r = parseLibraryCsv("shunts", [head, ...bad].join("\n"));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems).toHaveLength(50);
    expect(r.stopped).toBe(true);
  });
});

describe("library CSV of readouts", () => {
  it("round-trips the demo ADCs and meter ranges, nested figures as dotted columns", () => {
    const adcs = demoAdcs.map((a) => adcInput.parse(a));
    const csv = libraryToCsv("adcs", adcs);
    expect(csv.split("\n")[0]).toBe(
      "name,bits,fullScale,sampleRateHz,reference.tolerance,reference.tempco,offsetLsb,gainError,inlLsb",
    );
    const back = parseLibraryCsv("adcs", csv);
    expect(back.ok && back.parts.rows).toEqual(adcs);
    const meters = demoMeters.map((m) => meterInput.parse(m));
    const m = libraryToCsv("meters", meters);
    expect(m.split("\n")[0]).toBe("name,fullScale,counts,accuracy.percentOfReading,accuracy.digits");
    const mBack = parseLibraryCsv("meters", m);
    expect(mBack.ok && mBack.parts.rows).toEqual(meters);
  });

  it("reads plain names with units in the header or the cell", () => {
    const r = parseLibraryCsv(
      "adcs",
      "Name,Bits,Full scale [mV],Sample rate,Reference tolerance,Reference tempco,Offset,Gain error,INL\n" +
        "Bench converter,14,2048,50 kHz,0.1 %,10 ppm/K,3,0.05 %,1.5\n",
    );
    expect(r.ok).toBe(true);
    if (!r.ok || r.parts.kind !== "adcs") return;
    expect(r.parts.rows[0]).toEqual({
      name: "Bench converter",
      bits: 14,
      fullScale: 2.048,
      sampleRateHz: 50_000,
      reference: { tolerance: 0.001, tempco: 10e-6 },
      offsetLsb: 3,
      gainError: 0.0005,
      inlLsb: 1.5,
    });
  });

  it("names the row and the dotted column of a bad nested figure", () => {
    const head = "name,fullScale,counts,accuracy.percentOfReading,accuracy.digits\n";
    // The schema's own limit: a meter's accuracy below 50 % of reading.
    expect(refusal("meters", `${head}M,200 mV,2000,60 %,2\n`).place).toEqual({
      row: 1,
      line: 2,
      column: "accuracy.percentOfReading",
    });
    expect(refusal("meters", `${head}M,200 mV,2000.5,0.5 %,2\n`).message).toMatch(/Counts must be a whole number/);
    expect(refusal("adcs", "name,bits\nA,12\n").message).toMatch(/"fullScale", .* are missing/);
  });
});
