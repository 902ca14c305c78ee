// Point shapes that tell gains apart on the trade-off chart (shape and shade both change).
export const shapeNames = ["circle", "square", "triangle", "diamond", "cross", "down", "hexagon", "bar"] as const;
export type ShapeName = (typeof shapeNames)[number];

export function Shape({
  shape,
  x,
  y,
  r,
  fill,
  stroke,
  strokeWidth = 1,
}: {
  shape: ShapeName;
  x: number;
  y: number;
  r: number;
  fill: string;
  stroke?: string;
  strokeWidth?: number;
}) {
  const common = { fill, stroke: stroke ?? "none", strokeWidth };
  switch (shape) {
    case "circle":
      return <circle cx={x} cy={y} r={r} {...common} />;
    case "square":
      return <rect x={x - r * 0.85} y={y - r * 0.85} width={r * 1.7} height={r * 1.7} {...common} />;
    case "triangle":
      return <path d={`M${x},${y - r * 1.1}L${x + r},${y + r * 0.7}L${x - r},${y + r * 0.7}Z`} {...common} />;
    case "down":
      return <path d={`M${x},${y + r * 1.1}L${x + r},${y - r * 0.7}L${x - r},${y - r * 0.7}Z`} {...common} />;
    case "diamond":
      return <path d={`M${x},${y - r * 1.2}L${x + r},${y}L${x},${y + r * 1.2}L${x - r},${y}Z`} {...common} />;
    case "cross": {
      const w = r * 0.45;
      return (
        <path
          d={`M${x - w},${y - r}h${2 * w}v${r - w}h${r - w}v${2 * w}h${w - r}v${r - w}h${-2 * w}v${w - r}h${w - r}v${-2 * w}h${r - w}Z`}
          {...common}
        />
      );
    }
    case "hexagon": {
      const pts = Array.from(
        { length: 6 },
        (_, k) => `${x + r * Math.cos((Math.PI / 3) * k)},${y + r * Math.sin((Math.PI / 3) * k)}`,
      ).join(" ");
      return <polygon points={pts} {...common} />;
    }
    case "bar":
      return <rect x={x - r} y={y - r * 0.45} width={r * 2} height={r * 0.9} {...common} />;
  }
}

/** A legend swatch. */
export function ShapeIcon({ shape, fill }: { shape: ShapeName; fill: string }) {
  return (
    <svg width="12" height="12" aria-hidden="true" className="shrink-0">
      <Shape shape={shape} x={6} y={6} r={4.5} fill={fill} />
    </svg>
  );
}
