"use client";

import { useState } from "react";
import { Field, TextInput } from "@/components/ui/field";
import { formatSI } from "@/lib/design/format";
import { batteryLifeS, type ProfileSummary } from "@/lib/design/profile";
import type { PlanProfileSummary } from "@/lib/design/plan-switching";
import { formatDuration } from "@/lib/profile/duration";

const pct = (p: number) => `${String(Number(p.toPrecision(3)))} %`;

function Figure({ label, value, note, tone }: { label: string; value: string; note?: string; tone?: "bad" | "warn" }) {
  return (
    <div className="rounded border border-line bg-panel px-3 py-2">
      <dt className="text-2xs font-medium text-ink-muted">{label}</dt>
      <dd className={`num text-base font-semibold ${tone === "bad" ? "text-bad" : tone === "warn" ? "text-warn" : ""}`}>
        {value}
      </dd>
      {note && <dd className="text-2xs text-ink-faint">{note}</dd>}
    </div>
  );
}

/** The summary figures, in SI with prefixes, and the battery-life estimate. */
/** A range plan's summary carries the switching rule's figures. */
function isPlanSummary(s: ProfileSummary): s is PlanProfileSummary {
  return Array.isArray((s as Partial<PlanProfileSummary>).timeInRangeS);
}

export function ProfileSummaryView({ summary, loadMinV }: { summary: ProfileSummary; loadMinV?: number }) {
  const lowLoad = loadMinV !== undefined && summary.minLoadVoltageV < loadMinV;
  const plan = isPlanSummary(summary) ? summary : null;
  return (
    <div className="flex flex-col gap-3">
      <dl className="grid grid-cols-2 gap-2 sm:grid-cols-3 lg:grid-cols-5" data-testid="profile-summary">
        <Figure label="Samples" value={summary.samples.toLocaleString("en-GB")} />
        <Figure
          label="Duration"
          value={formatSI(summary.durationS, "s")}
          note={summary.durationS >= 120 ? formatDuration(summary.durationS) : undefined}
        />
        <Figure
          label={summary.chargeOutC ? "Net charge" : "Charge"}
          value={formatSI(summary.chargeC, "C")}
          note={`${formatSI(summary.chargeC / 3600, "Ah")}`}
        />
        {summary.chargeOutC ? (
          <>
            <Figure
              label="Charge in (I > 0)"
              value={formatSI(summary.chargeInC, "C")}
              note={formatSI(summary.chargeInC / 3600, "Ah")}
            />
            <Figure
              label="Charge out (I < 0)"
              value={formatSI(summary.chargeOutC, "C")}
              note={formatSI(summary.chargeOutC / 3600, "Ah")}
            />
          </>
        ) : null}
        <Figure label="Average current" value={formatSI(summary.averageCurrentA, "A")} />
        <Figure label="Peak current" value={formatSI(summary.peakCurrentA, "A")} />
        <Figure
          label="Largest burden"
          value={formatSI(summary.maxBurdenV, "V")}
          note={plan ? "through the range in use, its switch included" : "largest |current| × shunt"}
        />
        <Figure
          label="Lowest load voltage"
          value={formatSI(summary.minLoadVoltageV, "V", 4)}
          note={lowLoad ? `below the required ${formatSI(loadMinV!, "V")}` : "supply − largest burden"}
          tone={lowLoad ? "bad" : undefined}
        />
        <Figure
          label="Clipped"
          value={pct(summary.clippedPercent)}
          note={
            plan
              ? "samples past full scale on the range they were read on"
              : `samples above ${formatSI(summary.clipCurrentA, "A")} (full scale)`
          }
          tone={summary.clippedPercent > 0 ? "bad" : undefined}
        />
        <Figure
          label="Below one step"
          value={pct(summary.belowResolutionPercent)}
          note={
            plan ? "samples under one resolvable step of their range" : `samples under ${formatSI(summary.lsbA, "A")}`
          }
          tone={summary.belowResolutionPercent > 0 ? "warn" : undefined}
        />
      </dl>
      {plan && <PlanFigures summary={plan} />}
      <BatteryLife averageCurrentA={summary.averageCurrentA} />
    </div>
  );
}

/** What the switching rule did over the recording: switches, time per range, samples read late. */
function PlanFigures({ summary }: { summary: PlanProfileSummary }) {
  const total = summary.timeInRangeS.reduce((a, b) => a + b, 0) || 1;
  return (
    <dl className="grid grid-cols-2 gap-2 sm:grid-cols-3 lg:grid-cols-5" data-testid="plan-profile-summary">
      <Figure
        label="Range switches"
        value={summary.rangeSwitches.toLocaleString("en-GB")}
        note={`switch delay ${formatSI(summary.switchDelayS, "s")}`}
      />
      {summary.timeInRangeS.map((t, k) => (
        <Figure
          key={k}
          label={`Time on range ${k + 1}`}
          value={formatSI(t, "s")}
          note={`${pct((100 * t) / total)} of the time, ${(summary.samplesInRange[k] ?? 0).toLocaleString("en-GB")} samples`}
        />
      ))}
      <Figure
        label="Read before the switch acted"
        value={summary.clippedBeforeSwitchSamples.toLocaleString("en-GB")}
        note={`samples above their range's top while the switch waited (${pct(summary.clippedBeforeSwitchPercent)})`}
        tone={summary.clippedBeforeSwitchSamples > 0 ? "warn" : undefined}
      />
    </dl>
  );
}

type CapacityParser = (text: string) => number | null;

function BatteryLife({ averageCurrentA }: { averageCurrentA: number }) {
  const [text, setText] = useState("");
  // The capacity parser (the engine's unit parser) loads when the field is first used, not with the page.
  const [parser, setParser] = useState<CapacityParser | "loading" | "failed" | null>(null);
  const loadParser = () => {
    if (parser !== null && parser !== "failed") return;
    setParser("loading");
    import("@/lib/profile/capacity").then(
      (m) => setParser(() => m.parseCapacityC),
      () => setParser("failed"),
    );
  };
  const typed = text.trim() !== "";
  const capacity = typed && typeof parser === "function" ? parser(text) : null;
  const life = capacity === null ? null : batteryLifeS(capacity, averageCurrentA);
  const error =
    parser === "failed"
      ? "The capacity check could not be loaded; type again to retry."
      : typed && typeof parser === "function" && capacity === null
        ? 'Write a capacity such as "220 mAh", "2.4 Ah" or "800 C"'
        : undefined;
  return (
    <div className="flex flex-wrap items-start gap-4 rounded border border-line bg-sunken/40 px-3 py-2">
      <div className="w-56">
        <Field id="battery-capacity" label="Battery capacity" hint="e.g. 220 mAh (a plain number is mAh)" error={error}>
          <TextInput
            id="battery-capacity"
            value={text}
            placeholder="220 mAh"
            onFocus={loadParser}
            onChange={(e) => {
              loadParser();
              setText(e.target.value);
            }}
            aria-invalid={error ? true : undefined}
          />
        </Field>
      </div>
      <div className="pt-5 text-sm" aria-live="polite" data-testid="battery-life">
        {life !== null ? (
          <>
            <span className="num text-base font-semibold">{formatDuration(life)}</span>
            <span className="text-ink-muted">
              {" "}
              ({Number((life / 3600).toPrecision(3)).toLocaleString("en-GB")} h) at {formatSI(averageCurrentA, "A")}{" "}
              average, if the recording repeats; ignores self-discharge and the cell&apos;s cut-off voltage.
            </span>
          </>
        ) : (
          <span className="text-ink-muted">
            Enter a capacity to estimate how long it lasts at this profile&apos;s average current.
          </span>
        )}
      </div>
    </div>
  );
}
