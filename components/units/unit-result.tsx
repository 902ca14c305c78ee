// One unit judged against the sheet: pass or fail per reading, the likely cause, its calibration
// and the error left after correction at each test point.
import { Badge } from "@/components/ui/badge";
import type { UnitBody } from "@/lib/api-description/responses";
import { formatSI } from "@/lib/design/format";

/** Signed percent to two figures; below 0.001 % it is rounding, shown as 0. */
const pct = (x: number) =>
  Math.abs(x) < 1e-3 ? "0 %" : `${x >= 0 ? "+" : "−"}${String(Number(Math.abs(x).toPrecision(2)))} %`;

export const methodWords: Record<UnitBody["calibration"]["method"], string> = {
  "least-squares": "least-squares line through every reading",
  "two-point": "two-point line",
  "gain-only": "gain only (one reading)",
  none: "no usable reading",
};

export function UnitResult({ unit }: { unit: UnitBody }) {
  const c = unit.calibration;
  return (
    <div className="flex flex-col gap-3" data-testid="unit-result">
      <p className="flex flex-wrap items-center gap-2 text-sm">
        <span className="font-semibold">{unit.serial}</span>
        {unit.pass ? (
          <Badge tone="good">passes the bench check</Badge>
        ) : (
          <Badge tone="bad">fails the bench check</Badge>
        )}
        <span className="text-xs text-ink-muted">
          revision {unit.revision}, built {unit.builtOn}, recorded by {unit.recordedByName}
        </span>
      </p>
      {unit.cause && (
        <div role="note" aria-label="Likely cause" className="rounded border border-bad/40 bg-bad/5 px-3 py-2 text-sm">
          <p className="text-xs font-semibold text-bad">Likely cause</p>
          <p data-testid="unit-cause">{unit.cause}</p>
        </div>
      )}
      <div className="overflow-x-auto">
        <table className="w-full text-sm num" aria-label={`Readings of ${unit.serial}`}>
          <thead className="border-b border-line text-xs text-ink-muted">
            <tr>
              <th scope="col" className="py-1 pr-3 text-left font-medium">
                Test point
              </th>
              <th scope="col" className="py-1 pr-3 text-right font-medium">
                Reading
              </th>
              <th scope="col" className="py-1 pr-3 text-right font-medium">
                Accept between
              </th>
              <th scope="col" className="py-1 pr-3 text-left font-medium">
                Verdict
              </th>
              <th scope="col" className="py-1 pr-3 text-right font-medium">
                Error
              </th>
              <th scope="col" className="py-1 text-right font-medium">
                After correction
              </th>
            </tr>
          </thead>
          <tbody>
            {unit.readings.map((r) => (
              <tr key={r.label} className="border-b border-line last:border-0" data-in-band={r.inBand}>
                <th scope="row" className="py-1 pr-3 text-left font-normal whitespace-nowrap">
                  {r.label} <span className="text-ink-muted">({formatSI(r.currentA, "A")})</span>
                </th>
                <td className="py-1 pr-3 text-right font-semibold whitespace-nowrap">{formatSI(r.outputV, "V", 4)}</td>
                <td className="py-1 pr-3 text-right whitespace-nowrap">
                  {formatSI(r.minV, "V", 4)} to {formatSI(r.maxV, "V", 4)}
                </td>
                <td className="py-1 pr-3 whitespace-nowrap">
                  {r.inBand ? (
                    <span className="text-good">in band</span>
                  ) : (
                    <span className="font-semibold text-bad">out of band{r.atFloor ? " (at the floor)" : ""}</span>
                  )}
                </td>
                <td className="py-1 pr-3 text-right whitespace-nowrap">{pct(r.errorPercent)}</td>
                <td className="py-1 text-right whitespace-nowrap">{r.atFloor ? "—" : pct(r.correctedErrorPercent)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-xs text-ink-muted" data-testid="unit-calibration">
        Calibration ({methodWords[c.method]}): corrected = <span className="num text-ink">{c.gain.toPrecision(6)}</span>{" "}
        × reading {c.offsetV >= 0 ? "+" : "−"}{" "}
        <span className="num text-ink">{formatSI(Math.abs(c.offsetV), "V", 4)}</span>
        {Number.isFinite(c.residualPercent) && (
          <>
            ; largest error left at the test points{" "}
            <span className="num text-ink">
              {c.residualPercent < 1e-3 ? "0 %" : `${String(Number(c.residualPercent.toPrecision(2)))} %`}
            </span>
          </>
        )}
        .
        {!unit.pass &&
          " A unit that fails the sheet should be reworked first: calibration hides a wrong part, it does not fix its drift or heating."}
      </p>
    </div>
  );
}
