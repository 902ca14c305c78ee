// Why a pair is rejected, in the constraint order and in words: a module without the model, so a
// screen that only names the reasons (figures, the rejection list) does not download the engine.

/** Constraint order: a rejected pair is counted under the first one it fails. */
export const rejectReasons = [
  "drop",
  "commonMode",
  "output",
  "counts",
  "power",
  "bandwidth",
  "accuracy",
  "deadZone",
] as const;
export type RejectReason = (typeof rejectReasons)[number];

export const rejectReasonLabels: Record<RejectReason, string> = {
  drop: "Drop over the limit, or load voltage under its minimum",
  commonMode: "Amplifier inputs outside their common-mode range (or a single-ended stage on the high side)",
  output: "Output, with its worst-case errors, beyond the readout's full scale or the amplifier's swing",
  counts: "Too few steps the readout can tell apart (through the noise) at the minimum current",
  power: "Dissipation beyond the largest rating on offer at the hottest ambient, or the shunt too hot",
  bandwidth: "Bandwidth short of the requirement",
  accuracy: "Accuracy target missed in the accuracy band",
  deadZone: "Dead zone (output stuck at its floor, offset included) above the minimum current",
};
