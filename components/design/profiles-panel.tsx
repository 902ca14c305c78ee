"use client";

import { keepPreviousData, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { PROFILE_CHART_HEIGHT, ProfileChart, useProfileWidth } from "@/components/profile/profile-chart";
import { ProfileSummaryView } from "@/components/profile/profile-summary";
import { UploadForm } from "@/components/profile/upload-form";
import { Button } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { formatSI } from "@/lib/design/format";
import type { ClientDesignView, DesignViewer } from "@/lib/design-view";
import { RangeSwatch } from "@/components/profile/range-bands";
import type { ApiError, ProfileDetail, ProfileListItem, ProfilesBody } from "@/lib/api-description/responses";

type ListItem = ProfileListItem;
type Detail = ProfileDetail;

async function getJson<T>(url: string): Promise<T> {
  const res = await fetch(url);
  const data = (await res.json().catch(() => ({}))) as T & Partial<ApiError>;
  if (!res.ok) throw new Error(data.message ?? `The server answered ${res.status}.`);
  return data;
}

/** Current-profile uploads of a saved design: upload, the list, the summary and the chart. */
export function ProfilesPanel({ design, viewer }: { design: ClientDesignView; viewer: DesignViewer }) {
  const canUpload = viewer.may.uploadProfiles;
  const qc = useQueryClient();
  const listKey = ["profiles", design.id];
  const list = useQuery({
    queryKey: listKey,
    queryFn: () => getJson<ProfilesBody>(`/api/designs/${design.id}/profiles`),
  });
  const [selected, setSelected] = useState<string | null>(null);
  const profiles = list.data?.profiles ?? [];
  const shown = selected && profiles.some((p) => p.id === selected) ? selected : (profiles[0]?.id ?? null);
  const [deleteError, setDeleteError] = useState<string | null>(null);

  async function remove(p: ListItem) {
    if (!window.confirm(`Delete the recording ${p.fileName}? This cannot be undone.`)) return;
    setDeleteError(null);
    const res = await fetch(`/api/designs/${design.id}/profiles/${p.id}`, { method: "DELETE" }).catch(() => null);
    const data = (await res?.json().catch(() => ({}))) as Partial<ApiError> | undefined;
    if (!res?.ok) setDeleteError(data?.message ?? "The recording could not be deleted.");
    if (selected === p.id) setSelected(null);
    await qc.invalidateQueries({ queryKey: listKey });
  }

  return (
    <div data-testid="profiles-panel">
      <Panel title="Measured current profiles">
        <div className="flex flex-col gap-4">
          <p className="max-w-prose text-ink-muted">
            Check this design against a recording of how the device really draws current: how far the shunt pulls the
            load voltage down, how often the readout clips or reads below one step, and how much charge flowed.
          </p>
          {canUpload ? (
            <UploadForm
              designId={design.id}
              onUploaded={async (id) => {
                setSelected(id);
                await qc.invalidateQueries({ queryKey: listKey });
              }}
            />
          ) : (
            <p className="text-xs text-ink-muted">Owners and designers upload recordings; you can read them.</p>
          )}

          {list.isError && <p className="text-bad">The recordings could not be loaded: {list.error.message}</p>}
          {list.isSuccess && profiles.length === 0 && (
            <p className="text-ink-muted">No recordings stored on this design yet.</p>
          )}
          {profiles.length > 0 && (
            <div className="overflow-x-auto">
              <table className="w-full text-left text-sm" aria-label="Stored profiles">
                <thead className="border-b border-line text-xs text-ink-muted">
                  <tr>
                    <th className="px-2 py-1.5 font-medium">Recording</th>
                    <th className="px-2 py-1.5 font-medium">Samples</th>
                    <th className="px-2 py-1.5 font-medium">Duration</th>
                    <th className="px-2 py-1.5 font-medium">Peak</th>
                    <th className="px-2 py-1.5 font-medium">Clipped</th>
                    <th className="px-2 py-1.5 font-medium">Uploaded</th>
                    <th className="px-2 py-1.5" aria-label="Actions" />
                  </tr>
                </thead>
                <tbody>
                  {profiles.map((p) => (
                    <tr
                      key={p.id}
                      className={`border-b border-line last:border-0 ${p.id === shown ? "bg-signal-soft/50" : ""}`}
                    >
                      <td className="px-2 py-1.5">
                        <button
                          type="button"
                          className="font-medium text-signal hover:underline"
                          onClick={() => setSelected(p.id)}
                          aria-pressed={p.id === shown}
                        >
                          {p.fileName}
                        </button>
                      </td>
                      <td className="num px-2 py-1.5">{p.samples.toLocaleString("en-GB")}</td>
                      <td className="num px-2 py-1.5">{formatSI(p.summary.durationS, "s")}</td>
                      <td className="num px-2 py-1.5">{formatSI(p.summary.peakCurrentA, "A")}</td>
                      <td className="num px-2 py-1.5">{`${Number(p.summary.clippedPercent.toPrecision(3))} %`}</td>
                      <td className="px-2 py-1.5 text-ink-muted">
                        {p.uploadedByName},{" "}
                        {new Date(p.createdAt).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" })}{" "}
                        (rev. {p.revision})
                      </td>
                      <td className="px-2 py-1 text-right">
                        {p.canDelete && (
                          <Button variant="ghost" onClick={() => remove(p)} aria-label={`Delete ${p.fileName}`}>
                            Delete
                          </Button>
                        )}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
              {deleteError && <p className="text-sm text-bad">{deleteError}</p>}
            </div>
          )}
          {shown && (
            <ProfileDetail
              key={shown}
              designId={design.id}
              profileId={shown}
              designRevision={design.revision}
              loadMinV={design.requirement.drop.loadMin}
            />
          )}
        </div>
      </Panel>
    </div>
  );
}

function ProfileDetail({
  designId,
  profileId,
  designRevision,
  loadMinV,
}: {
  designId: string;
  profileId: string;
  designRevision: number;
  loadMinV?: number;
}) {
  const { ref, width } = useProfileWidth();
  const [zoom, setZoom] = useState<{ from: number; to: number } | null>(null);
  const [log, setLog] = useState<boolean | null>(null);
  const pixels = Math.max(10, width - 128);
  const query = useQuery({
    queryKey: ["profile", profileId, zoom?.from, zoom?.to, pixels],
    queryFn: () => {
      const q = new URLSearchParams({ width: String(pixels) });
      if (zoom) {
        q.set("from", String(zoom.from));
        q.set("to", String(zoom.to));
      }
      return getJson<Detail>(`/api/designs/${designId}/profiles/${profileId}?${q.toString()}`);
    },
    // The server decimates to the chart's pixels: ask once the frame is measured.
    enabled: width > 0,
    placeholderData: keepPreviousData,
  });
  const d = query.data;
  // Log scale by default for bursty recordings (long sleeps, short peaks), where linear hides the sleep.
  const summary = d?.current.summary;
  const wide = summary ? summary.peakCurrentA > 20 * summary.averageCurrentA : false;
  const useLog = log ?? wide;

  const zoomBy = (factor: number) => {
    if (!d) return;
    const from = zoom?.from ?? d.startS;
    const to = zoom?.to ?? d.endS;
    const mid = (from + to) / 2;
    const half = ((to - from) / 2) * factor;
    const a = Math.max(d.startS, mid - half);
    const b = Math.min(d.endS, mid + half);
    setZoom(a <= d.startS && b >= d.endS ? null : { from: a, to: b });
  };

  return (
    <section className="flex flex-col gap-3" aria-label="Profile detail">
      {query.isError && <p className="text-bad">The recording could not be loaded: {query.error.message}</p>}
      {d && summary && (
        <>
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <h3 className="font-semibold">{d.fileName}</h3>
            {d.revision !== designRevision && (
              <p className="text-xs text-warn">
                Uploaded against revision {d.revision}; the figures below are for the current revision{" "}
                {d.current.revision}.
              </p>
            )}
          </div>
          <ProfileSummaryView summary={summary} loadMinV={loadMinV} />
          <div className="flex flex-wrap items-center gap-2 text-xs">
            <Button onClick={() => zoomBy(0.5)} aria-label="Zoom in">
              Zoom in
            </Button>
            <Button onClick={() => zoomBy(2)} disabled={!zoom} aria-label="Zoom out">
              Zoom out
            </Button>
            <Button onClick={() => setZoom(null)} disabled={!zoom}>
              Reset zoom
            </Button>
            <label className="ml-2 flex items-center gap-1.5">
              <input
                type="checkbox"
                checked={useLog}
                onChange={(e) => setLog(e.target.checked)}
                className="accent-copper"
              />
              Logarithmic current axis
            </label>
            <span className="ml-auto text-ink-muted num" data-testid="chart-window">
              {formatSI(d.series.fromS, "s", 4)} – {formatSI(d.series.toS, "s", 4)} ·{" "}
              {d.series.windowSamples.toLocaleString("en-GB")} samples drawn as{" "}
              {d.series.tS.length.toLocaleString("en-GB")} points {query.isFetching ? "· loading…" : ""}
            </span>
          </div>
          <p className="text-2xs text-ink-faint">
            Point at the chart to read a sample; drag across it to zoom to a stretch.
          </p>
        </>
      )}
      <div ref={ref} className="w-full overflow-hidden">
        {d && width > 0 && (
          <ProfileChart
            series={d.series}
            width={width}
            log={useLog}
            design={{
              // A plan's load voltage comes with the series; the shunt is not used for it.
              shuntOhms: d.design.kind === "pair" ? d.design.shuntOhms : 0,
              supplyV: d.design.supplyV,
              lsbA: d.design.lsbA,
              clipCurrentA: d.current.summary.clipCurrentA,
              loadMinV,
            }}
            onZoom={(from, to) => setZoom({ from, to })}
          />
        )}
        {!d && !query.isError && (
          <div
            className="animate-pulse rounded bg-sunken"
            style={{ height: PROFILE_CHART_HEIGHT }}
            aria-label="Loading the chart"
          />
        )}
      </div>
      {d && (
        <ul className="flex flex-wrap gap-4 text-2xs text-ink-muted" aria-label="Chart key">
          <li className="flex items-center gap-1.5">
            <span className="inline-block h-0.5 w-4 bg-signal" /> current
          </li>
          <li className="flex items-center gap-1.5">
            <span className="inline-block h-0.5 w-4 bg-copper" /> load voltage (burden on the right axis)
          </li>
          <li className="flex items-center gap-1.5">
            <span className="inline-block size-3 bg-bad/20" /> clipped: output past the readout&apos;s full scale
          </li>
          <li className="flex items-center gap-1.5">
            <span className="inline-block size-3 bg-warn/15" />{" "}
            {d.design.kind === "plan"
              ? "below one resolvable step of the range in use"
              : `below one readout step (${formatSI(d.design.lsbA, "A")})`}
          </li>
          {d.design.kind === "plan" &&
            d.design.ranges.map((r, k) => (
              <li key={`range-${k}`} className="flex items-center gap-1.5" data-testid={`range-key-${k + 1}`}>
                <RangeSwatch range={k} /> R{k + 1}: read on range {k + 1} ({formatSI(r.minA, "A")} to{" "}
                {formatSI(r.maxA, "A")}, {formatSI(r.shuntOhms, "Ω")})
              </li>
            ))}
          {loadMinV !== undefined &&
            loadMinV >= d.design.supplyV - 4 * (d.design.supplyV - (summary?.minLoadVoltageV ?? d.design.supplyV)) && (
              <li className="flex items-center gap-1.5">
                <span className="inline-block h-0.5 w-4 border-t border-dashed border-bad" /> required minimum load
                voltage ({formatSI(loadMinV, "V")})
              </li>
            )}
        </ul>
      )}
    </section>
  );
}
