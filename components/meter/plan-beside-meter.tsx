"use client";
// A saved range plan beside a bench meter's three current ranges on the same load: the voltage each
// leaves the load across the plan's span. The figures are the engine's (meterBesidePlan).
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useMemo } from "react";
import { formatSI } from "@/lib/design/format";
import { meterBesidePlan, type LoadVoltageSeries } from "@/lib/design/plan-stretches";
import type { PlanChoice } from "@/lib/design/plan-choice";
import type { Requirement } from "@/lib/design/requirement";
import { logDomain, logTicks } from "@/components/charts/axes";
import { budgetColours, usePalette } from "@/components/charts/palette";
import { SvgFrame } from "@/components/charts/svg-frame";
import { useWidth } from "@/components/charts/use-width";
import { Select } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";

export type PlanForMeter = { id: string; name: string; revision: number; requirement: Requirement; plan: PlanChoice };

/** Per series: an Okabe–Ito hue, a dash pattern and a number drawn on the curve (never colour alone). */
const styles: Record<string, { colour: string; dash?: string; mark: string }> = {
  amps: { colour: budgetColours.light[5], dash: "2 3", mark: "A" },
  milliamps: { colour: budgetColours.light[1], dash: "7 4", mark: "mA" },
  microamps: { colour: budgetColours.light[6], dash: "10 3 2 3", mark: "µA" },
  plan: { colour: budgetColours.light[0], mark: "plan" },
};

const loadWords = {
  "constant-current": "constant-current",
  resistive: "resistive",
  "constant-power": "constant-power",
};

export function PlanBesideMeter({
  plans,
  selected,
}: {
  plans: { id: string; name: string }[];
  selected: PlanForMeter | null;
}) {
  const router = useRouter();
  return (
    <Panel title="A bench meter's ranges beside a designed range plan">
      <div className="flex flex-col gap-3 text-xs" data-testid="plan-beside-meter">
        {plans.length === 0 ? (
          <p className="text-ink-muted">
            No range plan is saved in this team yet. When one range cannot cover a span,{" "}
            <Link href="/designs/new" className="text-copper-strong underline">
              the wizard
            </Link>{" "}
            proposes a plan; save it to see it here beside a meter&apos;s ranges.
          </p>
        ) : (
          <div className="flex max-w-md flex-col gap-1">
            <label htmlFor="meter-plan" className="text-xs font-medium text-ink-muted">
              Range plan
            </label>
            <Select
              id="meter-plan"
              value={selected?.id ?? ""}
              onChange={(e) => router.replace(`/meter?design=${encodeURIComponent(e.target.value)}`, { scroll: false })}
            >
              {!selected && <option value="">Choose a saved plan</option>}
              {plans.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.name}
                </option>
              ))}
            </Select>
          </div>
        )}
        {selected && <Comparison design={selected} />}
      </div>
    </Panel>
  );
}

function Comparison({ design }: { design: PlanForMeter }) {
  const r = design.requirement;
  const series = useMemo(() => meterBesidePlan(r, design.plan), [r, design.plan]);
  const plan = series.find((s) => s.key === "plan");
  const lowest = (s: LoadVoltageSeries) => (s.points.length ? Math.min(...s.points.map((q) => q.loadVoltageV)) : null);
  const full = (s: LoadVoltageSeries) => {
    const q = s.points.at(-1);
    return q && Math.abs(q.currentA - r.current.max) <= 1e-9 * r.current.max ? q.loadVoltageV : null;
  };
  return (
    <>
      <p className="text-ink-muted">
        <Link href={`/designs/${design.id}`} className="text-copper-strong underline">
          {design.name}
        </Link>{" "}
        (revision {design.revision}): {formatSI(r.current.min, "A")} to {formatSI(r.current.max, "A")} from{" "}
        {formatSI(r.supply.voltage, "V")}, a {loadWords[r.load.model]} load, {design.plan.ranges.length} ranges with a{" "}
        {formatSI(r.rangeSwitch.onResistance, "Ω")} switch each. Each meter range is drawn as if it stayed in series
        across the whole span; the plan changes range as the current moves.
      </p>
      <LoadVoltageChart series={series} supplyV={r.supply.voltage} loadMinV={r.drop.loadMin} />
      <div className="overflow-x-auto">
        <table className="w-full min-w-[28rem]" aria-label="Voltage left at the load">
          <thead className="text-left text-2xs tracking-wide text-ink-muted">
            <tr>
              <th className="py-1">In series</th>
              <th>Resistance</th>
              <th>At the load, full current {formatSI(r.current.max, "A")}</th>
              <th>Lowest across the span</th>
            </tr>
          </thead>
          <tbody className="num">
            {series.map((s) => {
              const f = full(s);
              const lo = lowest(s);
              return (
                <tr key={s.key} className={`border-t border-line ${s.key === "plan" ? "bg-copper-soft/50" : ""}`}>
                  <td className="py-1">{s.label}</td>
                  <td>{s.key === "plan" ? `up to ${formatSI(s.seriesOhms, "Ω")}` : formatSI(s.seriesOhms, "Ω")}</td>
                  <td data-testid={`meter-vs-${s.key}-full`}>
                    {f === null ? "cannot power the load" : formatSI(f, "V")}
                  </td>
                  <td>{lo === null ? "—" : formatSI(lo, "V")}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {plan && (
        <p className="text-2xs text-ink-faint">
          Meter resistances are the usual values for a handheld meter (common practice, no source); your meter&apos;s
          manual gives its own, and each range also has a current limit and a fuse. Inside a plan&apos;s hysteresis band
          either range may be in use; the lower voltage is drawn.
        </p>
      )}
    </>
  );
}

const HEIGHT = 260;
const M = { top: 12, right: 14, bottom: 40, left: 64 };

function LoadVoltageChart({
  series,
  supplyV,
  loadMinV,
}: {
  series: LoadVoltageSeries[];
  supplyV: number;
  loadMinV?: number;
}) {
  const { ref, width } = useWidth<HTMLDivElement>();
  const p = usePalette();
  const all = series.flatMap((s) => s.points);
  const xd = logDomain(
    all.map((q) => q.currentA),
    0.02,
  );
  const yd: [number, number] = [0, supplyV * 1.05];
  const w = Math.max(0, width - M.left - M.right);
  const h = HEIGHT - M.top - M.bottom;
  const sx = (a: number) => M.left + ((Math.log10(a) - Math.log10(xd[0])) / Math.log10(xd[1] / xd[0])) * w;
  const sy = (v: number) => M.top + h - ((v - yd[0]) / (yd[1] - yd[0])) * h;
  const yStep = supplyV > 10 ? 5 : supplyV > 4 ? 1 : 0.5;
  const yTicks = Array.from({ length: Math.floor(yd[1] / yStep) + 1 }, (_, i) => i * yStep);
  return (
    <div data-testid="meter-plan-chart">
      <div ref={ref} style={{ height: HEIGHT }}>
        {width > 0 && (
          <svg
            width={width}
            height={HEIGHT}
            role="img"
            aria-label={`Voltage left at the load against current, for ${series.map((s) => s.label).join(", ")}`}
          >
            <SvgFrame
              frame={{ left: M.left, top: M.top, width: w, height: h, total: HEIGHT }}
              palette={p}
              xTicks={logTicks(xd[0], xd[1], width < 480 ? 4 : 8)}
              yTicks={yTicks}
              sx={sx}
              sy={sy}
              yTick={(v) => formatSI(v, "V", 3)}
              xTitle="Load current"
              yTitle="Voltage at the load"
            />
            <line
              x1={M.left}
              x2={M.left + w}
              y1={sy(supplyV)}
              y2={sy(supplyV)}
              stroke={p.faint}
              strokeDasharray="2 3"
            />
            {loadMinV !== undefined && (
              <line
                x1={M.left}
                x2={M.left + w}
                y1={sy(loadMinV)}
                y2={sy(loadMinV)}
                stroke={p.bad}
                strokeWidth={1.5}
                strokeDasharray="8 3 2 3"
              />
            )}
            {series.map((s) => {
              const st = styles[s.key] ?? styles.plan!;
              const d = s.points
                .map((q, i) => `${i === 0 ? "M" : "L"}${sx(q.currentA).toFixed(1)},${sy(q.loadVoltageV).toFixed(1)}`)
                .join(" ");
              const end = s.points.at(-1);
              return (
                <g key={s.key}>
                  <path
                    d={d}
                    fill="none"
                    stroke={st.colour}
                    strokeWidth={s.key === "plan" ? 2.5 : 1.8}
                    strokeDasharray={st.dash}
                  />
                  {end && (
                    <text
                      x={Math.min(sx(end.currentA) + 3, M.left + w - 2)}
                      y={sy(end.loadVoltageV) + (s.key === "plan" ? -5 : 12)}
                      textAnchor={sx(end.currentA) + 30 > M.left + w ? "end" : "start"}
                      fontSize={10}
                      fontWeight={600}
                      fill={st.colour}
                    >
                      {st.mark}
                    </text>
                  )}
                </g>
              );
            })}
          </svg>
        )}
      </div>
      <ul className="mt-1 flex flex-wrap gap-x-4 gap-y-1 text-2xs text-ink-muted" aria-label="Legend">
        {series.map((s) => {
          const st = styles[s.key] ?? styles.plan!;
          return (
            <li key={s.key} className="flex items-center gap-1">
              <svg width={22} height={8} aria-hidden>
                <line x1={0} x2={22} y1={4} y2={4} stroke={st.colour} strokeWidth={2} strokeDasharray={st.dash} />
              </svg>
              <span>
                {s.label} (“{st.mark}”)
              </span>
            </li>
          );
        })}
        <li>supply dotted{loadMinV !== undefined ? `; load minimum ${formatSI(loadMinV, "V")} dash-dot` : ""}</li>
      </ul>
    </div>
  );
}
