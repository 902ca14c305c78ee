// What calibrating each unit buys: the error terms it removes, the ones that remain and why, and
// the worst-case accuracy a calibrated unit can reach across the span (the engine's figures).
import type { CalibratedAccuracy } from "@/lib/design/calibrated-accuracy";
import { formatSI } from "@/lib/design/format";

const pct = (x: number) => `${String(Number(x.toPrecision(2)))} %`;

export function CalibrationReach({ reach, target }: { reach: CalibratedAccuracy; target: number }) {
  return (
    <section
      aria-labelledby="calibration-reach-heading"
      className="flex flex-col gap-2"
      data-testid="calibration-reach"
    >
      <h3 id="calibration-reach-heading" className="text-sm font-semibold">
        What a calibrated unit can reach
      </h3>
      <p className="max-w-prose text-sm">
        After its own gain-and-offset correction, a unit&apos;s worst-case error is{" "}
        <span className="num font-semibold">{pct(reach.bandWorstPercent)}</span> of reading over the accuracy band
        (uncalibrated: <span className="num">{pct(reach.uncalibratedBandWorstPercent)}</span>),{" "}
        <span className="num">{pct(reach.atMinPercent)}</span> at the minimum current and{" "}
        <span className="num">{pct(reach.atMaxPercent)}</span> at the maximum.{" "}
        {reach.lowestAccurateCurrentA === null ? (
          <>It does not meet the {pct(target)} target anywhere in the span.</>
        ) : (
          <>
            It meets the {pct(target)} target from{" "}
            <span className="num font-semibold">{formatSI(reach.lowestAccurateCurrentA, "A")}</span> up.
          </>
        )}{" "}
        This leaves out the calibration&apos;s own uncertainty (the reference current and the meter used on the bench).
      </p>
      <div className="grid grid-cols-1 gap-3 text-sm sm:grid-cols-2">
        <div>
          <h4 className="text-xs font-medium text-ink-muted">Removed by calibration (fixed once the unit is built)</h4>
          <ul className="mt-1 list-disc pl-5">
            {reach.removed.map((t) => (
              <li key={t.source}>{t.label}</li>
            ))}
          </ul>
        </div>
        <div>
          <h4 className="text-xs font-medium text-ink-muted">Remaining after calibration</h4>
          <ul className="mt-1 list-disc pl-5">
            {reach.remaining.map((t) => (
              <li key={t.source}>
                {t.label}
                {t.why && <span className="text-ink-muted">: {t.why}</span>}
              </li>
            ))}
          </ul>
        </div>
      </div>
    </section>
  );
}
