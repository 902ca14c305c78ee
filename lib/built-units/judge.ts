// Built units as the API and the screens show them: each unit judged against the bench check of
// the revision it was built from, and the design's units against the Monte Carlo's prediction.
// Pure: the engine does every figure; nothing here touches the database.
import {
  benchCheck,
  calibratedAccuracy,
  judgeUnit,
  outsideSpread,
  predictBench,
  spreadCheck,
  TEST_POINT_MATCH,
  type BenchCheckRow,
  type BenchPrediction,
  type CalibratedAccuracy,
  type Calibration,
  type CauseKind,
  type Choice,
  type JudgedReading,
  type Requirement,
  type SpreadCheck,
  type UnitReading,
} from "@/lib/design";

export type RevisionBasis = { revision: number; requirement: Requirement; choice: Choice; approved: boolean };

export type StoredUnitLike = {
  id: string;
  revision: number;
  serial: string;
  builtOn: string;
  recordedBy: string;
  recordedByName: string;
  createdAt: string;
  updatedAt: string;
  readings: { rangeIndex: number; pointIndex: number; currentA: number; outputV: number }[];
};

export type UnitView = Omit<StoredUnitLike, "readings"> & {
  pass: boolean;
  readings: (JudgedReading & { outsideSpread: boolean | null })[];
  cause: string | null;
  causeKind: CauseKind | null;
  calibration: Calibration;
  /** Some reading lies outside its point's predicted p1–p99 spread (null: no prediction for its revision). */
  outsideSpread: boolean | null;
};

export type UnitsSummary = {
  units: UnitView[];
  yield: { measured: number | null; predicted: number | null; revision: number | null; units: number; passing: number };
  spread: (SpreadCheck & { revision: number }) | null;
  prediction: (Omit<BenchPrediction, "points"> & { revision: number; points: BenchPrediction["points"] }) | null;
  calibratedAccuracy: CalibratedAccuracy | null;
  benchCheck: BenchCheckRow[];
};

/** Stored readings paired with the bench rows at their currents, in the sheet's order. */
export function pairWithBench(bench: BenchCheckRow[], readings: UnitReading[]) {
  const rows: { bench: BenchCheckRow; reading: UnitReading }[] = [];
  for (const b of bench) {
    const r = readings.find((x) => Math.abs(x.currentA - b.currentA) <= TEST_POINT_MATCH * Math.abs(b.currentA));
    if (r) rows.push({ bench: b, reading: r });
  }
  return rows;
}

export function unitView(unit: StoredUnitLike, basis: RevisionBasis, prediction: BenchPrediction | null): UnitView {
  const bench = benchCheck(basis.requirement, basis.choice);
  const judged = judgeUnit(basis.requirement, basis.choice, pairWithBench(bench, unit.readings));
  const readings = judged.readings.map((r) => {
    const p = prediction?.points.find((x) => x.currentA === r.currentA || x.label === r.label);
    return { ...r, outsideSpread: p ? outsideSpread(p, r.outputV) : null };
  });
  const { readings: _stored, ...rest } = unit;
  return {
    ...rest,
    pass: judged.pass,
    readings,
    cause: judged.cause,
    causeKind: judged.causeKind,
    calibration: judged.calibration,
    outsideSpread: prediction ? readings.some((r) => r.outsideSpread) : null,
  };
}

/** The revision yield and spread are reported for: the newest approved one. */
export function referenceRevision(revisions: RevisionBasis[]): RevisionBasis | null {
  return [...revisions].reverse().find((r) => r.approved) ?? null;
}

export function summarizeUnits(units: StoredUnitLike[], revisions: RevisionBasis[]): UnitsSummary {
  const ref = referenceRevision(revisions);
  const predictions = new Map<number, BenchPrediction>();
  const predictionFor = (basis: RevisionBasis) => {
    let p = predictions.get(basis.revision);
    if (!p) {
      p = predictBench(basis.requirement, basis.choice, benchCheck(basis.requirement, basis.choice));
      predictions.set(basis.revision, p);
    }
    return p;
  };
  const views = units.flatMap((u) => {
    const basis = revisions.find((r) => r.revision === u.revision);
    return basis ? [unitView(u, basis, predictionFor(basis))] : [];
  });
  if (!ref) {
    return {
      units: views,
      yield: { measured: null, predicted: null, revision: null, units: 0, passing: 0 },
      spread: null,
      prediction: null,
      calibratedAccuracy: null,
      benchCheck: [],
    };
  }
  const prediction = predictionFor(ref);
  const ofRef = views.filter((v) => v.revision === ref.revision);
  const passing = ofRef.filter((v) => v.pass).length;
  const outside = ofRef.filter((v) => v.outsideSpread).length;
  return {
    units: views,
    yield: {
      measured: ofRef.length ? passing / ofRef.length : null,
      predicted: prediction.yield,
      revision: ref.revision,
      units: ofRef.length,
      passing,
    },
    spread: { ...spreadCheck(ofRef.length, outside, prediction.outsideSpread), revision: ref.revision },
    prediction: { ...prediction, revision: ref.revision },
    calibratedAccuracy: calibratedAccuracy(ref.requirement, ref.choice),
    benchCheck: benchCheck(ref.requirement, ref.choice),
  };
}
