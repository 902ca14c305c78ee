// Every figure of one candidate, grouped, in SI with prefixes.
import { rejectReasonLabels } from "@/lib/design/reject-reasons";
import type { Requirement } from "@/lib/design/requirement";
import type { CandidateDetail } from "@/lib/design/types";
import { formatPercent, formatSI } from "@/lib/design/format";

type Row = [label: string, value: string, note?: string];

/** Why the current at full load is what it is, in the load model's words. */
const loadNotes: Record<Requirement["load"]["model"], string> = {
  "constant-current": "the load draws the maximum current whatever the shunt takes",
  resistive: "a resistive load draws a little less: the shunt takes some of its voltage",
  "constant-power": "a constant-power load draws more: it makes up for the voltage the shunt takes",
};

/** Figures added in v2; a design saved before them has none: shown as a dash. */
const maybe = (v: number | undefined, unit: string) => (v === undefined ? "—" : formatSI(v, unit));

export function figureGroups(
  req: Requirement,
  m: CandidateDetail,
  outputCeilingV: number,
): { title: string; rows: Row[] }[] {
  const pct = (v: number | null) => (v === null ? "—" : formatPercent(v / 100));
  return [
    {
      title: "Choice",
      rows: [
        ["Shunt", formatSI(m.shuntOhms, "Ω")],
        ["Gain", String(Number(m.gain.toPrecision(6)))],
        [
          "Transimpedance R·G",
          formatSI(m.transimpedanceVPerA, "V/A"),
          `${formatSI(m.transimpedanceVPerA * 1e-3, "V")} per mA`,
        ],
      ],
    },
    {
      title: "On the load",
      rows: [
        ["Burden at Imax", formatSI(m.burdenV, "V"), `allowed ${formatSI(req.drop.max, "V")}`],
        [
          "Load voltage at Imax",
          formatSI(m.loadVoltageV, "V"),
          req.drop.loadMin !== undefined ? `needs ${formatSI(req.drop.loadMin, "V")}` : undefined,
        ],
        ["Current at full load", maybe(m.operatingCurrentA, "A"), loadNotes[req.load.model]],
        ["Dissipation at full load", formatSI(m.dissipationW, "W")],
        // A copper trace has no rating: its limit is the power that heats it to the shunt's maximum temperature.
        req.shunt.trace
          ? ["Trace may dissipate", formatSI(m.ratingW, "W"), `before it passes ${formatSI(req.shunt.maxTempC, "°C")}`]
          : [
              "Power rating chosen",
              formatSI(m.ratingW, "W"),
              `used at most ${formatPercent(req.shunt.derating)} of rating`,
            ],
        [
          "Self-heating",
          formatSI(m.selfHeatingK, "K"),
          req.shunt.trace ? "above ambient at full load (IPC-2221)" : "above ambient at full load",
        ],
        [
          "Shunt hot spot",
          m.hotSpotC === undefined ? "—" : `${Number(m.hotSpotC.toPrecision(3))} °C`,
          `at the hottest ambient; the part allows ${req.shunt.maxTempC} °C`,
        ],
      ],
    },
    {
      title: "Signal",
      rows: [
        [
          "Output at full load",
          formatSI(m.outputAtMaxV, "V"),
          req.amplifier.reference.voltage > 0
            ? `ideal: the ${formatSI(req.amplifier.reference.voltage, "V")} zero level + current × R × G`
            : "ideal: current × R × G",
        ],
        [
          "Output at full load, worst case",
          maybe(m.outputAtMaxWorstV, "V"),
          `with every error that can raise it; must stay within ${formatSI(outputCeilingV, "V")} (the readout's full scale less its own worst errors, or the amplifier's swing, the lower)`,
        ],
        ["Headroom", formatSI(m.headroomV, "V")],
        ["Readout step (LSB)", formatSI(m.lsbA, "A")],
        [
          "Smallest step it can tell apart",
          maybe(m.resolvableStepA, "A"),
          m.resolvableStepA === undefined
            ? undefined
            : m.resolvableStepA > m.lsbA * (1 + 1e-9)
              ? "the RMS noise, larger than one readout step: finer steps drown in it; counts at Imin use this"
              : "one readout step (the noise is smaller); counts at Imin use this",
        ],
        ["Counts at Imin", String(Number(m.countsAtMin.toPrecision(3))), `wanted ${req.resolution.countsAtMin}`],
        ["Dead zone", formatSI(m.deadZoneA, "A"), "reads zero below this"],
        ["Bandwidth", formatSI(m.bandwidthHz, "Hz")],
        ["Noise (RMS)", formatSI(m.noiseA, "A")],
        ["Offset (at 25 °C)", formatSI(m.offsetErrorA, "A")],
      ],
    },
    {
      title: "Error, % of reading",
      rows: [
        ["At Imin, worst case", pct(m.errorAtMinPercent), formatSI(req.current.min, "A")],
        ["At Imin, RSS", pct(m.rssAtMinPercent)],
        [
          "At typical",
          pct(m.errorAtTypicalPercent),
          req.current.typical !== undefined ? formatSI(req.current.typical, "A") : "no typical current given",
        ],
        ["At Imax, worst case", pct(m.errorAtMaxPercent), formatSI(req.current.max, "A")],
        [
          "Worst in accuracy band",
          pct(m.accuracyBandPercent),
          `${formatSI(req.accuracy.bandMin, "A")} – ${formatSI(req.accuracy.bandMax, "A")}, target ${formatPercent(req.accuracy.percent / 100)}`,
        ],
        [
          "Lowest current meeting target",
          m.lowestAccurateCurrentA === null ? "none in the span" : formatSI(m.lowestAccurateCurrentA, "A"),
        ],
      ],
    },
  ];
}

export function Figures({ req, m, outputCeilingV }: { req: Requirement; m: CandidateDetail; outputCeilingV: number }) {
  return (
    <div className="flex flex-col gap-3">
      {!m.feasible && (
        <div className="rounded border border-bad/40 bg-bad/5 px-3 py-2 text-xs" role="note">
          <p className="font-semibold text-bad">Not feasible</p>
          <ul className="list-disc pl-4 text-ink-muted">
            {m.reasons.map((r) => (
              <li key={r}>{rejectReasonLabels[r]}</li>
            ))}
          </ul>
        </div>
      )}
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        {figureGroups(req, m, outputCeilingV).map((g) => (
          <div key={g.title}>
            <h4 className="mb-1 text-2xs font-semibold tracking-wide text-ink-faint">{g.title}</h4>
            <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-xs">
              {g.rows.map(([label, value, note]) => (
                <div key={label} className="contents">
                  <dt className="text-ink-muted">{label}</dt>
                  <dd className="num">
                    <span className="font-medium text-ink">{value}</span>
                    {note && <span className="ml-1.5 text-2xs text-ink-faint">{note}</span>}
                  </dd>
                </div>
              ))}
            </dl>
          </div>
        ))}
      </div>
    </div>
  );
}
