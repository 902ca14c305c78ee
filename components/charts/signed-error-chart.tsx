"use client";
// Error against current over a span: one log–log panel for a one-way span; two for a signed span,
// the negative direction by magnitude beside the positive one (zero current has no % of reading).
import { ErrorCurveChart, type ErrorSeries } from "./error-curve-chart";

type Props = { series: ErrorSeries[]; targetPercent: number; bandMinA: number; bandMaxA: number };

const side = (series: ErrorSeries[], negative: boolean): ErrorSeries[] =>
  series.map((s) => ({
    ...s,
    points: s.points
      .filter((p) => (negative ? p.currentA < 0 : p.currentA > 0))
      .map((p) => (negative ? { ...p, currentA: -p.currentA } : p))
      .sort((a, b) => a.currentA - b.currentA),
  }));

export function SpanErrorChart(props: Props) {
  const signed = props.series.some((s) => s.points.some((p) => p.currentA < 0));
  if (!signed) return <ErrorCurveChart {...props} />;
  const neg = side(props.series, true);
  const top = Math.max(...neg.flatMap((s) => s.points.map((p) => p.currentA)));
  return (
    <div className="grid grid-cols-1 gap-3 lg:grid-cols-2" data-testid="signed-error-chart">
      <figure>
        <figcaption className="mb-1 text-2xs font-medium text-ink-muted">
          Negative direction (I &lt; 0), by magnitude
        </figcaption>
        <ErrorCurveChart {...props} series={neg} bandMaxA={Math.min(props.bandMaxA, top)} negative />
      </figure>
      <figure>
        <figcaption className="mb-1 text-2xs font-medium text-ink-muted">Positive direction (I &gt; 0)</figcaption>
        <ErrorCurveChart {...props} series={side(props.series, false)} />
      </figure>
    </div>
  );
}
