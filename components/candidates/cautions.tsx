// Safety notes that apply to one design (DESIGN.md §5). They inform; local codes and
// licensed practice decide.
import { formatSI, type CandidateDetail, type Requirement } from "@/lib/design";

export type Caution = { key: string; title: string; text: string; severity: "warn" | "bad" };

/** Self-heating worth a note, K, and dissipation worth a note, W (common practice, no source). */
const HOT_RISE_K = 10;
const HOT_POWER_W = 0.25;
/** Common-mode voltage above which isolation deserves a note on the high side (common practice, no source). */
const HIGH_CM_V = 30;
/** Above this a supply is treated as hazardous (the usual extra-low-voltage limit for DC, common practice, no source). */
const HAZARDOUS_V = 60;

export function cautionsFor(req: Requirement, m: CandidateDetail): Caution[] {
  const out: Caution[] = [];
  if (m.selfHeatingK >= HOT_RISE_K || m.dissipationW >= HOT_POWER_W) {
    out.push({
      key: "hot",
      severity: "warn",
      title: "Hot shunt",
      text: `At the maximum current the shunt dissipates ${formatSI(m.dissipationW, "W")} and runs about ${formatSI(m.selfHeatingK, "K")} above ambient (rated ${formatSI(m.ratingW, "W")}). Give it copper area, keep heat-sensitive parts and the amplifier away from it, and do not touch it while current flows.`,
    });
  }
  if (req.current.max >= 1) {
    out.push({
      key: "fuse",
      severity: "warn",
      title: "Fuse the measured path",
      text: `${formatSI(req.current.max, "A")} flows through the shunt: fuse the path for the wiring and the shunt's rating, and never open a live inductive circuit (a motor, a coil) at the shunt.`,
    });
  }
  if (req.supply.side === "high" && req.supply.voltage > HIGH_CM_V) {
    out.push({
      key: "cm",
      severity: "bad",
      title: "High common-mode voltage",
      text: `The shunt sits ${formatSI(req.supply.voltage, "V")} above ground. The amplifier must be rated for that common-mode voltage, the readout may need isolation, and bench instruments connected to it must be of a suitable measurement category.`,
    });
  }
  if (req.supply.voltage > HAZARDOUS_V) {
    out.push({
      key: "mains",
      severity: "bad",
      title: "Hazardous voltage",
      text: `${formatSI(req.supply.voltage, "V")} can kill. Mains-connected or high-voltage work needs isolation, creepage and clearance, enclosure and fusing as local codes require; have it designed and checked by someone licensed to do so. These figures do not replace that.`,
    });
  }
  return out;
}

export function Cautions({ cautions }: { cautions: Caution[] }) {
  if (cautions.length === 0) return null;
  return (
    <ul className="flex flex-col gap-2" aria-label="Cautions">
      {cautions.map((c) => (
        <li
          key={c.key}
          className={`rounded border px-3 py-2 text-xs ${c.severity === "bad" ? "border-bad/40 bg-bad/5" : "border-warn/40 bg-warn/5"}`}
          data-testid={`caution-${c.key}`}
        >
          <p className={`font-semibold ${c.severity === "bad" ? "text-bad" : "text-warn"}`}>⚠ {c.title}</p>
          <p className="text-ink-muted">{c.text}</p>
        </li>
      ))}
    </ul>
  );
}
