"use client";
// The live results beside the form: the trade-off, the refusals, the table, the selected
// candidate in depth, the range plan when one range cannot do, and saving.
import { memo, useCallback, useDeferredValue, useEffect, useMemo, type ReactNode, type RefObject } from "react";
import { evaluateCandidate, isInSweep } from "@/lib/design/candidate";
import { rejectReasonLabels } from "@/lib/design/pair";
import type { Requirement } from "@/lib/design/requirement";
import type { SolveResult } from "@/lib/design/solve";
import type { Candidate } from "@/lib/design/types";
import { formatSI } from "@/lib/design/format";
import type { PlanChoice } from "@/lib/design/plan-choice";
import { planChoiceOf } from "@/lib/design/range-candidates";
import { TradeOffChart } from "@/components/charts/trade-off-chart";
import { CandidateStudy } from "@/components/candidates/candidate-study";
import { CandidateTable } from "@/components/candidates/candidate-table";
import { Rejections } from "@/components/candidates/rejections";
import { Panel } from "@/components/ui/panel";
import { candidateKey, choiceFromKey } from "@/lib/wizard/candidate-key";
import { inWords } from "@/lib/wizard/form-errors";
import { rankingInWords, recommendationReason, recommendedOf } from "@/lib/wizard/recommend";
import type { Solved, useSolver } from "@/lib/wizard/use-solver";
import { measureSince } from "@/lib/wizard/measure";
import { usePlanCheck } from "@/lib/wizard/use-plan-check";
import { Button } from "@/components/ui/button";
import { DefaultsSummary } from "./defaults-summary";
import { DiagnosisView } from "./diagnosis";
import { PlanEditor, planStatus } from "./plan-editor";
import { SavePanel, type PickNote, type PlanToSave } from "./save-panel";
import { SweepProgress } from "./sweep-progress";

const pairText = (c: { shuntOhms: number; gain: number }) =>
  `${formatSI(c.shuntOhms, "Ω")} × ${Number(c.gain.toPrecision(4))}`;

const decades = [
  { label: "1 mV per mA", vPerA: 1 },
  { label: "1 mV per µA", vPerA: 1e3 },
  { label: "1 mV per nA", vPerA: 1e6 },
];

/** Memoised: the form's own re-renders (its checks, touched fields) leave the results alone. */
export const Explorer = memo(function Explorer({
  solver,
  headingRef,
  selected: selectedState,
  setSelected,
  chosen,
  setChosen,
  pinned,
  setPinned,
  plan,
  setPlan,
  planEdited,
  setPlanEdited,
  canSave,
  name,
  setName,
  project,
  setProject,
  onSaved,
  revise,
}: {
  solver: ReturnType<typeof useSolver>;
  headingRef: RefObject<HTMLHeadingElement | null>;
  selected: string | null;
  setSelected: (k: string | null) => void;
  chosen: boolean;
  setChosen: (b: boolean) => void;
  pinned: string[];
  setPinned: (p: string[]) => void;
  plan: PlanChoice | null;
  setPlan: (p: PlanChoice | null) => void;
  planEdited: boolean;
  setPlanEdited: (b: boolean) => void;
  canSave: boolean;
  name: string;
  setName: (s: string) => void;
  project: string;
  setProject: (s: string) => void;
  onSaved: () => void;
  revise?: { id: string; revision: number };
}) {
  const { state, busy, sweeping, last: shown } = solver;
  const result = shown?.result ?? null;

  // Listed candidates plus the engine's decade-scale picks, which may lie outside the list.
  const byKey = useMemo(
    () =>
      new Map(
        [...(result?.decadeScales ?? []), ...(result?.candidates ?? [])].map((c) => [candidateKey(c), c] as const),
      ),
    [result],
  );
  // The selection follows the ranking after every solve, unless the designer picked a pair.
  const recommended = recommendedOf(result);
  const recommendedKey = recommended ? candidateKey(recommended) : null;
  // Drawn from the solve itself, so the charts show the new selection in the solve's own render;
  // the state (kept in the draft) catches up in an effect, which then redraws nothing.
  const selected = result && !chosen ? recommendedKey : selectedState;
  useEffect(() => {
    if (!result || chosen) return;
    if (selectedState !== recommendedKey) setSelected(recommendedKey);
  }, [result, chosen, selectedState, recommendedKey, setSelected]);
  const pick = useCallback(
    (k: string | null) => {
      setSelected(k);
      setChosen(k !== null);
    },
    [setSelected, setChosen],
  );
  useEffect(() => {
    const keep = pinned.filter((k) => byKey.has(k));
    if (keep.length !== pinned.length) setPinned(keep);
  }, [byKey, pinned, setPinned]);

  // Edit → redrawn chart, for the benchmark (scripts/bench/wizard.ts reads "wizard-resolve").
  const solvedId = state.status === "solved" ? state.id : null;
  const editAt = state.status === "solved" ? state.editAt : null;
  useEffect(() => {
    if (solvedId === null || editAt === null) return;
    measureSince("wizard-resolve", editAt);
  }, [solvedId, editAt]);

  const req = result?.requirement;
  // A picked pair that dropped out of the list is evaluated on its own, to say why.
  const candidate: Candidate | null = useMemo(() => {
    if (!selected || !req) return null;
    const listed = byKey.get(selected);
    if (listed) return listed;
    const choice = choiceFromKey(selected);
    if (!choice || !isInSweep(req, choice)) return null;
    return { ...evaluateCandidate(req, choice), pareto: false };
  }, [selected, req, byKey]);
  const note: PickNote | null = useMemo(() => {
    if (!result || !selected) return null;
    const choice = choiceFromKey(selected);
    if (!choice) return null;
    const follow = recommended && selected !== recommendedKey ? recommended : null;
    if (!chosen) return { tone: "info", text: "Following the ranking: the recommended pair is selected." };
    if (!candidate)
      return {
        tone: "bad",
        text: `Your pick, ${pairText(choice)}, is no longer in the sweep of this requirement.`,
        follow,
      };
    if (!candidate.feasible)
      return {
        tone: "bad",
        text: `Your pick, ${pairText(choice)}, no longer meets the requirement: ${candidate.reasons.map((r) => rejectReasonLabels[r]).join("; ")}.`,
        follow,
      };
    if (!candidate.pareto)
      return {
        tone: "warn",
        text: `Your pick, ${pairText(choice)}, is feasible but no longer on the Pareto front: another pair is at least as good on drop, step and error, and better on one.`,
        follow,
      };
    return follow
      ? {
          tone: "info",
          text: `Your pick, ${pairText(choice)}, stays selected; the ranking now puts another pair first.`,
          follow,
        }
      : { tone: "info", text: "Your pick is the recommended pair." };
  }, [result, selected, chosen, candidate, recommended, recommendedKey]);
  const frontCount = result ? result.candidates.filter((c) => c.pareto).length : 0;

  // The range plan follows the engine's proposal until the designer adjusts it; every plan on
  // screen is checked by the engine in the plan worker.
  const proposal = result?.rangePlan ?? null;
  const proposed = useMemo(() => (proposal ? planChoiceOf(proposal) : null), [proposal]);
  useEffect(() => {
    if (!planEdited && proposed !== plan) setPlan(proposed);
  }, [planEdited, proposed, plan, setPlan]);
  const planCheck = usePlanCheck();
  const { check } = planCheck;
  const planShown = result && plan && (proposal || planEdited) ? plan : null;
  useEffect(() => {
    if (req && planShown) check(req, planShown);
  }, [req, planShown, check]);
  const planTexts = useMemo(() => (proposal ? [proposal.adds] : []), [proposal]);
  const planSlot = useMemo(
    () =>
      planShown ? (
        <PlanEditor
          plan={planShown}
          setPlan={(p) => {
            setPlan(p);
            setPlanEdited(true);
          }}
          edited={planEdited}
          onReset={() => {
            setPlanEdited(false);
            setPlan(proposed);
          }}
          check={planCheck.state}
          proposalTexts={planTexts}
        />
      ) : null,
    [planShown, setPlan, setPlanEdited, planEdited, proposed, planCheck.state, planTexts],
  );
  const planToSave: PlanToSave | null = useMemo(() => {
    if (!planShown) return null;
    const st = planStatus(planCheck.state, planShown);
    return {
      choice: planShown,
      checking: st.kind === "checking",
      refusal:
        st.kind === "error"
          ? st.message
          : st.kind === "checked" && !st.reply.verdict.sound
            ? st.reply.verdict.message
            : null,
    };
  }, [planShown, planCheck.state]);

  // The save panel follows a deferred copy too: the chart is committed without waiting for it.
  const { differences } = solver;
  const saveView: SaveView | null = useMemo(
    () =>
      req
        ? {
            requirement: req,
            differences,
            candidate: planToSave ? null : candidate,
            plan: planToSave,
            note: planToSave ? null : note,
          }
        : null,
    [req, differences, candidate, planToSave, note],
  );
  const saveLater = useDeferredValue(saveView);
  const follow = useCallback(() => {
    setChosen(false);
    setSelected(recommendedKey);
  }, [setChosen, setSelected, recommendedKey]);

  return (
    <div className="flex min-w-0 flex-col gap-4" aria-busy={busy}>
      <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
        <h2 ref={headingRef} tabIndex={-1} className="text-base font-semibold focus:outline-none">
          Candidates
        </h2>
        <p className="text-xs text-ink-muted num" role="status" aria-live="polite" data-testid="solve-status">
          {busy ? (
            <SweepProgress sweeping={sweeping} />
          ) : result ? (
            `${result.evaluated.toLocaleString("en")} pairs swept in ${formatSI(shown!.solveMs / 1000, "s", 2)}: ${result.feasibleCount.toLocaleString("en")} feasible, ${frontCount} on the Pareto front`
          ) : (
            "Waiting for a complete requirement"
          )}
        </p>
      </div>

      {state.status === "invalid" && (
        <div
          className="rounded-panel border border-bad/40 bg-bad/5 px-4 py-3 text-xs"
          data-testid="requirement-problems"
        >
          <p className="font-semibold text-bad">
            {result
              ? "The requirement has a problem; the results below are from the last complete one."
              : "The requirement is not complete yet."}
          </p>
          <ul className="mt-1 list-disc pl-4 text-ink-muted">
            {Object.entries(state.fieldErrors)
              .flatMap(([path, msgs]) => msgs.map((m) => inWords(path, m)))
              .slice(0, 6)
              .map((m) => (
                <li key={m}>{m}</li>
              ))}
            {Object.keys(state.fieldErrors).length === 0 && (
              <li>
                {state.message.startsWith("Invalid input")
                  ? "An entry cannot be read as it stands; the form marks the field to correct."
                  : state.message}
              </li>
            )}
          </ul>
        </div>
      )}

      {result && req && (
        <>
          {recommended ? (
            <div
              className="rounded-panel border border-copper/40 bg-copper-soft/40 px-4 py-3 text-xs"
              data-testid="recommended"
            >
              <p className="text-sm">
                <span className="font-semibold">Recommended pair: </span>
                <span className="num font-semibold">{pairText(recommended)}</span>
                {selected === recommendedKey ? (
                  <span className="ml-2 text-ink-muted">(selected)</span>
                ) : (
                  <Button variant="ghost" className="ml-2" onClick={() => pick(recommendedKey)}>
                    Select it
                  </Button>
                )}
              </p>
              <p className="mt-1 text-ink-muted num">{recommendationReason(recommended, result)}</p>
            </div>
          ) : null}
          <Results
            shown={shown!}
            selected={selected}
            recommendedKey={recommendedKey}
            setSelected={pick}
            pinned={pinned}
            setPinned={setPinned}
            planSlot={planSlot}
          />
          {saveLater && (
            <SaveSection
              view={saveLater}
              onFollow={follow}
              revise={revise}
              canSave={canSave}
              name={name}
              setName={setName}
              project={project}
              setProject={setProject}
              onSaved={onSaved}
            />
          )}
        </>
      )}
    </div>
  );
});

/** Everything drawn from one solve; memoised so busy flags and typing elsewhere do not redraw the charts. */
const Results = memo(function Results({
  shown,
  selected,
  recommendedKey,
  setSelected,
  pinned,
  setPinned,
  planSlot,
}: {
  shown: Solved;
  selected: string | null;
  recommendedKey: string | null;
  setSelected: (k: string | null) => void;
  pinned: string[];
  setPinned: (p: string[]) => void;
  /** The plan editor, when the engine proposes ranges (or the designer is revising a plan). */
  planSlot: ReactNode;
}) {
  const result = shown.result;
  const req = result.requirement;
  const listed = result.candidates;
  const feasibleListed = result.candidates.filter((c) => c.feasible).length;
  // What lies below the chart follows a deferred copy of the solve (see Below).
  const later = useDeferredValue(shown);
  // A new selection (the ranking's pick after a solve, or a click) and the new ranking reach the
  // table and the study in the same deferred pass: the chart marks them first.
  const laterSelected = useDeferredValue(selected);
  const laterPinned = useDeferredValue(pinned);
  const laterRecommended = useDeferredValue(recommendedKey);
  return (
    <>
      {req.readout.kind === "meter" && (
        <div
          className="flex flex-wrap items-center gap-2 text-xs"
          role="group"
          aria-label="Decade scale factors"
          data-testid="decade-scales"
        >
          <span className="text-ink-muted">Read straight off the meter at a decade scale factor:</span>
          {decades.map((d) => {
            const hit = (result.decadeScales ?? []).find(
              (c) => Math.abs(c.transimpedanceVPerA - d.vPerA) <= 1e-6 * d.vPerA,
            );
            const key = hit ? candidateKey(hit) : null;
            return (
              <button
                key={d.vPerA}
                type="button"
                disabled={!hit}
                aria-pressed={key !== null && selected === key}
                onClick={() => key && setSelected(key)}
                title={
                  hit
                    ? `Select ${formatSI(hit.shuntOhms, "Ω")} × ${hit.gain}`
                    : "No feasible pair gives exactly this scale factor"
                }
                className={`rounded border px-2 py-0.5 disabled:cursor-not-allowed disabled:opacity-50 ${key !== null && selected === key ? "border-copper bg-copper-soft text-copper-strong" : "border-line hover:bg-sunken"}`}
              >
                {d.label}{" "}
                <span className="text-ink-faint num">
                  {hit ? `${formatSI(hit.shuntOhms, "Ω")} × ${Number(hit.gain.toPrecision(4))}` : "none feasible"}
                </span>
              </button>
            );
          })}
        </div>
      )}

      <Panel
        title="Trade-off: burden against low-current error"
        actions={
          feasibleListed < result.feasibleCount ? (
            <span className="text-2xs text-ink-faint num">
              showing the best {feasibleListed} of {result.feasibleCount} feasible (raise “Candidates listed”)
            </span>
          ) : undefined
        }
      >
        {result.feasibleCount > 0 ? (
          <TradeOffChart
            candidates={listed}
            selected={selected}
            pinned={pinned}
            onSelect={setSelected}
            dropMaxV={req.drop.max}
          />
        ) : (
          <p className="text-sm text-ink-muted" data-testid="no-feasible">
            No single shunt and gain meets every constraint across {formatSI(req.current.min, "A")} to{" "}
            {formatSI(req.current.max, "A")}.{" "}
            {result.rangePlan
              ? "A plan with several ranges does; see below."
              : req.shunt.trace
                ? "Relax the drop, the counts at the minimum current or the accuracy target, or change the trace's width or longest length, and the gains."
                : "Relax the drop, the counts at the minimum current or the accuracy target, or widen the shunt bounds and gains."}
          </p>
        )}
      </Panel>

      {result.diagnosis && (
        <Panel title="What would make it work">
          <DiagnosisView diagnosis={result.diagnosis} evaluated={result.evaluated} />
        </Panel>
      )}

      {planSlot}

      <Below
        shown={later}
        selected={laterSelected}
        recommendedKey={laterRecommended}
        setSelected={setSelected}
        pinned={laterPinned}
        setPinned={setPinned}
      />
    </>
  );
});

/**
 * The refusals, the table and the selected pair in depth. They draw from a deferred copy of the
 * solve: React commits the trade-off chart first and may interrupt this part for a newer edit,
 * so hundreds of table cells and the study's curves (worked out on this thread) never hold up
 * the chart the designer is watching.
 */
const Below = memo(function Below({
  shown,
  selected,
  recommendedKey,
  setSelected,
  pinned,
  setPinned,
}: {
  shown: Solved;
  selected: string | null;
  recommendedKey: string | null;
  setSelected: (k: string | null) => void;
  pinned: string[];
  setPinned: (p: string[]) => void;
}) {
  const result = shown.result;
  const req = result.requirement;
  const listed = result.candidates;
  const listedKeys = useMemo(
    () => new Set([...(result.decadeScales ?? []), ...result.candidates].map(candidateKey)),
    [result],
  );
  const choice = useMemo(
    () => (selected && listedKeys.has(selected) ? choiceFromKey(selected) : null),
    [selected, listedKeys],
  );
  const pinnedChoices = useMemo(
    () => pinned.map(choiceFromKey).filter((c): c is NonNullable<typeof c> => c !== null),
    [pinned],
  );
  // Edit → everything below the chart drawn as well (scripts/bench/wizard.ts reads "wizard-settled").
  useEffect(() => {
    measureSince("wizard-settled", shown.editAt);
  }, [shown]);
  return (
    <>
      <Panel title="Why pairs were refused">
        <Rejections rejected={result.rejected} evaluated={result.evaluated} feasibleCount={result.feasibleCount} />
      </Panel>

      <Panel title="Candidate table">
        <CandidateTable
          candidates={listed}
          selected={selected}
          recommended={recommendedKey}
          onSelect={setSelected}
          pinned={pinned}
          onTogglePin={(k) =>
            setPinned(pinned.includes(k) ? pinned.filter((x) => x !== k) : [...pinned, k].slice(0, 3))
          }
          transimpedanceFilter={null}
        />
        <p className="mt-2 text-2xs text-ink-faint">{rankingInWords(result)}</p>
      </Panel>

      {choice && (
        <div>
          <CandidateStudy req={req} choice={choice} pinned={pinnedChoices} />
        </div>
      )}
    </>
  );
});

type SaveView = {
  requirement: Requirement;
  differences: ReturnType<typeof useSolver>["differences"];
  candidate: Candidate | null;
  plan: PlanToSave | null;
  note: PickNote | null;
};

/** The defaults summary and saving, from a deferred copy of what the solve gives them. */
const SaveSection = memo(function SaveSection({
  view,
  onFollow,
  revise,
  canSave,
  name,
  setName,
  project,
  setProject,
  onSaved,
}: {
  view: SaveView;
  onFollow: () => void;
  revise?: { id: string; revision: number };
  canSave: boolean;
  name: string;
  setName: (s: string) => void;
  project: string;
  setProject: (s: string) => void;
  onSaved: () => void;
}) {
  return (
    <Panel title={revise ? `Save revision ${revise.revision + 1}` : "Save"}>
      <DefaultsSummary requirement={view.requirement} groups={view.differences} />
      <div className="mt-3" />
      <SavePanel
        requirement={view.requirement}
        candidate={view.candidate}
        plan={view.plan}
        note={view.note}
        onFollow={onFollow}
        revise={revise}
        canSave={canSave}
        name={name}
        setName={setName}
        project={project}
        setProject={setProject}
        onSaved={onSaved}
      />
    </Panel>
  );
});
