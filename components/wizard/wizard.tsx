"use client";
// The design wizard: the requirement form (steps) on the left, the live-solved explorer on
// the right. The form is mounted only once the saved draft has been read, so a reload
// comes back exactly where the designer left it.
import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { FormProvider, useForm, type Resolver } from "react-hook-form";
import type { FieldErrors, Requirement } from "@/lib/design/requirement";
import type { PlanChoice } from "@/lib/design/plan-choice";
import type { Choice } from "@/lib/design/types";
import { candidateKey } from "@/lib/wizard/candidate-key";
import { deepMerge } from "@/lib/wizard/deep-merge";
import { clearDraft, draftKey, loadDraft, saveDraft, type Draft } from "@/lib/wizard/draft";
import { check, warmChecker } from "@/lib/wizard/checker";
import { engineErrorsFor, errorPaths } from "@/lib/wizard/form-errors";
import { revisionStart } from "@/lib/wizard/from-requirement";
import { readableDefaults, valuesFrom, type WizardValues } from "@/lib/wizard/form-values";
import { scenarios } from "@/lib/wizard/scenarios";
import { useSolver } from "@/lib/wizard/use-solver";
import { Button } from "@/components/ui/button";
import { Explorer } from "./explorer";
import { AmplifierStep, ReadoutStep, ShuntStep, SpanStep, SupplyStep, TemperatureStep, steps } from "./steps";

/** A new design starts from the documented defaults (lib/design/DEFAULTS.md), the span and supply
 * blank; `scenario` loads one of the examples instead. */
const freshDraft = (scenario?: string): Draft => {
  const s = scenario ? scenarios.find((x) => x.key === scenario) : undefined;
  return {
    version: 1,
    values: s ? valuesFrom(s.input) : readableDefaults,
    step: 0,
    visited: s ? steps.length - 1 : 0,
    dropMode: (s?.input.drop as { fraction?: unknown } | undefined)?.fraction !== undefined ? "share" : "volts",
    gainMode: "list",
    partName: null,
    selected: null,
    pinned: [],
    name: "",
    project: "",
  };
};

/** The saved design a revision starts from. */
export type ReviseTarget = {
  id: string;
  revision: number;
  name: string;
  project: string | null;
  requirement: Requirement;
  /** The saved pair, or (a plan design) the saved plan. */
  choice: Choice | null;
  plan?: PlanChoice | null;
};

/** The saved requirement and pair, as the wizard shows them; the saved pair stays picked. */
function revisionDraft(t: ReviseTarget): Draft {
  const start = revisionStart(t.requirement);
  return {
    version: 1,
    values: start.values,
    step: 0,
    dropMode: start.dropMode,
    gainMode: start.gainMode,
    partName: null,
    selected: t.choice ? candidateKey(t.choice) : null,
    chosen: t.choice !== null,
    pinned: [],
    // A saved plan stays as saved until the designer changes it.
    plan: t.plan ?? null,
    planEdited: Boolean(t.plan),
    name: t.name,
    project: t.project ?? "",
  };
}

// The form holds what a person types (WizardValues, all text); the engine's schema, in the check
// worker, reads it into a normalized Requirement, which is what a valid form resolves to
// (lib/wizard/form-check.ts).
const inWorker: Resolver<WizardValues, unknown, Requirement> = async (values) => {
  const r = await check({ kind: "form", values });
  return r.ok ? { values: r.requirement, errors: {} } : { values: {}, errors: r.errors };
};

const noErrors: FieldErrors = {};

export function Wizard({ canSave, revise }: { canSave: boolean; revise?: ReviseTarget }) {
  const [draft, setDraft] = useState<Draft | null>(null);
  const [generation, setGeneration] = useState(0);
  const key = draftKey(revise);
  useEffect(() => {
    // localStorage exists only in the browser, after mount.
    // eslint-disable-next-line react-hooks/set-state-in-effect
    setDraft(loadDraft(key) ?? (revise ? revisionDraft(revise) : freshDraft()));
  }, [key, revise]);
  if (!draft) {
    return (
      <p className="text-ink-muted" role="status">
        Reading your draft…
      </p>
    );
  }
  const restart = (scenario?: string) => {
    const d = freshDraft(scenario);
    saveDraft(d, key);
    setDraft(d);
    setGeneration((g) => g + 1);
  };
  return (
    <WizardForm
      key={generation}
      initial={draft}
      canSave={canSave}
      onRestart={restart}
      revise={revise}
      storageKey={key}
    />
  );
}

function WizardForm({
  initial,
  canSave,
  onRestart,
  revise,
  storageKey,
}: {
  initial: Draft;
  canSave: boolean;
  onRestart: (scenario?: string) => void;
  revise?: ReviseTarget;
  storageKey: string;
}) {
  const methods = useForm<WizardValues, unknown, Requirement>({
    resolver: inWorker,
    defaultValues: deepMerge(readableDefaults, initial.values),
    mode: "onTouched",
    shouldUnregister: true,
  });
  const { watch, trigger, getValues, formState } = methods;
  const [step, setStep] = useState(Math.min(initial.step, steps.length - 1));
  const { setValue, clearErrors } = methods;
  // A saved requirement is complete: every step of a revision is open from the start.
  const [visited, setVisited] = useState(revise ? steps.length - 1 : Math.max(step, initial.visited ?? 0));
  const [dropMode, setDropMode] = useState(initial.dropMode);
  const [gainMode, setGainMode] = useState(initial.gainMode);
  const [partName, setPartName] = useState(initial.partName);
  const [readoutPart, setReadoutPart] = useState(initial.readoutPart ?? null);
  const [selected, setSelected] = useState<string | null>(initial.selected);
  const [chosen, setChosen] = useState(initial.chosen ?? false);
  const [pinned, setPinned] = useState<string[]>(initial.pinned);
  const [plan, setPlan] = useState<PlanChoice | null>(initial.plan ?? null);
  const [planEdited, setPlanEdited] = useState(initial.planEdited ?? false);
  const [name, setName] = useState(initial.name);
  const [project, setProject] = useState(initial.project);
  const [complete, setComplete] = useState(false);
  const solver = useSolver();
  const stepHeading = useRef<HTMLHeadingElement>(null);
  const resultsHeading = useRef<HTMLHeadingElement>(null);

  // Every edit: re-solve (coalesced in the worker hook) and keep the draft. A revision keeps the
  // saved requirement's fields the steps do not show.
  const { request: solve } = solver;
  const base = useMemo(() => (revise ? revisionStart(revise.requirement).base : null), [revise]);
  const request = useCallback((values: unknown) => solve(base ? deepMerge(base, values) : values), [solve, base]);
  // The check worker loads the schema and the unit parser while the person reads the first step.
  useEffect(warmChecker, []);
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
      saveDraft(
        {
          version: 1,
          values: getValues(),
          step,
          visited,
          dropMode,
          gainMode,
          partName,
          readoutPart,
          selected,
          chosen,
          pinned,
          plan,
          planEdited,
          name,
          project,
        },
        storageKey,
      ),
    [
      getValues,
      step,
      visited,
      dropMode,
      gainMode,
      partName,
      readoutPart,
      selected,
      chosen,
      pinned,
      plan,
      planEdited,
      name,
      project,
      storageKey,
    ],
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

  // One empty object while the form is valid: a new one per solve would rebuild every step.
  const fieldErrors = solver.state.status === "invalid" ? solver.state.fieldErrors : noErrors;
  const touched = formState.touchedFields as Record<string, unknown>;
  const live = useCallback(
    (path: string) => {
      let node: unknown = touched;
      for (const k of path.split(".")) node = (node as Record<string, unknown> | undefined)?.[k];
      return node ? engineErrorsFor(fieldErrors, path, getValues()) : undefined;
    },
    [fieldErrors, touched, getValues],
  );

  const show = useCallback((to: number) => {
    setStep(to);
    setVisited((v) => Math.max(v, to));
    requestAnimationFrame(() => stepHeading.current?.focus());
  }, []);
  // Each step is a history entry (#supply, …): the browser's Back and Forward move between steps.
  const go = (to: number) => {
    if (to === step || to < 0 || to >= steps.length) return;
    window.history.pushState(window.history.state, "", `#${steps[to]!.key}`);
    show(to);
  };
  useEffect(() => {
    const fromHash = () => {
      const at = steps.findIndex((s) => `#${s.key}` === window.location.hash);
      return at >= 0 ? at : 0;
    };
    if (window.location.hash) {
      const at = fromHash();
      // eslint-disable-next-line react-hooks/set-state-in-effect -- the URL exists only after mount
      if (at <= visited) setStep(at);
    } else window.history.replaceState(window.history.state, "", `#${steps[step]!.key}`);
    const onPop = () => show(fromHash());
    window.addEventListener("popstate", onPop);
    return () => window.removeEventListener("popstate", onPop);
    // Once on mount: later steps come from go() and popstate.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  // A cross-field message goes as soon as its cause is fixed: every field showing an error is
  // checked again whenever any value changes (supply 3.3 V clears "drop must be below the supply").
  useEffect(() => {
    const sub = watch((_, { name }) => {
      const shown = errorPaths(methods.formState.errors).filter((p) => p !== name);
      if (shown.length) void trigger(shown as never);
    });
    return () => sub.unsubscribe();
  }, [watch, trigger, methods.formState]);

  // Switching how the allowed drop is given converts the value: 60 mV of 3 V is 2 %.
  const switchDropMode = (to: "volts" | "share") => {
    if (to === dropMode) return;
    const converting = check({ kind: "convertDrop", values: getValues(), to });
    setDropMode(to);
    clearErrors(["drop.max", "drop.fraction"] as never);
    // The other input mounts meanwhile; fill it once the worker has converted the value.
    void converting.then((converted) => {
      if (converted !== null)
        setTimeout(() => setValue(to === "share" ? "drop.fraction" : "drop.max", converted, { shouldDirty: true }), 0);
    });
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
      supply: <SupplyStep live={live} dropMode={dropMode} setDropMode={switchDropMode} />,
      readout: <ReadoutStep live={live} readoutPart={readoutPart} setReadoutPart={setReadoutPart} />,
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
    // switchDropMode reads the form when called; it need not rebuild the steps.
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [live, dropMode, gainMode, partName, readoutPart],
  );

  const onSaved = useCallback(() => clearDraft(storageKey), [storageKey]);
  const revising = useMemo(() => (revise ? { id: revise.id, revision: revise.revision } : undefined), [revise]);

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
            <ol
              className="grid grid-cols-3 border-b border-line text-2xs sm:grid-cols-6 lg:grid-cols-3"
              aria-label="Steps"
            >
              {steps.map((s, i) => (
                <li key={s.key} className="min-w-0">
                  <button
                    type="button"
                    onClick={() => i <= visited && go(i)}
                    disabled={i > visited}
                    aria-current={i === step ? "step" : undefined}
                    className={`flex w-full items-baseline justify-center gap-1 border-b-2 px-1 py-1.5 text-center leading-tight ${
                      i === step
                        ? "border-copper font-semibold text-ink"
                        : i <= visited
                          ? "border-transparent text-ink-muted hover:text-ink"
                          : "border-transparent text-ink-faint"
                    }`}
                  >
                    <span className="num text-ink-faint">{i + 1}</span>
                    <span>{s.title}</span>
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
            <summary className="cursor-pointer text-ink-muted">Start from an example</summary>
            <ul className="mt-2 flex flex-col gap-2">
              {scenarios.map((s) => (
                <li key={s.key}>
                  <button
                    type="button"
                    className="text-left text-copper-strong underline-offset-2 hover:underline"
                    onClick={() => {
                      if (
                        !getValues("current.max") ||
                        window.confirm(`Replace the current requirement with "${s.title}"?`)
                      )
                        onRestart(s.key);
                    }}
                  >
                    {s.title}
                  </button>
                  <p className="text-2xs text-ink-faint">{s.summary}</p>
                </li>
              ))}
              {!revise && (
                <li>
                  <button
                    type="button"
                    className="text-left text-copper-strong underline-offset-2 hover:underline"
                    onClick={() => {
                      if (window.confirm("Clear every step back to the defaults?")) onRestart();
                    }}
                  >
                    Clear to the defaults
                  </button>
                  <p className="text-2xs text-ink-faint">Blank span and supply; every other value as documented.</p>
                </li>
              )}
            </ul>
          </details>
        </div>
        <Explorer
          solver={solver}
          headingRef={resultsHeading}
          selected={selected}
          setSelected={setSelected}
          chosen={chosen}
          setChosen={setChosen}
          pinned={pinned}
          setPinned={setPinned}
          plan={plan}
          setPlan={setPlan}
          planEdited={planEdited}
          setPlanEdited={setPlanEdited}
          canSave={canSave}
          name={name}
          setName={setName}
          project={project}
          setProject={setProject}
          onSaved={onSaved}
          revise={revising}
        />
      </div>
    </FormProvider>
  );
}
