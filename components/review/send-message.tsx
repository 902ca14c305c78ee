"use client";

import { Button } from "@/components/ui/button";
import type { SendState } from "./use-send";

/** The outcome of a send, with a reload offer when the design changed underneath. */
export function SendMessage({ state, reload, testId }: { state: SendState; reload: () => void; testId?: string }) {
  return (
    <div aria-live="polite" data-testid={testId} className="text-xs">
      {state.error && (
        <p className="flex flex-wrap items-center gap-2 text-bad">
          {state.stale && <strong>Someone else changed this design.</strong>}
          <span>{state.error}</span>
          {state.stale && (
            <Button variant="secondary" className="px-2 py-0.5 text-xs" onClick={reload}>
              Reload the design
            </Button>
          )}
        </p>
      )}
      {state.ok && <p className="text-good">{state.ok}</p>}
    </div>
  );
}
