// The compare page's rows for a bidirectional design's other direction: the figures the one-way
// rows take at +Imax (drop, heat, output against the window), at the span's negative end too. The
// engine works them out (signedOutputEnds); a one-way design or a range plan leaves them blank.
import { signedOutputEnds } from "@/lib/design/signed-output";
import type { DesignView } from "@/lib/design-view";
import type { FieldInfo } from "./figures";

export const reverseFields: Record<string, FieldInfo> = {
  reverseCurrentA: { label: "Largest negative current", kind: "si", unit: "A" },
  reverseBurdenV: { label: "Burden at the largest negative current", kind: "si", unit: "V", better: "lower" },
  reverseDissipationW: {
    label: "Shunt dissipation at the largest negative current",
    kind: "si",
    unit: "W",
    better: "lower",
  },
  reverseOutputWorstV: { label: "Output at the largest negative current, worst case", kind: "si", unit: "V" },
  floorRoomV: { label: "Room above the output floor, worst case (negative end)", kind: "si", unit: "V" },
  ceilingRoomV: { label: "Room below the output ceiling, worst case (positive end)", kind: "si", unit: "V" },
};

/** A design's other-direction figures, or nothing for a one-way design or a range plan. */
export function reverseFigures(d: DesignView): Record<keyof typeof reverseFields, number> | Record<string, never> {
  if (d.kind === "plan") return {};
  const ends = signedOutputEnds(d.requirement, d.choice);
  if (!ends) return {};
  return {
    reverseCurrentA: ends.lowCurrentA,
    reverseBurdenV: ends.lowBurdenV,
    reverseDissipationW: ends.lowDissipationW,
    reverseOutputWorstV: ends.lowWorstV,
    floorRoomV: ends.lowMarginV,
    ceilingRoomV: ends.highMarginV,
  };
}
