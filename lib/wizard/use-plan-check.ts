"use client";
// Checks the plan being adjusted in a Web Worker, coalescing edits like the solver does: at most
// one check runs and only the latest plan waits behind it.
import { useCallback, useEffect, useRef, useState } from "react";
import type { PlanChoice } from "@/lib/design/plan-choice";
import type { Requirement } from "@/lib/design/requirement";
import type { PlanCheckReply, PlanCheckRequest } from "./plan-protocol";

export type PlanCheckState =
  | { status: "idle" }
  | { status: "checking"; plan: PlanChoice }
  | { status: "checked"; plan: PlanChoice; reply: PlanCheckReply };

export function usePlanCheck() {
  const worker = useRef<Worker | null>(null);
  const inFlight = useRef<PlanCheckRequest | null>(null);
  const pending = useRef<PlanCheckRequest | null>(null);
  const nextId = useRef(1);
  const [state, setState] = useState<PlanCheckState>({ status: "idle" });

  const dispatch = useCallback(() => {
    const w = worker.current;
    if (!w || inFlight.current || !pending.current) return;
    inFlight.current = pending.current;
    pending.current = null;
    w.postMessage(inFlight.current);
  }, []);

  useEffect(() => {
    const w = new Worker(new URL("./plan.worker.ts", import.meta.url), { name: "sensewright-plan" });
    worker.current = w;
    w.onmessage = (event: MessageEvent<PlanCheckReply>) => {
      const asked = inFlight.current;
      inFlight.current = null;
      if (pending.current) {
        dispatch();
        return;
      }
      if (asked) setState({ status: "checked", plan: asked.plan, reply: event.data });
    };
    w.onerror = (event) => {
      const asked = inFlight.current;
      inFlight.current = null;
      if (asked)
        setState({
          status: "checked",
          plan: asked.plan,
          reply: { id: asked.id, ok: false, message: `The plan check stopped: ${event.message}` },
        });
    };
    dispatch();
    return () => {
      w.terminate();
      worker.current = null;
    };
  }, [dispatch]);

  const check = useCallback(
    (requirement: Requirement, plan: PlanChoice) => {
      pending.current = { id: nextId.current++, requirement, plan };
      setState({ status: "checking", plan });
      dispatch();
    },
    [dispatch],
  );

  return { state, check };
}
