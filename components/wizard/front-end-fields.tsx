"use client";
// The wizard's fields for how the shunt is built and connected, and for the input filter
// (issue 14): trace geometry, Kelvin or 2-terminal sensing, thermal EMF, and an RC filter
// offered with a starting value for the readout's sample rate.
import { useEffect } from "react";
import { useFormContext, useWatch, type Control } from "react-hook-form";
import { formatSI } from "@/lib/design/format";
import { filterCornerHz, suggestInputFilter } from "@/lib/design/input-filter";
import type { WizardValues } from "@/lib/wizard/form-values";
import { readQuantity, useQuantity } from "@/lib/wizard/use-quantity";
import { FormField, RadioField, SelectField, type LiveErrors } from "./form-field";

// The form drops a field's value when the field leaves the screen (shouldUnregister), so a
// designer who flips between resistor and trace would lose what was typed: keep it per form.
const kept = new WeakMap<Control<WizardValues>, Map<string, unknown>>();

function useKeptValues(names: readonly string[]) {
  const { control, getValues, setValue } = useFormContext<WizardValues>();
  useEffect(() => {
    const store = kept.get(control) ?? new Map<string, unknown>();
    kept.set(control, store);
    for (const n of names) {
      const saved = store.get(n);
      // A remounted field holds its default again: what the designer had typed wins.
      if (saved !== undefined) setValue(n as never, saved as never);
    }
    return () => {
      for (const n of names) store.set(n, getValues(n as never));
    };
    // The names are fixed per component.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [control]);
}

const emfNames = ["shunt.thermalEmf", "shunt.gradient"] as const;
const traceNames = [
  "shunt.trace.width",
  "shunt.trace.length",
  "shunt.trace.thickness",
  "shunt.trace.tolerance",
] as const;
const filterNames = [
  "inputFilter.resistance",
  "inputFilter.capacitance",
  "inputFilter.tolerance",
  "amplifier.offsetCurrent",
] as const;

export function ShuntKindChoice() {
  return (
    <div className="col-span-2">
      <RadioField
        legend="The shunt is"
        name="shunt.kind"
        options={[
          { value: "resistor", label: "A resistor" },
          { value: "copper-trace", label: "A copper trace on the board" },
        ]}
      />
    </div>
  );
}

export function CopperTraceFields({ live }: { live: LiveErrors }) {
  useKeptValues(traceNames);
  return (
    <>
      <p className="col-span-2 text-2xs text-ink-muted">
        The sweep tries every tap-to-tap length on a 0.1 mm grid, from two widths up to the longest you allow. Copper
        reads about +0.39 %/K, and its heating follows IPC-2221 for the width and copper thickness given.
      </p>
      <FormField
        name="shunt.trace.width"
        unit="m"
        label="Trace width"
        placeholder="10 mm"
        extraError={live("shunt.trace.width")}
      />
      <FormField
        name="shunt.trace.length"
        unit="m"
        label="Longest trace the board allows"
        placeholder="40 mm"
        hint="Between the Kelvin taps"
        extraError={live("shunt.trace.length")}
      />
      <FormField
        name="shunt.trace.thickness"
        unit="m"
        label="Copper thickness"
        placeholder="35 µm"
        hint="35 µm is the usual outer-layer foil"
        extraError={live("shunt.trace.thickness")}
      />
      <SelectField
        name="shunt.trace.layer"
        label="Layer"
        hint="An inner layer carries half the current for the same rise"
        options={[
          { value: "external", label: "Outer" },
          { value: "internal", label: "Inner" },
        ]}
      />
      <FormField
        name="shunt.trace.tolerance"
        unit="ratio"
        label="Trace resistance tolerance (optional)"
        kind="optional"
        placeholder="12.5 %"
        hint="Default: copper thickness ±10 % plus ±25 µm of etch on the width"
        extraError={live("shunt.trace.tolerance")}
      />
    </>
  );
}

export function TerminalFields({ live }: { live: LiveErrors }) {
  const terminals = useWatch<WizardValues, "shunt.terminals">({ name: "shunt.terminals" });
  return (
    <>
      <div className="col-span-2">
        <RadioField
          legend="Sensed at"
          name="shunt.terminals"
          options={[
            { value: "4", label: "4 terminals (Kelvin)" },
            { value: "2", label: "2 terminals, across the pads" },
          ]}
        />
      </div>
      {terminals === "2" && <PadField live={live} />}
    </>
  );
}

function PadField({ live }: { live: LiveErrors }) {
  useKeptValues(["shunt.padResistance"]);
  return (
    <FormField
      name="shunt.padResistance"
      unit="Ω"
      label="Pad and solder resistance"
      placeholder="0.5 mΩ"
      hint="Adds to the value the amplifier sees: 0.5 mΩ on 1 mΩ reads 50 % high"
      extraError={live("shunt.padResistance")}
    />
  );
}

export function ThermalEmfFields({ live }: { live: LiveErrors }) {
  useKeptValues(emfNames);
  return (
    <>
      <FormField
        name="shunt.thermalEmf"
        unit="V/K"
        label="Thermal EMF of the shunt's joints"
        kind="optional"
        placeholder="1 µV/K"
        hint="Default: 1 µV/K for a resistor, 0 for a copper trace"
        extraError={live("shunt.thermalEmf")}
      />
      <FormField
        name="shunt.gradient"
        unit="K"
        label="Temperature difference between its ends"
        placeholder="0 K"
        hint="0 K for a symmetrical layout; more if one end sits on a hot part"
        extraError={live("shunt.gradient")}
      />
    </>
  );
}

/** The input filter: off, or a resistor and capacitor per leg, offered from the readout's sample rate. */
export function InputFilterFields({ live }: { live: LiveErrors }) {
  const { setValue, getValues, register } = useFormContext<WizardValues>();
  const on = useWatch<WizardValues, "inputFilterOn">({ name: "inputFilterOn" });
  const r = useWatch<WizardValues, "inputFilter.resistance">({ name: "inputFilter.resistance" });
  const c = useWatch<WizardValues, "inputFilter.capacitance">({ name: "inputFilter.capacitance" });
  const offer = async () => {
    const v = getValues();
    const [fs, offsetV, offsetCurrentA] = await Promise.all([
      v.readout.kind === "adc" ? readQuantity(v.readout.sampleRateHz ?? "1 kHz", "frequency") : 10,
      readQuantity(v.amplifier.offset, "voltage"),
      readQuantity(v.amplifier.offsetCurrent || v.amplifier.biasCurrent, "current"),
    ]);
    const s = suggestInputFilter({
      readoutHz: (fs ?? 1000) / (v.readout.kind === "adc" ? 10 : 1),
      bandwidthMinHz: 0,
      offsetV: offsetV ?? 10e-6,
      offsetCurrentA: offsetCurrentA ?? 20e-9,
    });
    setValue("inputFilter.resistance", formatSI(s.resistance, "Ω"), { shouldDirty: true });
    setValue("inputFilter.capacitance", formatSI(s.capacitance, "F"), { shouldDirty: true });
  };
  const rOhm = useQuantity(r ?? "", "resistance");
  const cF = useQuantity(c ?? "", "capacitance");
  const corner =
    rOhm && cF && rOhm > 0 && cF > 0 ? filterCornerHz({ resistance: rOhm, capacitance: cF, tolerance: 0 }) : null;
  return (
    <fieldset className="col-span-2 grid grid-cols-2 gap-3 rounded border border-line p-3">
      <legend className="px-1 text-xs font-medium text-ink-muted">Input filter</legend>
      <label className="col-span-2 flex items-center gap-2 text-sm">
        <input
          type="checkbox"
          {...register("inputFilterOn", {
            onChange: (e: { target: { checked: boolean } }) => {
              // After the fields mount (and get back any values they had), fill only what is empty.
              if (e.target.checked)
                setTimeout(() => {
                  if (!getValues("inputFilter.resistance")) void offer();
                }, 0);
            },
          })}
        />
        RC filter at the amplifier&apos;s inputs (a resistor in each leg, a capacitor from each leg to ground)
      </label>
      {on && <FilterValues live={live} offer={offer} corner={corner} />}
    </fieldset>
  );
}

function FilterValues({
  live,
  offer,
  corner,
}: {
  live: LiveErrors;
  offer: () => Promise<void>;
  corner: number | null;
}) {
  useKeptValues(filterNames);
  return (
    <>
      <FormField
        name="inputFilter.resistance"
        unit="Ω"
        label="Resistor, each leg"
        placeholder="47 Ω"
        extraError={live("inputFilter.resistance")}
      />
      <FormField
        name="inputFilter.capacitance"
        unit="F"
        label="Capacitor, each leg to ground"
        placeholder="4.7 µF"
        extraError={live("inputFilter.capacitance")}
      />
      <FormField
        name="inputFilter.tolerance"
        unit="ratio"
        label="Filter resistor tolerance"
        placeholder="1 %"
        extraError={live("inputFilter.tolerance")}
      />
      <FormField
        name="amplifier.offsetCurrent"
        unit="A"
        label="Input offset current (optional)"
        kind="optional"
        placeholder="2 nA"
        hint="Default: the bias current, the worst case"
        extraError={live("amplifier.offsetCurrent")}
      />
      <p className="col-span-2 text-2xs text-ink-muted" data-testid="filter-corner">
        {corner !== null ? `Corner ${formatSI(corner, "Hz")} (1/(2π·R·C)). ` : ""}
        It narrows the noise bandwidth; its cost, the bias currents through its resistors (and in a difference stage,
        their share of the input resistors), shows as its own rows in the error budget.{" "}
        <button type="button" className="text-signal underline" onClick={() => void offer()}>
          Start from the suggested values
        </button>{" "}
        (corner at a tenth of the sample rate).
      </p>
    </>
  );
}
