// A saved requirement in words and SI figures, for the design page.
import type { Requirement } from "@/lib/design/requirement";
import { formatPercent, formatSI } from "@/lib/design/format";
import { calibrationText, readoutErrorText } from "@/lib/build-sheet/readout-zero-text";

const loadWords = {
  "constant-current": "constant current",
  resistive: "resistive",
  "constant-power": "constant power",
} as const;

export function requirementRows(r: Requirement): [string, string][] {
  const a = r.amplifier;
  const readout =
    r.readout.kind === "adc"
      ? `ADC, ${r.readout.bits} bits over ${formatSI(r.readout.fullScale, "V")}`
      : `bench meter, ${r.readout.counts} counts over ${formatSI(r.readout.fullScale, "V")}`;
  const gains = a.gainSet
    ? `1 + Rf/Rg from ${a.gainSet.series}, ${a.gainSet.min} to ${a.gainSet.max} (${a.gains.length} gains)`
    : a.gains.map((g) => Number(g.toPrecision(4))).join(", ");
  return [
    [
      "Current span",
      `${formatSI(r.current.min, "A")} to ${formatSI(r.current.max, "A")}${r.current.typical !== undefined ? `, typical ${formatSI(r.current.typical, "A")}` : ""}`,
    ],
    ["Load behaviour", loadWords[r.load.model]],
    ["Supply", `${formatSI(r.supply.voltage, "V")}, shunt on the ${r.supply.side} side`],
    [
      "Allowed drop",
      `${formatSI(r.drop.max, "V")}${r.drop.fraction !== undefined ? ` (${formatPercent(r.drop.fraction)} of supply)` : ""}`,
    ],
    ["Minimum load voltage", r.drop.loadMin !== undefined ? formatSI(r.drop.loadMin, "V") : "not given"],
    ["Readout", readout],
    // Stated figures, then those typical of a class of part (not stated), in the build sheet's words.
    ["Readout's own error", readoutErrorText(r)],
    ["Calibration", calibrationText(r)],
    ["Counts at minimum current", String(r.resolution.countsAtMin)],
    [
      "Accuracy target",
      `${formatPercent(r.accuracy.percent / 100)} of reading from ${formatSI(r.accuracy.bandMin, "A")} to ${formatSI(r.accuracy.bandMax, "A")}`,
    ],
    ["Ambient", `${formatSI(r.temperature.min, "°C")} to ${formatSI(r.temperature.max, "°C")}`],
    ["Shunt values", `${r.shunt.series}, ${formatSI(r.shunt.min, "Ω")} to ${formatSI(r.shunt.max, "Ω")}`],
    ["Shunt tolerance and tempco", `${formatPercent(r.shunt.tolerance)}, ${formatSI(r.shunt.tempco * 1e6, "ppm/K")}`],
    [
      "Power ratings",
      `${r.shunt.ratings.map((w) => formatSI(w, "W")).join(", ")}; at most ${formatPercent(r.shunt.derating)} used`,
    ],
    ["Gains", gains],
    ["Amplifier offset and drift", `${formatSI(a.offset, "V")}, ${formatSI(a.offsetDrift, "V/K")}`],
    ["Gain error and drift", `${formatPercent(a.gainError)}, ${formatSI(a.gainDrift * 1e6, "ppm/K")}`],
    ["Bias current, noise", `${formatSI(a.biasCurrent, "A")}, ${formatSI(a.noiseDensity, "V/√Hz")}`],
    ["Gain-bandwidth, CMRR", `${formatSI(a.gbw, "Hz")}, ${a.cmrrDb} dB`],
    [
      "Output swing",
      `${formatSI(a.swingLow, "V")} above ground to ${formatSI(a.swingHigh, "V")} below its ${formatSI(a.supply, "V")} supply`,
    ],
  ];
}

export function RequirementSummary({ requirement }: { requirement: Requirement }) {
  return (
    <dl className="grid grid-cols-1 gap-x-6 gap-y-1 text-xs sm:grid-cols-2">
      {requirementRows(requirement).map(([k, v]) => (
        <div key={k} className="flex gap-2 border-b border-line/60 py-0.5">
          <dt className="w-44 shrink-0 text-ink-muted">{k}</dt>
          <dd className="num">{v}</dd>
        </div>
      ))}
    </dl>
  );
}
