"use client";
// "What does my meter's current range do to my circuit?" The figures come from /api/insertion
// for all three load behaviours; the curves from the engine's insertionCurve.
import { useQueries } from "@tanstack/react-query";
import { LineSeries, Tooltip, XYChart } from "@visx/xychart";
import { useEffect, useMemo, useState } from "react";
import { insertionCurve, type Insertion, type InsertionResult } from "@/lib/design/insertion";
import { benchMeterRanges } from "@/lib/design/plan-stretches";
import type { ApiError, InsertionBody } from "@/lib/api-description/responses";
import { loadModels, type LoadModel } from "@/lib/design/requirement-options";
import { formatPercent, formatSI } from "@/lib/design/format";
import { chartMargin, logDomain, siTick } from "@/components/charts/axes";
import { ChartAxes } from "@/components/charts/chart-axes";
import { SeriesTip } from "@/components/charts/series-tip";
import { chartTheme, usePalette } from "@/components/charts/palette";
import { useWidth } from "@/components/charts/use-width";
import { Field, Select, TextInput } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { LimitLine } from "@/components/charts/limit-line";

/** Typical resistance a handheld meter puts in series on each current range: the engine's benchMeterRanges. */
const presetWords: Record<(typeof benchMeterRanges)[number]["key"], { label: string; note: string }> = {
  amps: { label: "10 A range", note: "about 0.1 Ω" },
  milliamps: { label: "milliamp range", note: "about 1.8–2 Ω" },
  microamps: { label: "microamp range", note: "about 100 Ω" },
};
const presets = benchMeterRanges.map((r) => ({ ...presetWords[r.key], ohms: `${r.seriesOhms} ohm` }));

const modelWords: Record<LoadModel, string> = {
  "constant-current": "Constant current",
  resistive: "Resistive",
  "constant-power": "Constant power",
};

type Inputs = { supply: string; seriesOhms: string; model: LoadModel; current: string; loadMin: string };
type Answer =
  { ok: true; result: InsertionResult } | ({ ok: false } & Required<Pick<ApiError, "message" | "fieldErrors">>);

async function ask(i: Inputs, model: LoadModel): Promise<Answer> {
  const res = await fetch("/api/insertion", {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ supply: i.supply, seriesOhms: i.seriesOhms, load: { model, current: i.current } }),
  });
  const body = (await res.json()) as InsertionBody & Partial<ApiError>;
  if (res.ok) return { ok: true, result: body };
  return {
    ok: false,
    message: body.message ?? `The server answered ${res.status}`,
    fieldErrors: body.fieldErrors ?? {},
  };
}

type InsertionSchema = (typeof import("@/lib/design/insertion-schema"))["insertionSchema"];

/** The request's schema (zod and the unit parser), loaded after first paint: null until then. */
function useInsertionSchema(): InsertionSchema | null {
  const [schema, setSchema] = useState<InsertionSchema | null>(null);
  useEffect(() => {
    let live = true;
    void import("@/lib/design/insertion-schema").then((m) => live && setSchema(() => m.insertionSchema));
    return () => {
      live = false;
    };
  }, []);
  return schema;
}

function useDebounced<T>(value: T, ms: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

export function MeterCheck() {
  const [inputs, setInputs] = useState<Inputs>({
    supply: "3.0 V",
    seriesOhms: "1.9 ohm",
    model: "constant-current",
    current: "180 mA",
    loadMin: "",
  });
  const set = (k: keyof Inputs) => (v: string) => setInputs((s) => ({ ...s, [k]: v }));
  const asked = useDebounced(inputs, 150);
  const schema = useInsertionSchema();
  // Until the schema has loaded (just after first paint) the server's answer names any field at fault.
  const parsed = schema?.safeParse({
    supply: asked.supply,
    seriesOhms: asked.seriesOhms,
    load: { model: asked.model, current: asked.current },
  });
  const localErrors: Record<string, string> = {};
  if (parsed && !parsed.success) for (const i of parsed.error.issues) localErrors[i.path.join(".")] ??= i.message;

  const answers = useQueries({
    queries: loadModels.map((model) => ({
      queryKey: ["insertion", asked.supply, asked.seriesOhms, asked.current, model],
      queryFn: () => ask(asked, model),
      enabled: parsed?.success ?? true,
      staleTime: Infinity,
    })),
  });
  const byModel = Object.fromEntries(loadModels.map((m, k) => [m, answers[k]?.data])) as Record<
    LoadModel,
    Answer | undefined
  >;
  const mine = byModel[asked.model];
  const serverErrors = mine && !mine.ok ? mine.fieldErrors : {};
  const err = (path: string) => localErrors[path] ?? serverErrors[path]?.join("; ");
  const loadMin = (() => {
    const t = asked.loadMin.trim();
    if (!t) return undefined;
    const r = schema?.shape.supply.safeParse(t);
    return r?.success ? r.data : undefined;
  })();

  return (
    <div className="grid grid-cols-1 gap-4 lg:grid-cols-[22rem_minmax(0,1fr)]">
      <Panel title="The circuit" className="lg:self-start">
        <form className="flex flex-col gap-3" onSubmit={(e) => e.preventDefault()} aria-label="Meter check">
          <Field id="m-supply" label="Supply voltage" error={err("supply")}>
            <TextInput
              id="m-supply"
              value={inputs.supply}
              onChange={(e) => set("supply")(e.target.value)}
              aria-describedby="m-supply-error"
              aria-invalid={err("supply") ? true : undefined}
            />
          </Field>
          <Field
            id="m-current"
            label="Load current at full supply"
            hint="What the circuit draws with nothing in series; below zero for current flowing back (charging, regenerating)"
            error={err("load.current")}
          >
            <TextInput
              id="m-current"
              value={inputs.current}
              onChange={(e) => set("current")(e.target.value)}
              aria-describedby="m-current-error m-current-hint"
              aria-invalid={err("load.current") ? true : undefined}
            />
          </Field>
          <Field id="m-model" label="Load behaviour" error={err("load.model")}>
            <Select id="m-model" value={inputs.model} onChange={(e) => set("model")(e.target.value)}>
              {loadModels.map((m) => (
                <option key={m} value={m}>
                  {modelWords[m]}
                </option>
              ))}
            </Select>
          </Field>
          <Field
            id="m-series"
            label="Series resistance"
            hint="The meter's current range, or any shunt"
            error={err("seriesOhms")}
          >
            <TextInput
              id="m-series"
              value={inputs.seriesOhms}
              onChange={(e) => set("seriesOhms")(e.target.value)}
              aria-describedby="m-series-error m-series-hint"
              aria-invalid={err("seriesOhms") ? true : undefined}
            />
          </Field>
          <div className="flex flex-col gap-1">
            <p className="text-xs font-medium text-ink-muted">Typical meter ranges</p>
            <div className="flex flex-wrap gap-1.5">
              {presets.map((p) => (
                <button
                  key={p.label}
                  type="button"
                  onClick={() => set("seriesOhms")(p.ohms)}
                  aria-pressed={inputs.seriesOhms === p.ohms}
                  className={`rounded border px-2 py-1 text-left text-2xs ${inputs.seriesOhms === p.ohms ? "border-copper bg-copper-soft text-copper-strong" : "border-line hover:bg-sunken"}`}
                >
                  <span className="block font-medium">{p.label}</span>
                  <span className="text-ink-faint">{p.note}</span>
                </button>
              ))}
            </div>
            <p className="text-2xs text-ink-faint">
              Usual values for a handheld meter (common practice, no source); your meter&apos;s manual gives its own.
            </p>
          </div>
          <Field id="m-loadmin" label="Minimum load voltage (optional)" hint="Drawn on the chart">
            <TextInput
              id="m-loadmin"
              value={inputs.loadMin}
              onChange={(e) => set("loadMin")(e.target.value)}
              placeholder="2.7 V"
            />
          </Field>
        </form>
      </Panel>
      <div className="flex min-w-0 flex-col gap-4">
        <Panel title={`With the range in series: ${modelWords[asked.model].toLowerCase()} load`}>
          {mine?.ok ? (
            <Readout r={mine.result} />
          ) : mine && !mine.ok ? (
            <p className="text-sm text-bad" role="alert" data-testid="meter-refusal">
              {mine.message}
            </p>
          ) : (
            <p className="text-sm text-ink-muted">
              {parsed?.success !== false ? "Working it out…" : "Fix the marked entry to see the figures."}
            </p>
          )}
        </Panel>
        <Panel title="The three load behaviours side by side">
          <table className="w-full text-xs" aria-label="Figures by load behaviour">
            <thead className="text-left text-2xs tracking-wide text-ink-muted">
              <tr>
                <th className="py-1">Load</th>
                <th>Current</th>
                <th>Change</th>
                <th>Burden</th>
                <th>At the load</th>
                <th>Heat in the range</th>
              </tr>
            </thead>
            <tbody className="num">
              {loadModels.map((m) => {
                const a = byModel[m];
                return (
                  <tr key={m} className={`border-t border-line ${m === asked.model ? "bg-copper-soft/50" : ""}`}>
                    <td className="py-1">{modelWords[m]}</td>
                    {a?.ok ? (
                      <>
                        <td>{formatSI(a.result.currentA, "A")}</td>
                        <td>{formatPercent(a.result.currentChangePercent / 100)}</td>
                        <td>{formatSI(a.result.burdenV, "V")}</td>
                        <td>{formatSI(a.result.loadVoltageV, "V")}</td>
                        <td>{formatSI(a.result.powerInSeriesW, "W")}</td>
                      </>
                    ) : (
                      <td colSpan={5} className="text-ink-muted">
                        {a && !a.ok ? a.message : "—"}
                      </td>
                    )}
                  </tr>
                );
              })}
            </tbody>
          </table>
        </Panel>
        <Panel title="Voltage left at the load across load currents">
          {parsed?.success ? (
            <InsertionChart input={parsed.data} loadMinV={loadMin} />
          ) : (
            <p className="text-sm text-ink-muted">
              {parsed ? "Fix the marked entry to draw the curves." : "Working it out…"}
            </p>
          )}
        </Panel>
        <p className="text-2xs text-ink-faint">
          A meter on a current range must be in series, never across a supply. Fuse ratings, measurement category and
          the range&apos;s own limits are on the meter; on mains or other high-voltage circuits follow local codes and
          licensed practice.
        </p>
      </div>
    </div>
  );
}

function Readout({ r }: { r: InsertionResult }) {
  const items: [string, string, string][] = [
    ["Burden (drop across the range)", formatSI(r.burdenV, "V"), "meter-burden"],
    ["Voltage left at the load", formatSI(r.loadVoltageV, "V"), "meter-load-voltage"],
    ["Current that flows", formatSI(r.currentA, "A"), "meter-current"],
    ["Change of the current", formatPercent(r.currentChangePercent / 100), "meter-change"],
    ["Heat in the range", formatSI(r.powerInSeriesW, "W"), "meter-power"],
  ];
  return (
    <dl className="grid grid-cols-2 gap-3 sm:grid-cols-5">
      {items.map(([k, v, id]) => (
        <div key={id}>
          <dt className="text-2xs text-ink-muted">{k}</dt>
          <dd className="num text-lg font-semibold" data-testid={id}>
            {v}
          </dd>
        </div>
      ))}
    </dl>
  );
}

type Pt = { a: number; v: number };

function InsertionChart({ input, loadMinV }: { input: Insertion; loadMinV?: number }) {
  const { ref, width } = useWidth<HTMLDivElement>();
  const p = usePalette();
  const theme = useMemo(() => chartTheme(p), [p]);
  // A negative current (flowing back from the load side) is drawn by its magnitude on the log axis.
  const back = input.load.current < 0;
  const from = input.load.current / 1000;
  const to = input.load.current * 3;
  const curves = useMemo(
    () =>
      loadModels.map((model) => ({
        model,
        points: insertionCurve({ ...input, load: { ...input.load, model } }, { fromA: from, toA: to, points: 80 }),
      })),
    [input, from, to],
  );
  const colours: Record<LoadModel, string> = {
    "constant-current": p.copper,
    resistive: p.signal,
    "constant-power": p.good,
  };
  const xd = logDomain([Math.abs(from), Math.abs(to)], 0);
  // Current flowing back lifts the load side above the supply.
  const topV = Math.max(input.supply, ...curves.flatMap((c) => c.points.map((q) => q.loadVoltageV)));
  const yd: [number, number] = [0, topV * 1.05];
  return (
    <div>
      <div ref={ref} style={{ height: 260 }} data-testid="meter-chart">
        {width > 0 && (
          <XYChart
            width={width}
            height={260}
            margin={chartMargin}
            theme={theme}
            xScale={{ type: "log", domain: xd }}
            yScale={{ type: "linear", domain: yd }}
            accessibilityLabel="Voltage at the load against load current"
          >
            <ChartAxes
              gridStroke={p.line}
              gridTicks={5}
              x={{
                label: back ? "Current flowing back (magnitude)" : "Load current at full supply",
                tick: siTick("A"),
                logDomain: xd,
              }}
              y={{ label: "Voltage at the load", tick: siTick("V", 3) }}
            />
            <LimitLine
              name="now"
              direction="vertical"
              at={Math.abs(input.load.current)}
              span={[0, topV]}
              stroke={p.faint}
              dash="2 3"
              strokeWidth={1}
            />
            {loadMinV !== undefined && <LimitLine name="Load minimum" at={loadMinV} span={xd} stroke={p.bad} />}
            {curves.map((c) => (
              <LineSeries
                key={c.model}
                dataKey={modelWords[c.model]}
                data={c.points.map((q) => ({ a: Math.abs(q.nominalA), v: q.loadVoltageV }))}
                xAccessor={(d: Pt) => d.a}
                yAccessor={(d: Pt) => d.v}
                stroke={colours[c.model]}
                strokeWidth={c.model === input.load.model ? 2.2 : 1.2}
              />
            ))}
            <Tooltip<Pt>
              snapTooltipToDatumX
              showVerticalCrosshair
              showSeriesGlyphs
              renderTooltip={({ tooltipData }) => {
                const near = tooltipData?.nearestDatum?.datum;
                if (!near) return null;
                return (
                  <SeriesTip
                    title={back ? `${formatSI(near.a, "A")} flowing back` : `load drawing ${formatSI(near.a, "A")}`}
                    byKey={tooltipData.datumByKey}
                    skip={["now", "Load minimum"]}
                    value={(d) => formatSI(d.v, "V")}
                  />
                );
              }}
            />
          </XYChart>
        )}
      </div>
      <ul className="mt-1 flex flex-wrap gap-x-3 text-2xs text-ink-muted" aria-label="Legend">
        {loadModels.map((m) => (
          <li key={m}>
            <span className="mr-1 inline-block h-0.5 w-4 align-middle" style={{ background: colours[m] }} aria-hidden />
            {modelWords[m]}
          </li>
        ))}
        <li>dotted: the current entered; a curve stops where the load can no longer be powered</li>
      </ul>
    </div>
  );
}
