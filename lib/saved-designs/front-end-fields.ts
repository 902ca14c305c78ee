// The compare page's rows for issue 14's fields: how the shunt is built and sensed, the input
// filter, and the figures a candidate reports about them.
/** The shape of figures.ts's FieldInfo, written out so the two files do not import each other. */
type FieldInfo = {
  label: string;
  kind: "si" | "fraction" | "text" | "count";
  unit?: string;
  better?: "lower" | "higher";
};

export const frontEndRequirementFields: Record<string, FieldInfo> = {
  "shunt.kind": { label: "Shunt built as", kind: "text" },
  "shunt.trace.width": { label: "Trace width", kind: "si", unit: "m" },
  "shunt.trace.length": { label: "Longest trace allowed", kind: "si", unit: "m" },
  "shunt.trace.thickness": { label: "Copper thickness", kind: "si", unit: "m" },
  "shunt.trace.layer": { label: "Trace layer", kind: "text" },
  "shunt.trace.tolerance": { label: "Trace resistance tolerance", kind: "fraction" },
  "shunt.terminals": { label: "Shunt terminals", kind: "count" },
  "shunt.padResistance": { label: "Pad and solder resistance", kind: "si", unit: "Ω" },
  "shunt.thermalEmf": { label: "Thermal EMF of the shunt's joints", kind: "si", unit: "V/K" },
  "shunt.gradient": { label: "Temperature difference across the shunt", kind: "si", unit: "K" },
  "inputFilter.resistance": { label: "Input filter resistor (each leg)", kind: "si", unit: "Ω" },
  "inputFilter.capacitance": { label: "Input filter capacitor (each leg)", kind: "si", unit: "F" },
  "inputFilter.tolerance": { label: "Input filter resistor tolerance", kind: "fraction" },
  "amplifier.offsetCurrent": { label: "Input offset current", kind: "si", unit: "A" },
};

export const frontEndMetricFields: Record<string, FieldInfo> = {
  inputFilterCornerHz: { label: "Input filter corner", kind: "si", unit: "Hz" },
  traceLengthM: { label: "Trace length between the Kelvin taps", kind: "si", unit: "m" },
  thermalEmfV: { label: "Thermal EMF at the stated gradient", kind: "si", unit: "V", better: "lower" },
};
