"use client";
// The range plan before it is saved: move a switch point, pick another pair for one range from
// that range's own candidates. Every change goes to the engine (in the plan worker); the verdict,
// the figures and the charts come back from it.
import { useEffect, useState } from "react";
import { formatPercent, formatSI } from "@/lib/design/format";
import type { PlanChoice } from "@/lib/design/plan-choice";
import { moveSwitchPoint, withRangePair, type RangeCandidates } from "@/lib/design/range-candidates";
import { SWITCH_DOWN_FRACTION } from "@/lib/design/range-plan";
import { PlanStretchChart, PlanStretchLegend } from "@/components/charts/plan-stretch-chart";
import { RangePlanChart } from "@/components/charts/range-plan-chart";
import { Button } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { check } from "@/lib/wizard/checker";
import type { PlanCheckState } from "@/lib/wizard/use-plan-check";

const pairText = (c: { shuntOhms: number; gain: number }) =>
  `${formatSI(c.shuntOhms, "Ω")} × ${Number(c.gain.toPrecision(4))}`;

/** What the engine said about the plan on screen, or that it is still checking. */
export function planStatus(check: PlanCheckState, plan: PlanChoice | null) {
  if (!plan || check.status === "idle" || check.plan !== plan) return { kind: "checking" as const };
  if (check.status === "checking") return { kind: "checking" as const };
  const reply = check.reply;
  if (!reply.ok) return { kind: "error" as const, message: reply.message };
  return { kind: "checked" as const, reply };
}

export function PlanEditor({
  plan,
  setPlan,
  edited,
  onReset,
  check,
  proposalTexts,
}: {
  plan: PlanChoice;
  setPlan: (p: PlanChoice) => void;
  /** The designer changed the engine's proposal. */
  edited: boolean;
  onReset: () => void;
  check: PlanCheckState;
  /** The engine's further words on its own proposal (what the switch adds, settling). */
  proposalTexts: string[];
}) {
  const status = planStatus(check, plan);
  const checked = status.kind === "checked" ? status.reply : null;
  const [open, setOpen] = useState<number | null>(null);
  return (
    <Panel
      title={`Range plan: ${plan.ranges.length} ranges${edited ? " (adjusted)" : ""}`}
      actions={
        edited ? (
          <Button variant="ghost" onClick={onReset}>
            Back to the engine&apos;s proposal
          </Button>
        ) : (
          <span className="text-2xs text-ink-faint">as the engine proposes it</span>
        )
      }
    >
      <div className="flex flex-col gap-4 text-xs" data-testid="plan-editor">
        <RangePlanChart plan={plan} minA={plan.ranges[0]!.minA} maxA={plan.ranges.at(-1)!.maxA} />
        <p className="text-ink-muted">
          Adjust the plan before saving: move a switch point, or pick another pair for a range from the pairs that work
          on that range&apos;s own stretch. The engine checks every change.
        </p>
        <ol className="flex flex-col gap-3" aria-label="Ranges and switch points">
          {plan.ranges.map((r, k) => {
            const c = checked?.candidates[k];
            return (
              <li key={k} className="flex flex-col gap-3">
                <RangeRow
                  index={k}
                  range={r}
                  candidates={c}
                  open={open === k}
                  onToggle={() => setOpen(open === k ? null : k)}
                  onPick={(pair) => {
                    setPlan(withRangePair(plan, k, pair));
                    setOpen(null);
                  }}
                />
                {k < plan.switchPoints.length && <SwitchPointRow index={k} plan={plan} setPlan={setPlan} />}
              </li>
            );
          })}
        </ol>
        <PlanVerdictLine status={status} />
        {checked && (
          <div className="flex flex-col gap-3">
            <div className="grid grid-cols-1 gap-4 xl:grid-cols-3">
              <PlanStretchChart curves={checked.curves} kind="error" />
              <PlanStretchChart curves={checked.curves} kind="burden" />
              <PlanStretchChart curves={checked.curves} kind="load" />
            </div>
            <PlanStretchLegend curves={checked.curves} />
          </div>
        )}
        {checked?.verdict.sound && (
          <>
            <p className="text-ink-muted" data-testid="plan-switch-rule">
              {checked.verdict.switchRule}
            </p>
            <p className="text-ink-muted">{checked.verdict.protection}</p>
          </>
        )}
        {!edited &&
          proposalTexts.map((t) => (
            <p key={t.slice(0, 40)} className="text-ink-muted">
              {t}
            </p>
          ))}
        <p className="text-2xs text-ink-faint">
          A low range&apos;s shunt left in circuit at the full current is the usual way to burn one: build the
          protection the plan names, and check each switch point from both sides on the bench.
        </p>
      </div>
    </Panel>
  );
}

export function PlanVerdictLine({ status }: { status: ReturnType<typeof planStatus> }) {
  return (
    <p aria-live="polite" data-testid="plan-verdict" className="text-xs">
      {status.kind === "checking" ? (
        <span className="text-ink-muted">The engine is checking the plan…</span>
      ) : status.kind === "error" ? (
        <span className="text-bad">{status.message}</span>
      ) : status.reply.verdict.sound ? (
        <span className="text-good">
          The engine accepts this plan: every range works on its own stretch and the switch points sit in the overlaps.
        </span>
      ) : (
        <span className="text-bad">The engine refuses this plan. {status.reply.verdict.message}</span>
      )}
    </p>
  );
}

function RangeRow({
  index,
  range,
  candidates,
  open,
  onToggle,
  onPick,
}: {
  index: number;
  range: PlanChoice["ranges"][number];
  candidates: RangeCandidates | undefined;
  open: boolean;
  onToggle: () => void;
  onPick: (pair: { shuntOhms: number; gain: number }) => void;
}) {
  const cur = candidates?.current;
  const listId = `range-${index}-pairs`;
  return (
    <div className="rounded border border-line" data-testid={`plan-range-${index + 1}`}>
      <div className="flex flex-wrap items-baseline gap-x-4 gap-y-1 px-3 py-2">
        <span className="font-semibold">Range {index + 1}</span>
        <span className="num font-semibold" data-testid={`plan-range-${index + 1}-pair`}>
          {pairText(range)}
        </span>
        <span className="num text-ink-muted">
          {formatSI(range.minA, "A")} – {formatSI(range.maxA, "A")}
        </span>
        {cur && (
          <>
            <span className="num text-ink-muted">
              drop at its top {formatSI(cur.worstBurdenV, "V")} with the switch
            </span>
            <span className="num text-ink-muted">{Number(cur.countsAtBottom.toPrecision(3))} steps at its bottom</span>
            {!cur.feasible && <span className="text-bad">does not work on this stretch</span>}
          </>
        )}
        <Button variant="ghost" className="ml-auto" onClick={onToggle} aria-expanded={open} aria-controls={listId}>
          {open ? "Close" : `Other pairs for range ${index + 1}`}
        </Button>
      </div>
      {open && (
        <fieldset id={listId} className="border-t border-line px-3 py-2">
          <legend className="sr-only">Pairs for range {index + 1}</legend>
          {!candidates ? (
            <p className="text-ink-muted">Sweeping this range…</p>
          ) : candidates.candidates.length === 0 ? (
            <p className="text-bad">
              No pair works on {formatSI(range.minA, "A")} – {formatSI(range.maxA, "A")}: move a switch point to give
              this range a narrower stretch.
            </p>
          ) : (
            <>
              <p className="mb-1 text-2xs text-ink-muted num">
                {candidates.feasibleCount.toLocaleString("en")} of {candidates.evaluated.toLocaleString("en")} pairs
                work on this stretch; the best {candidates.candidates.length}, ranked as the plan ranks its own pick:
              </p>
              <div className="flex flex-col gap-1">
                {candidates.candidates.map((c, i) => {
                  const same = c.shuntOhms === range.shuntOhms && c.gain === range.gain;
                  return (
                    <label
                      key={`${c.shuntOhms}:${c.gain}`}
                      className={`flex cursor-pointer flex-wrap items-baseline gap-x-3 rounded px-2 py-1 num ${same ? "bg-copper-soft/60" : "hover:bg-sunken"}`}
                    >
                      <input
                        type="radio"
                        name={listId}
                        checked={same}
                        onChange={() => onPick(c)}
                        aria-label={`${pairText(c)} for range ${index + 1}`}
                      />
                      <span className="font-semibold">
                        {i + 1}. {pairText(c)}
                      </span>
                      <span className="text-ink-muted">drop {formatSI(c.worstBurdenV, "V")}</span>
                      <span className="text-ink-muted">{Number(c.countsAtBottom.toPrecision(3))} steps at bottom</span>
                      <span className="text-ink-muted">
                        {formatPercent(c.errorAtBottomPercent / 100)} error at bottom
                      </span>
                    </label>
                  );
                })}
              </div>
            </>
          )}
        </fieldset>
      )}
    </div>
  );
}

/** Log-scale slider steps per decade: fine enough to land within about 1 % of any current. */
const SLIDER_STEPS_PER_DECADE = 200;

function SwitchPointRow({
  index,
  plan,
  setPlan,
}: {
  index: number;
  plan: PlanChoice;
  setPlan: (p: PlanChoice) => void;
}) {
  const sp = plan.switchPoints[index]!;
  const [typed, setTyped] = useState(formatSI(sp.upA, "A", 3));
  const [error, setError] = useState<string | null>(null);
  useEffect(() => {
    // eslint-disable-next-line react-hooks/set-state-in-effect -- the field follows the plan when the slider moves it
    setTyped(formatSI(sp.upA, "A", 3));
  }, [sp.upA]);
  const id = `switch-${index + 1}`;
  const lower = plan.ranges[index]!;
  const upper = plan.ranges[index + 1]!;
  // The slider spans what keeps the two ranges non-empty; the engine refuses what does not work.
  const lo = Math.log10((lower.minA / SWITCH_DOWN_FRACTION) * 1.001);
  const hi = Math.log10(upper.maxA * 0.999);
  const apply = (upA: number) => {
    const moved = moveSwitchPoint(plan, index, upA);
    if (!moved.ok) {
      setError(moved.message);
      return;
    }
    setError(null);
    setPlan(moved.plan);
  };
  const commit = async () => {
    const r = await check({
      kind: "quantity",
      input: typed.trim(),
      dim: "current",
      label: `Switch point ${index + 1}`,
    });
    if (!r.ok) {
      setError(r.message);
      return;
    }
    if (Math.abs(r.value - sp.upA) > 1e-12 * sp.upA) apply(r.value);
  };
  return (
    <div className="ml-4 flex flex-col gap-1 border-l-2 border-dashed border-line pl-3" data-testid={id}>
      <div className="flex flex-wrap items-end gap-x-3 gap-y-1">
        <div className="flex flex-col gap-0.5">
          <label htmlFor={`${id}-up`} className="text-2xs font-medium text-ink-muted">
            Switch point {index + 1}: up to range {index + 2} above
          </label>
          <input
            id={`${id}-up`}
            value={typed}
            onChange={(e) => setTyped(e.target.value)}
            onBlur={() => void commit()}
            onKeyDown={(e) => {
              if (e.key === "Enter") {
                e.preventDefault();
                void commit();
              }
            }}
            aria-invalid={error ? true : undefined}
            aria-describedby={`${id}-hyst ${id}-error`}
            className="w-28 rounded border border-line bg-panel px-2 py-1 text-sm num aria-[invalid=true]:border-bad focus:border-copper focus:outline-none"
          />
        </div>
        <input
          type="range"
          aria-label={`Move switch point ${index + 1}`}
          min={lo}
          max={hi}
          step={1 / SLIDER_STEPS_PER_DECADE}
          value={Math.min(hi, Math.max(lo, Math.log10(sp.upA)))}
          onChange={(e) => apply(10 ** Number(e.target.value))}
          className="min-w-32 flex-1 accent-copper"
        />
      </div>
      <p id={`${id}-hyst`} className="text-2xs text-ink-muted num">
        back down to range {index + 1} below {formatSI(sp.downA, "A")}: a hysteresis band of{" "}
        {formatSI(sp.upA - sp.downA, "A")} ({formatPercent(1 - sp.downA / sp.upA)} of the switch-up current), where both
        ranges read within their limits
      </p>
      <p id={`${id}-error`} aria-live="polite" className="text-2xs font-medium text-bad">
        {error}
      </p>
    </div>
  );
}
