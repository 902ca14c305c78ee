// Which range a plan's recording was read on, stretch by stretch: a band along the top of the
// current plot and a light tint over the plot, each range in its own colour (the Okabe–Ito set the
// budget bars use, lightness apart) AND its own pattern and label, so colour is never the only cue.
import { budgetColours } from "@/components/charts/palette";
import type { RangeStretch } from "@/lib/profile/plan-series";

const BAND_H = 14;
/** Patterns per range: plain, diagonal hatch, cross-hatch (a reader tells them apart without colour). */
const patternOf = (k: number) => `range-pattern-${k % 3}`;
export const rangeColour = (k: number) =>
  `light-dark(${budgetColours.light[k % budgetColours.light.length]}, ${budgetColours.dark[k % budgetColours.dark.length]})`;

export function RangePatterns() {
  return (
    <>
      <pattern id="range-pattern-0" width="6" height="6" patternUnits="userSpaceOnUse">
        <circle cx="3" cy="3" r="0.9" fill="currentColor" />
      </pattern>
      <pattern id="range-pattern-1" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
        <line x1="0" y1="0" x2="0" y2="6" stroke="currentColor" strokeWidth="1.4" />
      </pattern>
      <pattern id="range-pattern-2" width="6" height="6" patternUnits="userSpaceOnUse">
        <path d="M0,0 L6,6 M6,0 L0,6" stroke="currentColor" strokeWidth="1" />
      </pattern>
    </>
  );
}

export function RangeBands({
  stretches,
  x,
  top,
  height,
}: {
  stretches: RangeStretch[];
  x: (t: number) => number;
  top: number;
  height: number;
}) {
  return (
    <g data-testid="range-bands" pointerEvents="none">
      {stretches.map((s, k) => {
        const a = x(s.fromS);
        const w = Math.max(1, x(s.toS) - a);
        const colour = rangeColour(s.range);
        return (
          <g key={k} data-range={s.range + 1}>
            <rect x={a} y={top} width={w} height={height} style={{ fill: colour, opacity: 0.08 }} />
            <rect x={a} y={top} width={w} height={BAND_H} style={{ fill: colour, opacity: 0.55 }} />
            <rect
              x={a}
              y={top}
              width={w}
              height={BAND_H}
              fill={`url(#${patternOf(s.range)})`}
              style={{ color: "rgb(255 255 255 / 0.7)" }}
            />
            {w >= 22 && (
              <text x={a + w / 2} y={top + 10} textAnchor="middle" className="fill-ink text-[9px] font-semibold">
                {`R${s.range + 1}`}
              </text>
            )}
          </g>
        );
      })}
    </g>
  );
}

/** The key's swatch for a range: its colour, its pattern and its name. */
export function RangeSwatch({ range }: { range: number }) {
  return (
    <svg width="18" height="12" aria-hidden="true" className="inline-block">
      <defs>
        <RangePatterns />
      </defs>
      <rect width="18" height="12" style={{ fill: rangeColour(range), opacity: 0.55 }} />
      <rect width="18" height="12" fill={`url(#${patternOf(range)})`} style={{ color: "rgb(255 255 255 / 0.7)" }} />
    </svg>
  );
}
