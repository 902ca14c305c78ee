"use client";
// "Built units" on the design page: record a unit's bench readings (typed in or from a CSV), see
// each judged against the sheet with its likely cause and calibration, the predicted spread with
// the readings over it, the yield measured against predicted, and the calibration exports.
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { Badge } from "@/components/ui/badge";
import { Button, buttonClass } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import type { ApiError, UnitBody, UnitsSummaryBody } from "@/lib/api-description/responses";
import { formatSI } from "@/lib/design/format";
import type { PredictedPoint } from "@/lib/design/unit-prediction";
import type { ClientDesignView, DesignViewer } from "@/lib/design-view";
import { CalibrationReach } from "./calibration-reach";
import { ImportUnitsForm } from "./import-units-form";
import { RecordUnitForm } from "./record-unit-form";
import { SpreadChart } from "./spread-chart";
import { UnitResult } from "./unit-result";

async function getSummary(url: string): Promise<UnitsSummaryBody> {
  const res = await fetch(url);
  const data = (await res.json().catch(() => ({}))) as UnitsSummaryBody & Partial<ApiError>;
  if (!res.ok) throw new Error(data.message ?? `The server answered ${res.status}.`);
  return data;
}

const share = (x: number | null) => (x === null ? "—" : `${String(Number((100 * x).toPrecision(3)))} %`);

export function UnitsPanel({ design, viewer }: { design: ClientDesignView; viewer: DesignViewer }) {
  const qc = useQueryClient();
  const base = `/api/designs/${design.id}/units`;
  const key = ["units", design.id];
  const q = useQuery({ queryKey: key, queryFn: () => getSummary(base) });
  const [selected, setSelected] = useState<string | null>(null);
  const [lastRecorded, setLastRecorded] = useState<UnitBody | null>(null);
  const [deleteError, setDeleteError] = useState<string | null>(null);
  const canRecord = viewer.may.recordUnits && design.status === "approved";
  const data = q.data;
  const units = data?.units ?? [];
  const shown = units.find((u) => u.id === selected) ?? null;

  async function recorded(unit: UnitBody) {
    setLastRecorded(unit);
    setSelected(unit.id);
    await qc.invalidateQueries({ queryKey: key });
  }

  async function remove(u: UnitBody) {
    if (!window.confirm(`Delete unit ${u.serial} and its readings? This cannot be undone.`)) return;
    setDeleteError(null);
    const res = await fetch(`${base}/${u.id}`, { method: "DELETE" }).catch(() => null);
    const body = (await res?.json().catch(() => ({}))) as Partial<ApiError> | undefined;
    if (!res?.ok) setDeleteError(body?.message ?? "The unit could not be deleted.");
    if (lastRecorded?.id === u.id) setLastRecorded(null);
    await qc.invalidateQueries({ queryKey: key });
  }

  const mayDelete = (u: UnitBody) =>
    viewer.may.changeOthersUnits || (viewer.may.recordUnits && u.recordedBy === viewer.userId);

  const readingsAt = (pt: PredictedPoint) =>
    units
      .filter((u) => u.revision === data?.prediction?.revision)
      .flatMap((u) =>
        u.readings
          .filter((r) => r.label === pt.label)
          .map((r) => ({ serial: u.serial, outputV: r.outputV, inBand: r.inBand, selected: u.id === shown?.id })),
      );

  return (
    <div data-testid="units-panel" id="built-units">
      <Panel title="Built units">
        <div className="flex flex-col gap-5">
          <p className="max-w-prose text-ink-muted">
            Each unit built from an approved revision, checked against its bench-check bands, with the likely cause of a
            failure and a gain-and-offset correction for a production line or firmware to load.
          </p>
          {q.isError && <p className="text-bad">The units could not be loaded: {q.error.message}</p>}

          {data && data.yield.revision !== null && (
            <section aria-labelledby="yield-heading" className="flex flex-col gap-2" data-testid="units-yield">
              <h3 id="yield-heading" className="text-sm font-semibold">
                Yield, revision {data.yield.revision}
              </h3>
              <dl className="grid grid-cols-2 gap-x-6 gap-y-1 text-sm sm:grid-cols-4">
                <div>
                  <dt className="text-xs text-ink-muted">Measured</dt>
                  <dd className="num text-base font-semibold" data-testid="yield-measured">
                    {share(data.yield.measured)}
                  </dd>
                  <dd className="text-2xs text-ink-muted">
                    {data.yield.passing} of {data.yield.units} units pass
                  </dd>
                </div>
                <div>
                  <dt className="text-xs text-ink-muted">Predicted</dt>
                  <dd className="num text-base font-semibold" data-testid="yield-predicted">
                    {share(data.yield.predicted)}
                  </dd>
                  <dd className="text-2xs text-ink-muted">Monte Carlo, {data.prediction?.draws} units at 25 °C</dd>
                </div>
              </dl>
              {data.spread && data.spread.units > 0 && (
                <p
                  role={data.spread.flagged ? "alert" : undefined}
                  data-testid="spread-check"
                  className={`rounded border px-3 py-2 text-sm ${data.spread.flagged ? "border-warn/50 bg-warn/10" : "border-line bg-sunken/50"}`}
                >
                  {data.spread.flagged && <Badge tone="warn">units outside the predicted spread</Badge>}{" "}
                  {data.spread.text}
                </p>
              )}
            </section>
          )}

          {data?.prediction && (
            <section aria-labelledby="spread-heading">
              <h3 id="spread-heading" className="mb-1 text-sm font-semibold">
                Predicted spread at each test point, with the recorded readings
              </h3>
              <SpreadChart points={data.prediction.points} readingsAt={readingsAt} />
            </section>
          )}

          {canRecord && data && data.benchCheck.length > 0 && (
            <section aria-labelledby="record-heading" className="flex flex-col gap-2 rounded border border-line p-3">
              <h3 id="record-heading" className="text-sm font-semibold">
                Record a unit
              </h3>
              <RecordUnitForm designId={design.id} bench={data.benchCheck} onRecorded={recorded} />
              {lastRecorded && <UnitResult unit={lastRecorded} />}
              <details className="text-sm">
                <summary className="cursor-pointer text-copper">Import many units from a CSV file</summary>
                <div className="mt-2">
                  <ImportUnitsForm
                    designId={design.id}
                    onImported={async () => {
                      await qc.invalidateQueries({ queryKey: key });
                    }}
                  />
                </div>
              </details>
            </section>
          )}
          {!canRecord && design.status !== "approved" && (
            <p className="text-sm text-ink-muted">Units are recorded once this revision is approved.</p>
          )}

          {q.isSuccess && units.length === 0 && <p className="text-ink-muted">No units recorded on this design yet.</p>}
          {units.length > 0 && (
            <section aria-labelledby="units-heading">
              <div className="mb-1 flex flex-wrap items-center justify-between gap-2">
                <h3 id="units-heading" className="text-sm font-semibold">
                  Units ({units.length})
                </h3>
                <nav aria-label="Calibration downloads" className="flex flex-wrap items-center gap-2 text-xs">
                  <span className="text-ink-muted">Calibration per serial:</span>
                  <a
                    href={`${base}/calibration.csv`}
                    download
                    className={buttonClass("secondary")}
                    data-testid="download-calibration-csv"
                  >
                    CSV
                  </a>
                  <a
                    href={`${base}/calibration.json`}
                    download
                    className={buttonClass("secondary")}
                    data-testid="download-calibration-json"
                  >
                    JSON
                  </a>
                </nav>
              </div>
              <div className="overflow-x-auto">
                <table className="w-full text-left text-sm" aria-label="Built units" data-testid="units-table">
                  <thead className="border-b border-line text-xs text-ink-muted">
                    <tr>
                      <th scope="col" className="px-2 py-1.5 font-medium">
                        Serial
                      </th>
                      <th scope="col" className="px-2 py-1.5 font-medium">
                        Verdict
                      </th>
                      <th scope="col" className="px-2 py-1.5 text-right font-medium">
                        Gain
                      </th>
                      <th scope="col" className="px-2 py-1.5 text-right font-medium">
                        Offset
                      </th>
                      <th scope="col" className="hidden px-2 py-1.5 font-medium sm:table-cell">
                        Built
                      </th>
                      <th scope="col" className="px-2 py-1.5" aria-label="Actions" />
                    </tr>
                  </thead>
                  <tbody>
                    {units.map((u) => (
                      <tr
                        key={u.id}
                        className={`border-b border-line last:border-0 ${u.id === shown?.id ? "bg-signal-soft/50" : ""}`}
                      >
                        <td className="px-2 py-1.5 whitespace-nowrap">
                          <button
                            type="button"
                            className="font-medium text-signal hover:underline"
                            aria-pressed={u.id === shown?.id}
                            onClick={() => setSelected(u.id === shown?.id ? null : u.id)}
                          >
                            {u.serial}
                          </button>
                        </td>
                        <td className="px-2 py-1.5">
                          {u.pass ? <Badge tone="good">pass</Badge> : <Badge tone="bad">fail</Badge>}
                          {u.outsideSpread && u.pass && (
                            <span className="ml-1 text-2xs text-warn">outside the predicted spread</span>
                          )}
                        </td>
                        <td className="num px-2 py-1.5 text-right">{u.calibration.gain.toPrecision(5)}</td>
                        <td className="num px-2 py-1.5 text-right whitespace-nowrap">
                          {formatSI(u.calibration.offsetV, "V", 3)}
                        </td>
                        <td className="hidden px-2 py-1.5 text-xs whitespace-nowrap text-ink-muted sm:table-cell">
                          {u.builtOn}, {u.recordedByName} (rev. {u.revision})
                        </td>
                        <td className="px-2 py-1 text-right">
                          {mayDelete(u) && (
                            <Button variant="ghost" onClick={() => remove(u)} aria-label={`Delete unit ${u.serial}`}>
                              Delete
                            </Button>
                          )}
                        </td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
              {deleteError && <p className="text-sm text-bad">{deleteError}</p>}
              {shown && shown.id !== lastRecorded?.id && (
                <div className="mt-3 rounded border border-line p-3">
                  <UnitResult unit={shown} />
                </div>
              )}
            </section>
          )}

          {data?.calibratedAccuracy && (
            <CalibrationReach reach={data.calibratedAccuracy} target={design.requirement.accuracy.percent} />
          )}
        </div>
      </Panel>
    </div>
  );
}
