// The engine's safety cautions for one design (lib/design/cautions.ts), the same list the build
// sheet prints: hazards as boxes, the notes every build needs as a short list beneath.
import type { Caution } from "@/lib/design/cautions";

export function Cautions({ cautions }: { cautions: Caution[] }) {
  if (cautions.length === 0) return null;
  const hazards = cautions.filter((c) => c.severity !== "note");
  const notes = cautions.filter((c) => c.severity === "note");
  return (
    <div className="flex flex-col gap-2" aria-label="Cautions" role="group">
      {hazards.length > 0 && (
        <ul className="flex flex-col gap-2">
          {hazards.map((c) => (
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
      )}
      <ul className="list-disc space-y-0.5 pl-5 text-xs text-ink-muted">
        {notes.map((c) => (
          <li key={c.key} data-testid={`caution-${c.key}`}>
            <span className="font-semibold text-ink">{c.title}.</span> {c.text}
          </li>
        ))}
      </ul>
    </div>
  );
}
