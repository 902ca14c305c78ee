// One line of a design's parts list (the sheet, the CSV and the design page).
export type Part = {
  designator: string;
  part: string;
  value: string;
  tolerance: string;
  tempco: string;
  rating: string;
  notes: string;
  /** The value in SI base units, for scripts (null where a part has no single value). */
  valueSI: number | null;
  unit: string | null;
  /** A resistor's IEC 60062 letter-and-digit code ("4K7"); null for other parts and a copper trace. */
  code: string | null;
};
