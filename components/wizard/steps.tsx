"use client";
// The wizard's steps: what each asks for, and which fields it checks before moving on.
import { useState } from "react";
import { useFormContext, useWatch } from "react-hook-form";
import { seriesNames } from "@/lib/design/eseries";
import { topologies, topologyLabels } from "@/lib/design/requirement-options";
import type { ReadoutPart } from "@/lib/wizard/draft";
import type { WizardValues } from "@/lib/wizard/form-values";
import { LibraryPicker, useLibrary } from "./library-picker";
import {
  libraryAmplifierValues,
  libraryShuntValues,
  type LibraryAmplifierRow,
  type LibraryShuntRow,
} from "@/lib/wizard/library";
import { Choice, FormField, RadioField, SelectField, type LiveErrors } from "./form-field";
import {
  CopperTraceFields,
  InputFilterFields,
  ShuntKindChoice,
  TerminalFields,
  ThermalEmfFields,
} from "./front-end-fields";
import { ReadoutErrorFields, ZeroLevelFields } from "./readout-error-fields";
import { ReadoutLibraryPicker } from "./readout-library-picker";

export type StepKey = "span" | "supply" | "readout" | "shunt" | "amplifier" | "temperature";

export type StepDef = { key: StepKey; title: string; blurb: string; fields: string[] };

export const steps: StepDef[] = [
  {
    key: "span",
    title: "Current span",
    blurb: "The smallest and largest current the front end must read.",
    fields: ["current", "load"],
  },
  {
    key: "supply",
    title: "Supply and drop",
    blurb: "How much of the supply the shunt may take from the load.",
    fields: ["supply", "drop"],
  },
  {
    key: "readout",
    title: "Readout",
    blurb: "What reads the amplifier's output, and how well.",
    fields: ["readout", "resolution", "accuracy", "calibration"],
  },
  {
    key: "shunt",
    title: "Shunt",
    blurb: "The resistor values and ratings the sweep may use, or the copper trace; how it is sensed.",
    fields: ["shunt", "limit"],
  },
  {
    key: "amplifier",
    title: "Amplifier",
    blurb: "Gains to sweep, the amplifier's imperfections and its input filter.",
    fields: ["amplifier", "inputFilter"],
  },
  {
    key: "temperature",
    title: "Temperature",
    blurb: "The ambient range the figures must hold over.",
    fields: ["temperature"],
  },
];

const loadOptions = [
  { value: "constant-current", label: "Constant current (draws the same current whatever its voltage)" },
  { value: "resistive", label: "Resistive (current falls with its voltage)" },
  { value: "constant-power", label: "Constant power (a regulator: current rises as voltage falls)" },
];

/** Plain numbers typed into the percent box mean percent. */
const asPercent = (v: unknown) =>
  typeof v === "string" && /^\s*[+-]?(\d+\.?\d*|\.\d+)\s*$/.test(v)
    ? `${v.trim()} %`
    : typeof v === "string" && v.trim() === ""
      ? undefined
      : v;

export function SpanStep({ live }: { live: LiveErrors }) {
  return (
    <div className="grid grid-cols-2 gap-3">
      <FormField
        name="current.min"
        unit="A"
        label="Minimum current"
        placeholder="3 uA"
        hint="e.g. 3 uA (sleep current); below zero for a bidirectional span, e.g. −20 A of charge"
        extraError={live("current.min")}
      />
      <FormField
        name="current.max"
        unit="A"
        label="Maximum current"
        placeholder="180 mA"
        hint="e.g. 180 mA (peak)"
        extraError={live("current.max")}
      />
      <FormField
        name="current.typical"
        unit="A"
        label="Typical current (optional)"
        kind="optional"
        placeholder="20 mA"
        hint="Adds the error at this current to the figures"
      />
      <div className="col-span-2">
        <SelectField
          name="load.model"
          label="Load behaviour"
          options={loadOptions}
          hint="Decides how the drop changes the current itself"
        />
      </div>
    </div>
  );
}

export function SupplyStep({
  live,
  dropMode,
  setDropMode,
}: {
  live: LiveErrors;
  dropMode: "volts" | "share";
  setDropMode: (m: "volts" | "share") => void;
}) {
  return (
    <div className="grid grid-cols-2 gap-3">
      <FormField
        name="supply.voltage"
        unit="V"
        label="Supply voltage"
        placeholder="3.0 V"
        extraError={live("supply.voltage")}
      />
      <RadioField
        legend="Shunt position"
        name="supply.side"
        options={[
          { value: "low", label: "Low side (return)" },
          { value: "high", label: "High side (supply)" },
        ]}
      />
      <div className="col-span-2 flex flex-col gap-2">
        <Choice
          legend="Allowed drop given as"
          name="drop-mode"
          value={dropMode}
          onChange={setDropMode}
          options={[
            { value: "volts", label: "Volts" },
            { value: "share", label: "Share of supply" },
          ]}
        />
        {dropMode === "volts" ? (
          <FormField
            name="drop.max"
            unit="V"
            label="Allowed drop"
            placeholder="60 mV"
            hint="Largest voltage the shunt may take at the maximum current"
            extraError={live("drop.max")}
          />
        ) : (
          <FormField
            name="drop.fraction"
            label="Allowed drop (share of supply)"
            transform={asPercent}
            placeholder="2 %"
            hint="A percentage of the supply voltage, e.g. 2 %"
            extraError={live("drop.fraction")}
          />
        )}
      </div>
      <FormField
        name="drop.loadMin"
        unit="V"
        label="Minimum load voltage (optional)"
        kind="optional"
        placeholder="2.7 V"
        hint="The lowest voltage the load still works at"
        extraError={live("drop.loadMin")}
      />
    </div>
  );
}

export function ReadoutStep({
  live,
  readoutPart,
  setReadoutPart,
}: {
  live: LiveErrors;
  readoutPart: ReadoutPart | null;
  setReadoutPart: (p: ReadoutPart | null) => void;
}) {
  const kind = useWatch<WizardValues, "readout.kind">({ name: "readout.kind" });
  return (
    <div className="grid grid-cols-2 gap-3">
      <ReadoutLibraryPicker picked={readoutPart} setPicked={setReadoutPart} />
      <div className="col-span-2">
        <RadioField
          legend="Read by"
          name="readout.kind"
          options={[
            { value: "adc", label: "A converter (ADC)" },
            { value: "meter", label: "A bench meter's voltage range" },
          ]}
        />
      </div>
      {kind === "meter" ? (
        <>
          <FormField
            name="readout.fullScale"
            unit="V"
            label="Meter range (full scale)"
            placeholder="200 mV"
            extraError={live("readout.fullScale")}
          />
          <FormField
            name="readout.counts"
            label="Meter counts"
            kind="number"
            placeholder="2000"
            hint="Counts across the range, e.g. 2000"
            extraError={live("readout.counts")}
          />
        </>
      ) : (
        <>
          <FormField
            name="readout.fullScale"
            unit="V"
            label="ADC full scale"
            placeholder="2.5 V"
            extraError={live("readout.fullScale")}
          />
          <FormField
            name="readout.bits"
            label="ADC resolution (bits)"
            kind="number"
            placeholder="12"
            extraError={live("readout.bits")}
          />
          <FormField
            name="readout.sampleRateHz"
            label="ADC sample rate"
            placeholder="1 kHz"
            hint="Its anti-alias filter is taken at half this; it bounds the noise"
            extraError={live("readout.sampleRateHz")}
          />
        </>
      )}
      <ReadoutErrorFields kind={kind === "meter" ? "meter" : "adc"} live={live} />
      <FormField
        name="resolution.countsAtMin"
        label="Counts wanted at minimum current"
        kind="number"
        placeholder="10"
        hint="Readout steps the smallest current must span"
        extraError={live("resolution.countsAtMin")}
      />
      <FormField
        name="accuracy.percent"
        label="Accuracy target"
        kind="quantity"
        suffix="% of reading"
        placeholder="2"
        extraError={live("accuracy.percent")}
      />
      <FormField
        name="accuracy.bandMin"
        unit="A"
        label="Accuracy band from (optional)"
        kind="optional"
        placeholder="18 mA"
        hint="Default: the larger of the minimum and a tenth of the maximum"
        extraError={live("accuracy.bandMin")}
      />
      <FormField
        name="accuracy.bandMax"
        unit="A"
        label="Accuracy band to (optional)"
        kind="optional"
        placeholder="180 mA"
        hint="Default: the maximum current"
        extraError={live("accuracy.bandMax")}
      />
    </div>
  );
}

/** How many candidates the table lists: the same field on both kinds of shunt. */
function CandidateLimitField({ live }: { live: LiveErrors }) {
  return (
    <FormField
      name="limit"
      label="Candidates listed"
      kind="number"
      placeholder="200"
      hint="The front, then the best of the rest"
      extraError={live("limit")}
    />
  );
}

export function ShuntStep({ live }: { live: LiveErrors }) {
  const { setValue } = useFormContext<WizardValues>();
  const library = useLibrary();
  const shunts = library.data?.shunts ?? [];
  const [picked, setPicked] = useState("");
  const pick = (row: LibraryShuntRow | undefined) => {
    setPicked(row?.id ?? "");
    if (!row) return;
    for (const [k, val] of Object.entries(libraryShuntValues(row))) {
      if (val !== undefined) setValue(`shunt.${k}` as never, val as never, { shouldValidate: true, shouldDirty: true });
    }
  };
  const kind = useWatch<WizardValues, "shunt.kind">({ name: "shunt.kind" });
  // Distinct keys: React must not hand one branch's input boxes (and their typed text) to the other.
  if (kind === "copper-trace")
    return (
      <div key="copper-trace" className="grid grid-cols-2 gap-3">
        <ShuntKindChoice />
        <CopperTraceFields live={live} />
        <ThermalEmfFields live={live} />
        <CandidateLimitField live={live} />
      </div>
    );
  return (
    <div key="resistor" className="grid grid-cols-2 gap-3">
      <ShuntKindChoice />
      <LibraryPicker
        id="f-library-shunt"
        rows={shunts}
        value={picked}
        onPick={pick}
        loading={library.isLoading}
        noneText="— Type the shunt family below —"
        emptyText="No shunt families in the library yet"
        optionLabel={(s) => `${s.name}${s.fourTerminal ? " (4-terminal)" : ""}`}
        note={
          library.isError && (
            <p className="text-2xs text-ink-faint">The team library could not be read; type the shunt family below.</p>
          )
        }
      />
      <SelectField
        name="shunt.series"
        label="E-series (IEC 60063)"
        options={seriesNames.map((s) => ({ value: s, label: s }))}
      />
      <FormField
        name="shunt.tolerance"
        unit="ratio"
        label="Shunt tolerance"
        placeholder="0.5 %"
        extraError={live("shunt.tolerance")}
      />
      <FormField name="shunt.min" unit="Ω" label="Smallest shunt" placeholder="1 mohm" extraError={live("shunt.min")} />
      <FormField name="shunt.max" unit="Ω" label="Largest shunt" placeholder="1 kohm" extraError={live("shunt.max")} />
      <FormField
        name="shunt.tempco"
        unit="1/K"
        label="Shunt tempco"
        placeholder="50 ppm/K"
        extraError={live("shunt.tempco")}
      />
      <FormField
        name="shunt.derating"
        label="Share of rating used"
        kind="number"
        placeholder="0.5"
        hint="0.5 uses at most half the rating"
        extraError={live("shunt.derating")}
      />
      <FormField
        name="shunt.deratingKneeC"
        label="Full power up to (ambient)"
        placeholder="70 °C"
        hint="The derating curve's knee"
        extraError={live("shunt.deratingKneeC")}
      />
      <FormField
        name="shunt.maxTempC"
        label="Shunt maximum temperature"
        placeholder="155 °C"
        hint="No power left at this ambient; the hot spot may not pass it"
        extraError={live("shunt.maxTempC")}
      />
      <div className="col-span-2">
        <FormField
          name="shunt.ratings"
          label="Power ratings on offer"
          kind="list"
          placeholder="0.125 W, 0.25 W, 0.5 W, 1 W"
          hint="Separate with commas"
          extraError={live("shunt.ratings")}
        />
      </div>
      <TerminalFields live={live} />
      <ThermalEmfFields live={live} />
      <CandidateLimitField live={live} />
    </div>
  );
}

export function AmplifierStep({
  live,
  gainMode,
  setGainMode,
  partName,
  setPartName,
}: {
  live: LiveErrors;
  gainMode: "list" | "pair";
  setGainMode: (m: "list" | "pair") => void;
  partName: string | null;
  setPartName: (n: string | null) => void;
}) {
  const { setValue } = useFormContext<WizardValues>();
  const library = useLibrary();
  const amps = library.data?.amplifiers ?? [];
  const pick = (row: LibraryAmplifierRow | undefined) => {
    if (!row) {
      setPartName(null);
      return;
    }
    const v = libraryAmplifierValues(row);
    setGainMode(v.gainSet ? "pair" : "list");
    // Let the gain inputs of the chosen mode mount before filling them.
    setTimeout(() => {
      for (const [k, val] of Object.entries(v)) {
        if (val !== undefined)
          setValue(`amplifier.${k}` as never, val as never, { shouldValidate: true, shouldDirty: true });
      }
    }, 0);
    setPartName(row.name);
  };
  return (
    <div className="grid grid-cols-2 gap-3">
      <LibraryPicker
        id="f-library-amp"
        rows={amps}
        value={amps.find((a) => a.name === partName)?.id ?? ""}
        onPick={pick}
        loading={library.isLoading}
        noneText="— Type the specification below —"
        emptyText="No amplifiers in the library yet"
        note={
          <p className="text-2xs text-ink-faint">
            {library.isError
              ? "The team library could not be read; type the specification below."
              : partName
                ? `Filled from "${partName}"; any figure can still be changed.`
                : "Or type the amplifier's specification below."}
          </p>
        }
      />
      <div className="col-span-2">
        <Choice
          legend="Gains to sweep"
          name="gain-mode"
          value={gainMode}
          onChange={setGainMode}
          options={[
            { value: "list", label: "A list of fixed gains" },
            { value: "pair", label: "1 + Rf/Rg from a resistor series" },
          ]}
        />
      </div>
      {gainMode === "list" ? (
        <div className="col-span-2">
          <FormField
            name="amplifier.gains"
            label="Gains"
            kind="numberList"
            placeholder="10, 20, 50, 100, 200"
            hint="Separate with commas"
            extraError={live("amplifier.gains")}
          />
        </div>
      ) : (
        <>
          <SelectField
            name="amplifier.gainSet.series"
            label="Resistor series for Rf and Rg"
            options={seriesNames.map((s) => ({ value: s, label: s }))}
          />
          <FormField
            name="amplifier.gainSet.tolerance"
            label="Gain resistor tolerance"
            placeholder="0.1 %"
            hint="Each of Rf and Rg; sets the gain error"
            extraError={live("amplifier.gainSet.tolerance")}
          />
          <div className="col-span-2 grid grid-cols-2 gap-2">
            <FormField
              name="amplifier.gainSet.min"
              label="Lowest gain"
              kind="number"
              placeholder="2"
              extraError={live("amplifier.gainSet.min")}
            />
            <FormField
              name="amplifier.gainSet.max"
              label="Highest gain"
              kind="number"
              placeholder="1000"
              extraError={live("amplifier.gainSet.max")}
            />
          </div>
        </>
      )}
      <div className="col-span-2">
        <SelectField
          name="amplifier.topology"
          label="Amplifier topology"
          hint="Decides the common-mode range and how the gain resistors and their matching count"
          options={[
            {
              value: "",
              label:
                gainMode === "pair" ? "From the gains: non-inverting stage" : "From the gains: current-sense amplifier",
            },
            ...topologies.map((t) => ({ value: t, label: topologyLabels[t] })),
          ]}
        />
      </div>
      <FormField
        name="amplifier.commonMode.min"
        label="Lowest input common-mode voltage (optional)"
        kind="optional"
        placeholder="-0.3 V"
        hint="Blank: the topology's usual range"
        extraError={live("amplifier.commonMode.min")}
      />
      <FormField
        name="amplifier.commonMode.max"
        label="Highest input common-mode voltage (optional)"
        kind="optional"
        placeholder="26 V"
        hint="High side: must reach the supply voltage"
        extraError={live("amplifier.commonMode.max")}
      />
      <FormField
        name="amplifier.offset"
        unit="V"
        label="Input offset (at 25 °C)"
        placeholder="10 uV"
        extraError={live("amplifier.offset")}
      />
      <FormField
        name="amplifier.offsetDrift"
        unit="V/K"
        label="Offset drift"
        placeholder="0.1 uV/K"
        extraError={live("amplifier.offsetDrift")}
      />
      <FormField
        name="amplifier.gainError"
        unit="ratio"
        label="Gain error"
        placeholder="0.1 %"
        extraError={live("amplifier.gainError")}
      />
      <FormField
        name="amplifier.gainDrift"
        unit="1/K"
        label="Gain drift"
        placeholder="10 ppm/K"
        extraError={live("amplifier.gainDrift")}
      />
      <FormField
        name="amplifier.biasCurrent"
        unit="A"
        label="Input bias current"
        placeholder="20 nA"
        extraError={live("amplifier.biasCurrent")}
      />
      <FormField
        name="amplifier.noiseDensity"
        unit="V/√Hz"
        label="Input noise density"
        placeholder="40 nV/rtHz"
        extraError={live("amplifier.noiseDensity")}
      />
      <FormField
        name="amplifier.gbw"
        unit="Hz"
        label="Gain-bandwidth"
        placeholder="2 MHz"
        extraError={live("amplifier.gbw")}
      />
      <FormField
        name="amplifier.filterHz"
        label="Output filter corner (optional)"
        kind="optional"
        placeholder="1 kHz"
        hint="An RC filter after the amplifier; limits the noise"
        extraError={live("amplifier.filterHz")}
      />
      <InputFilterFields live={live} />
      <FormField
        name="amplifier.cmrrDb"
        label="CMRR (dB)"
        kind="number"
        placeholder="120"
        extraError={live("amplifier.cmrrDb")}
      />
      <FormField
        name="amplifier.supply"
        unit="V"
        label="Amplifier supply"
        placeholder="5 V"
        extraError={live("amplifier.supply")}
      />
      <FormField
        name="amplifier.swingLow"
        unit="V"
        label="Lowest output (above ground)"
        placeholder="10 mV"
        hint="0 V on a split supply"
        extraError={live("amplifier.swingLow")}
      />
      <FormField
        name="amplifier.swingHigh"
        unit="V"
        label="Output headroom below its supply"
        placeholder="50 mV"
        extraError={live("amplifier.swingHigh")}
      />
      <ZeroLevelFields live={live} />
    </div>
  );
}

export function TemperatureStep({ live }: { live: LiveErrors }) {
  return (
    <div className="grid grid-cols-2 gap-3">
      <FormField
        name="temperature.min"
        unit="°C"
        label="Lowest ambient temperature"
        placeholder="0 °C"
        extraError={live("temperature.min")}
      />
      <FormField
        name="temperature.max"
        unit="°C"
        label="Highest ambient temperature"
        placeholder="70 °C"
        extraError={live("temperature.max")}
      />
      <p className="col-span-2 text-2xs text-ink-faint">
        Tolerances, offsets and tempcos are taken at 25 °C; the figures use the larger excursion from it, plus the
        shunt&apos;s own self-heating.
      </p>
    </div>
  );
}
