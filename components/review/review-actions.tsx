"use client";

import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field, TextInput } from "@/components/ui/field";
import type { ClientDesignView, DesignViewer } from "@/lib/design-view";
import { SendMessage } from "./send-message";
import { StatusBadge, statusExplained } from "./status-badge";
import { useSend } from "./use-send";

/** Status, submit, the verdict form and the rename form: each shown only to who may use it. */
export function ReviewActions({ design, viewer }: { design: ClientDesignView; viewer: DesignViewer }) {
  const s = useSend();
  const [reason, setReason] = useState("");
  const [name, setName] = useState(design.name);
  const [project, setProject] = useState(design.project ?? "");
  const canEdit = viewer.may.edit;
  const canSubmit = canEdit && (design.status === "draft" || design.status === "returned");
  const url = `/api/designs/${design.id}`;

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center gap-2 text-sm">
        <StatusBadge status={design.status} />
        <span className="text-ink-muted">
          Revision {design.revision}: {statusExplained[design.status]}
        </span>
        {canEdit && (
          <Link
            href={`/designs/${design.id}/revise`}
            className="ml-auto rounded border border-line bg-panel px-3 py-1.5 text-sm font-medium hover:bg-sunken"
            data-testid="revise-link"
          >
            Revise requirement or pair
          </Link>
        )}
        {canSubmit && (
          <Button
            variant="primary"
            disabled={s.busy}
            onClick={() =>
              s.send(
                `${url}/submit`,
                "POST",
                { revision: design.revision },
                "Submitted; the team's reviewers have been mailed.",
              )
            }
          >
            Submit revision {design.revision} for review
          </Button>
        )}
      </div>

      {design.status === "in-review" && viewer.may.judge && !viewer.may.judgeThis && (
        <p className="text-xs text-ink-muted">
          You wrote this revision, so the verdict must come from another reviewer or owner. You can still comment.
        </p>
      )}
      {design.status === "in-review" && viewer.may.judgeThis && (
        <form
          className="flex flex-col gap-2 rounded border border-line bg-sunken p-3"
          onSubmit={(e) => e.preventDefault()}
          aria-label="Verdict"
        >
          <Field id="verdict-reason" label="Reason or note (a reason is needed to return the design)">
            <textarea
              id="verdict-reason"
              value={reason}
              onChange={(e) => setReason(e.target.value)}
              rows={2}
              className="w-full rounded border border-line bg-panel px-2 py-1.5 text-sm"
            />
          </Field>
          <div className="flex gap-2">
            <Button
              variant="primary"
              disabled={s.busy}
              onClick={() =>
                s.send(
                  `${url}/reviews`,
                  "POST",
                  { verdict: "approve", body: reason, revision: design.revision },
                  `Revision ${design.revision} approved; the author has been mailed.`,
                )
              }
            >
              Approve revision {design.revision}
            </Button>
            <Button
              variant="secondary"
              disabled={s.busy || !reason.trim()}
              title={reason.trim() ? undefined : "Write the reason first"}
              onClick={() =>
                s.send(
                  `${url}/reviews`,
                  "POST",
                  { verdict: "return", body: reason, revision: design.revision },
                  "Returned to the author with your reason.",
                )
              }
            >
              Return with reason
            </Button>
          </div>
        </form>
      )}

      {canEdit && (
        <details className="text-sm">
          <summary className="cursor-pointer text-xs text-ink-muted">
            Rename or move to another project (saves a new draft revision)
          </summary>
          <form
            className="mt-2 grid grid-cols-1 gap-2 sm:grid-cols-[1fr_1fr_auto] sm:items-end"
            onSubmit={(e) => {
              e.preventDefault();
              void s.send(url, "PATCH", { revision: design.revision, name, project: project.trim() || null }, (a) =>
                a.unchanged ? "Nothing changed, so no new revision was made." : "Saved as a new draft revision.",
              );
            }}
          >
            <Field id="design-name-input" label="Design name">
              <TextInput
                id="design-name-input"
                value={name}
                maxLength={200}
                onChange={(e) => setName(e.target.value)}
              />
            </Field>
            <Field id="design-project-input" label="Project">
              <TextInput
                id="design-project-input"
                value={project}
                maxLength={200}
                onChange={(e) => setProject(e.target.value)}
              />
            </Field>
            <Button
              type="submit"
              disabled={
                s.busy || (name.trim() === design.name && (project.trim() || null) === (design.project ?? null))
              }
              className="mb-[1.05rem]"
            >
              Save revision {design.revision + 1}
            </Button>
          </form>
        </details>
      )}
      <SendMessage state={s} reload={s.reload} testId="review-message" />
    </div>
  );
}
