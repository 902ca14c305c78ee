"use client";
// Name the design and save the chosen pair: POST /api/designs, then its own page.
import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import type { Requirement } from "@/lib/design/requirement";
import type { Candidate } from "@/lib/design/types";
import { formatSI } from "@/lib/design/format";
import { Button } from "@/components/ui/button";
import { Field, TextInput } from "@/components/ui/field";

type SaveError = { message: string; fieldErrors?: Record<string, string[]> };

export function SavePanel({
  requirement,
  candidate,
  canSave,
  name,
  setName,
  project,
  setProject,
  onSaved,
}: {
  requirement: Requirement;
  candidate: Candidate | null;
  canSave: boolean;
  name: string;
  setName: (s: string) => void;
  project: string;
  setProject: (s: string) => void;
  onSaved: () => void;
}) {
  const router = useRouter();
  const save = useMutation<{ id: string }, SaveError>({
    mutationFn: async () => {
      const res = await fetch("/api/designs", {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({
          name: name.trim(),
          ...(project.trim() ? { project: project.trim() } : {}),
          requirement,
          choice: { shuntOhms: candidate!.shuntOhms, gain: candidate!.gain },
        }),
      });
      const body = (await res.json().catch(() => ({ message: `The server answered ${res.status}` }))) as {
        id?: string;
      } & SaveError;
      if (!res.ok || !body.id)
        throw { message: body.message ?? `The server answered ${res.status}`, fieldErrors: body.fieldErrors };
      return { id: body.id };
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
        save.mutate();
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
        <Button type="submit" variant="primary" disabled={!candidate || !candidate.feasible || save.isPending}>
          {save.isPending
            ? "Saving…"
            : candidate
              ? `Save ${formatSI(candidate.shuntOhms, "Ω")} × ${Number(candidate.gain.toPrecision(4))}`
              : "Save"}
        </Button>
        {!candidate && <span className="text-xs text-ink-muted">Select a candidate first.</span>}
        {candidate && !candidate.feasible && (
          <span className="text-xs text-bad">Only a feasible candidate can be saved.</span>
        )}
        <p aria-live="polite" className="text-xs text-bad" data-testid="save-error">
          {save.isError && !nameError ? save.error.message : ""}
        </p>
      </div>
    </form>
  );
}
