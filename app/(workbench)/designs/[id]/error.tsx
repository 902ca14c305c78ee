"use client";

import { Button } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/panel";

export default function DesignError({ reset }: { error: Error; reset: () => void }) {
  return (
    <EmptyState title="The design could not be shown">
      <p>Something went wrong on the server; nothing was changed. The error has been logged.</p>
      <Button className="mt-3" onClick={reset}>
        Try again
      </Button>
    </EmptyState>
  );
}
