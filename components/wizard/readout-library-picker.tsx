"use client";

// The readout step's "Fill from the team library": a library ADC or meter range fills the readout's
// kind, scale and its own error figures (lib/wizard/library.ts); any figure can still be changed.
import { useFormContext } from "react-hook-form";
import type { ReadoutPart } from "@/lib/wizard/draft";
import type { WizardValues } from "@/lib/wizard/form-values";
import { libraryAdcValues, libraryMeterValues } from "@/lib/wizard/library";
import { LibraryPicker, useLibrary } from "./library-picker";

type Row = { id: string; name: string; label: string; values: WizardValues["readout"] };

/** Leaf paths of the readout's values ("readout.reference.tolerance"), for setValue one field at a time. */
function leaves(prefix: string, value: unknown): [string, unknown][] {
  if (typeof value !== "object" || value === null || Array.isArray(value)) return [[prefix, value]];
  return Object.entries(value).flatMap(([k, v]) => leaves(`${prefix}.${k}`, v));
}

/** `picked`: the part the readout was filled from, kept in the wizard's draft across reloads. */
export function ReadoutLibraryPicker({
  picked,
  setPicked,
}: {
  picked: ReadoutPart | null;
  setPicked: (p: ReadoutPart | null) => void;
}) {
  const { setValue } = useFormContext<WizardValues>();
  const library = useLibrary();
  const rows: Row[] = [
    ...(library.data?.adcs ?? []).map((a) => ({
      id: a.id,
      name: a.name,
      label: `ADC: ${a.name}`,
      values: libraryAdcValues(a),
    })),
    ...(library.data?.meters ?? []).map((m) => ({
      id: m.id,
      name: m.name,
      label: `Meter: ${m.name}`,
      values: libraryMeterValues(m),
    })),
  ];
  const pick = (row: Row | undefined) => {
    setPicked(row ? { id: row.id, name: row.name } : null);
    if (!row) return;
    setValue("readout.kind", row.values.kind, { shouldDirty: true });
    // Let the chosen kind's inputs mount before filling them (as the amplifier step does).
    setTimeout(() => {
      const { kind: _kind, ...figures } = row.values;
      for (const [path, v] of leaves("readout", figures))
        setValue(path as never, v as never, { shouldValidate: true, shouldDirty: true });
    }, 0);
  };
  return (
    <LibraryPicker
      id="f-library-readout"
      rows={rows}
      value={rows.find((r) => r.id === picked?.id)?.id ?? ""}
      onPick={pick}
      loading={library.isLoading}
      noneText="— Type the readout below —"
      emptyText="No ADCs or meter ranges in the library yet"
      optionLabel={(r) => r.label}
      note={
        <p className="text-2xs text-ink-faint">
          {library.isError
            ? "The team library could not be read; type the readout below."
            : picked
              ? `Filled from "${picked.name}", its own error included; any figure can still be changed.`
              : "A library part also fills the readout's own error from its data sheet."}
        </p>
      }
    />
  );
}
