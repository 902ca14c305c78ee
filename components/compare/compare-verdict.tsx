"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { SendMessage } from "@/components/review/send-message";
import { useSend } from "@/components/review/use-send";
import type { DesignStatus } from "@/db/schema";
import type { DesignViewer } from "@/lib/design-view";

/** Approve or return one compared design, for owners and reviewers who did not write it. */
export function CompareVerdict({
  design,
  viewer,
}: {
  design: { id: string; name: string; status: DesignStatus; revision: number; authorId: string };
  viewer: DesignViewer;
}) {
  const s = useSend();
  const [returning, setReturning] = useState(false);
  const [reason, setReason] = useState("");
  if (!viewer.may.judge) return null;
  // After a verdict the page refreshes into the new status: keep saying what just happened.
  if (design.status !== "in-review")
    return (
      <div className="flex flex-col gap-1">
        <p className="text-xs text-ink-faint">No verdict due: the design is {design.status}.</p>
        {s.ok && <SendMessage state={s} reload={s.reload} />}
      </div>
    );
  if (!viewer.may.judgeThis)
    return <p className="text-xs text-ink-faint">You wrote this revision; another reviewer gives the verdict.</p>;
  const post = (verdict: "approve" | "return", body: string, ok: string) =>
    s.send(`/api/designs/${design.id}/reviews`, "POST", { verdict, body, revision: design.revision }, ok);
  return (
    <div className="flex flex-col gap-1.5">
      <div className="flex flex-wrap gap-1.5">
        <Button
          variant="primary"
          className="px-2 py-1 text-xs"
          disabled={s.busy}
          onClick={() => post("approve", "", `${design.name} approved.`)}
          aria-label={`Approve ${design.name}`}
        >
          Approve
        </Button>
        <Button
          className="px-2 py-1 text-xs"
          disabled={s.busy}
          onClick={() => setReturning((r) => !r)}
          aria-label={`Return ${design.name}`}
        >
          Return…
        </Button>
      </div>
      {returning && (
        <form
          className="flex flex-col gap-1"
          onSubmit={(e) => {
            e.preventDefault();
            void post("return", reason, `${design.name} returned with your reason.`);
          }}
        >
          <label htmlFor={`reason-${design.id}`} className="text-2xs text-ink-muted">
            Reason for returning
          </label>
          <textarea
            id={`reason-${design.id}`}
            rows={2}
            value={reason}
            onChange={(e) => setReason(e.target.value)}
            className="rounded border border-line bg-panel px-2 py-1 text-xs"
          />
          <Button type="submit" className="self-start px-2 py-1 text-xs" disabled={s.busy || !reason.trim()}>
            Send it back
          </Button>
        </form>
      )}
      <SendMessage state={s} reload={s.reload} />
    </div>
  );
}
