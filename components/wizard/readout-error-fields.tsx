"use client";
// The wizard's fields for the readout's own error, the calibration, and a bidirectional span's
// zero-current output level (issue 14). A blank readout figure is read with its class of part's
// typical figure (lib/design/readout-error.ts, from memory), shown as the box's placeholder; one
// button writes those figures in, to edit them into the part's own.
import { useFormContext } from "react-hook-form";
import {
  calibrationLabels,
  calibrations,
  DEFAULT_ADC_GAIN_ERROR,
  DEFAULT_ADC_INL_LSB,
  DEFAULT_ADC_OFFSET_LSB,
  DEFAULT_ADC_REFERENCE,
  DEFAULT_METER_ACCURACY,
  readoutClassNames,
} from "@/lib/design/readout-error";
import { DEFAULT_ZERO_REFERENCE } from "@/lib/design/bidirectional";
import type { WizardValues } from "@/lib/wizard/form-values";
import { FormField, SelectField, type LiveErrors } from "./form-field";

/** A blank box is "not stated"; anything else is read as a number of LSB or counts. */
const optionalNumber = (v: unknown) =>
  typeof v === "string" && v.trim() === "" ? undefined : typeof v === "string" ? Number(v) : v;

const pct = (x: number) => `${Number((x * 100).toPrecision(3))} %`;
const ppm = (x: number) => `${Number((x * 1e6).toPrecision(3))} ppm/K`;

export const typicalAdc = {
  reference: { tolerance: pct(DEFAULT_ADC_REFERENCE.tolerance), tempco: ppm(DEFAULT_ADC_REFERENCE.tempco) },
  offsetLsb: String(DEFAULT_ADC_OFFSET_LSB),
  gainError: pct(DEFAULT_ADC_GAIN_ERROR),
  inlLsb: String(DEFAULT_ADC_INL_LSB),
};
export const typicalMeter = {
  accuracy: {
    percentOfReading: pct(DEFAULT_METER_ACCURACY.percentOfReading),
    digits: String(DEFAULT_METER_ACCURACY.digits),
  },
};

export function ReadoutErrorFields({ kind, live }: { kind: "adc" | "meter"; live: LiveErrors }) {
  const { setValue } = useFormContext<WizardValues>();
  const fill = () => {
    const pairs: [string, string][] =
      kind === "adc"
        ? [
            ["readout.reference.tolerance", typicalAdc.reference.tolerance],
            ["readout.reference.tempco", typicalAdc.reference.tempco],
            ["readout.offsetLsb", typicalAdc.offsetLsb],
            ["readout.gainError", typicalAdc.gainError],
            ["readout.inlLsb", typicalAdc.inlLsb],
          ]
        : [
            ["readout.accuracy.percentOfReading", typicalMeter.accuracy.percentOfReading],
            ["readout.accuracy.digits", typicalMeter.accuracy.digits],
          ];
    for (const [k, v] of pairs) setValue(k as never, v as never, { shouldValidate: true, shouldDirty: true });
  };
  return (
    <fieldset className="col-span-2 grid grid-cols-2 gap-3 rounded border border-line p-3" data-testid="readout-error">
      <legend className="px-1 text-xs font-medium text-ink">
        {kind === "adc" ? "The converter's own error" : "The meter's stated accuracy"}
      </legend>
      <p className="col-span-2 text-2xs text-ink-muted">
        A blank box is read with the figure shown in it, typical of {readoutClassNames[kind]} (from memory), and the
        budget marks it &ldquo;not stated&rdquo;. Type your part&apos;s figures from its data sheet; 0 counts an ideal
        part.{" "}
        <button type="button" onClick={fill} className="text-copper-strong underline underline-offset-2">
          Fill typical figures
        </button>
      </p>
      {kind === "adc" ? (
        <>
          <FormField
            name="readout.reference.tolerance"
            label="Reference tolerance"
            kind="optional"
            placeholder={typicalAdc.reference.tolerance}
            hint="Initial accuracy of the ADC's voltage reference"
            extraError={live("readout.reference.tolerance")}
          />
          <FormField
            name="readout.reference.tempco"
            label="Reference tempco"
            kind="optional"
            placeholder={typicalAdc.reference.tempco}
            extraError={live("readout.reference.tempco")}
          />
          <FormField
            name="readout.offsetLsb"
            label="Offset error"
            transform={optionalNumber}
            suffix="LSB"
            placeholder={typicalAdc.offsetLsb}
            extraError={live("readout.offsetLsb")}
          />
          <FormField
            name="readout.gainError"
            label="Gain error (reference excluded)"
            kind="optional"
            placeholder={typicalAdc.gainError}
            extraError={live("readout.gainError")}
          />
          <FormField
            name="readout.inlLsb"
            label="Integral nonlinearity (INL)"
            transform={optionalNumber}
            suffix="LSB"
            placeholder={typicalAdc.inlLsb}
            extraError={live("readout.inlLsb")}
          />
        </>
      ) : (
        <>
          <FormField
            name="readout.accuracy.percentOfReading"
            label="Accuracy, % of reading"
            kind="optional"
            placeholder={typicalMeter.accuracy.percentOfReading}
            extraError={live("readout.accuracy.percentOfReading")}
          />
          <FormField
            name="readout.accuracy.digits"
            label="Accuracy, digits"
            transform={optionalNumber}
            suffix="counts"
            placeholder={typicalMeter.accuracy.digits}
            hint="The ± counts of the last digit in the meter's spec"
            extraError={live("readout.accuracy.digits")}
          />
        </>
      )}
      <div className="col-span-2">
        <SelectField
          name="calibration"
          label="Calibration before use"
          options={calibrations.map((c) => ({ value: c, label: calibrationLabels[c] }))}
          hint="What a calibration at 25 °C takes out of the budget; drift, INL and noise stay"
        />
      </div>
    </fieldset>
  );
}

/** A bidirectional span's zero-current output level (the amplifier's reference input). */
export function ZeroLevelFields({ live }: { live: LiveErrors }) {
  return (
    <fieldset
      className="col-span-2 grid grid-cols-1 gap-3 rounded border border-line p-3 sm:grid-cols-3"
      data-testid="zero-level"
    >
      <legend className="px-1 text-xs font-medium text-ink">Zero-current output level (bidirectional spans)</legend>
      <p className="text-2xs text-ink-muted sm:col-span-3">
        With a negative minimum current the output sits at this level at zero current and swings both ways. Blank:
        placed in the output window in proportion to the two directions.
      </p>
      <FormField
        name="amplifier.reference.voltage"
        unit="V"
        label="Reference voltage"
        kind="optional"
        placeholder="auto"
        extraError={live("amplifier.reference.voltage")}
      />
      <FormField
        name="amplifier.reference.tolerance"
        label="Reference tolerance"
        placeholder={pct(DEFAULT_ZERO_REFERENCE.tolerance)}
        extraError={live("amplifier.reference.tolerance")}
      />
      <FormField
        name="amplifier.reference.tempco"
        label="Reference tempco"
        placeholder={ppm(DEFAULT_ZERO_REFERENCE.tempco)}
        extraError={live("amplifier.reference.tempco")}
      />
    </fieldset>
  );
}
