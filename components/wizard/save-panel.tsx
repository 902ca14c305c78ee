"use client";
// Name the design and save the chosen pair (or the range plan): POST /api/designs (a new design, with one
// Idempotency-Key per attempt so a repeated request creates nothing more) or, when revising,
// PATCH /api/designs/[id] with the revision it started from (409 when someone saved first).
import { useMutation } from "@tanstack/react-query";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useRef } from "react";
import type { PlanChoice } from "@/lib/design/plan-choice";
import type { Requirement } from "@/lib/design/requirement";
import type { ApiError, DesignCreated } from "@/lib/api-description/responses";
import type { Candidate } from "@/lib/design/types";
import { formatSI } from "@/lib/design/format";
import { Button } from "@/components/ui/button";
import { Field, TextInput } from "@/components/ui/field";

type SaveError = Pick<ApiError, "message" | "fieldErrors"> & { status?: number };

/** What to say beside Save about the selected pair: followed from the ranking, or the designer's own pick. */
export type PickNote = { tone: "info" | "warn" | "bad"; text: string; follow?: Candidate | null };

/** A range plan to save instead of a pair, with the engine's verdict on it. */
export type PlanToSave = { choice: PlanChoice; checking: boolean; refusal: string | null };

const noteTone = { info: "text-ink-muted", warn: "text-warn", bad: "text-bad" } as const;

export function SavePanel({
  requirement,
  candidate,
  plan = null,
  note = null,
  onFollow,
  revise,
  canSave,
  name,
  setName,
  project,
  setProject,
  onSaved,
}: {
  requirement: Requirement;
  candidate: Candidate | null;
  plan?: PlanToSave | null;
  note?: PickNote | null;
  onFollow?: () => void;
  /** Saving makes the next revision of this design instead of a new design. */
  revise?: { id: string; revision: number };
  canSave: boolean;
  name: string;
  setName: (s: string) => void;
  project: string;
  setProject: (s: string) => void;
  onSaved: () => void;
}) {
  const router = useRouter();
  const saving = useRef(false);
  const save = useMutation<{ id: string }, SaveError, string>({
    mutationFn: async (idempotencyKey) => {
      const design = {
        name: name.trim(),
        requirement,
        ...(plan ? { plan: plan.choice } : { choice: { shuntOhms: candidate!.shuntOhms, gain: candidate!.gain } }),
      };
      const res = revise
        ? await fetch(`/api/designs/${revise.id}`, {
            method: "PATCH",
            headers: { "content-type": "application/json" },
            body: JSON.stringify({ ...design, project: project.trim() || null, revision: revise.revision }),
          })
        : await fetch("/api/designs", {
            method: "POST",
            headers: { "content-type": "application/json", "idempotency-key": idempotencyKey },
            body: JSON.stringify({ ...design, ...(project.trim() ? { project: project.trim() } : {}) }),
          });
      const body = (await res
        .json()
        .catch(() => ({ message: `The server answered ${res.status}` }))) as Partial<DesignCreated> & ApiError;
      if (!res.ok || (!revise && !body.id))
        throw {
          message: body.message ?? `The server answered ${res.status}`,
          fieldErrors: body.fieldErrors,
          status: res.status,
        };
      return { id: revise?.id ?? body.id! };
    },
    onSuccess: ({ id }) => {
      onSaved();
      router.push(`/designs/${id}`);
    },
  });
  const fe = save.error?.fieldErrors ?? {};
  const nameError = name.trim() === "" && save.isError ? "Give the design a name" : fe.name?.join("; ");
  if (!canSave) {
    return (
      <p className="text-xs text-ink-muted">
        Reviewers and makers explore here; only owners and designers save designs.
      </p>
    );
  }
  return (
    <form
      className="flex flex-col gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        if (!name.trim()) {
          document.getElementById("save-name")?.focus();
          save.reset();
          return;
        }
        // A second click lands before React has drawn the button disabled: a ref guards the attempt.
        // One key per attempt: a repeated request of this attempt creates nothing more.
        if (saving.current) return;
        saving.current = true;
        save.mutate(crypto.randomUUID(), { onSettled: () => (saving.current = false) });
      }}
      aria-label="Save the design"
    >
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <Field id="save-name" label="Design name" error={nameError}>
          <TextInput
            id="save-name"
            value={name}
            onChange={(e) => setName(e.target.value)}
            placeholder="Logger supply monitor"
            aria-invalid={nameError ? true : undefined}
            aria-describedby="save-name-error"
            maxLength={200}
          />
        </Field>
        <Field id="save-project" label="Project (optional)" error={fe.project?.join("; ")}>
          <TextInput
            id="save-project"
            value={project}
            onChange={(e) => setProject(e.target.value)}
            placeholder="Soil-moisture logger"
            aria-describedby="save-project-error"
            maxLength={200}
          />
        </Field>
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <Button
          type="submit"
          variant="primary"
          disabled={
            (plan ? plan.checking || plan.refusal !== null : !candidate || !candidate.feasible) || save.isPending
          }
        >
          {save.isPending
            ? "Saving…"
            : `${revise ? `Save as revision ${revise.revision + 1}` : "Save"}${
                plan
                  ? ` the ${plan.choice.ranges.length}-range plan`
                  : candidate
                    ? ` with ${formatSI(candidate.shuntOhms, "Ω")} × ${Number(candidate.gain.toPrecision(4))}`
                    : ""
              }`}
        </Button>
        {plan?.checking && <span className="text-xs text-ink-muted">The engine is checking the plan…</span>}
        {plan?.refusal && (
          <span className="text-xs text-bad" data-testid="plan-refusal">
            Not saved as it stands: {plan.refusal}
          </span>
        )}
        {!plan && !candidate && <span className="text-xs text-ink-muted">Select a candidate first.</span>}
        {candidate && !candidate.feasible && (
          <span className="text-xs text-bad">Only a feasible candidate can be saved.</span>
        )}
        {note && (
          <span className={`text-xs ${noteTone[note.tone]}`} data-testid="pick-note">
            {note.text}
            {note.follow && onFollow && (
              <>
                {" "}
                <button type="button" className="text-copper-strong underline" onClick={onFollow}>
                  Follow the ranking ({formatSI(note.follow.shuntOhms, "Ω")} × {Number(note.follow.gain.toPrecision(4))}
                  )
                </button>
              </>
            )}
          </span>
        )}
        <p aria-live="polite" className="text-xs text-bad" data-testid="save-error">
          {save.isError && !nameError ? save.error.message : ""}
          {save.isError && save.error.status === 409 && revise && (
            <>
              {" "}
              <Link href={`/designs/${revise.id}`} className="text-copper-strong underline">
                Open the design as it is now
              </Link>
            </>
          )}
        </p>
      </div>
    </form>
  );
}
