"use client";
// Runs the engine's sweep in a Web Worker, coalescing edits: at most one sweep runs, and
// only the latest input waits behind it, so typing never queues stale work or blocks the page.
import { useCallback, useEffect, useRef, useState } from "react";
import type { FieldErrors } from "@/lib/design/requirement";
import type { SolveResult } from "@/lib/design/solve";
import type { SolveReply, SolveRequest } from "./solver-protocol";

export type SolverState =
  | { status: "idle" }
  | { status: "solved"; id: number; result: SolveResult; solveMs: number; editAt: number }
  | { status: "invalid"; id: number; fieldErrors: FieldErrors; message: string; editAt: number };

/** Debounce for bursts of keystrokes; short, so the edit-to-redraw time stays well under 100 ms. */
const DEBOUNCE_MS = 10;

export function useSolver() {
  const worker = useRef<Worker | null>(null);
  const inFlight = useRef<SolveRequest | null>(null);
  const pending = useRef<SolveRequest | null>(null);
  const editTimes = useRef(new Map<number, number>());
  const nextId = useRef(1);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const [state, setState] = useState<SolverState>({ status: "idle" });
  const [busy, setBusy] = useState(false);
  // The last good result stays on screen while the form holds an error.
  const [last, setLast] = useState<{ result: SolveResult; solveMs: number } | null>(null);

  const dispatch = useCallback(() => {
    const w = worker.current;
    if (!w || inFlight.current || !pending.current) return;
    inFlight.current = pending.current;
    pending.current = null;
    setBusy(true);
    w.postMessage(inFlight.current);
  }, []);

  useEffect(() => {
    const w = new Worker(new URL("./solve.worker.ts", import.meta.url), { name: "sensewright-solver" });
    worker.current = w;
    w.onmessage = (event: MessageEvent<SolveReply>) => {
      const reply = event.data;
      inFlight.current = null;
      const editAt = editTimes.current.get(reply.id) ?? performance.now();
      editTimes.current.delete(reply.id);
      // Edit → answer from the worker (the rest of "wizard-resolve" is drawing).
      try {
        performance.measure("wizard-roundtrip", { start: editAt, end: performance.now() });
      } catch {
        /* no User Timing level 3 */
      }
      // A newer input is waiting: skip drawing this one and solve that instead.
      if (pending.current) {
        dispatch();
        return;
      }
      setBusy(false);
      if (reply.ok) setLast({ result: reply.result, solveMs: reply.solveMs });
      setState(
        reply.ok
          ? { status: "solved", id: reply.id, result: reply.result, solveMs: reply.solveMs, editAt }
          : { status: "invalid", id: reply.id, fieldErrors: reply.fieldErrors, message: reply.message, editAt },
      );
    };
    w.onerror = (event) => {
      inFlight.current = null;
      setBusy(false);
      setState({
        status: "invalid",
        id: 0,
        fieldErrors: {},
        message: `The solver stopped: ${event.message}`,
        editAt: performance.now(),
      });
    };
    dispatch();
    return () => {
      w.terminate();
      worker.current = null;
      if (timer.current) clearTimeout(timer.current);
    };
  }, [dispatch]);

  /** Queue a sweep of `input` (raw form values); `editAt` is when the edit happened (performance.now()). */
  const request = useCallback(
    (input: unknown, editAt = performance.now()) => {
      const id = nextId.current++;
      if (pending.current) editTimes.current.delete(pending.current.id);
      editTimes.current.set(id, editAt);
      // Keep a plain copy: the form hands out live objects.
      pending.current = { id, input: JSON.parse(JSON.stringify(input ?? {})) as unknown };
      setBusy(true);
      if (timer.current) clearTimeout(timer.current);
      timer.current = setTimeout(dispatch, DEBOUNCE_MS);
    },
    [dispatch],
  );

  return { state, busy, last, request };
}
