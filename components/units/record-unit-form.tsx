"use client";
// Typing in one unit's readings from the sheet: a serial, the date, and one field per test point.
// The same zod schema as the route checks it here first; the server's refusals land on their fields.
import { useState } from "react";
import { useForm, type Resolver } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { Field, TextInput } from "@/components/ui/field";
import type { ApiError, UnitBody } from "@/lib/api-description/responses";
import type { recordUnitSchema } from "@/lib/built-units/schemas";
import { todayIso } from "@/lib/built-units/today";
import { formatSI } from "@/lib/design/format";
import type { BenchCheckRow } from "@/lib/design/bench-check";

// The form holds what a person types (the schema's input) and submits what the schema reads (its output).
type Typed = z.input<typeof recordUnitSchema>;
type Read = z.output<typeof recordUnitSchema>;

// The schema and its unit parser load on the form's first focus (or submit), once per page.
let loading: Promise<Resolver<Typed, unknown, Read>> | null = null;
const loadResolver = () =>
  (loading ??= import("./record-unit-resolver").then(
    (m) => m.recordUnitResolver,
    (e: unknown) => {
      loading = null;
      throw e;
    },
  ));
const resolver: Resolver<Typed, unknown, Read> = async (values, context, options) => {
  try {
    return await (
      await loadResolver()
    )(values, context, options);
  } catch {
    return {
      values: {},
      errors: { root: { type: "load", message: "The form's checks could not be loaded; try again." } },
    };
  }
};

export function RecordUnitForm({
  designId,
  bench,
  onRecorded,
}: {
  designId: string;
  bench: BenchCheckRow[];
  onRecorded: (unit: UnitBody) => void | Promise<void>;
}) {
  const [message, setMessage] = useState<string | null>(null);
  const form = useForm<Typed, unknown, Read>({
    resolver,
    defaultValues: {
      serial: "",
      builtOn: todayIso(),
      readings: bench.map((b) => ({ currentA: b.currentA, outputV: "" })),
    },
  });
  const { errors, isSubmitting } = form.formState;

  async function submit(values: Read) {
    setMessage(null);
    const res = await fetch(`/api/designs/${designId}/units`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify(values),
    }).catch(() => null);
    const data = (await res?.json().catch(() => ({}))) as (UnitBody & Partial<ApiError>) | undefined;
    if (!res?.ok || !data) {
      setMessage(data?.message ?? "The unit could not be recorded; nothing was stored.");
      for (const [path, msgs] of Object.entries(data?.fieldErrors ?? {})) {
        if (path === "serial" || path === "builtOn" || /^readings\.\d+\.outputV$/.test(path))
          form.setError(path as "serial", { message: msgs[0] });
      }
      return;
    }
    await onRecorded(data);
    form.reset({ ...values, serial: "", readings: bench.map((b) => ({ currentA: b.currentA, outputV: "" })) });
  }

  const readingError = (k: number) => errors.readings?.[k]?.outputV?.message;
  return (
    <form
      onSubmit={form.handleSubmit(submit)}
      onFocus={() => void loadResolver().catch(() => undefined)}
      noValidate
      aria-label="Record a built unit"
      className="flex flex-col gap-3"
    >
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <Field id="unit-serial" label="Serial" error={errors.serial?.message} hint="As marked on the board">
          <TextInput
            id="unit-serial"
            autoComplete="off"
            aria-invalid={Boolean(errors.serial)}
            aria-describedby="unit-serial-error"
            {...form.register("serial")}
          />
        </Field>
        <Field id="unit-built-on" label="Date built" error={errors.builtOn?.message}>
          <TextInput
            id="unit-built-on"
            type="date"
            aria-invalid={Boolean(errors.builtOn)}
            {...form.register("builtOn")}
          />
        </Field>
      </div>
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-xs font-medium text-ink-muted">
          Output at each test point (e.g. “36.9 mV” or “0.0369 V”; a number alone is read in volts)
        </legend>
        <div className="grid grid-cols-1 gap-3 sm:grid-cols-2 xl:grid-cols-4">
          {bench.map((b, k) => (
            <Field
              key={b.label}
              id={`unit-reading-${k}`}
              label={`${b.label} (${formatSI(b.currentA, "A")})`}
              error={readingError(k)}
              hint={`expect ${formatSI(b.expectedV, "V", 4)}, accept ${formatSI(b.minV, "V", 4)} to ${formatSI(b.maxV, "V", 4)}`}
            >
              <TextInput
                id={`unit-reading-${k}`}
                inputMode="decimal"
                autoComplete="off"
                placeholder={formatSI(b.expectedV, "V", 4)}
                aria-invalid={Boolean(readingError(k))}
                aria-describedby={`unit-reading-${k}-hint unit-reading-${k}-error`}
                {...form.register(`readings.${k}.outputV` as const)}
              />
            </Field>
          ))}
        </div>
      </fieldset>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" variant="primary" disabled={isSubmitting}>
          {isSubmitting ? "Recording…" : "Record unit"}
        </Button>
        <p aria-live="polite" className="text-sm text-bad">
          {message ?? errors.root?.message}
        </p>
      </div>
    </form>
  );
}
