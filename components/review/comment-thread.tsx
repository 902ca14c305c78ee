"use client";

import { useState } from "react";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import type { ReviewRecord } from "@/db/queries/reviews";
import { formatWhen } from "@/lib/saved-designs/when";
import { SendMessage } from "./send-message";
import { useSend } from "./use-send";

const verdictBadge = {
  approve: <Badge tone="good">approved</Badge>,
  return: <Badge tone="warn">returned</Badge>,
  comment: null,
} as const;

function Composer({
  designId,
  revision,
  parentId,
  label,
  onDone,
}: {
  designId: string;
  revision: number;
  parentId?: string;
  label: string;
  onDone?: () => void;
}) {
  const s = useSend();
  const [text, setText] = useState("");
  const id = `comment-${parentId ?? `rev-${revision}`}`;
  return (
    <form
      className="flex flex-col gap-1.5"
      onSubmit={async (e) => {
        e.preventDefault();
        if (
          await s.send(
            `/api/designs/${designId}/reviews`,
            "POST",
            { verdict: "comment", body: text, revision, parentId },
            "Comment posted.",
          )
        ) {
          setText("");
          onDone?.();
        }
      }}
    >
      <label htmlFor={id} className="text-xs font-medium text-ink-muted">
        {label}
      </label>
      <textarea
        id={id}
        rows={2}
        value={text}
        onChange={(e) => setText(e.target.value)}
        className="w-full rounded border border-line bg-panel px-2 py-1.5 text-sm"
      />
      <div className="flex items-center gap-2">
        <Button type="submit" disabled={s.busy || !text.trim()} className="px-2 py-1 text-xs">
          {parentId ? "Post reply" : "Post comment"}
        </Button>
        <SendMessage state={s} reload={s.reload} />
      </div>
    </form>
  );
}

function Entry({ r, replies, designId }: { r: ReviewRecord; replies: ReviewRecord[]; designId: string }) {
  const [replying, setReplying] = useState(false);
  return (
    <li className="flex flex-col gap-1" data-testid="review-entry">
      <div className="flex flex-wrap items-center gap-2 text-xs text-ink-muted">
        <span className="font-medium text-ink">{r.authorName}</span>
        {verdictBadge[r.verdict]}
        <span>{formatWhen(r.createdAt)}</span>
      </div>
      {r.body ? (
        <p className="whitespace-pre-wrap text-sm">{r.body}</p>
      ) : (
        <p className="text-xs text-ink-faint">(no note)</p>
      )}
      {replies.length > 0 && (
        <ul className="ml-4 flex flex-col gap-2 border-l border-line pl-3">
          {replies.map((c) => (
            <li key={c.id} className="flex flex-col gap-0.5" data-testid="review-reply">
              <div className="flex gap-2 text-xs text-ink-muted">
                <span className="font-medium text-ink">{c.authorName}</span>
                <span>{formatWhen(c.createdAt)}</span>
              </div>
              <p className="whitespace-pre-wrap text-sm">{c.body}</p>
            </li>
          ))}
        </ul>
      )}
      <div className="ml-4">
        {replying ? (
          <Composer
            designId={designId}
            revision={r.revision}
            parentId={r.id}
            label={`Reply to ${r.authorName}`}
            onDone={() => setReplying(false)}
          />
        ) : (
          <button type="button" className="text-xs text-copper hover:underline" onClick={() => setReplying(true)}>
            Reply
          </button>
        )}
      </div>
    </li>
  );
}

/** Threads shown before "Show comments on … earlier revisions": a long history opens on its latest. */
const RECENT_THREADS = 5;

/** Comments and verdicts, one thread per revision (newest revision first), replies nested. */
export function CommentThreads({
  designId,
  currentRevision,
  reviews,
}: {
  designId: string;
  currentRevision: number;
  reviews: ReviewRecord[];
}) {
  const [all, setAll] = useState(false);
  const revisions = [...new Set([currentRevision, ...reviews.map((r) => r.revision)])].sort((a, b) => b - a);
  const earlier = revisions.length - RECENT_THREADS;
  return (
    <div className="flex flex-col gap-4">
      {(all ? revisions : revisions.slice(0, RECENT_THREADS)).map((rev) => {
        const top = reviews.filter((r) => r.revision === rev && !r.parentId);
        return (
          <section key={rev} aria-label={`Comments on revision ${rev}`} className="flex flex-col gap-2">
            <h3 className="text-xs font-semibold text-ink-muted">
              Revision {rev}
              {rev === currentRevision ? " (current)" : ""}
            </h3>
            {top.length === 0 && <p className="text-xs text-ink-faint">No comments on this revision yet.</p>}
            <ul className="flex flex-col gap-3">
              {top.map((r) => (
                <Entry key={r.id} r={r} designId={designId} replies={reviews.filter((c) => c.parentId === r.id)} />
              ))}
            </ul>
            {rev === currentRevision && (
              <Composer
                designId={designId}
                revision={rev}
                label="Comment on this revision (a bench finding counts too)"
              />
            )}
          </section>
        );
      })}
      {earlier > 0 && (
        <button
          type="button"
          onClick={() => setAll((v) => !v)}
          aria-expanded={all}
          className="self-start text-xs text-copper hover:underline"
        >
          {all
            ? `Show the ${RECENT_THREADS} latest threads only`
            : `Show comments on ${earlier} earlier revision${earlier === 1 ? "" : "s"}`}
        </button>
      )}
    </div>
  );
}
