// Expected readings for a bench check of the built front end (the build sheet's table).
import { readoutOwnSources } from "./budget-readout-signed";
import { budgetTerms } from "./error-budget";
import { buildModel, type Model } from "./model";
import { readoutSignedFields } from "./model-readout-signed";
import type { Requirement } from "./requirement";
import type { Choice } from "./types";

export type BenchCheckRow = { label: string; currentA: number; expectedV: number; minV: number; maxV: number };

/**
 * Rows at Imin, the typical current (if given), 10 %, 50 % and 100 % of Imax: expected I·R·G and
 * the band (I ∓ worst-case error)·R·G, clamped to what the output can show.
 */
export function benchCheck(req: Requirement, choice: Choice): BenchCheckRow[] {
  const { min, max, typical } = req.current;
  // A signed span is checked at both ends, half of each, and zero (where the output is the zero level).
  const points: { label: string; currentA: number }[] =
    min < 0
      ? [
          { label: "Largest negative current", currentA: min },
          { label: "50 % of the largest negative current", currentA: 0.5 * min },
          { label: "Zero current", currentA: 0 },
        ]
      : [{ label: "Minimum current", currentA: min }];
  if (typical !== undefined) points.push({ label: "Typical current", currentA: typical });
  points.push(
    { label: "10 % of maximum current", currentA: 0.1 * max },
    { label: "50 % of maximum current", currentA: 0.5 * max },
    { label: "Maximum current", currentA: max },
  );
  return benchCheckAt(req, buildModel(req), choice, points);
}

/** Bench rows at the given currents on a given model (one range's sub-span of a plan, or the whole span). */
export function benchCheckAt(
  req: Requirement,
  model: Model,
  choice: Choice,
  points: { label: string; currentA: number }[],
): BenchCheckRow[] {
  const tz = choice.shuntOhms * choice.gain;
  // The bench reads the amplifier's output, uncalibrated: the readout's own error is not in its band.
  // The range's own span (iMin) stays; only what a calibration keeps is reset.
  const raw: Requirement = { ...req, calibration: "none" };
  const m: Model = { ...model, ...readoutSignedFields(raw, model.dTamb), iMin: model.iMin };
  return points.map(({ label, currentA }) => {
    const worstA = budgetTerms(raw, m, choice, Math.abs(currentA))
      .filter((t) => !readoutOwnSources.includes(t.source))
      .reduce((sum, t) => sum + Math.abs(t.errorA), 0);
    // The band stops where the output can go: no lower than the amplifier's lowest output, no
    // higher than the readout can show or the amplifier can swing.
    const clamp = (v: number) => Math.min(m.outCeil, Math.max(m.swingLow, v));
    return {
      label,
      currentA,
      expectedV: m.vRef + currentA * tz,
      minV: clamp(m.vRef + (currentA - worstA) * tz),
      maxV: clamp(m.vRef + (currentA + worstA) * tz),
    };
  });
}
