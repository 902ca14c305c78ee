"use client";
// Runs the engine's sweep in a Web Worker, coalescing edits: at most one sweep runs, and only the
// latest input waits behind it, so typing never queues stale work or blocks the page. A sweep that
// has run past CANCEL_AFTER_MS when a newer edit arrives is stale and long (up to 2,000,000 pairs):
// its worker is stopped and a fresh one solves the newer input, rather than making the person wait.
import { startTransition, useCallback, useEffect, useMemo, useRef, useState } from "react";
import type { FieldErrors } from "@/lib/design/requirement";
import type { SolveResult } from "@/lib/design/solve";
import type { StepDifferences } from "./from-defaults";
import { measureSince } from "./measure";
import type { DifferencesReply, SolveReply, SolveRequest } from "./solver-protocol";

/** A solve on screen: its result, the sweep's time, and when the edit it answers happened. */
export type Solved = { id: number; result: SolveResult; solveMs: number; editAt: number };

export type SolverState =
  | { status: "idle" }
  | { status: "solved"; id: number; result: SolveResult; solveMs: number; editAt: number }
  | { status: "invalid"; id: number; fieldErrors: FieldErrors; message: string; editAt: number };

/** A sweep running longer than this shows its progress (the time it has taken so far). */
export const SLOW_MS = 200;
/**
 * A sweep still running this long after it started is cancelled when an edit makes it stale. Not
 * sooner: a fresh worker loads the engine again (100–300 ms), so a shorter sweep is better awaited.
 */
const CANCEL_AFTER_MS = 600;

/** A sweep under way: since when (performance.now()), for the progress line. */
export type Sweeping = { since: number } | null;

export function useSolver() {
  const worker = useRef<Worker | null>(null);
  const inFlight = useRef<(SolveRequest & { startedAt: number }) | null>(null);
  const pending = useRef<SolveRequest | null>(null);
  const editTimes = useRef(new Map<number, number>());
  const nextId = useRef(1);
  const slowTimer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const [state, setState] = useState<SolverState>({ status: "idle" });
  const [busy, setBusy] = useState(false);
  // Set only once a sweep has run SLOW_MS: a quick one never flashes a progress line.
  const [sweeping, setSweeping] = useState<Sweeping>(null);
  // The last good result stays on screen while the form holds an error.
  const [last, setLast] = useState<Solved | null>(null);
  // The save summary's differences from the defaults, which follow each solved reply.
  const [differences, setDifferences] = useState<{ id: number; groups: StepDifferences[] } | null>(null);
  const lastSolved = useRef(0);
  const start = useRef<() => void>(() => undefined);

  const dispatch = useCallback(() => {
    const w = worker.current;
    if (!w || inFlight.current || !pending.current) return;
    const startedAt = performance.now();
    inFlight.current = { ...pending.current, startedAt };
    pending.current = null;
    setBusy(true);
    if (slowTimer.current) clearTimeout(slowTimer.current);
    slowTimer.current = setTimeout(() => setSweeping({ since: startedAt }), SLOW_MS);
    w.postMessage({ id: inFlight.current.id, input: inFlight.current.input } satisfies SolveRequest);
  }, []);

  const settle = useCallback(() => {
    if (slowTimer.current) clearTimeout(slowTimer.current);
    setSweeping(null);
  }, []);

  useEffect(() => {
    const onReply = (event: MessageEvent<SolveReply | DifferencesReply>) => {
      if ("differences" in event.data) {
        if (event.data.id === lastSolved.current) setDifferences({ id: event.data.id, groups: event.data.differences });
        return;
      }
      const reply = event.data;
      if (reply.id !== inFlight.current?.id) return; // from a worker stopped meanwhile
      inFlight.current = null;
      const editAt = editTimes.current.get(reply.id) ?? performance.now();
      editTimes.current.delete(reply.id);
      // Edit → answer from the worker (the rest of "wizard-resolve" is drawing).
      measureSince("wizard-roundtrip", editAt);
      // A newer input is waiting: skip drawing this one and solve that instead.
      if (pending.current) {
        dispatch();
        return;
      }
      settle();
      setBusy(false);
      if (reply.ok) {
        lastSolved.current = reply.id;
        setLast({ id: reply.id, result: reply.result, solveMs: reply.solveMs, editAt });
      }
      setState(
        reply.ok
          ? { status: "solved", id: reply.id, result: reply.result, solveMs: reply.solveMs, editAt }
          : { status: "invalid", id: reply.id, fieldErrors: reply.fieldErrors, message: reply.message, editAt },
      );
    };
    const onError = (event: ErrorEvent) => {
      inFlight.current = null;
      settle();
      setBusy(false);
      setState({
        status: "invalid",
        id: 0,
        fieldErrors: {},
        message: `The solver stopped: ${event.message}`,
        editAt: performance.now(),
      });
    };
    start.current = () => {
      worker.current?.terminate();
      const w = new Worker(new URL("./solve.worker.ts", import.meta.url), { name: "sensewright-solver" });
      w.onmessage = onReply;
      w.onerror = onError;
      worker.current = w;
    };
    start.current();
    dispatch();
    return () => {
      worker.current?.terminate();
      worker.current = null;
      if (slowTimer.current) clearTimeout(slowTimer.current);
    };
  }, [dispatch, settle]);

  /** Queue a sweep of `input` (raw form values); `editAt` is when the edit happened (performance.now()). */
  const request = useCallback(
    (input: unknown, editAt = performance.now()) => {
      const id = nextId.current++;
      if (pending.current) editTimes.current.delete(pending.current.id);
      editTimes.current.set(id, editAt);
      // Keep a plain copy: the form hands out live objects.
      pending.current = { id, input: JSON.parse(JSON.stringify(input ?? {})) as unknown };
      // Not urgent: the keystroke's own (synchronous) render stays small, and the solve's answer
      // is drawn first if it comes before this.
      startTransition(() => setBusy(true));
      // No debounce: a burst of keystrokes is coalesced by the queue itself (the first goes at once,
      // the rest wait as one pending input behind it), so a single edit never waits on a timer.
      const running = inFlight.current;
      // A long sweep made stale by this edit: stop its worker and solve the edit on a fresh one.
      if (running && performance.now() - running.startedAt >= CANCEL_AFTER_MS) {
        editTimes.current.delete(running.id);
        inFlight.current = null;
        settle();
        start.current();
      }
      dispatch();
    },
    [dispatch, settle],
  );

  /** The differences of the result on screen; null until the worker has sent them. */
  const shownDifferences = last && differences?.id === last.id ? differences.groups : null;
  // One object per change of what it holds, so a memoised explorer skips the form's own re-renders.
  return useMemo(
    () => ({ state, busy, sweeping, last, differences: shownDifferences, request }),
    [state, busy, sweeping, last, shownDifferences, request],
  );
}
