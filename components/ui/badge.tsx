import type { ReactNode } from "react";

type Tone = "neutral" | "copper" | "signal" | "good" | "warn" | "bad";

const tones: Record<Tone, string> = {
  neutral: "bg-sunken text-ink-muted border-line",
  copper: "bg-copper-soft text-copper-strong border-copper/30",
  signal: "bg-signal-soft text-signal border-signal/30",
  good: "bg-good/10 text-good border-good/30",
  warn: "bg-warn/10 text-warn border-warn/30",
  bad: "bg-bad/10 text-bad border-bad/30",
};

export function Badge({ tone = "neutral", children }: { tone?: Tone; children: ReactNode }) {
  return (
    <span className={`inline-flex items-center rounded border px-1.5 py-0.5 text-2xs font-medium ${tones[tone]}`}>
      {children}
    </span>
  );
}
