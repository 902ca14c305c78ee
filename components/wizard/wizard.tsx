"use client";
// The design wizard: the requirement form (steps) on the left, the live-solved explorer on
// the right. The form is mounted only once the saved draft has been read, so a reload
// comes back exactly where the designer left it.
import { zodResolver } from "@hookform/resolvers/zod";
import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { FormProvider, useForm, type Resolver } from "react-hook-form";
import { requirementSchema } from "@/lib/design/requirement";
import { deepMerge } from "@/lib/wizard/deep-merge";
import { clearDraft, loadDraft, saveDraft, type Draft } from "@/lib/wizard/draft";
import { engineErrorsFor } from "@/lib/wizard/form-errors";
import { readableDefaults, valuesFrom, type WizardValues } from "@/lib/wizard/form-values";
import { scenarios } from "@/lib/wizard/scenarios";
import { useSolver } from "@/lib/wizard/use-solver";
import { Button } from "@/components/ui/button";
import { Explorer } from "./explorer";
import { AmplifierStep, ReadoutStep, ShuntStep, SpanStep, SupplyStep, TemperatureStep, steps } from "./steps";

const freshDraft = (key = scenarios[0]!.key): Draft => {
  const s = scenarios.find((x) => x.key === key) ?? scenarios[0]!;
  const values = valuesFrom(s.input);
  return {
    version: 1,
    values,
    step: 0,
    dropMode: (s.input.drop as { fraction?: unknown } | undefined)?.fraction !== undefined ? "share" : "volts",
    gainMode: "list",
    partName: null,
    selected: null,
    pinned: [],
    name: "",
    project: "",
  };
};

export function Wizard({ canSave }: { canSave: boolean }) {
  const [draft, setDraft] = useState<Draft | null>(null);
  const [generation, setGeneration] = useState(0);
  useEffect(() => {
    // localStorage exists only in the browser, after mount.
    // eslint-disable-next-line react-hooks/set-state-in-effect
    setDraft(loadDraft() ?? freshDraft());
  }, []);
  if (!draft) {
    return (
      <p className="text-ink-muted" role="status">
        Reading your draft…
      </p>
    );
  }
  const restart = (key: string) => {
    const d = freshDraft(key);
    saveDraft(d);
    setDraft(d);
    setGeneration((g) => g + 1);
  };
  return <WizardForm key={generation} initial={draft} canSave={canSave} onRestart={restart} />;
}

function WizardForm({
  initial,
  canSave,
  onRestart,
}: {
  initial: Draft;
  canSave: boolean;
  onRestart: (scenario: string) => void;
}) {
  const methods = useForm<WizardValues>({
    resolver: zodResolver(requirementSchema) as unknown as Resolver<WizardValues>,
    defaultValues: deepMerge(readableDefaults, initial.values),
    mode: "onTouched",
    shouldUnregister: true,
  });
  const { watch, trigger, getValues, formState } = methods;
  const [step, setStep] = useState(Math.min(initial.step, steps.length - 1));
  const [visited, setVisited] = useState(Math.max(step, 0));
  const [dropMode, setDropMode] = useState(initial.dropMode);
  const [gainMode, setGainMode] = useState(initial.gainMode);
  const [partName, setPartName] = useState(initial.partName);
  const [selected, setSelected] = useState<string | null>(initial.selected);
  const [pinned, setPinned] = useState<string[]>(initial.pinned);
  const [name, setName] = useState(initial.name);
  const [project, setProject] = useState(initial.project);
  const [complete, setComplete] = useState(false);
  const solver = useSolver();
  const stepHeading = useRef<HTMLHeadingElement>(null);
  const resultsHeading = useRef<HTMLHeadingElement>(null);

  // Every edit: re-solve (coalesced in the worker hook) and keep the draft.
  const { request } = solver;
  useEffect(() => {
    request(getValues());
    const sub = watch((values) => {
      performance.mark("wizard-edit");
      request(values);
    });
    return () => sub.unsubscribe();
  }, [watch, getValues, request]);
  // Switching a mode mounts other inputs: solve what is on screen now.
  useEffect(() => {
    request(getValues());
  }, [dropMode, gainMode, request, getValues]);

  const persist = useCallback(
    () =>
      saveDraft({
        version: 1,
        values: getValues(),
        step,
        dropMode,
        gainMode,
        partName,
        selected,
        pinned,
        name,
        project,
      }),
    [getValues, step, dropMode, gainMode, partName, selected, pinned, name, project],
  );
  // Keep the draft on every change of the screen's own state and of the form's values.
  useEffect(() => {
    const t = setTimeout(persist, 150);
    const sub = watch(() => persist());
    // A reload or closed tab inside the 150 ms would otherwise lose the last change.
    window.addEventListener("pagehide", persist);
    return () => {
      clearTimeout(t);
      sub.unsubscribe();
      window.removeEventListener("pagehide", persist);
    };
  }, [watch, persist]);

  const fieldErrors = useMemo(
    () => (solver.state.status === "invalid" ? solver.state.fieldErrors : {}),
    [solver.state],
  );
  const touched = formState.touchedFields as Record<string, unknown>;
  const live = useCallback(
    (path: string) => {
      let node: unknown = touched;
      for (const k of path.split(".")) node = (node as Record<string, unknown> | undefined)?.[k];
      return node ? engineErrorsFor(fieldErrors, path) : undefined;
    },
    [fieldErrors, touched],
  );

  const go = (to: number) => {
    setStep(to);
    setVisited((v) => Math.max(v, to));
    requestAnimationFrame(() => stepHeading.current?.focus());
  };
  const next = async () => {
    const def = steps[step]!;
    const ok = await trigger(def.fields as never, { shouldFocus: true });
    if (!ok) return;
    if (step < steps.length - 1) go(step + 1);
    else {
      const all = await trigger(undefined, { shouldFocus: true });
      setComplete(all);
      if (all) requestAnimationFrame(() => resultsHeading.current?.focus());
    }
  };

  const stepBodies = useMemo(
    () => ({
      span: <SpanStep live={live} />,
      supply: <SupplyStep live={live} dropMode={dropMode} setDropMode={setDropMode} />,
      readout: <ReadoutStep live={live} />,
      shunt: <ShuntStep live={live} />,
      amplifier: (
        <AmplifierStep
          live={live}
          gainMode={gainMode}
          setGainMode={setGainMode}
          partName={partName}
          setPartName={setPartName}
        />
      ),
      temperature: <TemperatureStep live={live} />,
    }),
    [live, dropMode, gainMode, partName],
  );

  return (
    <FormProvider {...methods}>
      <div className="grid grid-cols-1 gap-4 lg:grid-cols-[22rem_minmax(0,1fr)]">
        <div className="flex flex-col gap-3 lg:sticky lg:top-4 lg:self-start">
          <form
            noValidate
            aria-label="Requirement"
            onSubmit={(e) => {
              e.preventDefault();
              void next();
            }}
            className="rounded-panel border border-line bg-panel"
          >
            <ol className="flex border-b border-line text-2xs" aria-label="Steps">
              {steps.map((s, i) => (
                <li key={s.key} className="flex-1">
                  <button
                    type="button"
                    onClick={() => i <= visited && go(i)}
                    disabled={i > visited}
                    aria-current={i === step ? "step" : undefined}
                    className={`w-full border-b-2 px-1 py-2 text-center ${
                      i === step
                        ? "border-copper font-semibold text-ink"
                        : i <= visited
                          ? "border-transparent text-ink-muted hover:text-ink"
                          : "border-transparent text-ink-faint"
                    }`}
                    title={s.title}
                  >
                    <span className="num">{i + 1}</span>
                    <span className="sr-only">. {s.title}</span>
                  </button>
                </li>
              ))}
            </ol>
            {steps.map((s, i) => (
              <section key={s.key} hidden={i !== step} aria-labelledby={`step-${s.key}`} className="p-4">
                <h2
                  id={`step-${s.key}`}
                  ref={i === step ? stepHeading : undefined}
                  tabIndex={-1}
                  className="text-sm font-semibold focus:outline-none"
                >
                  <span className="num text-ink-faint">
                    {i + 1}/{steps.length}
                  </span>{" "}
                  {s.title}
                </h2>
                <p className="mb-3 text-2xs text-ink-muted">{s.blurb}</p>
                {stepBodies[s.key]}
              </section>
            ))}
            <div className="flex items-center justify-between gap-2 border-t border-line px-4 py-2.5">
              <Button type="button" variant="ghost" onClick={() => go(step - 1)} disabled={step === 0}>
                Back
              </Button>
              {complete && step === steps.length - 1 && (
                <span className="text-2xs text-good" role="status">
                  Every step checks out.
                </span>
              )}
              <Button type="submit" variant="primary">
                {step < steps.length - 1 ? `Next: ${steps[step + 1]!.title}` : "Check the whole requirement"}
              </Button>
            </div>
          </form>
          <details className="rounded-panel border border-line bg-panel px-4 py-2 text-xs">
            <summary className="cursor-pointer text-ink-muted">Start again from an example</summary>
            <ul className="mt-2 flex flex-col gap-2">
              {scenarios.map((s) => (
                <li key={s.key}>
                  <button
                    type="button"
                    className="text-left text-copper-strong underline-offset-2 hover:underline"
                    onClick={() => {
                      if (window.confirm(`Replace the current requirement with "${s.title}"?`)) onRestart(s.key);
                    }}
                  >
                    {s.title}
                  </button>
                  <p className="text-2xs text-ink-faint">{s.summary}</p>
                </li>
              ))}
            </ul>
          </details>
        </div>
        <Explorer
          solver={solver}
          headingRef={resultsHeading}
          selected={selected}
          setSelected={setSelected}
          pinned={pinned}
          setPinned={setPinned}
          canSave={canSave}
          name={name}
          setName={setName}
          project={project}
          setProject={setProject}
          onSaved={clearDraft}
        />
      </div>
    </FormProvider>
  );
}
