// Expected readings for a bench check of the built front end (the build sheet's table).
import { errorAtWith } from "./error-budget";
import { buildModel, type Model } from "./model";
import type { Requirement } from "./requirement";
import type { Choice } from "./types";

export type BenchCheckRow = { label: string; currentA: number; expectedV: number; minV: number; maxV: number };

/**
 * Rows at Imin, the typical current (if given), 10 %, 50 % and 100 % of Imax: expected I·R·G and
 * the band (I ∓ worst-case error)·R·G, clamped to what the output can show.
 */
export function benchCheck(req: Requirement, choice: Choice): BenchCheckRow[] {
  const { min, max, typical } = req.current;
  const points: { label: string; currentA: number }[] = [{ label: "Minimum current", currentA: min }];
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
  m: Model,
  choice: Choice,
  points: { label: string; currentA: number }[],
): BenchCheckRow[] {
  const tz = choice.shuntOhms * choice.gain;
  return points.map(({ label, currentA }) => {
    const { worstA } = errorAtWith(req, m, choice, currentA);
    // The band stops where the output can go: no lower than the amplifier's lowest output, no
    // higher than the readout can show or the amplifier can swing.
    const clamp = (v: number) => Math.min(m.outCeil, Math.max(m.swingLow, v));
    return {
      label,
      currentA,
      expectedV: currentA * tz,
      minV: clamp((currentA - worstA) * tz),
      maxV: clamp((currentA + worstA) * tz),
    };
  });
}
