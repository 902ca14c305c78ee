"use client";
// One labelled wizard input bound to react-hook-form, with its error beside it (aria-live).
import type { ReactNode } from "react";
import { useFormContext, useWatch, type RegisterOptions } from "react-hook-form";
import { Field, Select, TextInput } from "@/components/ui/field";
import { errorText } from "@/lib/wizard/form-errors";
import type { WizardValues } from "@/lib/wizard/form-values";
import { isBareNumber, normaliseTyped, type BaseUnit } from "@/lib/wizard/typed-quantity";

const fieldId = (name: string) => `f-${name.replace(/\./g, "-")}`;

/** Empty text means "use the default" for optional fields. */
const optionalText = (v: unknown) => (typeof v === "string" && v.trim() === "" ? undefined : v);
/** Whole numbers and plain numbers stay numbers; anything else goes to the schema as typed, to be refused there. */
const numberOrText = (v: unknown) => {
  if (typeof v !== "string") return v;
  const t = v.trim();
  if (t === "") return undefined;
  return /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(t) ? Number(t) : t;
};
/** A comma- or semicolon-separated list. */
const listOf = (each: (s: string) => unknown) => (v: unknown) =>
  typeof v === "string"
    ? v
        .split(/[,;]/)
        .map((s) => s.trim())
        .filter(Boolean)
        .map(each)
    : v;
export const listOfText = listOf((s) => s);
export const listOfNumbers = listOf((s) => (Number.isFinite(Number(s)) ? Number(s) : s));

type Kind = "quantity" | "optional" | "number" | "list" | "numberList";

const setValueAsFor: Record<Kind, RegisterOptions["setValueAs"]> = {
  quantity: (v: unknown) => v,
  optional: optionalText,
  number: numberOrText,
  list: listOfText,
  numberList: listOfNumbers,
};

export function FormField({
  name,
  label,
  hint,
  kind = "quantity",
  placeholder,
  extraError,
  transform,
  suffix,
  unit,
}: {
  name: string;
  label: ReactNode;
  hint?: ReactNode;
  kind?: Kind;
  placeholder?: string;
  /** An engine message for this field from the live solve, shown when the form has none. */
  extraError?: string;
  transform?: (v: unknown) => unknown;
  suffix?: ReactNode;
  /** The unit a bare number is read in; shown beside the box while the entry is a bare number. */
  unit?: BaseUnit;
}) {
  const { register, formState, trigger } = useFormContext<WizardValues>();
  const id = fieldId(name);
  const own = errorText(formState.errors, name);
  const error = own ?? extraError;
  const read = transform ?? setValueAsFor[kind];
  const setValueAs = (v: unknown) => read?.(normaliseTyped(v, unit));
  const base = register(name as never, { setValueAs });
  const typed = useWatch({ name: name as never }) as unknown;
  const shownUnit = unit && !suffix && isBareNumber(typeof typed === "number" ? String(typed) : typed) ? unit : null;
  // A refused entry is re-checked as it is corrected, before the field is ever left.
  const reg = {
    ...base,
    onChange: async (e: { target: unknown; type?: unknown }) => {
      await base.onChange(e);
      if (own) void trigger(name as never);
    },
  };
  return (
    <Field id={id} label={label} hint={hint} error={error}>
      <div className="flex items-center gap-1.5">
        <TextInput
          id={id}
          {...reg}
          placeholder={placeholder}
          autoComplete="off"
          spellCheck={false}
          aria-invalid={error ? true : undefined}
          aria-describedby={`${id}-error${hint ? ` ${id}-hint` : ""}`}
        />
        {suffix && <span className="shrink-0 text-2xs text-ink-faint">{suffix}</span>}
        {shownUnit && (
          <span
            className="shrink-0 text-xs text-ink-muted"
            data-testid={`${id}-unit`}
            title="A bare number is read in this unit"
          >
            {shownUnit}
          </span>
        )}
      </div>
    </Field>
  );
}

export function SelectField({
  name,
  label,
  hint,
  options,
}: {
  name: string;
  label: ReactNode;
  hint?: ReactNode;
  options: { value: string; label: string }[];
}) {
  const { register, formState } = useFormContext<WizardValues>();
  const id = fieldId(name);
  const error = errorText(formState.errors, name);
  return (
    <Field id={id} label={label} hint={hint} error={error}>
      <Select
        id={id}
        {...register(name as never)}
        aria-invalid={error ? true : undefined}
        aria-describedby={`${id}-error`}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </Select>
    </Field>
  );
}

const pill = (active: boolean) =>
  `cursor-pointer rounded px-2.5 py-1 text-xs has-[:focus-visible]:outline has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-copper ${
    active ? "bg-panel font-medium text-ink shadow-sm" : "text-ink-muted"
  }`;

/** A segmented group of radio buttons (one tab stop, arrows move). */
function Segmented({
  legend,
  options,
  isActive,
  input,
}: {
  legend: string;
  options: { value: string; label: string }[];
  isActive: (v: string) => boolean;
  input: (v: string) => ReactNode;
}) {
  return (
    <fieldset className="flex flex-col gap-1">
      <legend className="mb-1 text-xs font-medium text-ink-muted">{legend}</legend>
      <div className="inline-flex w-fit rounded border border-line bg-sunken p-0.5">
        {options.map((o) => (
          <label key={o.value} className={pill(isActive(o.value))}>
            {input(o.value)}
            {o.label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

/** A small two- or three-way choice held outside the form (a mode of the screen). */
export function Choice<T extends string>({
  legend,
  name,
  value,
  options,
  onChange,
}: {
  legend: string;
  name: string;
  value: T;
  options: { value: T; label: string }[];
  onChange: (v: T) => void;
}) {
  return (
    <Segmented
      legend={legend}
      options={options}
      isActive={(v) => v === value}
      input={(v) => (
        <input
          type="radio"
          className="sr-only"
          name={name}
          value={v}
          checked={v === value}
          onChange={() => onChange(v as T)}
        />
      )}
    />
  );
}

/** The wizard's fields that hold one text choice out of a few. */
type ChoiceField = "supply.side" | "readout.kind" | "shunt.kind" | "shunt.terminals";

/** The same choice bound to a form field (react-hook-form handles the radio group). */
export function RadioField({
  legend,
  name,
  options,
}: {
  legend: string;
  /** A field whose value is one of the options (a text choice such as supply.side). */
  name: ChoiceField;
  options: { value: string; label: string }[];
}) {
  const { register } = useFormContext<WizardValues>();
  // useWatch re-renders this group only, not the whole form, on each keystroke elsewhere.
  const current = useWatch<WizardValues, ChoiceField>({ name });
  return (
    <Segmented
      legend={legend}
      options={options}
      isActive={(v) => v === current}
      input={(v) => <input type="radio" className="sr-only" value={v} {...register(name)} />}
    />
  );
}

/** The live (worker-side) message for a field path, if the engine refuses what is typed there. */
export type LiveErrors = (path: string) => string | undefined;
