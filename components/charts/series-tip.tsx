// Tooltip body for charts with several line series: one figure per series at the nearest point.
import type { ReactNode } from "react";

export function SeriesTip<D>({
  title,
  byKey,
  skip = [],
  value,
}: {
  title: ReactNode;
  byKey: Record<string, { datum: D }>;
  skip?: string[];
  value: (d: D) => string;
}) {
  return (
    <div className="num text-2xs leading-4">
      <p className="font-semibold">{title}</p>
      {Object.entries(byKey)
        .filter(([k]) => !skip.includes(k))
        .map(([k, d]) => (
          <p key={k}>
            {k}: {value(d.datum)}
          </p>
        ))}
    </div>
  );
}
